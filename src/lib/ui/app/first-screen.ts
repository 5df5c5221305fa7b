/**
 * On a first visit the demo study is requested while the app's code starts, not after it has
 * mounted (bench section 6: the request used to start about 0.7 s into a cold load). The
 * canvas's drawing code is not: the canvas shows a first view without it and loads it on demand
 * (Canvas.svelte, canvas/on-demand.ts).
 */
import { base as appBase } from '$app/paths';
import type { Diagram } from '../../graph/diagram';
import { parseDiagramJson } from '../../graph/native-json';
import { VISITED_KEY } from '../../editor/autosave';

const DEMO_URL = `${appBase}/demo/cycling-hypertension.causeway.json`;

let demoRequest: Promise<Response> | null = null;
const demoResponse = () => (demoRequest ??= fetch(DEMO_URL));

/** Called once, when App.svelte's module is evaluated in the browser. */
export function requestFirstScreen(): void {
	if (typeof window === 'undefined') return;
	try {
		if (localStorage.getItem(VISITED_KEY) === null) void demoResponse().catch(() => undefined);
	} catch {
		// No storage: the start-up says so later.
	}
}

/** The demo study, laid out by `place`; on failure the reason is said and null returned. */
export async function loadDemo(place: (d: Diagram) => Promise<Diagram>, say: (error: string) => void): Promise<Diagram | null> {
	try {
		const response = await demoResponse();
		demoRequest = null; // a later "Open the demo study" fetches it again
		if (!response.ok) throw new Error(`HTTP ${response.status}`);
		return await place(parseDiagramJson(await response.text()));
	} catch (e) {
		say(`The demo study could not be loaded (${e instanceof Error ? e.message : String(e)}).`);
		return null;
	}
}
