/**
 * Tidy layout in a Web Worker: one short-lived worker per layout (layouts are occasional),
 * terminated when done, so the canvas stays responsive while dagre works (about a second of
 * CPU at 300 variables). Small diagrams are laid out on the main thread, where starting a
 * worker and loading dagre into it would cost more than the layout itself. Both paths call
 * the same entry point, `tidyPositions` (src/lib/layout/tidy.ts), as `causeway export` does.
 */
import { tidyPositions, type LayoutInput, type Positions } from '../layout';

/** Up to this many variables the layout takes a few tens of milliseconds: no worker needed. */
export const MAIN_THREAD_LAYOUT_LIMIT = 60;

export function layoutInWorker(input: LayoutInput): Promise<Positions> {
	if (input.nodes.length <= MAIN_THREAD_LAYOUT_LIMIT) {
		try {
			return Promise.resolve(tidyPositions(input));
		} catch (e) {
			return Promise.reject(e instanceof Error ? e : new Error(String(e)));
		}
	}
	return new Promise((resolve, reject) => {
		const worker = new Worker(new URL('./layout.worker.ts', import.meta.url), { type: 'module' });
		worker.onmessage = (e: MessageEvent<{ ok: true; positions: Positions } | { ok: false; message: string }>) => {
			worker.terminate();
			if (e.data.ok) resolve(e.data.positions);
			else reject(new Error(e.data.message));
		};
		worker.onerror = (e) => {
			worker.terminate();
			reject(new Error(e.message || 'the layout worker failed'));
		};
		worker.postMessage(input);
	});
}
