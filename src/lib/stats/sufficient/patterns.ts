/**
 * Covariate patterns: the rows of a design grouped by their values, with the number of rows
 * and of 1s of a 0/1 outcome in each — the binomial likelihood's sufficient statistics, on
 * which irls.ts fits in O(patterns·p²) per iteration. Used when the product of the sources'
 * numbers of distinct values (a coded column's levels, a numeric column's distinct values)
 * is small, e.g. a binary exposure with a whole-number age: at most a quarter of the rows
 * and 2²² slots for the direct-address table. O(n·sources).
 */
import { materialize, type DesignPlan } from '../regression/design';
import { POLL_MASK, type Interrupt } from './interrupt';

/** A source column of the design: per-row ids 0…count−1 (codes, or ids of distinct values). */
export interface PatternSource {
	ids: Int32Array;
	count: number;
}

export interface Patterns {
	/** One design row per pattern (patterns × p, row-major). */
	x: Float64Array;
	units: number;
	trials: Float64Array;
	events: Float64Array;
}

const MAX_SLOTS = 1 << 22;

/** Whether grouping pays: few enough patterns (the product of the sources' counts) for the rows. */
export function fewPatterns(counts: readonly number[], rows: number): boolean {
	let product = 1;
	for (const c of counts) product *= Math.max(1, c);
	return product <= MAX_SLOTS && product * 4 <= rows;
}

/** Group the plan's rows by the sources' ids; `outcome` gives each data row's 0/1 (null: events are not counted). */
export function groupPatterns(plan: DesignPlan, sources: readonly PatternSource[], outcome: Int32Array | null, interrupt?: Interrupt): Patterns {
	const rows = plan.rows;
	let product = 1;
	const strides = sources.map((s) => {
		const stride = product;
		product *= Math.max(1, s.count);
		return stride;
	});
	const slot = new Int32Array(product).fill(-1);
	const representative: number[] = [];
	const trials: number[] = [];
	const events: number[] = [];
	for (let k = 0; k < rows.length; k++) {
		if ((k & POLL_MASK) === 0) interrupt?.poll();
		const r = rows[k];
		let key = 0;
		for (let s = 0; s < sources.length; s++) key += sources[s].ids[r] * strides[s];
		let g = slot[key];
		if (g < 0) {
			g = slot[key] = representative.length;
			representative.push(r);
			trials.push(0);
			events.push(0);
		}
		trials[g]++;
		if (outcome) events[g] += outcome[r];
	}
	const units = representative.length;
	const x = materialize({ ...plan, rows: Int32Array.from(representative), n: units, response: null }).x;
	return { x, units, trials: Float64Array.from(trials), events: Float64Array.from(events) };
}
