/**
 * Variable ids as byte spans → variable index, without making a JavaScript string per arrow end:
 * an open-addressing hash table (linear probing, FNV-1a hash of the bytes, murmur3's final mix)
 * over the spans the scanner recorded. Two ids are the same when their bytes are equal: ids hold
 * no escapes on the fast path and the bytes are valid UTF-8, so equal text is equal bytes.
 *
 * The lookups are bound by cache misses, not by hashing (measured on the 100,000-variable file
 * of bench/cli.ts: hashing all 400,000 arrow ends took 3 ms, looking them up 50–110 ms when each
 * lookup read the slot, then the id's offset, then its bytes). So a slot holds, in 16 bytes, the
 * index, the length, the full hash and the id's first 8 bytes: an id of up to 8 bytes is
 * compared without leaving the slot; longer ids compare the rest in a pool of the ids' bytes.
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
/** Slot word 0 is length << INDEX_BITS | (index + 1). */
const INDEX_BITS = 18;
const MAX_IDS = (1 << INDEX_BITS) - 1;
const MAX_LENGTH = (1 << (31 - INDEX_BITS)) - 1;
const SLOT = 4;

export class SpanTable {
	/** Per slot: length and index + 1 (0 = empty), hash, first 4 bytes, next 4 bytes. */
	private readonly slots: Int32Array;
	private readonly mask: number;
	/** The ids' bytes end to end; id i is pool[poolStart[i] .. poolStart[i + 1]). */
	readonly pool: Uint8Array;
	readonly poolStart: Int32Array;
	private probes = 0;
	private budget: number;
	/** The hash and first bytes of the span last hashed (set by `hashSpan`). */
	private h = 0;
	private w0 = 0;
	private w1 = 0;

	/** The index of the first id that repeats an earlier one, or -1. */
	readonly duplicate: number;

	/** Adds the ids (spans ids[2i] .. ids[2i+1] of `bytes`) in order; `lookups` sizes the probe budget. */
	constructor(bytes: Uint8Array, ids: Int32Array, n: number, lookups: number) {
		if (n > MAX_IDS) offFastPath('too many ids for the table');
		// At most 4/5 full: a smaller table misses the cache less and takes fewer pages, and the
		// stored hash makes the extra probes of linear probing cheap (four slots share a cache line).
		let size = 16;
		while (size * 4 < 5 * n) size *= 2;
		this.slots = new Int32Array(SLOT * size);
		this.mask = size - 1;
		this.budget = PROBE_BUDGET * (n + lookups + 16);
		this.poolStart = new Int32Array(n + 1);
		for (let i = 0; i < n; i++) this.poolStart[i + 1] = this.poolStart[i] + ids[2 * i + 1] - ids[2 * i];
		const pool = new Uint8Array(this.poolStart[n]);
		// A plain loop: a subarray() and set() per id cost more than copying a few bytes.
		for (let i = 0, q = 0; i < n; i++) for (let p = ids[2 * i]; p < ids[2 * i + 1]; p++) pool[q++] = bytes[p];
		this.pool = pool;
		let duplicate = -1;
		for (let i = 0; i < n && duplicate === -1; i++) if (this.probe(pool, this.poolStart[i], this.poolStart[i + 1], i) !== i) duplicate = i;
		this.duplicate = duplicate;
	}

	/**
	 * Ends the probe budget once the file is read: the few lookups that follow (the question's
	 * ids, IdIndex) must answer, not leave a fast path that is already taken.
	 */
	settle(): void {
		this.budget = Infinity;
	}

	/** The variable whose id is src[start .. end), or -1. */
	find(src: Uint8Array, start: number, end: number): number {
		return end - start > MAX_LENGTH ? -1 : this.probe(src, start, end, -1);
	}

	/** The variable whose id is src[start ..] up to the next double quote (a string without escapes), or -1. */
	findQuoted(src: Uint8Array, start: number): number {
		return this.probe(src, start, -1, -1);
	}

	/**
	 * Finds src[start .. end) (end -1: up to the next double quote); when absent, inserts it as
	 * variable `insert` (unless -1) and returns that.
	 */
	private probe(src: Uint8Array, start: number, end: number, insert: number): number {
		const len = this.hashSpan(src, start, end) - start;
		if (len > MAX_LENGTH) offFastPath('an id too long for the table');
		const { h, w0, w1 } = this;
		const slots = this.slots;
		let slot = h & this.mask;
		for (;;) {
			const at = SLOT * slot;
			const head = slots[at];
			if (head === 0) {
				if (insert >= 0) {
					slots[at] = (len << INDEX_BITS) | (insert + 1);
					slots[at + 1] = h;
					slots[at + 2] = w0;
					slots[at + 3] = w1;
				}
				return insert;
			}
			if (slots[at + 1] === h && head >>> INDEX_BITS === len && slots[at + 2] === w0 && slots[at + 3] === w1) {
				const v = (head & MAX_IDS) - 1;
				if (len <= 8 || sameBytes(this.pool, this.poolStart[v] + 8, src, start + 8, len - 8)) return v;
			}
			slot = (slot + 1) & this.mask;
			if (++this.probes > this.budget) offFastPath('too many hash collisions among the ids');
		}
	}

	/**
	 * Sets h (FNV-1a with a final mix, so the low bits used for the slot depend on every byte)
	 * and w0, w1 (the first 8 bytes) of src[start .. end), or up to the next double quote when
	 * end is -1 (found in the same pass); returns the end.
	 */
	private hashSpan(src: Uint8Array, start: number, end: number): number {
		let h = FNV_OFFSET;
		let w0 = 0;
		let w1 = 0;
		const stop = end < 0 ? src.length : end;
		let p = start;
		for (; p < stop; p++) {
			const c = src[p];
			if (c === 0x22 && end < 0) break;
			h = Math.imul(h ^ c, FNV_PRIME);
			const k = p - start;
			if (k < 4) w0 |= c << (8 * k);
			else if (k < 8) w1 |= c << (8 * (k - 4));
		}
		h ^= h >>> 16;
		h = Math.imul(h, 0x85ebca6b);
		h ^= h >>> 13;
		this.h = h | 0;
		this.w0 = w0;
		this.w1 = w1;
		return p;
	}
}

function sameBytes(a: Uint8Array, s: number, b: Uint8Array, t: number, len: number): boolean {
	for (let k = 0; k < len; k++) if (a[s + k] !== b[t + k]) return false;
	return true;
}
