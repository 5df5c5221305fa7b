/**
 * Variable ids as byte spans → variable index, without making a JavaScript string per arrow end:
 * an open-addressing hash table (linear probing, FNV-1a hash of the bytes, murmur3's final mix)
 * over the spans the scanner recorded. Two ids are the same when their bytes are equal: ids hold
 * no escapes on the fast path and the bytes are valid UTF-8, so equal text is equal bytes.
 *
 * Each slot keeps the id's full hash beside its index, and the ids' bytes are copied into one
 * small pool, so a lookup touches the slot and, on a hash match, the pool — not the 12 MiB file
 * at a random place (the lookups took 2× longer that way; measured on the 100,000-variable file
 * of bench/cli.ts).
 *
 * A file built to make many ids collide could make probing quadratic; the table counts its
 * probes and gives up (OffFastPath) past a budget linear in the input, so the full reader, with
 * the engine's own seeded hashing, takes over. O(bytes of the ids) expected.
 */
import { offFastPath } from './json-bytes';

const FNV_OFFSET = 0x811c9dc5;
const FNV_PRIME = 0x01000193;
/** Probes allowed per insertion or lookup on average before the table gives up. */
const PROBE_BUDGET = 16;

export class SpanTable {
	/** Per slot: variable index + 1 (0 = empty), then the id's hash. */
	private readonly slots: Int32Array;
	private readonly mask: number;
	/** The ids' bytes end to end; id i is pool[poolStart[i] .. poolStart[i + 1]). */
	private readonly pool: Uint8Array;
	private readonly poolStart: Int32Array;
	private probes = 0;
	private readonly budget: number;

	/** The index of the first id that repeats an earlier one, or -1. */
	readonly duplicate: number;

	/** Adds the ids (spans ids[2i] .. ids[2i+1] of `bytes`) in order; `lookups` sizes the probe budget. */
	constructor(bytes: Uint8Array, ids: Int32Array, n: number, lookups: number) {
		let size = 16;
		while (size < 2 * n) size *= 2;
		this.slots = new Int32Array(2 * size);
		this.mask = size - 1;
		this.budget = PROBE_BUDGET * (n + lookups + 16);
		this.poolStart = new Int32Array(n + 1);
		for (let i = 0; i < n; i++) this.poolStart[i + 1] = this.poolStart[i] + ids[2 * i + 1] - ids[2 * i];
		this.pool = new Uint8Array(this.poolStart[n]);
		for (let i = 0; i < n; i++) this.pool.set(bytes.subarray(ids[2 * i], ids[2 * i + 1]), this.poolStart[i]);
		let duplicate = -1;
		for (let i = 0; i < n && duplicate === -1; i++) {
			const start = this.poolStart[i];
			if (this.probe(this.pool, start, this.poolStart[i + 1], i) !== i) duplicate = i;
		}
		this.duplicate = duplicate;
	}

	/** The variable whose id is src[start .. end), or -1. */
	find(src: Uint8Array, start: number, end: number): number {
		return this.probe(src, start, end, -1);
	}

	/** Finds src[start .. end); when absent, inserts it as variable `insert` (unless -1) and returns that. */
	private probe(src: Uint8Array, start: number, end: number, insert: number): number {
		const h = hash(src, start, end);
		const slots = this.slots;
		const len = end - start;
		let slot = h & this.mask;
		for (;;) {
			const v = slots[2 * slot] - 1;
			if (v < 0) {
				if (insert >= 0) {
					slots[2 * slot] = insert + 1;
					slots[2 * slot + 1] = h;
				}
				return insert;
			}
			if (slots[2 * slot + 1] === h) {
				const s = this.poolStart[v];
				if (this.poolStart[v + 1] - s === len && sameBytes(this.pool, s, src, start, len)) return v;
			}
			slot = (slot + 1) & this.mask;
			if (++this.probes > this.budget) offFastPath('too many hash collisions among the ids');
		}
	}
}

function hash(b: Uint8Array, start: number, end: number): number {
	let h = FNV_OFFSET;
	for (let p = start; p < end; p++) h = Math.imul(h ^ b[p], FNV_PRIME);
	// Final mixing (murmur3's fmix32) so that the low bits used for the slot depend on every byte.
	h ^= h >>> 16;
	h = Math.imul(h, 0x85ebca6b);
	h ^= h >>> 13;
	return h | 0;
}

function sameBytes(a: Uint8Array, s: number, b: Uint8Array, t: number, len: number): boolean {
	for (let k = 0; k < len; k++) if (a[s + k] !== b[t + k]) return false;
	return true;
}
