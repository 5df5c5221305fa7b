/**
 * Mouse and touch on the canvas: selecting (click, Shift/Ctrl/⌘+click, box), double-click to
 * add or rename, right-click menus, dragging variables (several together, one undo step per
 * drag), hover, and the arrows the edgehandles gesture completes.
 */
import type { Core, EdgeSingular, EventObject, NodeSingular } from 'cytoscape';
import type { Editor } from '../../editor/editor.svelte';
import { cycleClosedBy } from '../../editor/commands';
import type { ArrowRef } from '../../editor/selection';
import { nodeKey } from './elements';
import type { Point } from './viewport';

export type Pointed = { variable: string } | { arrow: ArrowRef };

export interface PointerHandlers {
	editor: Editor;
	container: HTMLElement;
	/** An arrow is being drawn with the keyboard: a click on a variable ends it there. */
	drawingTo(): ((id: string | null) => void) | null;
	startNewVariable(at: Point): void;
	startRename(id: string): void;
	openMenu(target: Pointed | null, at: Point, model?: Point): void;
	hover(target: Pointed | null): void;
	/** A drag began: the arrow handle hides. */
	dragging(): void;
	viewportChanged(): void;
}

const arrowOf = (t: { data(k: string): unknown }): ArrowRef => ({ from: t.data('from') as string, to: t.data('to') as string });

/** A click on a variable or an arrow: select it, or with Shift/Ctrl/⌘ add or remove it. */
function selectByPointer(editor: Editor, target: Pointed, additive: boolean) {
	const cur = editor.selection;
	if (!additive) {
		editor.select('variable' in target ? { variables: [target.variable], arrows: [] } : { variables: [], arrows: [target.arrow] });
		return;
	}
	if ('variable' in target) {
		const id = target.variable;
		const variables = cur.variables.includes(id) ? cur.variables.filter((v) => v !== id) : [...cur.variables, id];
		editor.select({ variables, arrows: cur.arrows });
	} else {
		const a = target.arrow;
		const has = cur.arrows.some((b) => b.from === a.from && b.to === a.to);
		editor.select({ variables: cur.variables, arrows: has ? cur.arrows.filter((b) => b.from !== a.from || b.to !== a.to) : [...cur.arrows, a] });
	}
}

