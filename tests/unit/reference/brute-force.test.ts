/**
 * Checks of the brute-force oracle itself, before it is trusted to judge the engine:
 * tiny hand-made graphs whose answers follow from the definitions by hand (worked out in the
 * comments), and a cross-check of its path-enumerating d-separation against a second,
 * unrelated criterion: separation in the moralised ancestral graph (Lauritzen, Dawid,
 * Larsen & Leimer, Networks 1990), which is equivalent to d-separation.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { compileDag, type CompiledDag } from '../../../src/lib/graph/compiled';
import {
	adjustmentOracle,
	ancestorsOf,
	dSeparatedOracle,
	directEffectOracle,
	findOpenPath,
	isOpenPath,
	isSimplePathInSkeleton,
	listPathsOracle,
	optimalSetOracle,
	pairSeparation,
	parentsOf,
	rolesOracle
} from './brute-force';
import { randomDsepQuery } from './random-dag';
import { PEARL_BACK_DOOR, variableIds } from './published-diagrams';

/** Graph from "a->b" strings; `unmeasured` lists ids. Returns the graph and an id→index helper. */
function graph(ids: string[], arrows: string[], unmeasured: string[] = []) {
	const g = compileDag(
		ids,
		arrows.map((a) => {
			const [from, to] = a.split('->');
			return { from, to };
		}),
		ids.map((id) => !unmeasured.includes(id))
	);
	const ix = (...names: string[]) => names.map((nm) => g.indexOf.get(nm) as number);
	const names = (vs: readonly number[]) => vs.map((v) => g.ids[v]);
	const sets = (family: number[][]) => family.map((s) => names(s).sort()).map((s) => s.join(',')).sort();
	return { g, ix, names, sets };
}

/** Lauritzen et al. (1990): X ⫫ Y | Z iff Z separates X and Y in the moral graph of An(X ∪ Y ∪ Z). */
function separatedInMoralAncestralGraph(g: CompiledDag, xs: number[], ys: number[], zs: number[]): boolean {
	const keep = new Set<number>();
	for (const v of [...xs, ...ys, ...zs]) for (const a of ancestorsOf(g, v)) keep.add(a);
	const adj = new Map<number, Set<number>>();
	const link = (a: number, b: number) => {
		if (!adj.has(a)) adj.set(a, new Set());
		if (!adj.has(b)) adj.set(b, new Set());
		adj.get(a)?.add(b);
		adj.get(b)?.add(a);
	};
	for (const v of keep) {
		const ps = parentsOf(g, v);
		for (const p of ps) link(p, v);
		for (let i = 0; i < ps.length; i++) for (let j = i + 1; j < ps.length; j++) link(ps[i], ps[j]);
	}
	const blocked = new Set(zs);
	const targets = new Set(ys);
	const seen = new Set(xs);
	const queue = [...xs];
	while (queue.length > 0) {
		const u = queue.shift() as number;
		if (targets.has(u)) return false;
		for (const w of adj.get(u) ?? [])
			if (!seen.has(w) && !blocked.has(w)) {
				seen.add(w);
				queue.push(w);
			}
	}
	return true;
}

describe('oracle: d-separation on hand-made graphs (Pearl 1988 definition)', () => {
	it('chain a→b→c: open given ∅, blocked given b', () => {
		const { g, ix } = graph(['a', 'b', 'c'], ['a->b', 'b->c']);
		expect(dSeparatedOracle(g, ix('a'), ix('c'), [])).toBe(false);
		expect(dSeparatedOracle(g, ix('a'), ix('c'), ix('b'))).toBe(true);
		expect(findOpenPath(g, ix('a'), ix('c'), [])).toEqual(ix('a', 'b', 'c'));
	});
	it('collider a→c←b with c→d: blocked given ∅, opened by c or by its descendant d', () => {
		const { g, ix } = graph(['a', 'b', 'c', 'd'], ['a->c', 'b->c', 'c->d']);
		expect(dSeparatedOracle(g, ix('a'), ix('b'), [])).toBe(true);
		expect(dSeparatedOracle(g, ix('a'), ix('b'), ix('c'))).toBe(false);
		expect(dSeparatedOracle(g, ix('a'), ix('b'), ix('d'))).toBe(false);
		expect(isOpenPath(g, ix('a', 'c', 'b'), new Set(ix('d')))).toBe(true);
	});
	it('fork and sets: a←c→b, c→d; {a,d} vs {b} given {c}', () => {
		const { g, ix } = graph(['a', 'b', 'c', 'd'], ['c->a', 'c->b', 'c->d']);
		expect(dSeparatedOracle(g, ix('a', 'd'), ix('b'), ix('c'))).toBe(true);
		expect(dSeparatedOracle(g, ix('a', 'd'), ix('b'), [])).toBe(false);
	});
	it('skeleton path check', () => {
		const { g, ix } = graph(['a', 'b', 'c'], ['a->b', 'b->c']);
		expect(isSimplePathInSkeleton(g, ix('c', 'b', 'a'))).toBe(true);
		expect(isSimplePathInSkeleton(g, ix('a', 'c'))).toBe(false);
		expect(isSimplePathInSkeleton(g, ix('a', 'b', 'a'))).toBe(false);
	});
});

