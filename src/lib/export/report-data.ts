/**
 * What the protocol report shows about data, when data are loaded: a plain, typed input that
 * the data pane (or any other caller) fills in. Every field is optional beyond the minimum, and
 * all numbers are shown as given (rounded for display only); the report computes nothing here.
 */

export interface ReportDataResults {
	/** Where the data came from; nothing else about the data is written into the report. */
	source?: { name?: string; rows?: number; columns?: number; /** What the data were: rows, grouped counts, sums and cross-products. */ kind?: string };
	/** Checks of the diagram's implied independencies (claims) against the data. */
	checks?: ReportDataCheck[];
	/** Crude and adjusted effect estimates. */
	estimates?: ReportEstimate[];
	/** Free-text remarks shown under the tables (e.g. missing data handling). */
	notes?: string[];
	/** Notices shown first, e.g. a column whose values look like category codes. */
	notices?: string[];
	/** Arrow checks into and out of the exposure and the outcome, with two-way tables. */
	arrowChecks?: ReportArrowCheck[];
	/** The confounder check of each candidate, as text cells. */
	confounders?: { intro?: string; rows: ReportConfounderRow[]; notes?: string[] };
	/** Standardized (marginal) estimates of a binary exposure on a binary outcome. */
	standardized?: ReportStandardized[];
	/** Analysis code for the planned set, printed as an appendix. */
	code?: ReportCode[];
	/** How each variable met the data: its column, the kind it was analysed as, its reference level. */
	columns?: ReportDataColumn[];
	/** The commands that reproduce the checks and estimates from the saved diagram file and the data file. */
	reproduce?: { diagramFile: string; dataFile: string; commands: string[] };
}

/** A table already in words: caption, header and rows of text. */
export interface ReportTextTable {
	caption: string;
	head: string[];
	rows: string[][];
}

export interface ReportArrowCheck {
	/** "Age → Commutes by bicycle". */
	arrow: string;
	/** The kind of each column, e.g. "continuous; binary (reference 0)". */
	kinds: string;
	/** The size in the measure read, with p and n. */
	result: string;
	verdict: string;
	/** Two discrete columns: counts with row %, then the X² line, then per-level odds ratios. */
	table?: ReportTextTable & { tests: string[]; oddsRatios?: ReportTextTable };
}

export interface ReportConfounderRow {
	candidate: string;
	kind: string;
	roles: string;
	withExposure: string;
	withOutcome: string;
	/** Crude → adjusted for the candidate alone, on the same rows. */
	change: string;
	/** Mantel–Haenszel odds ratio with its interval, or "". */
	stratified: string;
	/** Breslow–Day–Tarone, or "". */
	homogeneity: string;
}

export interface ReportStandardized {
	label: string;
	adjustedFor: string[];
	/** Standardized risks with the exposure at its second and first level. */
	risk1: number;
	risk0: number;
	riskDifference: number;
	rdLower: number;
	rdUpper: number;
	riskRatio: number;
	rrLower: number;
	rrUpper: number;
	marginalOddsRatio: number;
	orLower: number;
	orUpper: number;
	/** The model's conditional odds ratio and the crude one on the same rows. */
	conditionalOddsRatio: number;
	crudeOddsRatio?: number | null;
}

export interface ReportCode {
	/** "R (glm)", "Stata", … */
	language: string;
	/** Fence tag for Markdown: r, stata, sas, python. */
	tag: string;
	text: string;
}

export interface ReportDataColumn {
	/** Variable id (shown by its label). */
	variable: string;
	column: string;
	kind: string;
	/** True when the kind was chosen (saved in the diagram), false when detected. */
	chosen: boolean;
	/** The reference level of a coded column, null for a numeric one. */
	reference?: string | null;
}

export interface ReportDataCheck {
	/** The claim in words, e.g. "Age is independent of Distance to work given Income". */
	statement: string;
	/** The test used, e.g. "partial correlation (Fisher's z)" or "G-test". */
	test: string;
	statistic?: number | null;
	/** Degrees of freedom: one number, or two for an F test. */
	df?: number | number[] | null;
	pValue?: number | null;
	/** p-value after a multiple-testing adjustment, when one was made. */
	adjustedP?: number | null;
	verdict: 'consistent' | 'inconsistent' | 'not-tested';
	/** Short remark, e.g. "too few rows in some strata". */
	detail?: string;
}

