/**
 * What the first screen needs, requested while the app's code starts rather than after it has
 * mounted (bench section 6: both requests used to start about 0.7 s into a cold load): the
 * canvas's drawing code, and on a first visit the demo study.
 */
import { base as appBase } from '$app/paths';
import type { Diagram } from '../../graph/diagram';
import { parseDiagramJson } from '../../graph/native-json';
import { VISITED_KEY } from '../../editor/autosave';
import { loadCytoscape } from '../canvas/load-cytoscape';

const DEMO_URL = `${appBase}/demo/cycling-hypertension.causeway.json`;

let demoRequest: Promise<Response> | null = null;
const demoResponse = () => (demoRequest ??= fetch(DEMO_URL));

/** Called once, when App.svelte's module is evaluated in the browser. */
export function requestFirstScreen(): void {
	if (typeof window === 'undefined') return;
	void loadCytoscape();
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
