import { readFileSync } from 'node:fs';
import { alg } from '@dagrejs/graphlib';
import { describe, expect, it } from 'vitest';
import { emptyDiagram, type Diagram } from '../../../src/lib/graph/diagram';
import { InputError } from '../../../src/lib/graph/errors';
import { fromGraphlib, idOfNodeKey, nodeKey, toGraphlib } from '../../../src/lib/graph/graphlib-model';
import { parseDiagramJson } from '../../../src/lib/graph/native-json';

const demo = parseDiagramJson(readFileSync('static/demo/cycling-hypertension.causeway.json', 'utf8'));

describe('graphlib model', () => {
	it('holds the demo diagram and gives it back unchanged', () => {
		const g = toGraphlib(demo);
		expect(g.nodeCount()).toBe(13);
		expect(g.edgeCount()).toBe(21);
		expect(g.successors('cycling')?.sort()).toEqual(['app_panel', 'bmi', 'fitness']);
		expect(alg.isAcyclic(g)).toBe(true);
		expect(fromGraphlib(g)).toEqual(demo);
		expect(fromGraphlib(g, demo)).toEqual(demo);
	});

	it('copies: editing the graph leaves the diagram alone', () => {
		const g = toGraphlib(demo);
		g.node('age').label = 'Changed';
		g.graph().exposures.push('age');
		expect(demo.variables[0].label).toBe('Age');
		expect(demo.exposures).toEqual(['cycling']);
	});

	it('reflects edits: new nodes and edges follow, removed ones leave the roles too', () => {
		const g = toGraphlib(demo);
		g.removeNode('income');
		g.setNode('smoking', { id: 'smoking', label: 'Smoking', measured: true });
		g.setEdge('smoking', 'hypertension', { extra: { evidence: 'meta-analysis' } });
		g.setNode('bare');
		const d = fromGraphlib(g, demo);
		expect(d.variables.map((v) => v.id)).toEqual([...demo.variables.map((v) => v.id).filter((id) => id !== 'income'), 'smoking', 'bare']);
		expect(d.variables.at(-1)).toEqual({ id: 'bare', label: 'bare', measured: true });
		expect(d.arrows.filter((a) => a.from === 'income' || a.to === 'income')).toEqual([]);
		expect(d.arrows.at(-1)).toEqual({ from: 'smoking', to: 'hypertension', extra: { evidence: 'meta-analysis' } });
		expect(d.adjusted).toEqual(['age', 'diet']);
	});

	it('keeps ids that clash with Object.prototype or are all digits, in order', () => {
		const ids = ['__proto__', 'constructor', 'toString', '10', '2', '~tilde', 'a\u0001b', 'plain'];
		const d: Diagram = {
			...emptyDiagram('odd ids'),
			variables: ids.map((id) => ({ id, label: id, measured: true })),
			arrows: [
				{ from: '__proto__', to: 'constructor' },
				{ from: '10', to: '2' },
				{ from: 'a\u0001b', to: 'toString' }
			],
			exposures: ['__proto__'],
			outcomes: ['2']
		};
		const g = toGraphlib(d);
		expect(g.nodeCount()).toBe(ids.length);
		expect(fromGraphlib(g)).toEqual(d);
		expect(nodeKey('plain')).toBe('plain');
		for (const id of ids) expect(idOfNodeKey(nodeKey(id))).toBe(id);
		expect(({} as Record<string, unknown>).id).toBeUndefined();
	});

	it('refuses diagrams a simple graph cannot hold', () => {
		const base: Diagram = { ...emptyDiagram(), variables: [{ id: 'a', label: 'a', measured: true }, { id: 'b', label: 'b', measured: true }] };
		expect(() => toGraphlib({ ...base, arrows: [{ from: 'a', to: 'b' }, { from: 'a', to: 'b' }] })).toThrow('Arrow 2 (a → b) repeats arrow 1');
		expect(() => toGraphlib({ ...base, arrows: [{ from: 'a', to: 'c' }] })).toThrow(InputError);
		expect(() => toGraphlib({ ...base, variables: [...base.variables, base.variables[0]] })).toThrow(InputError);
	});

	it('keeps cycles and self-loops for validation to report', () => {
		const d: Diagram = {
			...emptyDiagram(),
			variables: [{ id: 'a', label: 'a', measured: true }, { id: 'b', label: 'b', measured: true }],
			arrows: [{ from: 'a', to: 'b' }, { from: 'b', to: 'a' }, { from: 'b', to: 'b' }]
		};
		const g = toGraphlib(d);
		expect(alg.isAcyclic(g)).toBe(false);
		expect(fromGraphlib(g)).toEqual(d);
	});
});
