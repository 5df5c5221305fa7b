/**
 * Mid-ranks (ties get the average of the ranks they span) and the tie sizes needed for
 * tie corrections. O(n log n): one native numeric sort of a copy, then a binary search per
 * value (no comparator callbacks, no per-value objects).
 */

export interface Ranking {
	/** 1-based mid-ranks, in the order of the input. */
	ranks: Float64Array;
	/** Σ (t³ − t) over groups of t tied values. */
	tieSum: number;
}

export function midRanks(values: Float64Array): Ranking {
	const sorted = values.slice().sort();
	const n = sorted.length;
	const ranks = new Float64Array(n);
	for (let i = 0; i < n; i++) {
		const v = values[i];
		const lo = lowerBound(sorted, v);
		const hi = upperBound(sorted, v, lo);
		ranks[i] = (lo + 1 + hi) / 2;
	}
	let tieSum = 0;
	for (let i = 0; i < n; ) {
		let j = i + 1;
		while (j < n && sorted[j] === sorted[i]) j++;
		const t = j - i;
		if (t > 1) tieSum += t * t * t - t;
		i = j;
	}
	return { ranks, tieSum };
}

function lowerBound(a: Float64Array, v: number): number {
	let lo = 0;
	let hi = a.length;
	while (lo < hi) {
		const mid = (lo + hi) >>> 1;
		if (a[mid] < v) lo = mid + 1;
		else hi = mid;
	}
	return lo;
}

function upperBound(a: Float64Array, v: number, from: number): number {
	let lo = from;
	let hi = a.length;
	while (lo < hi) {
		const mid = (lo + hi) >>> 1;
		if (a[mid] <= v) lo = mid + 1;
		else hi = mid;
	}
	return lo;
}
