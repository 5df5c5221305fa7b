/**
 * Contingency tables (cross-tabulations) and their chi-square-family statistics.
 */
import { StatsError } from '../errors';
import { completeRows, observedLevels } from '../table/columns';
import type { CodedColumn } from '../table/types';

/** An r × c table of counts, row-major. */
export interface ContingencyTable {
	counts: Float64Array;
	rows: number;
	cols: number;
	rowLevels: string[];
	colLevels: string[];
	n: number;
}

/** A table from nested arrays of counts (rows of the table). O(r·c). */
export function tableFromCounts(counts: readonly (readonly number[])[], rowLevels?: string[], colLevels?: string[]): ContingencyTable {
	const rows = counts.length;
	const cols = rows > 0 ? counts[0].length : 0;
	const flat = new Float64Array(rows * cols);
	let n = 0;
	counts.forEach((r, i) => {
		if (r.length !== cols) throw new StatsError(`Row ${i + 1} of the table has ${r.length} cells; expected ${cols}.`);
		r.forEach((v, j) => {
			if (!(v >= 0) || !Number.isFinite(v)) throw new StatsError(`Cell (${i + 1}, ${j + 1}) of the table is not a non-negative count.`);
			flat[i * cols + j] = v;
			n += v;
		});
	});
	return {
		counts: flat,
		rows,
		cols,
		rowLevels: rowLevels ?? counts.map((_, i) => String(i + 1)),
		colLevels: colLevels ?? Array.from({ length: cols }, (_, j) => String(j + 1)),
		n
	};
}

/**
 * Cross-tabulate two coded columns over their complete cases, keeping only observed
 * levels (a level with no complete case would give a zero margin). O(n + r·c).
 */
export function crossTabulate(a: CodedColumn, b: CodedColumn): ContingencyTable {
	const rows = completeRows([a, b]);
	const ra = observedLevels(a, rows);
	const rb = observedLevels(b, rows);
	const r = ra.levels.length;
	const c = rb.levels.length;
	const counts = new Float64Array(r * c);
	for (let k = 0; k < rows.length; k++) counts[ra.codes[k] * c + rb.codes[k]]++;
	return { counts, rows: r, cols: c, rowLevels: ra.levels, colLevels: rb.levels, n: rows.length };
}

export function rowSums(t: ContingencyTable): Float64Array {
	const s = new Float64Array(t.rows);
	for (let i = 0; i < t.rows; i++) for (let j = 0; j < t.cols; j++) s[i] += t.counts[i * t.cols + j];
	return s;
}

export function colSums(t: ContingencyTable): Float64Array {
	const s = new Float64Array(t.cols);
	for (let i = 0; i < t.rows; i++) for (let j = 0; j < t.cols; j++) s[j] += t.counts[i * t.cols + j];
	return s;
}

/** Expected counts under independence, E_ij = R_i·C_j / n. O(r·c). */
export function expectedCounts(t: ContingencyTable): Float64Array {
	const rs = rowSums(t);
	const cs = colSums(t);
	const e = new Float64Array(t.rows * t.cols);
	for (let i = 0; i < t.rows; i++) for (let j = 0; j < t.cols; j++) e[i * t.cols + j] = t.n > 0 ? (rs[i] * cs[j]) / t.n : 0;
	return e;
}

/** Pearson's X² = Σ (O − E)² / E over cells with E > 0. O(r·c). */
export function pearsonStatistic(t: ContingencyTable, expected = expectedCounts(t)): number {
	let x2 = 0;
	for (let k = 0; k < t.counts.length; k++) {
		const e = expected[k];
		if (e > 0) x2 += ((t.counts[k] - e) * (t.counts[k] - e)) / e;
	}
	return x2;
}

/** The likelihood-ratio statistic G² = 2 Σ O ln(O / E) over cells with O > 0. O(r·c). */
export function likelihoodRatioStatistic(t: ContingencyTable, expected = expectedCounts(t)): number {
	let g = 0;
	for (let k = 0; k < t.counts.length; k++) {
		const o = t.counts[k];
		if (o > 0) g += o * Math.log(o / expected[k]);
	}
	return 2 * g;
}

/** Number of rows and columns with a non-zero margin. */
export function nonEmptyDims(t: ContingencyTable): { rows: number; cols: number } {
	return { rows: rowSums(t).filter((v) => v > 0).length, cols: colSums(t).filter((v) => v > 0).length };
}
