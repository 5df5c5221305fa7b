/**
 * What the protocol report shows about data, when data are loaded: a plain, typed input that
 * the data pane (or any other caller) fills in. Every field is optional beyond the minimum, and
 * all numbers are shown as given (rounded for display only); the report computes nothing here.
 */

export interface ReportDataResults {
	/** Where the data came from; nothing else about the data is written into the report. */
	source?: { name?: string; rows?: number; columns?: number };
	/** Checks of the diagram's implied independencies (claims) against the data. */
	checks?: ReportDataCheck[];
	/** Crude and adjusted effect estimates. */
	estimates?: ReportEstimate[];
	/** Free-text remarks shown under the tables (e.g. missing data handling). */
	notes?: string[];
	/** How each variable met the data: its column, the kind it was analysed as, its reference level. */
	columns?: ReportDataColumn[];
	/** The commands that reproduce the checks and estimates from the saved diagram file and the data file. */
	reproduce?: { diagramFile: string; dataFile: string; commands: string[] };
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
			for (const k of ['lower', 'upper', 'level', 'n']) optNumber(e, k, p);
			needString(e, 'note', p, true);
		});
	}
	if (value.notes !== undefined && (!Array.isArray(value.notes) || value.notes.some((x: Json) => typeof x !== 'string'))) fail('notes', 'a list of texts', value.notes);
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
