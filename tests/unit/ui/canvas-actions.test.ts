/**
 * The canvas's actions run against the real editor: a key press and the menu item of the same
 * action do the same edit, a key whose action needs a selection says so, Ctrl+letters are
 * left to the window (undo, redo), and keyboard arrow drawing takes the arrow keys, Enter and
 * Escape first. The keys dialog (KeysDialog.svelte, rendered on the server) lists every row.
 */
import { describe, expect, it } from 'vitest';
import { render } from 'svelte/server';
import { Editor } from '../../../src/lib/editor/editor.svelte';
import { emptyDiagram, type Diagram } from '../../../src/lib/graph/diagram';
import { runKey, type Mode } from '../../../src/lib/ui/actions/action';
import { CANVAS_ACTIONS, menuItems, selectionTarget, type CanvasContext } from '../../../src/lib/ui/actions/canvas-actions';
import { keyRows } from '../../../src/lib/ui/actions/key-rows';
import KeysDialog from '../../../src/lib/ui/KeysDialog.svelte';

const v = (id: string, label: string, x: number, y = 0) => ({ id, label, measured: true, x, y });
const mediator = (): Diagram => ({
	...emptyDiagram(),
	variables: [v('age', 'Age', 0, -100), v('cycling', 'Cycling', 0), v('fitness', 'Fitness', 150), v('hypertension', 'Hypertension', 300)],
	arrows: [
		{ from: 'age', to: 'cycling' },
		{ from: 'age', to: 'hypertension' },
		{ from: 'cycling', to: 'fitness' },
		{ from: 'fitness', to: 'hypertension' }
	]
});

function setUp(d: Diagram = mediator()) {
	const editor = new Editor(d);
	const calls: string[] = [];
	const ctx: CanvasContext = {
		editor,
		highlighted: false,
		arrowAnchor: { id: null },
		startNewVariable: (at) => calls.push(`new ${at ? `${at.x},${at.y}` : 'beside'}`),
		startRename: (id) => calls.push(`rename ${id}`),
		edit: (e) => calls.push(`edit ${e.kind} ${'variable' in e ? e.variable : `${e.arrow.from}>${e.arrow.to}`}`),
		beginArrow: (id) => calls.push(`arrow from ${id}`),
		chooseArrowTarget: (dir) => calls.push(`target ${dir}`),
		finishArrow: () => calls.push('draw'),
		cancelArrow: () => calls.push('cancel'),
		openMenu: () => calls.push('menu'),
		layout: () => calls.push('layout'),
		fit: () => calls.push('fit'),
		zoomBy: (f) => calls.push(`zoom ${f > 1 ? 'in' : 'out'}`),
		ensureVisible: () => undefined,
		announce: (t) => calls.push(`say ${t}`),
		labelOf: (id) => editor.diagram.variables.find((x) => x.id === id)?.label ?? id
	};
	const key = (k: string, mods: { ctrl?: boolean; shift?: boolean; alt?: boolean } = {}, modes: Mode[] = ['canvas']) => {
		const e = { key: k, ctrlKey: !!mods.ctrl, metaKey: false, shiftKey: !!mods.shift, altKey: !!mods.alt, defaultPrevented: false, preventDefault() { this.defaultPrevented = true; } };
		const taken = runKey(CANVAS_ACTIONS, modes, e as unknown as KeyboardEvent, ctx, selectionTarget(editor), (t) => editor.say(t, 'info'));
		return { taken, prevented: e.defaultPrevented };
	};
	const select = (...ids: string[]) => editor.select({ variables: ids, arrows: [] });
	return { editor, ctx, calls, key, select };
}

