import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { applyCommand, cycleClosedBy } from '../../../src/lib/editor/commands';
import { emptyDiagram, type Diagram } from '../../../src/lib/graph/diagram';
import { parseDiagramJson } from '../../../src/lib/graph/native-json';
import { validateDiagram } from '../../../src/lib/graph/validate';
import { isAcyclic } from './oracle';

const demo = parseDiagramJson(readFileSync('static/demo/cycling-hypertension.causeway.json', 'utf8'));

function apply(d: Diagram, ...cmds: Parameters<typeof applyCommand>[1][]): Diagram {
	for (const c of cmds) {
		const r = applyCommand(d, c);
		if (!r.ok) throw new Error(r.message);
		d = r.diagram;
	}
	return d;
}

const v = (id: string, label = id) => ({ id, label, measured: true, x: 0, y: 0 });

describe('arrows', () => {
	it('refuses an arrow that closes a cycle, names the cycle and leaves the diagram as it was', () => {
		const d = apply(emptyDiagram(), { kind: 'add-variable', variable: v('a', 'A') }, { kind: 'add-variable', variable: v('b', 'B') }, { kind: 'add-variable', variable: v('c', 'C') }, { kind: 'add-arrow', from: 'a', to: 'b' }, { kind: 'add-arrow', from: 'b', to: 'c' });
		const before = structuredClone(d);
		const r = applyCommand(d, { kind: 'add-arrow', from: 'c', to: 'a' });
		expect(r.ok).toBe(false);
		if (r.ok) return;
		expect(r.message).toBe('Arrow C → A refused: it would close the cycle C → A → B → C.');
		expect(r.cycle).toEqual(['c', 'a', 'b', 'c']);
		expect(d).toEqual(before);
	});

	it('refuses self-loops and duplicate arrows', () => {
		const d = apply(emptyDiagram(), { kind: 'add-variable', variable: v('a') }, { kind: 'add-variable', variable: v('b') }, { kind: 'add-arrow', from: 'a', to: 'b' });
		expect(applyCommand(d, { kind: 'add-arrow', from: 'a', to: 'a' }).ok).toBe(false);
		expect(applyCommand(d, { kind: 'add-arrow', from: 'a', to: 'b' }).ok).toBe(false);
	});

	it('reverses an arrow unless that closes a cycle', () => {
		// a → b → c and a → c: reversing a → c gives c → a, closing a → b → c → a.
		const d = apply(emptyDiagram(), ...['a', 'b', 'c'].map((id) => ({ kind: 'add-variable' as const, variable: v(id) })), { kind: 'add-arrow', from: 'a', to: 'b' }, { kind: 'add-arrow', from: 'b', to: 'c' }, { kind: 'add-arrow', from: 'a', to: 'c' });
		const r = applyCommand(d, { kind: 'reverse-arrow', from: 'a', to: 'c' });
		expect(r.ok).toBe(false);
		const ok = applyCommand(d, { kind: 'reverse-arrow', from: 'b', to: 'c' });
		expect(ok.ok && ok.diagram.arrows).toEqual([
			{ from: 'a', to: 'b' },
			{ from: 'c', to: 'b' },
			{ from: 'a', to: 'c' }
		]);
	});

	it('agrees with Kahn’s topological sort on every possible new arrow of the demo diagram', () => {
		const ids = demo.variables.map((x) => x.id);
		for (const from of ids)
			for (const to of ids) {
				if (from === to || demo.arrows.some((a) => a.from === from && a.to === to)) continue;
				const closes = !isAcyclic(ids, [...demo.arrows, { from, to }]);
				const cycle = cycleClosedBy(demo, from, to);
				expect(cycle !== null).toBe(closes);
				if (cycle) {
					expect(cycle[0]).toBe(from);
					expect(cycle[1]).toBe(to);
					for (let i = 0; i + 1 < cycle.length; i++) {
						const [p, q] = [cycle[i], cycle[i + 1]];
						expect(p === from && q === to ? true : demo.arrows.some((a) => a.from === p && a.to === q)).toBe(true);
					}
				}
			}
	});
});

describe('variables', () => {
	it('deleting a variable removes its arrows and its roles', () => {
		const r = applyCommand(demo, { kind: 'remove-elements', ids: ['cycling'], arrows: [] });
		expect(r.ok).toBe(true);
		if (!r.ok) return;
		expect(r.diagram.arrows.some((a) => a.from === 'cycling' || a.to === 'cycling')).toBe(false);
		expect(r.diagram.exposures).toEqual([]);
		expect(validateDiagram(r.diagram)).toEqual([]);
		expect(r.summary).toBe('Delete variable Commutes by bicycle');
	});

	it('renaming keeps the id, even one generated from the old label (ids are stable)', () => {
		const d = apply(emptyDiagram(), { kind: 'add-variable', variable: v('age', 'Age') }, { kind: 'add-variable', variable: v('bp', 'Blood pressure') }, { kind: 'add-arrow', from: 'age', to: 'bp' }, { kind: 'set-role', list: 'exposures', id: 'age', member: true });
		const r = apply(d, { kind: 'rename-variable', id: 'age', label: 'Age in years' });
		expect(r.variables[0]).toMatchObject({ id: 'age', label: 'Age in years' });
		expect(r.arrows).toEqual([{ from: 'age', to: 'bp' }]);
		expect(r.exposures).toEqual(['age']);
	});

	it('refuses an empty name', () => {
		expect(applyCommand(demo, { kind: 'rename-variable', id: 'age', label: '   ' }).ok).toBe(false);
	});
});

describe('question', () => {
	it('keeps exposure, outcome and planned set disjoint', () => {
		const d = apply(demo, { kind: 'set-role', list: 'outcomes', id: 'age', member: true });
		expect(d.outcomes).toEqual(['hypertension', 'age']);
		expect(d.adjusted).toEqual(['income', 'diet']);
		const e = apply(d, { kind: 'set-role', list: 'exposures', id: 'age', member: true });
		expect(e.outcomes).toEqual(['hypertension']);
		expect(e.exposures).toEqual(['cycling', 'age']);
		expect(validateDiagram(e)).toEqual([]);
	});

	it('replaces the planned set in one step', () => {
		const d = apply(demo, { kind: 'set-adjusted', ids: ['age', 'income'] });
		expect(d.adjusted).toEqual(['age', 'income']);
		expect(applyCommand(d, { kind: 'set-adjusted', ids: ['income', 'age'] }).ok).toBe(false);
	});
});