describe('oracle: adjustment criterion on hand-made graphs', () => {
	it('plain confounding c→x, c→y, x→y: ∅ fails through x←c→y, {c} is the unique minimal set', () => {
		const { g, ix, sets } = graph(['x', 'y', 'c'], ['c->x', 'c->y', 'x->y']);
		const o = adjustmentOracle(g, ix('x'), ix('y'));
		expect(o.isValid([])).toBe(false);
		expect(o.openPaths([])).toEqual([ix('x', 'c', 'y')]);
		expect(o.isValid(ix('c'))).toBe(true);
		expect(sets(o.minimalSets())).toEqual(['c']);
		expect(optimalSetOracle(g, ix('x'), ix('y'))).toEqual(ix('c'));
	});
	it('M structure a→x, a→m←b, b→y, x→y: ∅ minimal, {m} fails, {m,a} valid but not minimal', () => {
		const { g, ix, sets } = graph(['x', 'y', 'a', 'b', 'm'], ['a->x', 'a->m', 'b->m', 'b->y', 'x->y']);
		const o = adjustmentOracle(g, ix('x'), ix('y'));
		expect(o.isValid([])).toBe(true);
		expect(o.isValid(ix('m'))).toBe(false);
		expect(o.isValid(ix('m', 'a'))).toBe(true);
		expect(sets(o.minimalSets())).toEqual(['']);
	});
	it('mediator x→m→y: m is forbidden by condition (a), ∅ is the unique minimal set', () => {
		const { g, ix, sets } = graph(['x', 'm', 'y', 'd'], ['x->m', 'm->y', 'm->d']);
		const o = adjustmentOracle(g, ix('x'), ix('y'));
		expect(o.isValid(ix('m'))).toBe(false);
		expect(o.isValid(ix('d'))).toBe(false);
		expect([...o.forbidden].sort()).toEqual(ix('m', 'y', 'd').sort());
		expect(sets(o.minimalSets())).toEqual(['']);
	});
	it('unmeasured confounder u→x, u→y: no valid set', () => {
		const { g, ix } = graph(['x', 'y', 'u'], ['u->x', 'u->y', 'x->y'], ['u']);
		const o = adjustmentOracle(g, ix('x'), ix('y'));
		expect(o.minimalSets()).toEqual([]);
		expect(o.isValid(ix('u'))).toBe(false);
	});
	it('Pearl (2009) §3.3.1 eight-variable graph (reconstructed from memory): four minimal sets', () => {
		// X1→X3→X, X1→X4←X2, X2→X5→Y, X4→X, X4→Y, X→X6→Y.
		const { g, ix, sets } = graph(variableIds(PEARL_BACK_DOOR), [...PEARL_BACK_DOOR.arrows]);
		const o = adjustmentOracle(g, ix('X'), ix('Y'));
		expect(sets(o.minimalSets())).toEqual(['X1,X4', 'X2,X4', 'X3,X4', 'X4,X5']);
		expect(o.isValid(ix('X4'))).toBe(false);
	});
	it('two exposures: a proper path starts at one exposure and meets no other', () => {
		// x1→x2→y and x1←c→y: the path x2←x1←c→y is not proper; x1←c→y is.
		const { g, ix, sets } = graph(['x1', 'x2', 'y', 'c'], ['x1->x2', 'x2->y', 'c->x1', 'c->y']);
		const o = adjustmentOracle(g, ix('x1', 'x2'), ix('y'));
		expect(o.properNonCausal.map((p) => p.join())).toEqual([ix('x1', 'c', 'y').join()]);
		expect(sets(o.minimalSets())).toEqual(['c']);
	});
});

describe('oracle: single-door criterion (Pearl 2009 §5.3.1)', () => {
	it('x→m→y, x→y: {m} is the unique minimal set for the direct effect', () => {
		const { g, ix, sets } = graph(['x', 'm', 'y'], ['x->m', 'm->y', 'x->y']);
		expect(sets(directEffectOracle(g, ix('x')[0], ix('y')[0]).minimalSets())).toEqual(['m']);
	});
	it('x→m→y, x→y, m←u→y with u unmeasured: conditioning on m opens x→m←u→y, no valid set', () => {
		const { g, ix } = graph(['x', 'm', 'y', 'u'], ['x->m', 'm->y', 'x->y', 'u->m', 'u->y'], ['u']);
		const o = directEffectOracle(g, ix('x')[0], ix('y')[0]);
		expect(o.minimalSets()).toEqual([]);
		expect(o.isValid(ix('m'))).toBe(false);
	});
	it('descendants of y are excluded', () => {
		const { g, ix } = graph(['x', 'y', 'd'], ['x->y', 'y->d']);
		const o = directEffectOracle(g, ix('x')[0], ix('y')[0]);
		expect(o.isValid([])).toBe(true);
		expect(o.isValid(ix('d'))).toBe(false);
	});
});

