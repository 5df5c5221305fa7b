/** Runs the dagre layout off the main thread (src/lib/layout). */
import { dagrePositions, type LayoutInput } from '../layout';

self.onmessage = (event: MessageEvent<LayoutInput>) => {
	try {
		(self as unknown as Worker).postMessage({ ok: true, positions: dagrePositions(event.data) });
	} catch (e) {
		(self as unknown as Worker).postMessage({ ok: false, message: e instanceof Error ? e.message : String(e) });
	}
};