export function bindPointerEvents(c: Core, h: PointerHandlers): void {
	const { editor } = h;
	const additive = (e: EventObject) => {
		const oe = e.originalEvent as MouseEvent | undefined;
		return !!oe && (oe.shiftKey || oe.ctrlKey || oe.metaKey);
	};
	c.on('tap', (e: EventObject) => {
		const finish = h.drawingTo();
		if (finish) {
			if (e.target === c) finish(null);
			else if (e.target.isNode?.()) finish((e.target as NodeSingular).data('vid') as string);
			return;
		}
		if (e.target === c) {
			if (!additive(e)) editor.select({ variables: [], arrows: [] });
		} else if (e.target.isNode()) selectByPointer(editor, { variable: (e.target as NodeSingular).data('vid') as string }, additive(e));
		else if (e.target.isEdge() && e.target.data('from') !== undefined) selectByPointer(editor, { arrow: arrowOf(e.target) }, additive(e));
	});
	// Box selection: Cytoscape reports each element in the box ('box'), after 'boxend'.
	c.on('boxend', (e: EventObject) => {
		const add = additive(e);
		const boxed: { variables: string[]; arrows: ArrowRef[] } = { variables: [], arrows: [] };
		const collect = (ev: EventObject) => {
			if (ev.target.isNode?.()) boxed.variables.push(ev.target.data('vid') as string);
			else if (ev.target.data?.('from') !== undefined) boxed.arrows.push(arrowOf(ev.target));
		};
		c.on('box', collect);
		queueMicrotask(() => {
			c.off('box', collect);
			if (boxed.variables.length === 0 && boxed.arrows.length === 0) return;
			const cur = editor.selection;
			editor.select(
				add
					? { variables: [...new Set([...cur.variables, ...boxed.variables])], arrows: [...cur.arrows, ...boxed.arrows.filter((a) => !cur.arrows.some((b) => b.from === a.from && b.to === a.to))] }
					: boxed
			);
		});
	});
	c.on('dbltap', (e: EventObject) => {
		if (e.target === c) h.startNewVariable(e.position);
		else if (e.target.isNode?.()) h.startRename((e.target as NodeSingular).data('vid'));
	});
	c.on('cxttap', (e: EventObject) => {
		const oe = e.originalEvent as MouseEvent | undefined;
		const r = h.container.getBoundingClientRect();
		const at = oe ? { x: oe.clientX, y: oe.clientY } : { x: r.left + e.renderedPosition.x, y: r.top + e.renderedPosition.y };
		if (e.target === c) h.openMenu(null, at, e.position);
		else if (e.target.isNode()) {
			const id = (e.target as NodeSingular).data('vid') as string;
			if (!editor.selection.variables.includes(id)) editor.select({ variables: [id], arrows: [] });
			h.openMenu({ variable: id }, at);
		} else if (e.target.isEdge()) {
			const a = arrowOf(e.target);
			editor.select({ variables: [], arrows: [a] });
			h.openMenu({ arrow: a }, at);
		}
	});
	bindDrag(c, editor);
	c.on('drag', 'node', () => {
		h.dragging();
		h.hover(null);
	});
	c.on('mouseover', 'node[vid], edge[from]', (e: EventObject) => {
		const t = e.target;
		h.hover(t.isNode() ? { variable: t.data('vid') as string } : { arrow: arrowOf(t) });
	});
	c.on('mouseout', 'node[vid], edge[from]', () => h.hover(null));
	c.on('pan zoom resize', () => h.viewportChanged());
	// Arrows drawn from the handle (cytoscape-edgehandles): a preview that would close a cycle
	// gets a bar end; the finished edge is replaced by an editor command, which may refuse it.
	c.on('ehpreviewon', (_e: EventObject, source: NodeSingular, target: NodeSingular, preview: EdgeSingular) => {
		const from = source.data('vid');
		const to = target.data('vid');
		if (from && to && cycleClosedBy(editor.diagram, from, to)) preview.addClass('refused');
	});
	c.on('ehcomplete', (_e: EventObject, source: NodeSingular, target: NodeSingular, added: EdgeSingular) => {
		added.remove();
		const from = source.data('vid');
		const to = target.data('vid');
		if (from && to) {
			const r = editor.dispatch({ kind: 'add-arrow', from, to });
			if (r.ok) editor.select({ variables: [], arrows: [{ from, to }] });
		}
	});
}

/** Dragging: one undoable step per drag, and dragging one of several selected variables moves them all. */
function bindDrag(c: Core, editor: Editor) {
	let dragTimer: ReturnType<typeof setTimeout> | null = null;
	const dragged = new Set<string>();
	type DragGroup = { id: string; x: number; y: number; others: { node: NodeSingular; x: number; y: number }[] };
	let group = null as DragGroup | null;
	c.on('grab', 'node', (e: EventObject) => {
		const id = (e.target as NodeSingular).data('vid') as string | undefined;
		const chosen = editor.selection.variables;
		group = null;
		if (!id || chosen.length < 2 || !chosen.includes(id)) return;
		const p = (e.target as NodeSingular).position();
		const others = chosen
			.filter((v) => v !== id)
			.map((v) => c.getElementById(nodeKey(v)))
			.filter((n) => !n.empty())
			.map((n) => ({ node: n as NodeSingular, x: (n as NodeSingular).position('x'), y: (n as NodeSingular).position('y') }));
		group = { id, x: p.x, y: p.y, others };
	});
	c.on('drag', 'node', (e: EventObject) => {
		const g = group;
		if (!g || (e.target as NodeSingular).data('vid') !== g.id) return;
		const p = (e.target as NodeSingular).position();
		c.batch(() => {
			for (const o of g.others) o.node.position({ x: o.x + p.x - g.x, y: o.y + p.y - g.y });
		});
	});
	c.on('dragfree', 'node', (e: EventObject) => {
		const id = (e.target as NodeSingular).data('vid');
		if (!id) return;
		dragged.add(id);
		const g: DragGroup | null = group;
		if (g && g.id === id) for (const o of g.others) dragged.add(o.node.data('vid') as string);
		group = null;
		if (dragTimer) clearTimeout(dragTimer);
		dragTimer = setTimeout(() => {
			const moves = [...dragged].map((vid) => {
				const p = c.getElementById(nodeKey(vid)).position();
				return { id: vid, x: Math.round(p.x), y: Math.round(p.y) };
			});
			dragged.clear();
			editor.dispatch({ kind: 'move-variables', moves });
		}, 0);
	});
}
