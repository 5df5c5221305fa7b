/**
 * The data checks as a sequence of steps: each check (an arrow, a claim, an estimate row, a
 * candidate confounder) is one step of a generator, so that the same code runs straight
 * through (the command line, `drain`) or gives way between steps (`drainAsync`, the data
 * worker), letting a Cancel message in; inside a step, long loops poll the interrupt
 * (src/lib/stats/sufficient/interrupt.ts). O(1) per step.
 */

export type Steps<T> = Generator<void, T, void>;

/** Runs all steps at once. */
export function drain<T>(steps: Steps<T>): T {
	for (;;) {
		const r = steps.next();
		if (r.done) return r.value;
	}
}

/**
 * Runs the steps, giving way to the event loop (`pause`) whenever `sliceMs` have passed since
 * the last pause, so that messages (a cancel) are handled between steps.
 */
export async function drainAsync<T>(steps: Steps<T>, pause: () => Promise<void>, sliceMs = 30, now: () => number = () => performance.now()): Promise<T> {
	let last = now();
	for (;;) {
		const r = steps.next();
		if (r.done) return r.value;
		if (now() - last >= sliceMs) {
			await pause();
			last = now();
		}
	}
}
