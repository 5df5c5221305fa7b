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
import { POLL_MASK, type Interrupt } from './interrupt';
import { keyOf } from './keys';

/** A vector of the table: a design column, or a coded column's codes as numbers (a response). */
export type TableVector = Exclude<DesignVector, { kind: 'one' }> | { kind: 'codes'; codes: Int32Array };

function at(v: TableVector, r: number): number {
	return v.kind === 'values' ? v.values[r] : v.kind === 'codes' ? v.codes[r] : v.codes[r] === v.level ? 1 : 0;
}

export function vectorKey(v: TableVector): string {
	return v.kind === 'values' ? `v${keyOf(v.values)}` : v.kind === 'codes' ? `s${keyOf(v.codes)}` : `c${keyOf(v.codes)}:${v.level}`;
}

export class Moments {
	private readonly means = new Map<string, number>();
	private readonly products = new Map<string, number>();

	constructor(
		readonly rows: Int32Array,
		private readonly interrupt?: Interrupt
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
		for (let k = 0; k < n; k++) {
			if ((k & POLL_MASK) === 0) this.interrupt?.poll();
			const r = rows[k];
			for (let j = 0; j < list.length; j++) sums[j] += at(list[j], r);
		}
		[...missing.keys()].forEach((key, j) => this.means.set(key, sums[j] / n));
	}

	private ensureProducts(vectors: readonly TableVector[], keys: readonly string[]): void {
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
		const d = new Float64Array(list.length);
		const rows = this.rows;
		const n = rows.length;
		const m = pairs.length;
		for (let k = 0; k < n; k++) {
			if ((k & POLL_MASK) === 0) this.interrupt?.poll();
			const r = rows[k];
			for (let j = 0; j < list.length; j++) d[j] = at(list[j], r) - mean[j];
			for (let q = 0; q < m; q++) sums[q] += d[first[q]] * d[second[q]];
		}
		pairs.forEach(([a, b], q) => this.products.set(pairKey(keys[a], keys[b]), sums[q]));
	}
}

function pairKey(a: string, b: string): string {
	return a < b ? `${a}|${b}` : `${b}|${a}`;
}
