/**
 * Property test of the editor core: random sequences of edits (including refused ones),
 * recorded in the history; undoing everything must give back the starting diagram and
 * redoing everything the final one. Every intermediate diagram must pass the diagram layer's
 * own validation and Kahn's acyclicity oracle.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { readFileSync } from 'node:fs';
import { applyCommand, type Command, type RoleList } from '../../../src/lib/editor/commands';
import { amend, canRedo, canUndo, createHistory, record, redo, undo, type History } from '../../../src/lib/editor/history';
import { emptyDiagram, type Diagram } from '../../../src/lib/graph/diagram';
import { parseDiagramJson } from '../../../src/lib/graph/native-json';
import { validateDiagram } from '../../../src/lib/graph/validate';
import { isAcyclic } from './oracle';

const demo = parseDiagramJson(readFileSync('static/demo/cycling-hypertension.causeway.json', 'utf8'));

/** An edit described by small numbers, turned into a command against the current diagram. */
type Intent =
	| { op: 'add'; name: string; x: number; y: number }
	| { op: 'remove' | 'measured' | 'rename'; i: number; name: string }
	| { op: 'move'; i: number; x: number; y: number }
	| { op: 'arrow' | 'unarrow' | 'reverse'; i: number; j: number }
	| { op: 'role'; i: number; list: RoleList; member: boolean }
	| { op: 'plan'; picks: number[] }
	| { op: 'undo' | 'redo' }
	| { op: 'nudge'; i: number; dx: number }
	| { op: 'reid' | 'arrow-note' | 'column'; i: number; name: string };

const name = fc.constantFrom('Age', 'Income', 'Diet', 'Smoking', 'Stress', 'Sleep', 'BMI', 'Salt', 'Variable', 'Age 2');
const idx = fc.nat(30);
const intent: fc.Arbitrary<Intent> = fc.oneof(
	fc.record({ op: fc.constant('add' as const), name, x: fc.integer({ min: -500, max: 500 }), y: fc.integer({ min: -500, max: 500 }) }),
	fc.record({ op: fc.constantFrom('remove' as const, 'measured' as const, 'rename' as const), i: idx, name }),
	fc.record({ op: fc.constant('move' as const), i: idx, x: fc.integer({ min: -500, max: 500 }), y: fc.integer({ min: -500, max: 500 }) }),
	fc.record({ op: fc.constantFrom('arrow' as const, 'arrow' as const, 'unarrow' as const, 'reverse' as const), i: idx, j: idx }),
	fc.record({ op: fc.constant('role' as const), i: idx, list: fc.constantFrom<RoleList>('exposures', 'outcomes', 'adjusted'), member: fc.boolean() }),
	fc.record({ op: fc.constant('plan' as const), picks: fc.array(idx, { maxLength: 4 }) }),
	fc.record({ op: fc.constantFrom('undo' as const, 'redo' as const) }),
	fc.record({ op: fc.constant('nudge' as const), i: idx, dx: fc.integer({ min: -20, max: 20 }) }),
	fc.record({ op: fc.constantFrom('reid' as const, 'arrow-note' as const, 'column' as const), i: idx, name })
);

