/**
 * The summary-matrix path, for when raw data cannot be shared or are too large: a
 * correlation or covariance matrix with n (and optionally means and SDs) supports the
 * checks that depend on the data only through second moments — arrow checks and claim
 * checks by (partial) correlation with Fisher's z, and linear-regression estimates
 * (src/lib/stats/regression/summary-stats.ts). Every variable is taken as continuous.
 *
 * Text form (comma, semicolon or tab separated; PapaParse reads it):
 *   ,age,income,bmi          first row: blank cell, then the variable names
 *   age,1,0.31,0.12          one row per variable, in the same order (a square matrix)
 *   …
 *   n,5000                   the sample size (required)
 *   mean,45,38,27            optional
 *   sd,11,10,3               optional (turns correlations into covariances)
 * A matrix with 1 on every diagonal cell is read as correlations, else as covariances.
 */
import Papa from 'papaparse';
import type { Diagram } from '../graph/diagram';
import { adjustmentSets, checkAdjustment, impliedClaims } from '../causal';
import { own, linearRegressionFromSummary, partialCorrelationFromSummary, StatsError, type SummaryStatistics } from '../stats';
import { associationStrength, DEFAULT_ALPHA, SMALL_STRENGTH, supportOf } from './arrow-checks';
import { claimFamily } from './claim-checks';
import { estimateQuestion, rowLabel, setsToEstimate, type EstimatesOutcome } from './estimates';
import { dataDiagram, mappedColumn, mapVariables } from './mapping';
import { settingsMapping, type SettingProblems } from './settings';
import type { ArrowCheck, DataCheckReport, EstimateRow, MappingOverrides } from './types';

function numberCell(cell: string, row: number, column: number): number {
	const t = cell.trim();
	const x = t === '' ? NaN : Number(t.replace(/^\+/, ''));
	if (!Number.isFinite(x)) throw new StatsError(`Row ${row}, column ${column}: '${t}' is not a number.`, { row });
	return x;
}

/** Reads the text form above. O(k²). Throws StatsError naming the row and column. */
export function parseSummaryMatrix(text: string): SummaryStatistics {
	const parsed = Papa.parse<string[]>(text.trim(), { skipEmptyLines: 'greedy' });
	const rows = parsed.data;
	if (rows.length < 3) throw new StatsError('A summary matrix needs a header row of names, one row per variable and an "n" row.');
	const names = rows[0].slice(1).map((s) => s.trim());
	const k = names.length;
	if (k < 2) throw new StatsError('Row 1: the header must name at least two variables after a blank first cell.', { row: 1 });
	const dup = names.find((n, i) => names.indexOf(n) !== i);
	if (dup !== undefined) throw new StatsError(`Row 1: the variable name '${dup}' appears twice.`, { row: 1 });
	const matrix: number[][] = [];
	let n: number | undefined;
	let means: number[] | undefined;
	let sds: number[] | undefined;
	for (let i = 1; i < rows.length; i++) {
		const row = rows[i];
		const label = (row[0] ?? '').trim();
		const key = label.toLowerCase();
		if (key === 'n') {
			n = numberCell(row[1] ?? '', i + 1, 2);
			if (!(Number.isInteger(n) && n > 0)) throw new StatsError(`Row ${i + 1}: n must be a positive whole number (got ${row[1]}).`, { row: i + 1 });
			continue;
		}
		if (key === 'mean' || key === 'sd') {
			if (row.length - 1 < k) throw new StatsError(`Row ${i + 1}: the ${key} row needs ${k} values.`, { row: i + 1 });
			const values = row.slice(1, k + 1).map((c, j) => numberCell(c, i + 1, j + 2));
			if (key === 'mean') means = values;
			else sds = values;
			continue;
		}
		const expected = names[matrix.length];
		if (expected === undefined) throw new StatsError(`Row ${i + 1}: '${label}' is one row too many for a ${k} × ${k} matrix.`, { row: i + 1 });
		if (label !== expected) throw new StatsError(`Row ${i + 1}: expected the row of '${expected}' (rows in the order of the header), found '${label}'.`, { row: i + 1 });
		if (row.length - 1 !== k) throw new StatsError(`Row ${i + 1} has ${row.length - 1} values; the header names ${k} variables.`, { row: i + 1 });
		matrix.push(row.slice(1).map((c, j) => numberCell(c, i + 1, j + 2)));
	}
	if (matrix.length !== k) throw new StatsError(`The matrix has ${matrix.length} rows for ${k} variables.`);
	if (n === undefined) throw new StatsError('The sample size is missing: add a row "n,<number>".');
	const type = matrix.every((r, i) => Math.abs(r[i] - 1) < 1e-9) ? 'correlation' : 'covariance';
	return { names, matrix, type, n, ...(means ? { means } : {}), ...(sds ? { sds } : {}) };
}

export interface SummaryCheckOptions {
	alpha?: number;
	mapping?: MappingOverrides;
	/** A diagram column link the matrix lacks: refused (default) or left out with a note. */
	settingProblems?: SettingProblems;
	planned?: readonly string[];
	maxClaims?: number;
	maxSets?: number;
}