export interface ReportEstimate {
	/** What is estimated, e.g. "Crude" or "Adjusted for the planned set". */
	label: string;
	/** Variable ids adjusted for (shown by their labels). */
	adjustedFor: string[];
	/** The effect measure, e.g. "odds ratio", "risk difference", "mean difference". */
	measure: string;
	estimate: number;
	lower?: number | null;
	upper?: number | null;
	/** Confidence level of [lower, upper]; default 0.95. */
	level?: number;
	/** Rows used. */
	n?: number;
	note?: string;
	/** The crude estimate on the same rows (with its interval), and the change from it in percent. */
	crudeSameRows?: number | null;
	crudeLower?: number | null;
	crudeUpper?: number | null;
	changePercent?: number | null;
	/** The kinds of the adjusted columns, in words. */
	kinds?: string;
}

type Json = unknown;

function fail(path: string, what: string, value: Json): never {
	const found = value === null ? 'null' : Array.isArray(value) ? 'a list' : typeof value === 'string' ? `the text ${JSON.stringify(value.slice(0, 30))}` : typeof value;
	throw new Error(`${path} must be ${what}, found ${found}`);
}
const isObject = (v: Json): v is Record<string, Json> => typeof v === 'object' && v !== null && !Array.isArray(v);
function optNumber(o: Record<string, Json>, key: string, path: string): void {
	if (o[key] !== undefined && o[key] !== null && (typeof o[key] !== 'number' || !Number.isFinite(o[key]))) fail(`${path}.${key}`, 'a number', o[key]);
}
function needString(o: Record<string, Json>, key: string, path: string, optional = false): void {
	if (optional && o[key] === undefined) return;
	if (typeof o[key] !== 'string') fail(`${path}.${key}`, 'text', o[key]);
}

/**
 * Checks that a parsed JSON value has the shape of ReportDataResults (for `causeway export
 * --results FILE`); throws an Error naming the first wrong field, e.g.
 * `estimates[1].estimate must be a number, found the text "1.2"`. O(size).
 */
export function checkReportData(value: Json): ReportDataResults {
	if (!isObject(value)) fail('the results', 'a JSON object', value);
	if (value.source !== undefined) {
		if (!isObject(value.source)) fail('source', 'an object', value.source);
		needString(value.source, 'name', 'source', true);
		optNumber(value.source, 'rows', 'source');
		optNumber(value.source, 'columns', 'source');
		needString(value.source, 'kind', 'source', true);
	}
	if (value.checks !== undefined) {
		if (!Array.isArray(value.checks)) fail('checks', 'a list', value.checks);
		value.checks.forEach((c: Json, i: number) => {
			const p = `checks[${i}]`;
			if (!isObject(c)) fail(p, 'an object', c);
			needString(c, 'statement', p);
			needString(c, 'test', p);
			for (const k of ['statistic', 'pValue', 'adjustedP']) optNumber(c, k, p);
			if (Array.isArray(c.df)) c.df.forEach((_: Json, j: number) => optNumber(c.df as unknown as Record<string, Json>, String(j), `${p}.df`));
			else optNumber(c, 'df', p);
			if (!['consistent', 'inconsistent', 'not-tested'].includes(c.verdict as string)) fail(`${p}.verdict`, '"consistent", "inconsistent" or "not-tested"', c.verdict);
			needString(c, 'detail', p, true);
		});
	}
	if (value.estimates !== undefined) {
		if (!Array.isArray(value.estimates)) fail('estimates', 'a list', value.estimates);
		value.estimates.forEach((e: Json, i: number) => {
			const p = `estimates[${i}]`;
			if (!isObject(e)) fail(p, 'an object', e);
			needString(e, 'label', p);
			needString(e, 'measure', p);
			if (!Array.isArray(e.adjustedFor) || e.adjustedFor.some((x: Json) => typeof x !== 'string')) fail(`${p}.adjustedFor`, 'a list of variable ids', e.adjustedFor);
			if (typeof e.estimate !== 'number' || !Number.isFinite(e.estimate)) fail(`${p}.estimate`, 'a number', e.estimate);
			for (const k of ['lower', 'upper', 'level', 'n', 'crudeSameRows', 'crudeLower', 'crudeUpper', 'changePercent']) optNumber(e, k, p);
			needString(e, 'note', p, true);
			needString(e, 'kinds', p, true);
		});
	}
	for (const key of ['notes', 'notices'])
		if (value[key] !== undefined && (!Array.isArray(value[key]) || (value[key] as Json[]).some((x: Json) => typeof x !== 'string'))) fail(key, 'a list of texts', value[key]);
	checkNewParts(value);
	if (value.columns !== undefined) {
		if (!Array.isArray(value.columns)) fail('columns', 'a list', value.columns);
		value.columns.forEach((c: Json, i: number) => {
			const p = `columns[${i}]`;
			if (!isObject(c)) fail(p, 'an object', c);
			for (const k of ['variable', 'column', 'kind']) needString(c, k, p);
			if (typeof c.chosen !== 'boolean') fail(`${p}.chosen`, 'true or false', c.chosen);
		});
	}
	if (value.reproduce !== undefined) {
		const r = value.reproduce;
		if (!isObject(r)) fail('reproduce', 'an object', r);
		needString(r, 'diagramFile', 'reproduce');
		needString(r, 'dataFile', 'reproduce');
		if (!Array.isArray(r.commands) || r.commands.some((x: Json) => typeof x !== 'string')) fail('reproduce.commands', 'a list of texts', r.commands);
	}
	return value as ReportDataResults;
}