function toCommand(d: Diagram, it: Intent, serial: number): Command | null {
	const n = d.variables.length;
	const at = (i: number) => d.variables[i % Math.max(n, 1)]?.id;
	const arrowAt = (i: number) => d.arrows[i % Math.max(d.arrows.length, 1)];
	switch (it.op) {
		case 'add':
			return { kind: 'add-variable', variable: { id: `v${serial}`, label: it.name, measured: true, x: it.x, y: it.y } };
		case 'remove':
			return n ? { kind: 'remove-elements', ids: [at(it.i)], arrows: [] } : null;
		case 'measured':
			return n ? { kind: 'set-measured', id: at(it.i), measured: !d.variables[it.i % n].measured } : null;
		case 'rename':
			return n ? { kind: 'rename-variable', id: at(it.i), label: it.name } : null;
		case 'move':
			return n ? { kind: 'move-variables', moves: [{ id: at(it.i), x: it.x, y: it.y }] } : null;
		case 'arrow':
			return n ? { kind: 'add-arrow', from: at(it.i), to: at(it.j) } : null;
		case 'unarrow':
			return d.arrows.length ? { kind: 'remove-elements', ids: [], arrows: [arrowAt(it.i)] } : null;
		case 'reverse':
			return d.arrows.length ? { kind: 'reverse-arrow', ...arrowAt(it.i) } : null;
		case 'role':
			return n ? { kind: 'set-role', list: it.list, id: at(it.i), member: it.member } : null;
		case 'nudge': {
			const v = d.variables[it.i % Math.max(n, 1)];
			return v ? { kind: 'move-variables', moves: [{ id: v.id, x: (v.x ?? 0) + it.dx, y: v.y ?? 0 }] } : null;
		}
		case 'plan':
			return n ? { kind: 'set-adjusted', ids: it.picks.map(at) } : null;
		case 'reid':
			// Ids taken or unchanged are refused by the command; both outcomes are exercised.
			return n ? { kind: 'change-id', id: at(it.i), newId: it.name.toLowerCase().replace(' ', '_') } : null;
		case 'arrow-note':
			return d.arrows.length ? { kind: 'set-arrow-note', ...arrowAt(it.i), note: it.name } : null;
		case 'column':
			return n ? { kind: 'set-variable-data', id: at(it.i), data: { column: it.name } } : null;
		default:
			return null;
	}
}

function checkDiagram(d: Diagram) {
	expect(validateDiagram(d)).toEqual([]);
	expect(isAcyclic(d.variables.map((v) => v.id), d.arrows)).toBe(true);
}

function run(start: Diagram, intents: Intent[]) {
	let h: History = createHistory(start);
	intents.forEach((it, serial) => {
		if (it.op === 'undo') h = undo(h);
		else if (it.op === 'redo') h = redo(h);
		else {
			const cmd = toCommand(h.present, it, serial);
			if (!cmd) return;
			const before = h.present;
			const r = applyCommand(before, cmd);
			// Nudges amend the last step (as held arrow keys do in the app); all else records one.
			if (r.ok) h = it.op === 'nudge' ? amend(h, r.diagram, r.summary) : record(h, r.diagram, r.summary);
			else expect(h.present).toBe(before); // a refusal changes nothing
		}
		checkDiagram(h.present);
	});
	// Edits may have left undone steps on the redo list: the end is the last state it reaches.
	const here = h.present;
	let ahead = 0;
	while (canRedo(h)) {
		h = redo(h);
		ahead++;
	}
	const end = h.present;
	const endJson = structuredClone(end);
	for (let k = 0; k < ahead; k++) h = undo(h);
	expect(h.present).toBe(here);
	while (canRedo(h)) h = redo(h);
	let steps = 0;
	while (canUndo(h)) {
		h = undo(h);
		checkDiagram(h.present);
		steps++;
	}
	expect(h.present).toEqual(start);
	expect(h.present).toBe(start);
	while (canRedo(h)) {
		h = redo(h);
		steps--;
	}
	expect(steps).toBe(0);
	expect(h.present).toEqual(endJson);
}

describe('undo/redo over random edit sequences', () => {
	it('undo all returns the start and redo all the end, from an empty diagram', () => {
		fc.assert(
			fc.property(fc.array(intent, { maxLength: 60 }), (intents) => run(emptyDiagram(), intents)),
			{ numRuns: 300 }
		);
	});

	it('undo all returns the start and redo all the end, from the demo study', () => {
		const frozen = structuredClone(demo);
		fc.assert(
			fc.property(fc.array(intent, { maxLength: 60 }), (intents) => run(demo, intents)),
			{ numRuns: 300 }
		);
		// No command ever mutated the diagram it was given.
		expect(demo).toEqual(frozen);
	});
});
