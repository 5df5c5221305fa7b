/**
 * Statistics of a table computed once and reused by every check that needs them, instead of
 * each test re-reading the rows (profiled on the demo study at 10⁶ rows with node
 * --cpu-prof: 83 % of `causeway test` was nested-model tests re-scanning the rows 8–10 times
 * per claim, with nothing shared):
 * - complete-case row sets, one per set of columns with missing values involved;
 * - centred cross-products per row set (moments.ts): every linear model, partial
 *   correlation and collinearity check on those rows;
 * - each numeric column's order (column-order.ts): ranks for any row set, distinct values;
 * - count tables of pairs of coded columns;
 * - logistic fits, by model and rows: on covariate patterns when they are few (patterns.ts),
 *   else on the rows, optionally warm-started from a nested model's fit (irls.ts).
 * Keys are the table's arrays (keys.ts), so a retyped copy of a column shares its entries.
 * Long loops poll the interrupt (interrupt.ts). Pass one object to all the checks of a table.
 */
import type { ContingencyTable } from '../association/contingency';
import { sortScratch, type Ranking, type SortScratch } from '../association/ranks';
import { StatsError } from '../errors';
import { collinearityFromGram, type CollinearityCheck } from '../regression/collinearity';
import { planDesign, type Design, type DesignPlan, type DesignVector } from '../regression/design';
import type { DesignSource } from '../regression/irls-row-pass';
import { irls } from '../regression/irls';
import { binaryNullDeviance, fitLogistic, logisticFit, type LogisticFit } from '../regression/logistic';
import { columnLength, completeRows, numericValues, observedLevels } from '../table/columns';
import type { CodedColumn, Column } from '../table/types';
import { ColumnOrder } from './column-order';
import { NEVER, type Interrupt } from './interrupt';
import { keyOf } from './keys';
import { leastSquares, type LeastSquares } from './least-squares';
import { Moments, vectorKey, type TableVector } from './moments';
import { fewPatterns, groupPatterns, type PatternSource } from './patterns';

/** Least squares of a plan's outcome on some of its columns, with what a LinearFit reports. */
export interface MomentFit {
	check: CollinearityCheck;
	ls: LeastSquares;
	/** Names and means of the kept columns (intercept excluded), the outcome's mean and centred sum of squares. */
	names: string[];
	means: Float64Array;
	meanY: number;
	tss: number;
}

type NonIntercept = Exclude<DesignVector, { kind: 'one' }>;

/** Most vectors whose cross-products are computed ahead (24 vectors: 300 products per row). */
const MAX_EXPECTED = 24;

function dataOf(c: Column): object {
	return c.kind === 'continuous' ? c.values : c.codes;
}

/** A column's identity for the caches: its array, name, kind and levels. */
function columnKey(c: Column): string {
	return `${keyOf(dataOf(c))}:${c.kind}:${c.name}${c.kind === 'continuous' ? '' : `:${c.levels.join('\u0000')}`}`;
}

/** A plan's rows, or its covariate patterns with their numbers of rows, as design rows. */
export interface Units {
	x: Float64Array;
	stride: number;
	/** The design columns wanted, as indices into a row of `x`. */
	cols: Int32Array;
	units: number;
	/** Rows per unit; null when each unit is one row. */
	weights: Float64Array | null;
	/** Rows read from the plan's vectors (irls-row-pass.ts fillBlock) rather than from `x`. */
	source?: DesignSource;
}

export class TableStatistics {
	/** Polled by long loops; the data checks set it per run. */
	interrupt: Interrupt;
	/** Polls whichever interrupt is current (for the caches that outlive a run). */
	private readonly current: Interrupt = { poll: () => this.interrupt.poll() };
	private readonly rowSets = new Map<string, Int32Array>();
	private readonly moments = new WeakMap<Int32Array, Moments>();
	private readonly orders = new WeakMap<Float64Array, ColumnOrder>();
	private readonly numbers = new WeakMap<Int32Array, Float64Array>();
	private readonly levelCounts = new WeakMap<Int32Array, number>();
	private readonly tables = new Map<string, ContingencyTable>();
	private readonly fits = new Map<string, LogisticFit>();
	private readonly fitKeys = new WeakMap<LogisticFit, string>();
	private scratch: SortScratch | null = null;
	/** Arrays whose missing values define each row set. */
	private readonly rowSetArrays = new WeakMap<Int32Array, Set<object>>();
	private expected: Column[] = [];
	private readonly missingness = new WeakMap<object, boolean>();
	private readonly plans = new Map<string, DesignPlan>();
	private readonly observedCache = new Map<string, { codes: Int32Array; levels: string[] }>();