describe('oracle: claims', () => {
	it('chain a→b→c: {b} minimal for (a, c); null-case when b is unmeasured', () => {
		const { g, ix } = graph(['a', 'b', 'c'], ['a->b', 'b->c']);
		const s = pairSeparation(g, ix('a')[0], ix('c')[0]);
		expect(s.isMinimalSeparator(ix('b'))).toBe(true);
		expect(s.isMinimalSeparator([])).toBe(false);
		const h = graph(['a', 'b', 'c'], ['a->b', 'b->c'], ['b']);
		expect(pairSeparation(h.g, h.ix('a')[0], h.ix('c')[0]).someMeasuredSetSeparates()).toBe(false);
	});
	it('collider a→c←b: ∅ minimal, {c} does not separate', () => {
		const { g, ix } = graph(['a', 'b', 'c'], ['a->c', 'b->c']);
		const s = pairSeparation(g, ix('a')[0], ix('b')[0]);
		expect(s.isMinimalSeparator([])).toBe(true);
		expect(s.separates(ix('c'))).toBe(false);
	});
	it('a set that separates but has a separating proper subset is not minimal', () => {
		const { g, ix } = graph(['a', 'b', 'c', 'd'], ['a->b', 'b->c', 'd->c']);
		const s = pairSeparation(g, ix('a')[0], ix('c')[0]);
		expect(s.separates(ix('b', 'd'))).toBe(true);
		expect(s.isMinimalSeparator(ix('b', 'd'))).toBe(false);
	});
});

describe('oracle: paths and roles', () => {
	it('lists X–Y paths with causal and open flags', () => {
		const { g, ix, names } = graph(['x', 'y', 'c', 'm', 'k'], ['c->x', 'c->y', 'x->m', 'm->y', 'x->k', 'y->k']);
		const listed = listPathsOracle(g, ix('x'), ix('y'), ix('c'))
			.map((p) => `${names(p.nodes).join('')}:${p.causal ? 'c' : 'n'}${p.open ? 'o' : 'b'}`)
			.sort();
		expect(listed).toEqual(['xcy:nb', 'xky:nb', 'xmy:co']);
	});
	it('each role by its definition on one small graph', () => {
		const { g, ix } = graph(
			['x', 'y', 'c', 'm', 'k', 'd', 'i', 'p', 'u', 'e'],
			['c->x', 'c->y', 'x->m', 'm->y', 'x->k', 'y->k', 'y->d', 'i->x', 'p->y', 'x->e']
		);
		const roles = rolesOracle(g, ix('x'), ix('y'));
		const of = (id: string) => roles[ix(id)[0]];
		expect(of('x')).toEqual(['exposure']);
		expect(of('y')).toEqual(['outcome']);
		expect(of('c')).toEqual(['confounder', 'common-cause']);
		expect(of('m')).toEqual(['mediator']);
		expect(of('k')).toEqual(['collider', 'descendant-of-outcome', 'descendant-of-exposure']);
		// d descends from y, hence also from x through x→m→y→d
		expect(of('d')).toEqual(['descendant-of-outcome', 'descendant-of-exposure']);
		expect(of('i')).toEqual(['instrument-like']);
		expect(of('p')).toEqual(['precision']);
		expect(of('u')).toEqual(['unrelated']);
		expect(of('e')).toEqual(['descendant-of-exposure']);
	});
	it('an ancestor of x that also reaches y around x is a confounder, not instrument-like', () => {
		const { g, ix } = graph(['x', 'y', 'a'], ['a->x', 'a->y', 'x->y']);
		expect(rolesOracle(g, ix('x'), ix('y'))[ix('a')[0]]).toEqual(['confounder', 'common-cause']);
	});
});

describe('oracle: d-separation agrees with the moralised ancestral graph criterion (Lauritzen et al. 1990)', () => {
	it('on 1,000 random DAGs with random disjoint X, Y, Z', () => {
		fc.assert(
			fc.property(randomDsepQuery({ maxNodes: 10 }), ({ dag, from, to, given }) => {
				const open = findOpenPath(dag.g, from, to, given);
				expect(open === null).toBe(separatedInMoralAncestralGraph(dag.g, from, to, given));
				if (open) expect(isOpenPath(dag.g, open, new Set(given)) && isSimplePathInSkeleton(dag.g, open)).toBe(true);
				if (dag.n <= 10) expect(pairSeparation(dag.g, from[0], to[0]).separates(given)).toBe(dSeparatedOracle(dag.g, from.slice(0, 1), to.slice(0, 1), given));
			}),
			{ numRuns: 1000, seed: 1990 }
		);
	});
});
