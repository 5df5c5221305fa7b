/**
 * The analysis worker: runs the engine off the main thread so the canvas never waits for it.
 * One request at a time; the app cancels a run by terminating the worker and starting a new
 * one (a running computation cannot be interrupted otherwise).
 */
import { runAnalysis } from './analysis-steps';
import type { AnalyseRequest, WorkerReply } from './protocol';

const post = (reply: WorkerReply) => (self as unknown as Worker).postMessage(reply);

self.onmessage = (event: MessageEvent<AnalyseRequest>) => {
	const { id, diagram, limits, knownClaims } = event.data;
	const started = performance.now();
	let lastPost = 0;
	try {
		const analysis = runAnalysis(diagram, limits, (progress, partial) => {
			// Partial results always go out; bare progress at most every 100 ms.
			const now = performance.now();
			if (partial || now - lastPost > 100) {
				lastPost = now;
				post({ id, kind: 'progress', progress, partial });
			}
		}, knownClaims);
		post({ id, kind: 'done', analysis, ms: performance.now() - started });
	} catch (e) {
		post({ id, kind: 'failed', message: e instanceof Error ? e.message : String(e) });
	}
};
