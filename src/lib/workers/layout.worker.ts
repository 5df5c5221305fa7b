/** Runs the tidy layout off the main thread: the same entry point as the page and the CLI (src/lib/layout/tidy.ts). */
import { tidyPositions, type LayoutInput } from '../layout';

self.onmessage = (event: MessageEvent<LayoutInput>) => {
	try {
		(self as unknown as Worker).postMessage({ ok: true, positions: tidyPositions(event.data) });
	} catch (e) {
		(self as unknown as Worker).postMessage({ ok: false, message: e instanceof Error ? e.message : String(e) });
	}
};
