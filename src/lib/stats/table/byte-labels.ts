/**
 * What a coded column's reader decided for each distinct raw cell it has seen (its code, or
 * missing, and whether it was a number), looked up by the cell's bytes, so that a repeated
 * label ("yes", "female", "NA") is not decoded to a string again. Open addressing on an FNV-1a
 * hash of the bytes (Fowler–Noll–Vo), compared byte for byte; short cells only, a bounded
 * number of entries. O(length) per lookup.
 */

const MAX_CELL = 48;
const SLOTS = 1024; // power of two, twice the entries kept
const MAX_ENTRIES = SLOTS / 2;

export interface CachedCell {
	/** The level code, or −1 for a missing cell. */
	code: number;
	isNumber: boolean;
}

export class ByteLabels {
	private readonly keys: (Uint8Array | null)[] = new Array<Uint8Array | null>(SLOTS).fill(null);
	private readonly values: (CachedCell | null)[] = new Array<CachedCell | null>(SLOTS).fill(null);
	private entries = 0;

	private static hash(bytes: Uint8Array, start: number, end: number, flags: number): number {
		let h = 0x811c9dc5 ^ flags;
		for (let i = start; i < end; i++) h = Math.imul(h ^ bytes[i], 0x01000193);
		return h >>> 0;
	}

	private slot(bytes: Uint8Array, start: number, end: number, flags: number): number {
		const length = end - start;
		let s = ByteLabels.hash(bytes, start, end, flags) & (SLOTS - 1);
		for (;;) {
			const key = this.keys[s];
			if (key === null) return s;
			if (key.length === length + 1 && key[length] === flags) {
				let same = true;
				for (let i = 0; i < length; i++)
					if (key[i] !== bytes[start + i]) {
						same = false;
						break;
					}
				if (same) return s;
			}
			s = (s + 1) & (SLOTS - 1);
		}
	}

	get(bytes: Uint8Array, start: number, end: number, flags: number): CachedCell | null {
		if (end - start > MAX_CELL) return null;
		return this.values[this.slot(bytes, start, end, flags)];
	}

	set(bytes: Uint8Array, start: number, end: number, flags: number, cell: CachedCell): void {
		if (end - start > MAX_CELL || this.entries >= MAX_ENTRIES) return;
		const s = this.slot(bytes, start, end, flags);
		if (this.keys[s] !== null) return;
		const key = new Uint8Array(end - start + 1);
		key.set(bytes.subarray(start, end));
		key[end - start] = flags;
		this.keys[s] = key;
		this.values[s] = cell;
		this.entries++;
	}
}
