/**
 * Opening a share link (src/lib/export/share-link.ts) in the app: at start-up and when the
 * fragment changes. The diagram replaces the current one as one undoable step; a damaged link
 * leaves the current diagram untouched and says what is wrong. The fragment is then removed
 * from the address bar, so a reload does not open it again over later edits. The link reader
 * (with its decompressor) loads only when the address holds a link, not with every start-up.
 */
import type { Diagram } from '../../graph/diagram';
import type { Editor } from '../../editor/editor.svelte';
import { openedDiagramText } from '../../wording';

export async function openShareLink(editor: Editor, place: (d: Diagram) => Promise<Diagram>): Promise<boolean> {
	const hash = window.location.hash;
	if (!hash.includes('=')) return false;
	let shared: Diagram | null;
	try {
		const { readShareFragment } = await import('../../export/share-link');
		shared = readShareFragment(hash);
	} catch (e) {
		clearFragment();
		editor.say(`The shared diagram was not opened — ${e instanceof Error ? e.message : String(e)}. Your current diagram is unchanged.`, 'error');
		return false;
	}
	if (!shared) return false;
	clearFragment();
	const d = await place(shared);
	editor.dispatch({ kind: 'replace-diagram', diagram: d, label: 'Open a shared diagram' });
	editor.select({ variables: [], arrows: [] });
	editor.say(`${openedDiagramText(`the shared diagram "${d.title || 'Untitled'}"`, d.variables.length, d.arrows.length)} Undo brings back your previous diagram.`, 'info');
	return true;
}

function clearFragment(): void {
	history.replaceState(history.state, '', window.location.pathname + window.location.search);
}
