/**
 * The reviewer-tools worker: one job at a time (a review or a stress test); the app cancels by
 * terminating it. Progress goes out at most every 100 ms.
 */
import { runJob } from './review-steps';
import type { ReviewReply, ReviewRequest } from './review-protocol';

const post = (reply: ReviewReply) => (self as unknown as Worker).postMessage(reply);

self.onmessage = (event: MessageEvent<ReviewRequest>) => {
	const { id, ...job } = event.data;
	const started = performance.now();
	let last = 0;
	try {
		const result = runJob(job, (fraction) => {
			const now = performance.now();
			if (now - last > 100) {
				last = now;
				post({ id, kind: 'progress', fraction });
			}
		});
		post({ id, kind: 'done', result, ms: performance.now() - started });
	} catch (e) {
		post({ id, kind: 'failed', message: e instanceof Error ? e.message : String(e) });
	}
};