function summaryEstimates(seen: Diagram, s: SummaryStatistics, columns: Record<string, string>, options: SummaryCheckOptions): EstimatesOutcome {
	const question = estimateQuestion(seen, columns, 'is not in the summary matrix');
	if ('message' in question) return { estimates: null, message: question.message };
	const { exposure: x, outcome: y } = question;
	// estimateQuestion has found both columns; the sets' members are checked row by row below.
	const col = (id: string) => mappedColumn({ columns }, id);
	const listing = adjustmentSets(seen, { max: options.maxSets ?? 20 });
	const wanted = setsToEstimate(listing, options.planned ?? seen.adjusted);
	const fit = (set: string[]) => {
		const r = linearRegressionFromSummary(s, col(y), [col(x), ...set.map(col)]);
		return r.coefficients.find((c) => c.name === col(x)) ?? null;
	};
	const crude = fit([]);
	const notes = ['From a summary matrix: linear regression on the second moments (every variable taken as continuous); no per-row checks (separation, missing values) are possible.'];
	if (s.type === 'correlation' && !s.sds) notes.push('Correlations without SDs: standardized coefficients.');
	const rows: EstimateRow[] = wanted.map((w) => {
		const blank = { roles: w.roles, label: rowLabel(w.roles, w.set), adjustedFor: w.set, n: s.n, term: col(x), estimate: NaN, ci: [NaN, NaN] as [number, number], pValue: NaN, crudeSameRows: null, crudeSameRowsCi: null, changePercent: null, changeMarked: false, standardized: null, sufficient: false, warnings: [] };
		const missing = w.set.filter((id) => own(columns, id) === undefined);
		if (missing.length > 0) return { ...blank, message: `Not estimated: ${missing.map((id) => `"${id}"`).join(', ')} not in the matrix.` };
		const sufficient = checkAdjustment(seen, { adjusted: w.set }).valid;
		try {
			const c = fit(w.set);
			if (!c) throw new StatsError('the exposure has no coefficient');
			const isCrude = w.set.length === 0;
			const change = !isCrude && crude ? (100 * (c.estimate - crude.estimate)) / crude.estimate : null;
			return { ...blank, sufficient, estimate: c.estimate, ci: c.ci, pValue: c.pValue, crudeSameRows: isCrude || !crude ? null : crude.estimate, crudeSameRowsCi: isCrude || !crude ? null : crude.ci, changePercent: change, changeMarked: change !== null && Math.abs(change) >= 10 };
		} catch (e) {
			if (!(e instanceof StatsError)) throw e;
			return { ...blank, sufficient, message: `Not estimated: ${e.message}` };
		}
	});
	return {
		estimates: { exposure: x, outcome: y, model: 'linear', measure: 'difference', nullValue: 0, rows, eValue: null, identifiable: listing.identifiable, notes, warnings: [] },
		message: null
	};
}

/** The data checks from a summary matrix (same report shape as runDataChecks). */
export function runSummaryChecks(diagram: Diagram, s: SummaryStatistics, options: SummaryCheckOptions = {}): DataCheckReport {
	const alpha = options.alpha ?? DEFAULT_ALPHA;
	// The diagram's column links apply to a matrix's names as to a table's columns (kinds do not: all are continuous).
	const links = settingsMapping(diagram, s.names, { mapping: options.mapping, settingProblems: options.settingProblems });
	const mapped = mapVariables(diagram, s.names, links.overrides);
	const mapping = { ...mapped, notes: [...links.notes, ...mapped.notes] };
	const seen = dataDiagram(diagram, mapping);
	const cols = mapping.columns;
	const checks: ArrowCheck[] = [];
	const skipped: { from: string; to: string; why: string }[] = [];
	for (const a of diagram.arrows) {
		if (cols[a.from] === undefined || cols[a.to] === undefined) {
			skipped.push({ from: a.from, to: a.to, why: 'not in the summary matrix' });
			continue;
		}
		const main = partialCorrelationFromSummary(s, cols[a.from], cols[a.to], []);
		main.test = "Pearson correlation, Fisher's z test (from the summary matrix)";
		main.effects[0] = { ...main.effects[0], name: 'Pearson r' };
		const strength = associationStrength([main]);
		const e = main.effects[0];
		const measure = { name: 'Pearson r', type: 'correlation' as const, value: e.value, ...(e.ci ? { ci: e.ci } : {}), smallBelow: SMALL_STRENGTH };
		checks.push({ from: a.from, to: a.to, columns: [cols[a.from], cols[a.to]], kinds: ['continuous', 'continuous'], support: supportOf(main.pValue, strength?.value ?? null, alpha, measure), measure, table: null, main, others: [], strength: strength?.value ?? null, strengthName: strength?.name ?? null, message: null });
	}
	const listed = impliedClaims(seen, { max: options.maxClaims === undefined ? undefined : options.maxClaims + 1 });
	const truncated = options.maxClaims !== undefined && listed.length > options.maxClaims;
	const claims = claimFamily(
		truncated ? listed.slice(0, options.maxClaims) : listed,
		(a, b, given) => ({ main: partialCorrelationFromSummary(s, cols[a], cols[b], given.map((g) => cols[g])), others: [] }),
		seen,
		alpha,
		truncated
	);
	const est = summaryEstimates(seen, s, cols, options);
	return {
		mapping,
		arrows: { alpha, checks, skipped },
		claims,
		estimates: est.estimates,
		estimatesMessage: est.message,
		confounders: null,
		categoryCodes: [],
		columns: Object.entries(mapping.columns).map(([variable, column]) => ({ variable, column, kind: 'continuous' as const, levels: [], numbersInFile: true, codeValues: null })),
		format: null,
		rowCount: s.n,
		notes: [`Summary ${s.type} matrix of ${s.names.length} variables, n = ${s.n}.`, ...mapping.notes]
	};
}
