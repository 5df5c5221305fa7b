/**
 * The numbers behind the small picture beside each arrow check (the app draws them as SVG):
 * - two discrete columns: the cross-table, drawn as stacked bars (share of each level of the
 *   arrow's head within each level of its tail);
 * - two continuous columns: an evenly spaced sample of at most 300 points and the
 *   least-squares line over all complete cases;
 * - a discrete and a continuous column: a box plot per level (quartiles by R's default
 *   type-7 rule, Hyndman & Fan 1996; whiskers to the furthest value within 1.5 IQR, Tukey 1977).
 * Complete cases only. O(n) for bars and scatter, O(n log n) for box plots.
 */
import { completeRows, type CodedColumn, type Column, type ContinuousColumn, type TableStatistics } from '../stats';

export interface BarsPicture {
	kind: 'bars';
	/** Levels of the arrow's tail (one bar each). */
	xLevels: string[];
	/** Levels of the arrow's head (the stacked parts). */
	yLevels: string[];
	/** counts[x][y]. */
	counts: number[][];
	n: number;
}

export interface ScatterPicture {
	kind: 'scatter';
	x: number[];
	y: number[];
	/** Least-squares line y = intercept + slope·x over all complete cases (null when x does not vary). */
	trend: { intercept: number; slope: number } | null;
	n: number;
}

export interface BoxStats {
	level: string;
	n: number;
	q1: number;
	median: number;
	q3: number;
	lowWhisker: number;
	highWhisker: number;
	/** Values beyond the whiskers (count only). */
	outside: number;
}

export interface BoxPicture {
	kind: 'box';
	/** The discrete column's name (one box per level) and whether it is the arrow's tail. */
	groupColumn: string;
	groupIsTail: boolean;
	boxes: BoxStats[];
	n: number;
}

export type PictureData = BarsPicture | ScatterPicture | BoxPicture;

const MAX_POINTS = 300;

/** With the table's statistics, rows and the numeric column's order are shared (no sort per picture). */
export function pictureData(tail: Column, head: Column, stats?: TableStatistics): PictureData {
	const rows = stats ? stats.rows([tail, head]) : completeRows([tail, head]);
	if (tail.kind !== 'continuous' && head.kind !== 'continuous') return bars(tail, head, rows);
	if (tail.kind === 'continuous' && head.kind === 'continuous') return scatter(tail, head, rows);
	const [group, value, groupIsTail] = tail.kind === 'continuous' ? [head as CodedColumn, tail, false] : [tail, head as ContinuousColumn, true];
	return box(group, value, stats ? stats.order(value.values).sortedRows(rows) : rows, groupIsTail, !!stats);
}

function bars(x: CodedColumn, y: CodedColumn, rows: Int32Array): BarsPicture {
	const counts = x.levels.map(() => new Array<number>(y.levels.length).fill(0));
	for (const r of rows) counts[x.codes[r]][y.codes[r]]++;
	// Levels never observed together with the other column are left out.
	const keepX = counts.map((c) => c.some((v) => v > 0));
	const keepY = y.levels.map((_, j) => counts.some((c) => c[j] > 0));
	return {
		kind: 'bars',
		xLevels: x.levels.filter((_, i) => keepX[i]),
		yLevels: y.levels.filter((_, j) => keepY[j]),
		counts: counts.filter((_, i) => keepX[i]).map((c) => c.filter((_, j) => keepY[j])),
		n: rows.length
	};
}

function scatter(x: ContinuousColumn, y: ContinuousColumn, rows: Int32Array): ScatterPicture {
	const n = rows.length;
	let mx = 0;
	let my = 0;
	for (const r of rows) {
		mx += x.values[r];
		my += y.values[r];
	}
	mx /= n;
	my /= n;
	let sxx = 0;
	let sxy = 0;
	for (const r of rows) {
		const dx = x.values[r] - mx;
		sxx += dx * dx;
		sxy += dx * (y.values[r] - my);
	}
	const trend = sxx > 0 ? { slope: sxy / sxx, intercept: my - (sxy / sxx) * mx } : null;
	const count = Math.min(n, MAX_POINTS);
	const xs: number[] = [];
	const ys: number[] = [];
	for (let i = 0; i < count; i++) {
		const r = rows[Math.floor((i * n) / count)];
		xs.push(x.values[r]);
		ys.push(y.values[r]);
	}
	return { kind: 'scatter', x: xs, y: ys, trend, n };
}

/** Quantile by R's type 7 rule on sorted values. */
function quantile(sorted: Float64Array, p: number): number {
	const h = (sorted.length - 1) * p;
	const lo = Math.floor(h);
	const hi = Math.min(sorted.length - 1, lo + 1);
	return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
}

/** `rows`: the complete cases, already in ascending order of value when `sorted`. */
function box(group: CodedColumn, value: ContinuousColumn, rows: Int32Array, groupIsTail: boolean, sorted: boolean): BoxPicture {
	const sizes = new Int32Array(group.levels.length);
	for (const r of rows) sizes[group.codes[r]]++;
	const parts = Array.from(sizes, (s) => new Float64Array(s));
	const fill = new Int32Array(group.levels.length);
	for (const r of rows) {
		const g = group.codes[r];
		parts[g][fill[g]++] = value.values[r];
	}
	const boxes: BoxStats[] = [];
	parts.forEach((v, g) => {
		if (v.length === 0) return;
		if (!sorted) v.sort();
		const q1 = quantile(v, 0.25);
		const q3 = quantile(v, 0.75);
		const fence = 1.5 * (q3 - q1);
		let lowWhisker = q1;
		let highWhisker = q3;
		let outside = 0;
		for (const x of v) {
			if (x < q1 - fence || x > q3 + fence) outside++;
			else {
				if (x < lowWhisker) lowWhisker = x;
				if (x > highWhisker) highWhisker = x;
			}
		}
		boxes.push({ level: group.levels[g], n: v.length, q1, median: quantile(v, 0.5), q3, lowWhisker, highWhisker, outside });
	});
	return { kind: 'box', groupColumn: group.name, groupIsTail, boxes, n: rows.length };
}
