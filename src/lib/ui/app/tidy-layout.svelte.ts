/**
 * Tidy layout of the whole diagram (toolbar button, L on the canvas): run in the layout worker;
 * edits made meanwhile stand, only positions change, in one undoable step.
 */
import type { Editor } from '../../editor/editor.svelte';
import type { Role } from '../../causal';
import { withPositions } from '../../layout/positions';
import { layoutInWorker } from '../../workers/layout-client';
import { layoutInput } from '../canvas/layout';
import type { Measure } from '../canvas/elements';

export class TidyLayout {
	/** A layout is being computed: the button is disabled. */
	arranging = $state(false);
	private readonly editor: Editor;
	private readonly measure: Measure;
	private readonly roles: () => ReadonlyMap<string, readonly Role[]>;
	private readonly fit: () => void;

	constructor(editor: Editor, measure: Measure, roles: () => ReadonlyMap<string, readonly Role[]>, fit: () => void) {
		this.editor = editor;
		this.measure = measure;
		this.roles = roles;
		this.fit = fit;
	}

	run = async (): Promise<void> => {
		const { editor } = this;
		if (editor.diagram.variables.length === 0 || this.arranging) return;
		this.arranging = true;
		editor.say('Arranging the diagram…', 'info');
		try {
			const positions = await layoutInWorker(layoutInput(editor.diagram, this.measure, this.roles()));
			editor.dispatch({ kind: 'replace-diagram', diagram: withPositions(editor.diagram, positions), label: 'Tidy layout' });
			this.fit();
		} catch (e) {
			editor.say(`The layout failed: ${e instanceof Error ? e.message : String(e)}`, 'error');
		} finally {
			this.arranging = false;
		}
	};
}