function listOf(value: Json, path: string, each: (item: Record<string, Json>, path: string) => void): void {
	if (value === undefined) return;
	if (!Array.isArray(value)) fail(path, 'a list', value);
	value.forEach((item: Json, i: number) => {
		const p = `${path}[${i}]`;
		if (!isObject(item)) fail(p, 'an object', item);
		each(item, p);
	});
}

function textTable(t: Json, path: string): void {
	if (!isObject(t)) fail(path, 'an object', t);
	needString(t, 'caption', path);
	if (!Array.isArray(t.head) || t.head.some((x: Json) => typeof x !== 'string')) fail(`${path}.head`, 'a list of texts', t.head);
	if (!Array.isArray(t.rows) || t.rows.some((r: Json) => !Array.isArray(r) || r.some((x: Json) => typeof x !== 'string'))) fail(`${path}.rows`, 'a list of rows of texts', t.rows);
}

/** The parts added for the confounder check: arrow checks, confounders, standardized estimates, code. O(size). */
function checkNewParts(value: Record<string, Json>): void {
	listOf(value.arrowChecks, 'arrowChecks', (a, p) => {
		for (const k of ['arrow', 'kinds', 'result', 'verdict']) needString(a, k, p);
		if (a.table !== undefined) {
			textTable(a.table, `${p}.table`);
			const t = a.table as Record<string, Json>;
			if (!Array.isArray(t.tests) || t.tests.some((x: Json) => typeof x !== 'string')) fail(`${p}.table.tests`, 'a list of texts', t.tests);
			if (t.oddsRatios !== undefined) textTable(t.oddsRatios, `${p}.table.oddsRatios`);
		}
	});
	if (value.confounders !== undefined) {
		if (!isObject(value.confounders)) fail('confounders', 'an object', value.confounders);
		needString(value.confounders, 'intro', 'confounders', true);
		listOf(value.confounders.rows, 'confounders.rows', (r, p) => {
			for (const k of ['candidate', 'kind', 'roles', 'withExposure', 'withOutcome', 'change', 'stratified', 'homogeneity']) needString(r, k, p);
		});
		if (!Array.isArray(value.confounders.rows)) fail('confounders.rows', 'a list', value.confounders.rows);
	}
	listOf(value.standardized, 'standardized', (s, p) => {
		needString(s, 'label', p);
		for (const k of ['risk1', 'risk0', 'riskDifference', 'rdLower', 'rdUpper', 'riskRatio', 'rrLower', 'rrUpper', 'marginalOddsRatio', 'orLower', 'orUpper', 'conditionalOddsRatio']) {
			if (typeof s[k] !== 'number' || !Number.isFinite(s[k])) fail(`${p}.${k}`, 'a number', s[k]);
		}
		optNumber(s, 'crudeOddsRatio', p);
		if (!Array.isArray(s.adjustedFor) || s.adjustedFor.some((x: Json) => typeof x !== 'string')) fail(`${p}.adjustedFor`, 'a list of variable ids', s.adjustedFor);
	});
	listOf(value.code, 'code', (c, p) => {
		for (const k of ['language', 'tag', 'text']) needString(c, k, p);
	});
}
