/**
 * Tidy layout in a Web Worker: one short-lived worker per layout (layouts are occasional),
 * terminated when done, so the canvas stays responsive while dagre works (about a second of
 * CPU at 300 variables). Small diagrams are laid out on the main thread, where starting a
 * worker and loading dagre into it would cost more than the layout itself. Both paths run the
 * same step (`layoutSteps`: `tidyPositions`, src/lib/layout/tidy.ts, as `causeway export` does)
 * through a job runner (job-runner.ts), which also falls back to the main thread when there is
 * no Worker.
 */
import type { LayoutInput, Positions } from '../layout';
import { JobRunner, stepsOnDemand } from './job-runner';

/** Up to this many variables the layout takes a few tens of milliseconds: no worker needed. */
export const MAIN_THREAD_LAYOUT_LIMIT = 60;

function defaultWorker(): Worker {
	return new Worker(new URL('./layout.worker.ts', import.meta.url), { type: 'module' });
}

export function layoutInWorker(input: LayoutInput, createWorker: () => Worker = defaultWorker): Promise<Positions> {
	const runner = new JobRunner<LayoutInput, never, Positions>({ steps: () => stepsOnDemand(async () => (await import('./layout-steps')).layoutSteps), createWorker, crashed: (m) => `The layout stopped: ${m}` });
	return new Promise((resolve, reject) => {
		runner.run(
			input,
			{
				done: (positions) => {
					runner.terminate();
					resolve(positions);
				},
				failed: (message) => {
					runner.terminate();
					reject(new Error(message));
				}
			},
			{ where: input.nodes.length <= MAIN_THREAD_LAYOUT_LIMIT ? 'main' : 'worker' }
		);
	});
}
