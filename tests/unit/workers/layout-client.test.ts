// The tidy layout's client (src/lib/workers/layout-client.ts) on the job runner: small diagrams
// on the main thread, larger ones in a short-lived worker (a fake one here) that is terminated
// once it answers; without a Worker the large ones are laid out on the main thread too, with the
// same positions as `tidyPositions`.
import { describe, expect, it } from 'vitest';
import { layoutInWorker, MAIN_THREAD_LAYOUT_LIMIT } from '../../../src/lib/workers/layout-client';
import { tidyPositions, type LayoutInput, type Positions } from '../../../src/lib/layout';
import { fakeWorkers } from './fake-worker';

function chain(n: number): LayoutInput {
	const nodes = Array.from({ length: n }, (_, i) => ({ id: `v${i}`, w: 60, h: 24 }));
	return { nodes, arrows: nodes.slice(1).map((v, i) => ({ from: nodes[i].id, to: v.id })) };
}

describe('layoutInWorker', () => {
	it('lays out small diagrams on the main thread', async () => {
		const { workers, create } = fakeWorkers<LayoutInput, never, Positions>();
		const small = chain(MAIN_THREAD_LAYOUT_LIMIT);
		expect(await layoutInWorker(small, create)).toEqual(tidyPositions(small));
		expect(workers).toHaveLength(0);
	});

	it('sends larger ones to a worker, terminated once it answers; its failure is passed on', async () => {
		const { workers, create } = fakeWorkers<LayoutInput, never, Positions>();
		const large = chain(MAIN_THREAD_LAYOUT_LIMIT + 1);
		const answer = tidyPositions(large);
		const pending = layoutInWorker(large, create);
		const worker = workers[0];
		expect(worker.lastRun.job).toBe(large);
		worker.reply({ id: worker.lastRun.id, kind: 'done', result: answer, ms: 1 });
		expect(await pending).toBe(answer);
		expect(worker.terminated).toBe(true);
		const failing = layoutInWorker(large, create);
		workers[1].crash('out of memory');
		await expect(failing).rejects.toThrow('The layout stopped: out of memory');
	});

	it('without a Worker, lays out the larger ones on the main thread', async () => {
		const large = chain(MAIN_THREAD_LAYOUT_LIMIT + 40);
		const noWorker = () => {
			throw new ReferenceError('Worker is not defined');
		};
		expect(await layoutInWorker(large, noWorker)).toEqual(tidyPositions(large));
	});
});
