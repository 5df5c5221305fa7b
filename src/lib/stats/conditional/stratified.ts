/**
 * Conditional independence of two discrete variables given discrete strata.
 * - Stratified G-test: the sum over strata of the likelihood-ratio statistics of
 *   independence, df = Σ (r_k − 1)(c_k − 1) over the levels observed in each stratum — the
 *   deviance of the log-linear model of conditional independence [XZ][YZ] (Agresti,
 *   Categorical Data Analysis, 3rd ed., §9.2). O(n + K·r·c).
 * - Cochran–Mantel–Haenszel test for 2 × 2 × K tables (Cochran 1954; Mantel & Haenszel
 *   1959) with the Mantel–Haenszel common odds ratio and its Robins–Breslow–Greenland
 *   (1986) confidence interval; continuity correction 0.5 by default, as R's
 *   mantelhaen.test. Strata with fewer than 2 cases carry no information and are left out.
 *   O(n + K).
 */
import { chiSquareSf, normalQuantile } from '../distributions';
import { StatsError } from '../errors';
import { likelihoodRatioStatistic } from '../association/contingency';
import { dropEmptyMargins } from '../association/chi-square';
import { completeRows, observedLevels } from '../table/columns';
import type { CodedColumn } from '../table/types';
import type { TestResult } from '../types';
import type { TableStatistics } from '../sufficient/table-statistics';

/** Counts of x × y in each stratum: Float64Array of K·r·c, stratum-major. */
export interface StratifiedTables {
	counts: Float64Array;
	strata: number;
	rows: number;
	cols: number;
	rowLevels: string[];
	colLevels: string[];
	/** Stratum labels, e.g. "age=old, sex=f". */
	strataLabels: string[];
	n: number;
}

/** Cross-tabulate x × y within the strata formed by `given` (complete cases). O(n·|given|). */
export function stratify(x: CodedColumn, y: CodedColumn, given: readonly CodedColumn[], stats?: TableStatistics): StratifiedTables {
	const rows = stats ? stats.rows([x, y, ...given]) : completeRows([x, y, ...given]);
	const observe = (c: CodedColumn) => (stats ? stats.observed(c, rows) : observedLevels(c, rows));
	const ox = observe(x);
	const oy = observe(y);
	const og = given.map(observe);
	// Mixed-radix stratum key, then renumber the keys that occur (in order of first occurrence);
	// a direct-address table when the keys are few (a Map lookup per row was 5 % of a
	// million-row check), a Map otherwise.
	let space = 1;
	for (const g of og) space *= g.levels.length;
	const direct = space <= 1 << 22 ? new Int32Array(space).fill(-1) : null;
	const keyOf = new Map<number, number>();
	const labels: string[] = [];
	const stratumOf = new Int32Array(rows.length);
	for (let k = 0; k < rows.length; k++) {
		let key = 0;
		for (const g of og) key = key * g.levels.length + g.codes[k];
		let s = direct ? direct[key] : (keyOf.get(key) ?? -1);
		if (s < 0) {
			s = labels.length;
			if (direct) direct[key] = s;
			else keyOf.set(key, s);
			labels.push(og.map((g, i) => `${given[i].name}=${g.levels[g.codes[k]]}`).join(', '));
		}
		stratumOf[k] = s;
	}
	const r = ox.levels.length;
	const c = oy.levels.length;
	const counts = new Float64Array(labels.length * r * c);
	for (let k = 0; k < rows.length; k++) counts[stratumOf[k] * r * c + ox.codes[k] * c + oy.codes[k]]++;
	return { counts, strata: labels.length, rows: r, cols: c, rowLevels: ox.levels, colLevels: oy.levels, strataLabels: labels, n: rows.length };
}

/** Stratified tables from nested arrays [stratum][row][col] (e.g. a published 2 × 2 × K table). */
export function stratifiedFromCounts(tables: readonly (readonly (readonly number[])[])[]): StratifiedTables {
	const strata = tables.length;
	const r = tables[0]?.length ?? 0;
	const c = tables[0]?.[0]?.length ?? 0;
	const counts = new Float64Array(strata * r * c);
	let n = 0;
	tables.forEach((t, s) =>
		t.forEach((row, i) =>
			row.forEach((v, j) => {
				counts[s * r * c + i * c + j] = v;
				n += v;
			})
		)
	);
	return {
		counts,
		strata,
		rows: r,
		cols: c,
		rowLevels: Array.from({ length: r }, (_, i) => String(i + 1)),
		colLevels: Array.from({ length: c }, (_, j) => String(j + 1)),
		strataLabels: tables.map((_, s) => `stratum ${s + 1}`),
		n
	};
}

