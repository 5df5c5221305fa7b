/**
 * Start-up and the browser's copies of the diagram: the autosaved diagram (or the newer
 * crash-safe copy) comes back, else the demo study on a first visit, then a share link in the
 * address; every edit is then saved in this browser. Two tabs on one autosave slot: the user
 * chooses, nothing is overwritten silently (docs/reliability.md).
 */
import type { Diagram } from '../../graph/diagram';
import type { Editor } from '../../editor/editor.svelte';
import { asideCopies, createAutosaver, discardAsideCopies, firstVisit, readStamp, restoreDiagram, type AsideCopy, type AutosaveConflict, type Autosaver } from '../../editor/autosave';
import { durableMirror, indexedDbStore, newerDurableDiagram, readDurableCopy, type DurableStore } from '../../editor/durable-copy';
import { openShareLink } from '../report/share-start';

export interface StartUpNeeds {
	editor: Editor;
	/** Lays out a diagram without positions. */
	place: (d: Diagram) => Promise<Diagram>;
	/** The demo study, or null (the reason already said). */
	loadDemo: () => Promise<Diagram | null>;
	/** Resolves once the canvas can draw. */
	canvasReady: Promise<void>;
	/** A diagram was put in place: fit it to the window. */
	fit: () => void;
}

export class StartUp {
	/** True once the first diagram is in place; autosave starts then. */
	ready = $state(false);
	/** Stored copies that could not be read, offered for download. */
	aside = $state.raw<AsideCopy[]>([]);
	/** Another tab saved to the same slot. */
	conflict = $state<AutosaveConflict | null>(null);
	#saver: Autosaver | null = null;
	private readonly needs: StartUpNeeds;

	constructor(needs: StartUpNeeds) {
		this.needs = needs;
	}

	/** Runs the start-up and saves every edit from then on; returns the clean-up. */
	mount(): () => void {
		const { editor } = this.needs;
		// The crash-safe second copy (docs/reliability.md); its failures are only logged, since
		// localStorage still holds every edit.
		const durableStore = indexedDbStore();
		void this.#start(durableStore);
		const saver = createAutosaver(localStorage, 300, (m) => editor.say(m, 'error'), {
			tabId: globalThis.crypto?.randomUUID?.(),
			onConflict: (c) => (this.conflict = c),
			mirror: durableStore ? durableMirror(durableStore, (m) => console.warn(m)).write : undefined
		});
		this.#saver = saver;
		// Another tab saving to the same slot: warn at once.
		const onStorage = (e: StorageEvent) => saver.onStorage(e.key);
		const onBeforeUnload = (e: BeforeUnloadEvent) => {
			if (saver.inConflict && saver.unsaved) e.preventDefault();
		};
		window.addEventListener('storage', onStorage);
		window.addEventListener('beforeunload', onBeforeUnload);
		const stopSaving = $effect.root(() => {
			$effect(() => {
				const d = editor.diagram;
				const deliberate = editor.canUndo;
				// Still within the edit's task (stored before any frame shows the edit), but after
				// the analysis is requested: the workers start while the diagram is written.
				if (this.ready) queueMicrotask(() => saver.schedule(d, deliberate));
			});
		});
		const flush = () => saver.flush();
		window.addEventListener('pagehide', flush);
		document.addEventListener('visibilitychange', flush);
		return () => {
			stopSaving();
			saver.flush();
			window.removeEventListener('pagehide', flush);
			window.removeEventListener('storage', onStorage);
			window.removeEventListener('beforeunload', onBeforeUnload);
			document.removeEventListener('visibilitychange', flush);
		};
	}

	async #start(durableStore: DurableStore | null): Promise<void> {
		const { editor, place, loadDemo, canvasReady, fit } = this.needs;
		const localStamp = readStamp(localStorage);
		const durable = readDurableCopy(durableStore);
		const kept = restoreDiagram(localStorage);
		this.aside = asideCopies(localStorage);
		const first = firstVisit(localStorage);
		// After the whole browser was killed, localStorage may hold an older state than the
		// crash-safe copy: the newer one is the user's last edit.
		const newer = newerDurableDiagram(localStamp, await durable);
		const restored = newer ? ({ kind: 'saved', diagram: newer } as const) : kept;
		if (restored.kind === 'saved') {
			const d = await place(restored.diagram);
			await canvasReady;
			editor.reset(d);
			editor.say('Your diagram from the last session is back (saved in this browser only).', 'info');
		} else {
			if (restored.kind === 'unreadable') editor.say(restored.message, 'error');
			if (first) {
				const demo = await loadDemo();
				await canvasReady;
				if (demo) {
					editor.reset(demo);
					editor.say('This is the demo study: does cycling to work lower the risk of hypertension? Edit it, or start a new diagram.', 'info');
				}
			}
		}
		await canvasReady;
		await openShareLink(editor, place);
		this.ready = true;
		fit();
	}

	takeTheirs = (): void => {
		const d = this.#saver?.takeTheirs() ?? null;
		this.conflict = null;
		if (d) this.needs.editor.dispatch({ kind: 'replace-diagram', diagram: d, label: 'Load the diagram from the other tab' });
		this.needs.fit();
	};

	keepMine = (): void => {
		this.#saver?.keepMine(this.needs.editor.diagram);
		this.conflict = null;
		this.needs.editor.say("This tab's diagram is saved in this browser; the other tab will be told.", 'info');
	};

	discardAside = (): void => {
		discardAsideCopies(localStorage);
		this.aside = [];
	};
}
