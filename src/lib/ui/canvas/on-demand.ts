/**
 * When the canvas loads Cytoscape: on demand (the first interaction, or something that needs
 * its viewport) or once the page is quiet, never during the start-up. A cold load spent most of
 * its main-thread time on Cytoscape (bench/RESULTS.md section 6), so the page answers first with
 * the first view (StaticView.svelte) and Cytoscape arrives in the idle time that follows.
 */

/** A library loaded once, on the first `ensure()`; work that needs it waits in a queue. */
export class OnDemand<T> {
	#pending: (() => void)[] = [];
	#state: 'idle' | 'loading' | 'ready' | 'disposed' = 'idle';

	/** `start` sets the view up with the loaded library; the queued work runs right after it. */
	constructor(
		private readonly load: () => Promise<T>,
		private readonly start: (lib: T) => void
	) {}

	get ready(): boolean {
		return this.#state === 'ready';
	}

	/** Starts loading (once). */
	ensure = (): void => {
		if (this.#state !== 'idle') return;
		this.#state = 'loading';
		void this.load().then(async (lib) => {
			// One task for the module's evaluation, another for the set-up: shorter long tasks.
			await new Promise((r) => setTimeout(r, 0));
			if (this.#state === 'disposed') return;
			this.start(lib);
			this.#state = 'ready';
			const queued = this.#pending;
			this.#pending = [];
			for (const run of queued) run();
		});
	};

	/** Runs `run` now if the library is set up, else once it is (and asks for it). */
	whenReady = (run: () => void): void => {
		if (this.ready) run();
		else {
			this.#pending.push(run);
			this.ensure();
		}
	};

	dispose(): void {
		this.#state = 'disposed';
		this.#pending = [];
	}
}

/**
 * Runs `run` once the page has had nothing else to do for `quietMs` (idle callbacks following
 * each other without a gap, so no task ran between them), or after `latestMs` at the latest.
 * Returns a cancel function.
 */
export function whenQuiet(run: () => void, quietMs: number, latestMs: number): () => void {
	const start = performance.now();
	let since = start;
	let last = start;
	let handle = 0;
	const idle: (cb: () => void) => number = typeof requestIdleCallback === 'function' ? (cb) => requestIdleCallback(cb, { timeout: 200 }) : (cb) => window.setTimeout(cb, 50);
	const cancelIdle: (h: number) => void = typeof cancelIdleCallback === 'function' ? cancelIdleCallback : clearTimeout;
	const step = () => {
		const now = performance.now();
		// Idle periods are at most 50 ms long: a longer gap means a task ran in between.
		if (now - last > 100) since = now;
		last = now;
		if (now - since >= quietMs || now - start >= latestMs) run();
		else handle = idle(step);
	};
	handle = idle(step);
	return () => cancelIdle(handle);
}