function stratumTable(t: StratifiedTables, s: number) {
	const size = t.rows * t.cols;
	const counts = t.counts.slice(s * size, (s + 1) * size);
	let n = 0;
	for (const v of counts) n += v;
	return { counts, rows: t.rows, cols: t.cols, rowLevels: t.rowLevels, colLevels: t.colLevels, n };
}

export function stratifiedGTest(t: StratifiedTables): TestResult {
	let g2 = 0;
	let df = 0;
	let uninformative = 0;
	for (let s = 0; s < t.strata; s++) {
		const table = dropEmptyMargins(stratumTable(t, s));
		if (table.rows < 2 || table.cols < 2) {
			uninformative++;
			continue;
		}
		g2 += likelihoodRatioStatistic(table);
		df += (table.rows - 1) * (table.cols - 1);
	}
	if (df === 0) throw new StatsError('No stratum has two observed levels of both variables; conditional independence cannot be tested.');
	const notes = [`${t.strata} strata.`];
	if (uninformative > 0) notes.push(`${uninformative} strata with only one observed level of a variable add nothing.`);
	return {
		test: 'Stratified likelihood-ratio G-test',
		statisticName: 'G²',
		statistic: g2,
		df: [df],
		pValue: chiSquareSf(g2, df),
		n: t.n,
		effects: [],
		notes,
		reference: 'Sum of per-stratum G² statistics; Agresti, Categorical Data Analysis, 3rd ed., §9.2'
	};
}

export function cochranMantelHaenszel(t: StratifiedTables, options: { continuityCorrection?: boolean } = {}): TestResult {
	if (t.rows !== 2 || t.cols !== 2)
		throw new StatsError(`The Cochran–Mantel–Haenszel test here needs two binary variables (found ${t.rows} × ${t.cols} levels).`);
	const correct = options.continuityCorrection ?? true;
	let delta = 0;
	let variance = 0;
	let sx = 0; // Σ a·d/n
	let sy = 0; // Σ b·c/n
	let v1 = 0;
	let v2 = 0;
	let v3 = 0;
	let used = 0;
	let n = 0;
	for (let s = 0; s < t.strata; s++) {
		const [a, b, c, d] = t.counts.subarray(s * 4, s * 4 + 4);
		const nk = a + b + c + d;
		if (nk < 2) continue;
		used++;
		n += nk;
		const r1 = a + b;
		const r2 = c + d;
		const c1 = a + c;
		const c2 = b + d;
		delta += a - (r1 * c1) / nk;
		variance += (r1 * r2 * c1 * c2) / (nk * nk * (nk - 1));
		sx += (a * d) / nk;
		sy += (b * c) / nk;
		v1 += ((a + d) * a * d) / (nk * nk);
		v2 += ((a + d) * b * c + (b + c) * a * d) / (nk * nk);
		v3 += ((b + c) * b * c) / (nk * nk);
	}
	if (!(variance > 0)) throw new StatsError('The Cochran–Mantel–Haenszel test is undefined: no stratum has variation in both variables.');
	const yates = correct && Math.abs(delta) >= 0.5 ? 0.5 : 0;
	const statistic = (Math.abs(delta) - yates) ** 2 / variance;
	const or = sx / sy;
	const se = Math.sqrt(v1 / (2 * sx * sx) + v2 / (2 * sx * sy) + v3 / (2 * sy * sy));
	const z = normalQuantile(0.975);
	const notes = [`${used} strata used.`, correct ? 'With continuity correction 0.5.' : 'No continuity correction.'];
	if (used < t.strata) notes.push(`${t.strata - used} strata with fewer than 2 cases left out.`);
	return {
		test: 'Cochran–Mantel–Haenszel test',
		statisticName: 'X²',
		statistic,
		df: [1],
		pValue: chiSquareSf(statistic, 1),
		n,
		effects: [
			{
				name: 'Mantel–Haenszel common odds ratio',
				value: or,
				ci: [or * Math.exp(-z * se), or * Math.exp(z * se)],
				note: '95 % interval with the Robins–Breslow–Greenland variance.'
			}
		],
		notes,
		reference: 'Cochran (1954); Mantel & Haenszel (1959); Robins, Breslow & Greenland (1986)'
	};
}
