/**
 * The compiled graph's id → index map for the fast reader, answered from its hash table over
 * the ids' bytes (span-table.ts) instead of a Map of every id: the engine looks up a handful of
 * ids (the question's), and filling a Map with 100,000 ids cost about 60 ms of the command's
 * time (node --cpu-prof, bench/cli.ts). The Map is built on the first call that needs all of
 * it (size, iteration). Exact: a lookup's answer is checked against the id's own text.
 */
import type { SpanTable } from './span-table';

const encoder = new TextEncoder();

export class IdIndex implements ReadonlyMap<string, number> {
	private whole: Map<string, number> | undefined;

	constructor(
		private readonly ids: readonly string[],
		private readonly table: SpanTable
	) {}

	get(id: string): number | undefined {
		if (this.whole) return this.whole.get(id);
		if (typeof id !== 'string') return undefined;
		const bytes = encoder.encode(id);
		const v = this.table.find(bytes, 0, bytes.length);
		// The check rules out an id with a lone surrogate, which the encoder turned into U+FFFD.
		return v >= 0 && this.ids[v] === id ? v : undefined;
	}

	has(id: string): boolean {
		return this.get(id) !== undefined;
	}

	get size(): number {
		return this.ids.length;
	}

	forEach(callback: (value: number, key: string, map: ReadonlyMap<string, number>) => void, thisArg?: unknown): void {
		this.map().forEach((value, key) => callback.call(thisArg, value, key, this));
	}

	entries(): MapIterator<[string, number]> {
		return this.map().entries();
	}

	keys(): MapIterator<string> {
		return this.map().keys();
	}

	values(): MapIterator<number> {
		return this.map().values();
	}

	[Symbol.iterator](): MapIterator<[string, number]> {
		return this.map()[Symbol.iterator]();
	}

	private map(): Map<string, number> {
		if (!this.whole) {
			const whole = new Map<string, number>();
			this.ids.forEach((id, i) => whole.set(id, i));
			this.whole = whole;
		}
		return this.whole;
	}
}
