/**
 * Cooperative cancellation of long computations. Loops over the rows call `poll()` every so
 * many rows (and fits once per iteration); when the caller's `isCancelled()` says so, `poll`
 * throws `Cancelled`, which the data checks let through to their caller (the data worker,
 * which then reports the run as cancelled). O(1) per poll.
 */

export class Cancelled extends Error {
	constructor() {
		super('Cancelled.');
		this.name = 'Cancelled';
	}
}

export interface Interrupt {
	/** Throws Cancelled when the run has been cancelled. */
	poll(): void;
}

/** An interrupt asking `isCancelled` at each poll. */
export function interruptWhen(isCancelled: () => boolean): Interrupt {
	return {
		poll() {
			if (isCancelled()) throw new Cancelled();
		}
	};
}

export const NEVER: Interrupt = { poll() {} };

/** Rows between polls inside a loop over the rows (a power of two minus one, as a mask). */
export const POLL_MASK = 0xffff;
