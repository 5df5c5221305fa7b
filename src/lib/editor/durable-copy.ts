/**
 * A second copy of the autosave in IndexedDB, committed with `durability: 'strict'`, for the
 * case localStorage cannot cover: the whole browser killed (crash, task manager, power cut).
 *
 * Measured in headless Chromium 14x with a persistent profile (scratch harness described in
 * docs/reliability.md): localStorage writes reach the disk in batches — the first after about
 * 5 s, later ones only after up to a minute (a write 30 s before a SIGKILL of the browser was
 * lost, one 65 s before survived) — while a strict IndexedDB transaction is on disk when its
 * `complete` event fires: a kill right after it kept the write every time. localStorage stays
 * the primary copy (it is synchronous, so the app opens without waiting, and the two-tab
 * warning listens to its `storage` event); this copy is read at start-up and wins only when
 * it is newer than what localStorage kept.
 */
import { parseDiagramJson } from '../graph/native-json';
import type { Diagram } from '../graph/diagram';

export interface DurableCopy {
	/** The diagram in the native format, exactly as written to localStorage. */
	text: string;
	/** The autosave stamp written beside it (`tab:serial:time`). */
	stamp: string;
	/** When it was written (ms since the epoch). */
	savedAt: number;
}

export interface DurableStore {
	put(copy: DurableCopy): Promise<void>;
	get(): Promise<DurableCopy | null>;
}

const DATABASE = 'causeway';
const STORE = 'autosave';
const KEY = 'latest';

/** The IndexedDB store, or null where IndexedDB is missing (some private modes, old engines). */
export function indexedDbStore(idb: IDBFactory | undefined = globalThis.indexedDB): DurableStore | null {
	if (!idb) return null;
	let opened: Promise<IDBDatabase> | null = null;
	const database = () =>
		(opened ??= new Promise<IDBDatabase>((resolve, reject) => {
			const request = idb.open(DATABASE, 1);
			request.onupgradeneeded = () => request.result.createObjectStore(STORE);
			request.onsuccess = () => resolve(request.result);
			request.onerror = () => reject(request.error);
			request.onblocked = () => reject(new Error('IndexedDB blocked'));
		}));
	return {
		async put(copy) {
			const db = await database();
			await new Promise<void>((resolve, reject) => {
				// 'strict': `complete` fires once the write is flushed to disk (IndexedDB 3.0).
				const tx = db.transaction(STORE, 'readwrite', { durability: 'strict' });
				tx.objectStore(STORE).put(copy, KEY);
				tx.oncomplete = () => resolve();
				tx.onerror = () => reject(tx.error);
				tx.onabort = () => reject(tx.error ?? new Error('IndexedDB write aborted'));
			});
		},
		async get() {
			const db = await database();
			return new Promise<DurableCopy | null>((resolve, reject) => {
				const request = db.transaction(STORE, 'readonly').objectStore(STORE).get(KEY);
				request.onsuccess = () => resolve(isDurableCopy(request.result) ? request.result : null);
				request.onerror = () => reject(request.error);
			});
		}
	};
}

function isDurableCopy(x: unknown): x is DurableCopy {
	const c = x as DurableCopy | null;
	return typeof c?.text === 'string' && typeof c.stamp === 'string' && typeof c.savedAt === 'number';
}

/**
 * Writes copies one at a time, the latest winning: while one transaction commits, later
 * copies replace each other and only the last is written next. A failing store (quota, a
 * closed database) costs only this second copy; `onError` hears about it once.
 */
export function durableMirror(store: DurableStore, onError?: (message: string) => void) {
	let waiting: DurableCopy | null = null;
	let running: Promise<void> | null = null;
	let failed = false;
	const run = async () => {
		while (waiting) {
			const copy = waiting;
			waiting = null;
			try {
				await store.put(copy);
			} catch (e) {
				if (!failed) onError?.(`The crash-safe copy of the autosave failed: ${e instanceof Error ? e.message : String(e)}`);
				failed = true;
			}
		}
		running = null;
	};
	return {
		write(copy: DurableCopy) {
			waiting = copy;
			running ??= run();
		},
		/** Resolves when every copy handed over so far is written (or has failed). */
		async idle(): Promise<void> {
			while (running) await running;
		}
	};
}

/** The time in an autosave stamp `tab:serial:time` (0 for stamps written before it had one). */
export function savedAtOfStamp(stamp: string | null): number {
	const time = Number(stamp?.split(':')[2]);
	return Number.isFinite(time) ? time : 0;
}

/**
 * The durable copy's diagram when it is newer than what localStorage kept (the browser was
 * killed before localStorage reached the disk); null when localStorage is as new or newer, or
 * the copy cannot be read (then localStorage's own handling stands).
 */
export function newerDurableDiagram(localStamp: string | null, durable: DurableCopy | null): Diagram | null {
	if (!durable || durable.stamp === localStamp) return null;
	if (durable.savedAt <= savedAtOfStamp(localStamp)) return null;
	try {
		return parseDiagramJson(durable.text);
	} catch {
		return null;
	}
}

/** Reads the durable copy, giving up after `waitMs` so a stuck IndexedDB never holds up the app. */
export async function readDurableCopy(store: DurableStore | null, waitMs = 10_000): Promise<DurableCopy | null> {
	if (!store) return null;
	let timer: ReturnType<typeof setTimeout> | undefined;
	const late = new Promise<null>((resolve) => (timer = setTimeout(() => resolve(null), waitMs)));
	try {
		return await Promise.race([store.get().catch(() => null), late]);
	} finally {
		clearTimeout(timer);
	}
}
