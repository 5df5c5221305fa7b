/**
 * An analysis worker: computes one part of the analysis (verdict, sets or claims; see
 * analysis-steps.ts) off the main thread, so the canvas never waits for it. The app runs one
 * worker per part, so a planned-set edit is answered while the sets or the claims of the same
 * structure are still being computed next to it; a worker still busy with a stale request is
 * terminated and replaced, since a running computation cannot be interrupted otherwise.
 */
import { analyseSets, analyseVerdict, analyseVerdictFirst, listClaims } from './analysis-steps';
import type { PartRequest, PartResult, WorkerReply } from './protocol';

const post = (reply: WorkerReply) => (self as unknown as Worker).postMessage(reply);

function compute(request: PartRequest): PartResult {
	const { id, part, diagram, limits } = request;
	switch (part) {
		case 'verdict': {
			// The verdict first, so the page shows it while the paths are counted.
			const started = performance.now();
			const first = analyseVerdictFirst(diagram);
			post({ id, kind: 'first', ms: performance.now() - started, part, value: first });
			return { part, value: first.ready ? analyseVerdict(diagram, limits, first.issues) : first };
		}
		case 'sets':
			return { part, value: analyseSets(diagram, limits) };
		case 'claims': {
			let lastPost = 0;
			const value = listClaims(diagram, limits.maxClaims, (fraction) => {
				// Progress at most every 100 ms.
				const now = performance.now();
				if (now - lastPost > 100) {
					lastPost = now;
					post({ id, kind: 'progress', fraction });
				}
			});
			return { part, value };
		}
	}
}

self.onmessage = (event: MessageEvent<PartRequest>) => {
	const started = performance.now();
	try {
		const result = compute(event.data);
		post({ id: event.data.id, kind: 'done', ms: performance.now() - started, ...result });
	} catch (e) {
		post({ id: event.data.id, kind: 'failed', message: e instanceof Error ? e.message : String(e) });
	}
};