	constructor(options: { interrupt?: Interrupt } = {}) {
		this.interrupt = options.interrupt ?? NEVER;
	}

	/** Complete cases of the columns (as completeRows), one array per set of columns with missing values. O(n·k) once. */
	rows(columns: readonly Column[]): Int32Array {
		if (columns.length === 0) return new Int32Array(0);
		const n = columnLength(columns[0]);
		for (const c of columns) if (columnLength(c) !== n) return completeRows(columns); // refused there, with its message
		const withMissing = columns.filter((c) => this.hasMissing(c));
		const key = `${n}:${[...new Set(withMissing.map((c) => keyOf(dataOf(c))))].sort((a, b) => a - b).join(',')}`;
		let rows = this.rowSets.get(key);
		if (!rows) {
			this.interrupt.poll();
			rows = withMissing.length === 0 ? Int32Array.from({ length: n }, (_, i) => i) : completeRows(withMissing);
			this.rowSets.set(key, rows);
			this.rowSetArrays.set(rows, new Set(withMissing.map(dataOf)));
		}
		return rows;
	}

	/** Whether the column has a missing value (looked at once per array). O(n) once. */
	private hasMissing(c: Column): boolean {
		const data = dataOf(c);
		let has = this.missingness.get(data);
		if (has === undefined) {
			has = false;
			if (c.kind === 'continuous') {
				const v = c.values;
				for (let i = 0; i < v.length && !has; i++) has = v[i] !== v[i];
			} else {
				const codes = c.codes;
				for (let i = 0; i < codes.length && !has; i++) has = codes[i] < 0;
			}
			this.missingness.set(data, has);
		}
		return has;
	}

	/**
	 * The columns the checks will use (the linked ones): the cross-products among them are
	 * computed together, in one pass per row set, when the first model asks for any.
	 */
	expect(columns: readonly Column[]): void {
		this.expected = [...columns];
	}

	/** Centred cross-products over a row set (from `rows`). */
	momentsOf(rows: Int32Array): Moments {
		let m = this.moments.get(rows);
		if (!m) {
			const arrays = this.rowSetArrays.get(rows);
			const valid = this.expected.filter((c) => !this.hasMissing(c) || arrays?.has(dataOf(c)));
			const vectors: TableVector[] = valid.flatMap((c): TableVector[] =>
				c.kind === 'continuous' ? [{ kind: 'values', values: c.values }] : c.levels.slice(1).map((_, l) => ({ kind: 'level', codes: c.codes, level: l + 1 }))
			);
			m = new Moments(rows, this.current, vectors.length <= MAX_EXPECTED ? vectors : []);
			this.moments.set(rows, m);
		}
		return m;
	}

	order(values: Float64Array): ColumnOrder {
		let o = this.orders.get(values);
		if (!o) {
			this.interrupt.poll();
			if (this.scratch?.copy.length !== values.length) this.scratch = sortScratch(values.length);
			o = new ColumnOrder(values, this.scratch);
			this.orders.set(values, o);
		}
		return o;
	}

	/** A column as numbers (numericValues), made once per coded column. */
	numeric(column: Column): Float64Array {
		if (column.kind === 'continuous') return column.values;
		let v = this.numbers.get(column.codes);
		if (!v) {
			v = numericValues(column);
			this.numbers.set(column.codes, v);
		}
		return v;
	}

	/** Mid-ranks of the column (as numbers) over `rows`: the column's order read, or counts of codes. O(n). */
	midRanks(column: Column, rows: Int32Array): Ranking {
		if (column.kind === 'continuous') return this.order(column.values).midRanks(rows, this.interrupt);
		numericValues(column); // a categorical column has no ranks: refused with its message
		const codes = column.codes;
		const counts = new Float64Array(column.levels.length);
		for (let k = 0; k < rows.length; k++) counts[codes[rows[k]]]++;
		const mid = new Float64Array(counts.length);
		let before = 0;
		let tieSum = 0;
		counts.forEach((t, l) => {
			mid[l] = (2 * before + t + 1) / 2;
			if (t > 1) tieSum += t * t * t - t;
			before += t;
		});
		const ranks = new Float64Array(rows.length);
		for (let k = 0; k < rows.length; k++) ranks[k] = mid[codes[rows[k]]];
		return { ranks, tieSum };
	}

	/** crossTabulate(a, b), once per pair. */
	crossTab(a: CodedColumn, b: CodedColumn): ContingencyTable {
		const key = `${columnKey(a)}|${columnKey(b)}`;
		let t = this.tables.get(key);
		if (!t) {
			// As crossTabulate, on the shared rows and observed levels.
			const rows = this.rows([a, b]);
			const ra = this.observed(a, rows);
			const rb = this.observed(b, rows);
			const c = rb.levels.length;
			const counts = new Float64Array(ra.levels.length * c);
			for (let k = 0; k < rows.length; k++) counts[ra.codes[k] * c + rb.codes[k]]++;
			t = { counts, rows: ra.levels.length, cols: c, rowLevels: ra.levels, colLevels: rb.levels, n: rows.length };
			this.tables.set(key, t);
		}
		return t;
	}

