/**
 * File operations of the window: New (empty or the demo study), Open (the file chooser, a
 * file dropped on the window), Save as Causeway JSON or DOT. A file that cannot be read leaves
 * the diagram as it was and says why.
 */
import { emptyDiagram, type Diagram } from '../../graph/diagram';
import { InputError } from '../../graph/errors';
import { writeDiagramJson } from '../../graph/native-json';
import { firstUnopenableIssue } from '../../graph/validate';
import type { Editor } from '../../editor/editor.svelte';
import { downloadText, fileStem, readFileText } from '../files';
import { openedDiagramText } from '../../wording';

export interface FileNeeds {
	editor: Editor;
	place: (d: Diagram) => Promise<Diagram>;
	loadDemo: () => Promise<Diagram | null>;
	/** Asks what becomes of loaded data before another diagram replaces this one; false: cancelled. */
	settleData: (action: string) => Promise<boolean>;
	fit: () => void;
}

export class FileActions {
	/** A file is dragged over the window. */
	dropping = $state(false);
	/** The hidden file input the toolbar holds. */
	input: HTMLInputElement | undefined = $state();
	private readonly needs: FileNeeds;

	constructor(needs: FileNeeds) {
		this.needs = needs;
	}

	choose = (): void => {
		this.input?.click();
	};

	async open(file: File): Promise<void> {
		const { editor, place, settleData, fit } = this.needs;
		try {
			const text = await readFileText(file);
			// The readers (DOT's parser among them) load with the first file opened.
			const { readDiagramText } = await import('../../graph/read-file');
			const read = readDiagramText(file.name, text);
			// Repeated ids and arrows to unlisted variables cannot be drawn: refuse, naming them.
			const unopenable = firstUnopenableIssue(read);
			if (unopenable) throw new InputError(`${file.name}: ${unopenable.message}; fix the file and open it again`);
			const d = await place(read);
			if (!(await settleData(`Opening ${file.name}`))) return editor.say(`${file.name} was not opened.`, 'info');
			editor.dispatch({ kind: 'replace-diagram', diagram: d, label: `Open ${file.name}` });
			editor.say(`${openedDiagramText(file.name, d.variables.length, d.arrows.length)} Undo brings back the previous diagram.`, 'info');
			fit();
		} catch (e) {
			const message = e instanceof InputError || e instanceof Error ? e.message : String(e);
			editor.say(`Not opened — ${message}`, 'error');
		}
	}

	chosen = (e: Event): void => {
		const input = e.currentTarget as HTMLInputElement;
		const file = input.files?.[0];
		if (file) void this.open(file);
		input.value = '';
	};

	saveJson = (): void => {
		const { editor } = this.needs;
		try {
			downloadText(`${fileStem(editor.diagram.title)}.causeway.json`, writeDiagramJson(editor.diagram), 'application/json');
			editor.say('Saved as a Causeway diagram file (JSON).', 'info');
		} catch (e) {
			editor.say(`Not saved — ${e instanceof Error ? e.message : String(e)}`, 'error');
		}
	};

	saveDot = async (): Promise<void> => {
		const { editor } = this.needs;
		try {
			const { writeDot } = await import('../../graph/dot');
			downloadText(`${fileStem(editor.diagram.title)}.dot`, writeDot(editor.diagram), 'text/vnd.graphviz');
			editor.say('Saved as a DOT (Graphviz) file.', 'info');
		} catch (e) {
			editor.say(`Not saved — ${e instanceof Error ? e.message : String(e)}`, 'error');
		}
	};

	/** New: an empty diagram or the demo study, in one undoable step. */
	async startNew(kind: 'empty' | 'demo'): Promise<void> {
		const { editor, loadDemo, settleData, fit } = this.needs;
		const d = kind === 'empty' ? emptyDiagram() : await loadDemo();
		if (!d || !(await settleData(kind === 'empty' ? 'Starting an empty diagram' : 'Opening the demo study'))) return;
		editor.dispatch({ kind: 'replace-diagram', diagram: d, label: kind === 'empty' ? 'New diagram' : 'Open the demo study' });
		editor.select({ variables: [], arrows: [] });
		fit();
	}

	dragover = (e: DragEvent): void => {
		if (!e.dataTransfer?.types.includes('Files')) return;
		e.preventDefault();
		e.dataTransfer.dropEffect = 'copy';
		this.dropping = true;
	};

	drop = (e: DragEvent): void => {
		if (!e.dataTransfer?.files.length) return;
		e.preventDefault();
		this.dropping = false;
		void this.open(e.dataTransfer.files[0]);
	};

	dragleave = (e: DragEvent): void => {
		if (e.relatedTarget === null) this.dropping = false;
	};
}
