/**
 * Centred cross-products Σ (a − ā)(b − b̄) of the table's vectors (numeric columns, level
 * indicators, codes as numbers) over one set of rows, computed once and shared by every
 * model on those rows: least squares, partial correlations and the collinearity check
 * depend on the data only through them (and the means). Entries are computed on demand, the
 * missing ones of a request together in one pass over the rows, each pair once; two passes
 * (means first) as the per-model code does, so the numbers are those of that code.
 * O(n·k²) for k vectors over all requests, then O(1) per entry.
 */
import type { DesignVector } from '../regression/design';
import type { Interrupt } from './interrupt';
import { keyOf } from './keys';

/** A vector of the table: a design column, or a coded column's codes as numbers (a response). */
export type TableVector = Exclude<DesignVector, { kind: 'one' }> | { kind: 'codes'; codes: Int32Array };

/** Rows per block: the block of centred values (block × vectors doubles) stays in cache. */
const BLOCK = 2048;

/**
 * out[(k − start)·stride + slot] = v at rows[k] − mean, for k in [start, end): one loop per
 * kind of vector (a call per value was 10 % of a million-row check).
 */
function fill(v: TableVector, rows: Int32Array, start: number, end: number, mean: number, out: Float64Array, stride: number, slot: number): void {
	let o = slot;
	if (v.kind === 'values') {
		const values = v.values;
		for (let k = start; k < end; k++, o += stride) out[o] = values[rows[k]] - mean;
	} else if (v.kind === 'codes') {
		const codes = v.codes;
		for (let k = start; k < end; k++, o += stride) out[o] = codes[rows[k]] - mean;
	} else {
		const { codes, level } = v;
		for (let k = start; k < end; k++, o += stride) out[o] = (codes[rows[k]] === level ? 1 : 0) - mean;
	}
}

export function vectorKey(v: TableVector): string {
	return v.kind === 'values' ? `v${keyOf(v.values)}` : v.kind === 'codes' ? `s${keyOf(v.codes)}` : `c${keyOf(v.codes)}:${v.level}`;
}

export class Moments {
	private readonly means = new Map<string, number>();
	private readonly products = new Map<string, number>();

	/**
	 * `expected`: vectors likely to be asked for on these rows (the table's linked columns);
	 * the first request computes all their cross-products in the same pass, so that later
	 * models find them ready instead of each new vector costing one more pass.
	 */
	constructor(
		readonly rows: Int32Array,
		private readonly interrupt?: Interrupt,
		private readonly expected: readonly TableVector[] = []
	) {}

	get n(): number {
		return this.rows.length;
	}

	mean(v: TableVector): number {
		this.ensureMeans([v]);
		return this.means.get(vectorKey(v)) as number;
	}

	/** The k × k matrix of centred cross-products of `vectors` (row-major, symmetric). */
	matrix(vectors: readonly TableVector[]): Float64Array {
		const keys = vectors.map(vectorKey);
		this.ensureProducts(vectors, keys);
		const k = vectors.length;
		const out = new Float64Array(k * k);
		for (let a = 0; a < k; a++)
			for (let b = 0; b <= a; b++) {
				const value = this.products.get(pairKey(keys[a], keys[b])) as number;
				out[a * k + b] = value;
				out[b * k + a] = value;
			}
		return out;
	}

	private ensureMeans(vectors: readonly TableVector[]): void {
		const missing = new Map<string, TableVector>();
		for (const v of vectors) {
			const key = vectorKey(v);
			if (!this.means.has(key)) missing.set(key, v);
		}
		if (missing.size === 0) return;
		const list = [...missing.values()];
		const sums = new Float64Array(list.length);
		const rows = this.rows;
		const n = rows.length;
		const block = new Float64Array(BLOCK);
		for (let start = 0; start < n; start += BLOCK) {
			this.interrupt?.poll();
			const end = Math.min(n, start + BLOCK);
			for (let j = 0; j < list.length; j++) {
				fill(list[j], rows, start, end, 0, block, 1, 0);
				let sum = sums[j];
				for (let k = 0; k < end - start; k++) sum += block[k];
				sums[j] = sum;
			}
		}
		[...missing.keys()].forEach((key, j) => this.means.set(key, sums[j] / n));
	}

	private ensureProducts(requested: readonly TableVector[], requestedKeys: readonly string[]): void {
		if (requested.every((_, a) => requested.every((__, b) => b > a || this.products.has(pairKey(requestedKeys[a], requestedKeys[b]))))) return;
		const vectors: TableVector[] = [...requested];
		const keys: string[] = [...requestedKeys];
		for (const v of this.expected) {
			const key = vectorKey(v);
			if (!keys.includes(key)) {
				vectors.push(v);
				keys.push(key);
			}
		}
		const pairs: [number, number][] = [];
		const seen = new Set<string>();
		for (let a = 0; a < vectors.length; a++)
			for (let b = 0; b <= a; b++) {
				const key = pairKey(keys[a], keys[b]);
				if (this.products.has(key) || seen.has(key)) continue;
				seen.add(key);
				pairs.push([a, b]);
			}
		if (pairs.length === 0) return;
		this.ensureMeans(vectors);
		// The vectors the missing pairs involve, each once.
		const slot = new Map<number, number>();
		const used: number[] = [];
		for (const [a, b] of pairs)
			for (const i of [a, b])
				if (!slot.has(i)) {
					slot.set(i, used.length);
					used.push(i);
				}
		const list = used.map((i) => vectors[i]);
		const mean = Float64Array.from(used, (i) => this.means.get(keys[i]) as number);
		const first = Int32Array.from(pairs, ([a]) => slot.get(a) as number);
		const second = Int32Array.from(pairs, ([, b]) => slot.get(b) as number);
		const sums = new Float64Array(pairs.length);
		const width = list.length;
		const block = new Float64Array(BLOCK * width);
		const rows = this.rows;
		const n = rows.length;
		const m = pairs.length;
		for (let start = 0; start < n; start += BLOCK) {
			this.interrupt?.poll();
			const end = Math.min(n, start + BLOCK);
			for (let j = 0; j < width; j++) fill(list[j], rows, start, end, mean[j], block, width, j);
			for (let k = 0, base = 0; k < end - start; k++, base += width)
				for (let q = 0; q < m; q++) sums[q] += block[base + first[q]] * block[base + second[q]];
		}
		pairs.forEach(([a, b], q) => this.products.set(pairKey(keys[a], keys[b]), sums[q]));
	}
}

function pairKey(a: string, b: string): string {
	return a < b ? `${a}|${b}` : `${b}|${a}`;
}
