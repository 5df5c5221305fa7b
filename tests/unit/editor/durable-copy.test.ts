// The crash-safe second copy of the autosave (src/lib/editor/durable-copy.ts). The browser
// side (a strict IndexedDB commit surviving a SIGKILL of the whole browser) is in
// tests/e2e/reliability.e2e.ts; here: which copy wins, and that copies are written in order.
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { AUTOSAVE_KEY, AUTOSAVE_STAMP_KEY, createAutosaver, readStamp, type StorageLike } from '../../../src/lib/editor/autosave';
import { durableMirror, newerDurableDiagram, readDurableCopy, savedAtOfStamp, type DurableCopy, type DurableStore } from '../../../src/lib/editor/durable-copy';
import { parseDiagramJson, writeDiagramJson } from '../../../src/lib/graph/native-json';

const demo = parseDiagramJson(readFileSync('static/demo/cycling-hypertension.causeway.json', 'utf8'));
const edited = { ...demo, title: 'Edited just before the crash' };

class MemoryStorage implements StorageLike {
	map = new Map<string, string>();
	getItem(k: string) {
		return this.map.get(k) ?? null;
	}
	setItem(k: string, v: string) {
		this.map.set(k, v);
	}
	removeItem(k: string) {
		this.map.delete(k);
	}
}

/** A store whose writes finish when the test says so. */
function slowStore() {
	const written: DurableCopy[] = [];
	const gates: (() => void)[] = [];
	const store: DurableStore = {
		put: (copy) =>
			new Promise<void>((resolve) =>
				gates.push(() => {
					written.push(copy);
					resolve();
				})
			),
		get: async () => written.at(-1) ?? null
	};
	const release = async () => {
		while (gates.length) {
			gates.shift()!();
			await Promise.resolve();
			await Promise.resolve();
		}
	};
	return { store, written, release, pending: () => gates.length };
}

const copy = (text: string, stamp: string): DurableCopy => ({ text, stamp, savedAt: savedAtOfStamp(stamp) });

describe('durable copy of the autosave', () => {
	it('the autosave stamps each write with its time and hands the same text and stamp to the mirror', () => {
		const storage = new MemoryStorage();
		const mirrored: DurableCopy[] = [];
		const saver = createAutosaver(storage, 300, undefined, { tabId: 'tab', mirror: (c) => mirrored.push(c), now: () => 1_700_000_000_000 });
		saver.schedule(demo);
		expect(readStamp(storage)).toBe('tab:1:1700000000000');
		expect(mirrored).toEqual([{ text: storage.getItem(AUTOSAVE_KEY), stamp: 'tab:1:1700000000000', savedAt: 1_700_000_000_000 }]);
		saver.flush();
	});

	it('writes one copy at a time and skips to the latest: no older copy lands after a newer one', async () => {
		const { store, written, release, pending } = slowStore();
		const mirror = durableMirror(store);
		mirror.write(copy('a', 't:1:1'));
		mirror.write(copy('b', 't:2:2'));
		mirror.write(copy('c', 't:3:3'));
		expect(pending()).toBe(1); // a is being written; b was replaced by c while waiting
		await release();
		await release();
		await mirror.idle();
		expect(written.map((c) => c.text)).toEqual(['a', 'c']);
	});

	it('a failing store is reported once and does not stop later writes from being tried', async () => {
		const errors: string[] = [];
		let calls = 0;
		const failing: DurableStore = {
			put: async () => {
				calls++;
				throw new Error('QuotaExceededError');
			},
			get: async () => null
		};
		const mirror = durableMirror(failing, (m) => errors.push(m));
		mirror.write(copy('a', 't:1:1'));
		await mirror.idle();
		mirror.write(copy('b', 't:2:2'));
		await mirror.idle();
		expect(errors).toEqual(['The crash-safe copy of the autosave failed: QuotaExceededError']);
		expect(calls).toBe(2);
	});

	it('the durable copy wins only when it is newer than what localStorage kept', () => {
		const newerText = writeDiagramJson(edited);
		// The browser was killed: localStorage on disk holds the first save, the copy the second.
		expect(newerDurableDiagram('tab:1:1000', copy(newerText, 'tab:2:2000'))?.title).toBe('Edited just before the crash');
		// Nothing reached localStorage at all (killed in the first seconds).
		expect(newerDurableDiagram(null, copy(newerText, 'tab:1:1000'))?.title).toBe('Edited just before the crash');
		// The same save in both, or localStorage newer (the copy's write failed or was late).
		expect(newerDurableDiagram('tab:2:2000', copy(newerText, 'tab:2:2000'))).toBeNull();
		expect(newerDurableDiagram('other:7:3000', copy(newerText, 'tab:2:2000'))).toBeNull();
		// No copy, or a copy that does not read: localStorage's own handling stands.
		expect(newerDurableDiagram('tab:1:1000', null)).toBeNull();
		expect(newerDurableDiagram('tab:1:1000', copy('{"format": "causeway.diagram", "vers', 'tab:2:2000'))).toBeNull();
	});

	it('stamps written before they carried a time count as oldest', () => {
		expect(savedAtOfStamp('tab:4')).toBe(0);
		expect(savedAtOfStamp(null)).toBe(0);
		expect(savedAtOfStamp('tab:4:1234')).toBe(1234);
		expect(newerDurableDiagram('tab:4', copy(writeDiagramJson(edited), 'tab:5:10'))?.title).toBe('Edited just before the crash');
	});

	it('a store that never answers does not hold up the start: the read gives up', async () => {
		const stuck: DurableStore = { put: () => new Promise(() => {}), get: () => new Promise(() => {}) };
		await expect(readDurableCopy(stuck, 20)).resolves.toBeNull();
		await expect(readDurableCopy(null)).resolves.toBeNull();
		const failing: DurableStore = { put: async () => {}, get: async () => Promise.reject(new Error('closed')) };
		await expect(readDurableCopy(failing, 1000)).resolves.toBeNull();
	});

	it('the stamp key is the one the two-tab check reads', () => {
		const storage = new MemoryStorage();
		createAutosaver(storage, 300, undefined, { tabId: 'x', now: () => 5 }).schedule(demo);
		expect(storage.getItem(AUTOSAVE_STAMP_KEY)).toBe('x:1:5');
	});
});