	/** planDesign over the cached complete cases, once per model. */
	plan(outcome: Column | null, covariates: readonly Column[]): DesignPlan {
		const all = outcome ? [outcome, ...covariates] : covariates;
		for (const c of all) if (c.kind !== 'continuous') this.levelCounts.set(c.codes, c.levels.length);
		const rows = this.rows(all);
		const key = `${keyOf(rows)}|${outcome ? columnKey(outcome) : ''}|${covariates.map(columnKey).join(',')}`;
		let plan = this.plans.get(key);
		if (!plan) {
			plan = planDesign(outcome, covariates, rows);
			this.plans.set(key, plan);
		}
		return plan;
	}

	/** observedLevels(column, rows), once per column and row set. */
	observed(column: CodedColumn, rows: Int32Array): { codes: Int32Array; levels: string[] } {
		const key = `${keyOf(rows)}|${columnKey(column)}`;
		let o = this.observedCache.get(key);
		if (!o) {
			o = observedLevels(column, rows);
			this.observedCache.set(key, o);
		}
		return o;
	}

	/** The collinearity check of the plan's `columns` (design indices, intercept first), from the moments; keep in plan indices. O(k³). */
	collinearity(plan: DesignPlan, columns: readonly number[]): CollinearityCheck {
		const vectors = columns.slice(1).map((j) => plan.vectors[j] as NonIntercept);
		const gram = this.momentsOf(plan.rows).matrix(vectors);
		const check = collinearityFromGram(gram, columns.map((j) => plan.names[j]));
		return { keep: check.keep.map((i) => columns[i]), dropped: check.dropped };
	}

	/** Least squares of the plan's outcome on its `columns`, collinear ones left out. O(k³) once the moments are known. */
	leastSquares(plan: DesignPlan, columns: readonly number[]): MomentFit {
		const response = responseVector(plan);
		const check = this.collinearity(plan, columns);
		const kept = check.keep.slice(1);
		const vectors: TableVector[] = [...kept.map((j) => plan.vectors[j] as NonIntercept), response];
		const moments = this.momentsOf(plan.rows);
		const c = moments.matrix(vectors);
		const k = kept.length;
		return {
			check,
			ls: leastSquares(c, k),
			names: kept.map((j) => plan.names[j]),
			means: Float64Array.from(vectors.slice(0, k), (v) => moments.mean(v)),
			meanY: moments.mean(response),
			tss: c[k * (k + 1) + k]
		};
	}

	/**
	 * Logistic regression of the plan's 0/1 outcome on its `columns` (intercept first), once per
	 * model and rows; `start`: a fit of a nested model to start from (its estimates, 0 for the
	 * added columns). On covariate patterns when they are few, else on the rows.
	 */
	logistic(plan: DesignPlan, columns: readonly number[], options: { start?: LogisticFit } = {}): LogisticFit {
		const response = responseVector(plan);
		const check = this.collinearity(plan, columns);
		const keptVectors = check.keep.slice(1).map((j) => plan.vectors[j] as NonIntercept);
		const startKey = options.start ? this.fitKeys.get(options.start) : undefined;
		const key = `${vectorKey(response)}|${keyOf(plan.rows)}|${keptVectors.map(vectorKey).join(',')}${startKey ? `|from ${startKey}` : ''}`;
		const cached = this.fits.get(key);
		if (cached) return cached;
		const names = check.keep.map((j) => plan.names[j]);
		const start = options.start ? startFrom(options.start, names) : null;
		const sources = response.kind === 'codes' && (this.levelCounts.get(response.codes) ?? 3) <= 2 ? this.patternSources(keptVectors, plan.n) : null;
		let fit: LogisticFit;
		if (response.kind === 'codes' && sources) {
			const groups = groupPatterns(plan, sources, response.codes, this.interrupt);
			this.interrupt.poll();
			const result = irls({ x: groups.x, stride: plan.p, cols: Int32Array.from(check.keep), units: groups.units, y: groups.events, trials: groups.trials }, { start, interrupt: this.interrupt });
			let events = 0;
			for (const e of groups.events) events += e;
			const n = plan.n;
			if (n <= names.length) throw new StatsError(`Too few complete cases (${n}) for ${names.length} coefficients.`);
			fit = logisticFit(result, { names, n, events, nullDeviance: binaryNullDeviance(events, n), dropped: check.dropped, notes: plan.notes, maxIterations: 25 });
		} else {
			// No n × p matrix: the fit reads the plan's vectors a block at a time (irls-row-pass.ts).
			const design: Design = { ...plan, x: new Float64Array(0), y: responseNumbers(plan, response) };
			fit = fitLogistic(design, { collinearity: check, start: start ?? subsampleStart(plan, design.y as Float64Array, check.keep, this.interrupt), interrupt: this.interrupt, source: plan });
		}
		this.fits.set(key, fit);
		this.fitKeys.set(fit, key);
		return fit;
	}