describe('canvas actions by key', () => {
	it('X, Y, Z and H set the exposure, the outcome, the planned set and unmeasured, and again unset them', () => {
		const { editor, key, select } = setUp();
		select('cycling');
		expect(key('x')).toEqual({ taken: true, prevented: true });
		select('hypertension');
		key('y');
		select('age');
		key('z');
		expect(editor.diagram).toMatchObject({ exposures: ['cycling'], outcomes: ['hypertension'], adjusted: ['age'] });
		key('Z'); // Caps Lock
		expect(editor.diagram.adjusted).toEqual([]);
		key('h');
		expect(editor.diagram.variables.find((x) => x.id === 'age')?.measured).toBe(false);
		key('h');
		expect(editor.diagram.variables.find((x) => x.id === 'age')?.measured).toBe(true);
	});

	it('says what a key needs when nothing fitting is selected, and leaves Ctrl and Shift letters alone', () => {
		const { editor, key, select } = setUp();
		expect(key('x').taken).toBe(true);
		expect(editor.message?.text).toBe('Select one variable first (arrow keys move the selection).');
		key('t');
		expect(editor.message?.text).toBe('Select one variable or arrow first, then press T to write its note.');
		key('r');
		expect(editor.message?.text).toBe('Select one arrow first ([ and ] step through the arrows of the selected variable).');
		select('age');
		expect(key('z', { ctrl: true })).toEqual({ taken: false, prevented: false }); // undo, for the window
		expect(key('y', { ctrl: true }).taken).toBe(false); // redo
		expect(key('X', { shift: true }).taken).toBe(false);
		expect(editor.diagram.exposures).toEqual([]);
		// Enter with no single variable does nothing and keeps its default.
		editor.select({ variables: [], arrows: [] });
		expect(key('Enter')).toEqual({ taken: false, prevented: false });
	});

	it('runs the view, naming and arrow keys through the context', () => {
		const { calls, key, select } = setUp();
		select('cycling');
		for (const k of ['>', 'v', 'Insert', 'F2', 'l', 'f', '+', '=', '-', 't']) key(k);
		key('F10', { shift: true });
		expect(calls).toEqual(['arrow from cycling', 'new beside', 'new beside', 'rename cycling', 'layout', 'fit', 'zoom in', 'zoom in', 'zoom out', 'edit note cycling', 'menu']);
	});

	it('while drawing an arrow, the arrow keys, Enter and Escape belong to the drawing; other keys still work', () => {
		const { editor, calls, key, select } = setUp();
		select('cycling');
		const drawing: Mode[] = ['drawing', 'canvas'];
		key('ArrowLeft', {}, drawing);
		key('Enter', {}, drawing);
		key('Escape', {}, drawing);
		key('x', {}, drawing);
		expect(calls).toEqual(['target left', 'draw', 'cancel']);
		expect(editor.diagram.exposures).toEqual(['cycling']);
	});

	it('moves the selection and the selected variables with the arrow keys; [ and ] step through arrows', () => {
		const { editor, key, select, calls } = setUp();
		select('cycling');
		key('ArrowRight');
		expect(editor.selection.variables).toEqual(['fitness']);
		key('ArrowRight', { shift: true });
		key('ArrowRight', { shift: true, alt: true });
		expect(editor.diagram.variables.find((x) => x.id === 'fitness')?.x).toBe(175);
		key(']');
		expect(editor.selection.arrows).toEqual([{ from: 'cycling', to: 'fitness' }]);
		key(']');
		expect(editor.selection.arrows).toEqual([{ from: 'fitness', to: 'hypertension' }]);
		key('Delete');
		expect(editor.diagram.arrows).toHaveLength(3);
		const empty = setUp(emptyDiagram());
		empty.key('ArrowDown');
		expect(empty.calls).toEqual(['say The diagram is empty. Press V to add a variable.']);
		expect(calls).toEqual([]);
	});
});

describe('canvas context menus', () => {
	it('offer the same actions with their keys, checked where on', () => {
		const { editor, ctx, calls } = setUp();
		editor.dispatch({ kind: 'set-role', list: 'exposures', id: 'cycling', member: true });
		const items = menuItems(ctx, 'variable', { variable: 'cycling' });
		expect(items.map((i) => [i.label, i.shortcut ?? '', i.checked ?? null])).toEqual([
			['Rename', 'F2', null],
			['Exposure', 'X', true],
			['Outcome', 'Y', false],
			['In the planned set', 'Z', false],
			['Unmeasured', 'H', false],
			['Draw an arrow from here', '>', null],
			['Add a note…', 'T', null],
			['Change id…', '', null],
			['Delete variable', 'Delete', null]
		]);
		items.find((i) => i.label === 'Outcome')!.run();
		expect(editor.diagram.outcomes).toEqual(['cycling']);
		expect(editor.diagram.exposures).toEqual([]); // exposure, outcome and planned set are exclusive
		const arrow = menuItems(ctx, 'arrow', { arrow: { from: 'age', to: 'cycling' } });
		expect(arrow.map((i) => `${i.label} ${i.shortcut}`)).toEqual(['Reverse arrow R', 'Add a note… T', 'Delete arrow Delete']);
		// The menu deletes the element it belongs to, not the whole selection.
		editor.select({ variables: ['age', 'fitness'], arrows: [] });
		menuItems(ctx, 'variable', { variable: 'fitness' }).at(-1)!.run();
		expect(editor.diagram.variables.map((x) => x.id)).toEqual(['age', 'cycling', 'hypertension']);
		menuItems(ctx, 'background', { at: { x: 5, y: 6 } })[0].run();
		expect(calls).toEqual(['new 5,6']);
	});

	it('disable what cannot run', () => {
		const { ctx } = setUp(emptyDiagram());
		expect(menuItems(ctx, 'background', { at: { x: 0, y: 0 } }).map((i) => `${i.label}${i.disabled ? ' (off)' : ''}`)).toEqual(['Add a variable here', 'Tidy layout (off)', 'Fit diagram to window']);
	});
});

describe('the keys dialog', () => {
	it('lists every row of the actions tables', () => {
		const { body } = render(KeysDialog, { props: { open: false } });
		const text = body.replace(/<[^>]+>/g, ' ').replace(/&gt;/g, '>').replace(/\s+/g, ' ');
		for (const r of keyRows()) expect(text).toContain(` ${r.keys} ${r.words} `);
	});
});
