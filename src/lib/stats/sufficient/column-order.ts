/**
 * A numeric column put in order once (ranks.ts's radix sort, O(n)), then read for any set
 * of its rows in O(n) without sorting again:
 * - mid-ranks and the tie sum over those rows — the same numbers midRanks gives on the rows'
 *   values, so Spearman's rho and the Kruskal–Wallis test are unchanged;
 * - the rows (or their values) in ascending order (fifths, box plots);
 * - dense ids of the distinct values over all rows (covariate patterns for grouped fits).
 * Reason: the arrow and claim checks ranked the same columns over and over (the radix sort
 * was 8 % of `causeway test` on 10⁶ rows, profiled with node --cpu-prof).
 */
import { sortedOrder, type Ranking, type SortScratch } from '../association/ranks';
import type { Interrupt } from './interrupt';

export class ColumnOrder {
	/** Row indices in ascending order of value (missing values last or first; never read). */
	readonly order: Uint32Array;
	private ids: { ids: Int32Array; count: number } | null = null;
	/** The ranks over every row, kept: most checks use complete columns. */
	private allRanks: Ranking | null = null;
	private first: Int32Array | null = null;

	constructor(
		readonly values: Float64Array,
		scratch?: SortScratch
	) {
		this.order = sortedOrder(values, scratch);
	}

	/** Position of each of `rows` in that list (−1 for other rows); null when `rows` is every row. */
	private positions(rows: Int32Array): Int32Array | null {
		const n = this.values.length;
		if (rows.length === n) return null;
		const pos = new Int32Array(n).fill(-1);
		for (let k = 0; k < rows.length; k++) pos[rows[k]] = k;
		return pos;
	}

	/** Mid-ranks of the values at `rows` (in the order of `rows`) and Σ(t³ − t) over ties. O(n). */
	midRanks(rows: Int32Array, interrupt?: Interrupt): Ranking {
		if (rows.length === this.values.length) return (this.allRanks ??= this.ranksOver(rows, interrupt));
		return this.ranksOver(rows, interrupt);
	}

	/**
	 * Mid-ranks from the dense ids of the distinct values: the rows of each id counted, each
	 * id's mid-rank from the counts before it, then one gather per row. Reason: walking the
	 * order read the values and wrote the ranks at random rows (a cache miss each at 10⁶ rows;
	 * ranksOver was 9 % of `causeway test`, node --cpu-prof); here the rows are read in their
	 * own order and only the small per-id tables are read at random. Same numbers and sums, in
	 * the same order as walking the runs of equal values. O(n + distinct values).
	 */
	private ranksOver(rows: Int32Array, interrupt?: Interrupt): Ranking {
		interrupt?.poll();
		const { ids, count } = this.distinctIds();
		const counts = new Float64Array(count);
		for (let k = 0; k < rows.length; k++) {
			const id = ids[rows[k]];
			if (id >= 0) counts[id]++;
		}
		interrupt?.poll();
		const mid = new Float64Array(count);
		let tieSum = 0;
		let rank = 0; // ranks given so far
		for (let id = 0; id < count; id++) {
			const t = counts[id];
			if (t === 0) continue;
			mid[id] = (2 * rank + t + 1) / 2;
			if (t > 1) tieSum += t * t * t - t;
			rank += t;
		}
		const ranks = new Float64Array(rows.length);
		for (let k = 0; k < rows.length; k++) {
			const id = ids[rows[k]];
			if (id >= 0) ranks[k] = mid[id];
		}
		return { ranks, tieSum };
	}

	/**
	 * `rows` in ascending order of value, ties in row order. When `rows` ascend and have no
	 * missing value (every complete-case set): a counting sort on the distinct-value ids, which
	 * reads the rows in their own order (walking the sort order read at random rows: sortedRows
	 * and sortedValues were 17 % of `causeway estimate`, node --cpu-prof). Else the walk. O(n).
	 */
	sortedRows(rows: Int32Array): Int32Array {
		const starts = this.idStarts(rows);
		if (starts === null) return this.walkSorted(rows);
		const ids = (this.ids as { ids: Int32Array }).ids;
		const out = new Int32Array(rows.length);
		for (let k = 0; k < rows.length; k++) out[starts[ids[rows[k]]]++] = rows[k];
		return out;
	}

	/** The values at `rows`, ascending. O(n). */
	sortedValues(rows: Int32Array): Float64Array {
		const counts = this.idCounts(rows);
		if (counts === null) {
			const sorted = this.walkSorted(rows);
			const out = new Float64Array(sorted.length);
			for (let k = 0; k < sorted.length; k++) out[k] = this.values[sorted[k]];
			return out;
		}
		const first = this.firstRows();
		const out = new Float64Array(rows.length);
		let k = 0;
		for (let id = 0; id < counts.length; id++) {
			const v = this.values[first[id]];
			for (let c = counts[id]; c > 0; c--) out[k++] = v;
		}
		return out;
	}

	/** Rows per distinct-value id over `rows`; null when `rows` do not ascend or hold a missing value. */
	private idCounts(rows: Int32Array): Int32Array | null {
		const { ids, count } = this.distinctIds();
		const counts = new Int32Array(count);
		let last = -1;
		for (let k = 0; k < rows.length; k++) {
			const r = rows[k];
			const id = ids[r];
			if (id < 0 || r <= last) return null;
			counts[id]++;
			last = r;
		}
		return counts;
	}

	/** Where each id's rows start in the sorted output (prefix sums of idCounts), or null. */
	private idStarts(rows: Int32Array): Int32Array | null {
		const counts = this.idCounts(rows);
		if (counts === null) return null;
		let at = 0;
		for (let id = 0; id < counts.length; id++) {
			const c = counts[id];
			counts[id] = at;
			at += c;
		}
		return counts;
	}

	/** A row holding each distinct value (the first in the sort order). */
	private firstRows(): Int32Array {
		if (this.first) return this.first;
		const { ids, count } = this.distinctIds();
		const first = new Int32Array(count).fill(-1);
		for (let r = ids.length - 1; r >= 0; r--) if (ids[r] >= 0) first[ids[r]] = r;
		return (this.first = first);
	}

	/** The sort order walked, keeping `rows`. O(n). */
	private walkSorted(rows: Int32Array): Int32Array {
		const { order, values } = this;
		const pos = this.positions(rows);
		const out = new Int32Array(rows.length);
		let k = 0;
		for (let i = 0; i < order.length && k < out.length; i++) {
			const r = order[i];
			if (pos === null ? values[r] === values[r] : pos[r] >= 0) out[k++] = r;
		}
		return out;
	}

	/** Number of distinct values (missing not counted): from distinctIds, which the ranks and patterns use too. O(n) once. */
	distinctCount(): number {
		return this.distinctIds().count;
	}

	/** Dense ids 0…count−1 of the distinct values, per row (−1 for missing). O(n). */
	distinctIds(): { ids: Int32Array; count: number } {
		if (this.ids) return this.ids;
		const { order, values } = this;
		const ids = new Int32Array(values.length).fill(-1);
		let count = 0;
		let last = NaN;
		for (let i = 0; i < order.length; i++) {
			const r = order[i];
			const v = values[r];
			if (v !== v) continue;
			if (count === 0 || v !== last) count++;
			ids[r] = count - 1;
			last = v;
		}
		this.ids = { ids, count };
		return this.ids;
	}
}