	/** The plan's `columns` over its covariate patterns when they are few, else over its rows. O(n·p). */
	units(plan: DesignPlan, columns: readonly number[]): Units {
		const cols = Int32Array.from(columns);
		const sources = this.patternSources(columns.filter((j) => j > 0).map((j) => plan.vectors[j] as NonIntercept), plan.n);
		if (sources) {
			const groups = groupPatterns(plan, sources, null, this.interrupt);
			return { x: groups.x, stride: plan.p, cols, units: groups.units, weights: groups.trials };
		}
		// No n × p matrix: the rows are read from the plan's vectors a block at a time (as the
		// per-row fits do); materializing it was 9 % of `causeway estimate` at 10⁶ rows (node --cpu-prof).
		return { x: new Float64Array(0), stride: plan.p, cols, units: plan.n, weights: null, source: plan };
	}

	/**
	 * Per-row ids of the columns behind the vectors when their patterns are few (patterns.ts),
	 * else null; the ids of a numeric column's distinct values are made only then.
	 */
	private patternSources(vectors: readonly NonIntercept[], rows: number): PatternSource[] | null {
		const counts = new Map<object, number>();
		for (const v of vectors) {
			const data = v.kind === 'values' ? v.values : v.codes;
			if (counts.has(data)) continue;
			const count = v.kind === 'values' ? this.order(v.values).distinctCount() : this.levelCounts.get(v.codes);
			if (count === undefined) return null;
			counts.set(data, count);
		}
		if (!fewPatterns([...counts.values()], rows)) return null;
		return [...counts].map(([data, count]) => (data instanceof Float64Array ? this.order(data).distinctIds() : { ids: data as Int32Array, count }));
	}
}

/** Rows from which a fit on every STRIDE-th row is worth making first. */
const SUBSAMPLE_FROM = 50_000;
const STRIDE = 16;

/**
 * A start for a large fit: the fit on every 16th row (cold, a sixteenth of the cost per
 * pass). From there the full data need about 3 passes instead of 5 (measured on the demo
 * study at 10⁶ rows, four models); the result is the same maximum (irls.ts polishes warm
 * fits). Null below SUBSAMPLE_FROM rows, where the cold fit is kept as it was.
 */
function subsampleStart(plan: DesignPlan, y: Float64Array, keep: readonly number[], interrupt: Interrupt): Float64Array | null {
	const { n, rows } = plan;
	if (n < SUBSAMPLE_FROM) return null;
	const m = Math.floor(n / STRIDE);
	const sub = new Int32Array(m);
	const ys = new Float64Array(m);
	for (let i = 0; i < m; i++) {
		sub[i] = rows[i * STRIDE];
		ys[i] = y[i * STRIDE];
	}
	try {
		const source = { vectors: plan.vectors, rows: sub };
		return irls({ x: new Float64Array(0), stride: plan.p, cols: Int32Array.from(keep), units: m, y: ys, trials: null, source }, { interrupt }).beta;
	} catch (e) {
		if (e instanceof StatsError) return null; // e.g. singular on the subsample: start as R does
		throw e;
	}
}

/** The plan's outcome over its rows, as numbers. O(n). */
function responseNumbers(plan: DesignPlan, response: TableVector): Float64Array {
	const { rows, n } = plan;
	const y = new Float64Array(n);
	if (response.kind === 'values') for (let k = 0; k < n; k++) y[k] = response.values[rows[k]];
	else if (response.kind === 'codes') for (let k = 0; k < n; k++) y[k] = response.codes[rows[k]];
	return y;
}

function responseVector(plan: DesignPlan): TableVector {
	const r = plan.response;
	if (!r) throw new StatsError('A regression needs an outcome.');
	return r;
}

/** A nested model's estimates as a start: by coefficient name, 0 for the others. */
function startFrom(fit: LogisticFit, names: readonly string[]): Float64Array {
	const byName = new Map(fit.coefficients.map((c) => [c.name, c.estimate]));
	return Float64Array.from(names, (name) => byName.get(name) ?? 0);
}
