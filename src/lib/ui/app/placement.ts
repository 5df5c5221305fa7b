/** Gives a diagram without positions a tidy layout (DOT files, hand-written JSON), in the layout worker. */
import type { Diagram } from '../../graph/diagram';
import type { Editor } from '../../editor/editor.svelte';
import { needsLayout, withPositions } from '../../layout/positions';
import { layoutInWorker } from '../../workers/layout-client';
import type { Measure } from '../canvas/elements';
import { layoutInput } from '../canvas/layout';

export function placer(editor: Editor, measure: Measure): (d: Diagram) => Promise<Diagram> {
	return async (d) => {
		if (!needsLayout(d)) return d;
		editor.say(`Arranging ${d.variables.length} variables…`, 'info');
		return withPositions(d, await layoutInWorker(layoutInput(d, measure)));
	};
}
