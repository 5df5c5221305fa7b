/** Runs the dagre layout off the main thread (see ui/canvas/layout.ts). */
import { dagrePositions, type LayoutInput } from '../ui/canvas/layout';

self.onmessage = (event: MessageEvent<LayoutInput>) => {
	try {
		(self as unknown as Worker).postMessage({ ok: true, positions: dagrePositions(event.data) });
	} catch (e) {
		(self as unknown as Worker).postMessage({ ok: false, message: e instanceof Error ? e.message : String(e) });
	}
};
