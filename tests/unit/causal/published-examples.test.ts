/**
 * The engine's façade (src/lib/causal/analysis.ts, string ids) on published worked examples
 * of confounding and of adjustment gone wrong, and on the project's demo diagram. The source
 * of each expectation is named beside it; graphs reconstructed from memory say so.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import type { Diagram } from '../../../src/lib/graph/diagram';
import { parseDiagramJson } from '../../../src/lib/graph/native-json';
import {
	adjustmentSets,
	analyse,
	checkAdjustment,
	dSeparation,
	exposureOutcomePaths,
	variableRoles
} from '../../../src/lib/causal/analysis';
import type { AdjustmentCheck, Role } from '../../../src/lib/causal/types';
import { optimalSetSentence, rolesText } from '../../../src/lib/wording';
import { BUTTERFLY, diagramOf, FRONT_DOOR, M_BIAS, OVERADJUSTMENT, PEARL_BACK_DOOR } from '../reference/published-diagrams';

/** A diagram from "a->b" arrows; variables in order of first mention. */
function diagram(spec: { arrows: string[]; exposures: string[]; outcomes: string[]; unmeasured?: string[]; adjusted?: string[] }): Diagram {
	const arrows = spec.arrows.map((a) => {
		const [from, to] = a.split('->');
		return { from, to };
	});
	const ids: string[] = [];
	for (const id of [...spec.exposures, ...spec.outcomes, ...arrows.flatMap((a) => [a.from, a.to])]) if (!ids.includes(id)) ids.push(id);
	return {
		title: 'published example',
		variables: ids.map((id) => ({ id, label: id, measured: !(spec.unmeasured ?? []).includes(id) })),
		arrows,
		exposures: spec.exposures,
		outcomes: spec.outcomes,
		adjusted: spec.adjusted ?? []
	};
}

const rolesOf = (d: Diagram, id: string): Role[] => variableRoles(d).find((r) => r.id === id)?.roles ?? [];
const openPaths = (c: AdjustmentCheck) => c.problems.flatMap((p) => (p.kind === 'open-path' ? [p.path.join('-')] : []));
const forbidden = (c: AdjustmentCheck) => c.problems.flatMap((p) => (p.kind === 'forbidden' ? [`${p.variable}:${p.why}`] : []));

describe('Pearl, Causality (2nd ed. 2009), §3.3.1, the back-door example (graph and statements reconstructed from memory)', () => {
	// Eight variables: X1→X3→X, X1→X4←X2, X2→X5→Y, X4→X, X4→Y, X→X6→Y (X = treatment, Y = outcome).
	const d = diagramOf(PEARL_BACK_DOOR);

	it('minimal sufficient sets are {X1,X4}, {X2,X4}, {X3,X4}, {X4,X5} (from memory, DESIGN.md "Outside checks")', () => {
		const r = adjustmentSets(d);
		expect(r.identifiable).toBe(true);
		expect(r.sets).toEqual([
			['X1', 'X4'],
			['X2', 'X4'],
			['X3', 'X4'],
			['X4', 'X5']
		]);
		expect(r.truncated).toBe(false);
		expect(r.minimum).toHaveLength(2);
	});

	it('Pearl: {X3,X4} and {X4,X5} meet the back-door criterion', () => {
		expect(checkAdjustment(d, { adjusted: ['X3', 'X4'] }).valid).toBe(true);
		expect(checkAdjustment(d, { adjusted: ['X4', 'X5'] }).valid).toBe(true);
	});

	it('Pearl: {X4} alone fails, because it opens X←X3←X1→X4←X2→X5→Y', () => {
		const c = checkAdjustment(d, { adjusted: ['X4'] });
		expect(c.valid).toBe(false);
		expect(openPaths(c)).toContain('X-X3-X1-X4-X2-X5-Y');
	});

	it('Pearl: X6, a descendant of X on the causal path, may not be adjusted', () => {
		const c = checkAdjustment(d, { adjusted: ['X3', 'X4', 'X6'] });
		expect(c.valid).toBe(false);
		expect(forbidden(c)).toEqual(['X6:mediator']);
	});
});

describe('M-bias (Greenland, Epidemiology 2003)', () => {
	// A→X, A→M←B, B→Y, X→Y: M is a pre-exposure collider of two independent causes.
	const d = diagramOf(M_BIAS);

	it('Greenland: the empty set is sufficient (it is the unique minimal set)', () => {
		expect(adjustmentSets(d).sets).toEqual([[]]);
		expect(checkAdjustment(d, { adjusted: [] }).valid).toBe(true);
	});

	it('Greenland: adjusting the collider M alone opens X←A→M←B→Y', () => {
		const c = checkAdjustment(d, { adjusted: ['M'] });
		expect(c.valid).toBe(false);
		expect(openPaths(c)).toEqual(['X-A-M-B-Y']);
	});

	it('Greenland: adding A (or B) to M closes the path again', () => {
		expect(checkAdjustment(d, { adjusted: ['M', 'A'] }).valid).toBe(true);
		expect(checkAdjustment(d, { adjusted: ['M', 'B'] }).valid).toBe(true);
	});

	it('M is shown as a collider', () => {
		expect(rolesOf(d, 'M')).toEqual(['collider']);
	});
});

describe('Overadjustment (Schisterman, Cole & Platt, Epidemiology 2009)', () => {
	// C confounds; M is an intermediate on X→M→Y; D is a descendant of the intermediate.
	const d = diagramOf(OVERADJUSTMENT);

	it('Schisterman et al.: adjusting an intermediate is not valid for the total effect', () => {
		const c = checkAdjustment(d, { adjusted: ['C', 'M'] });
		expect(c.valid).toBe(false);
		expect(forbidden(c)).toEqual(['M:mediator']);
	});

	it('Schisterman et al.: neither is adjusting a descendant of the intermediate', () => {
		const c = checkAdjustment(d, { adjusted: ['C', 'D'] });
		expect(c.valid).toBe(false);
		expect(forbidden(c)).toEqual(['D:descendant-of-mediator']);
	});

	it('the confounder alone is the unique minimal set, and M is a mediator', () => {
		expect(adjustmentSets(d).sets).toEqual([['C']]);
		expect(rolesOf(d, 'M')).toEqual(['mediator']);
	});

	it('for the direct effect (single-door criterion, Pearl 2009 §5.3.1) adjusting M is what is needed', () => {
		expect(adjustmentSets(d, { effect: 'direct' }).sets).toEqual([['C', 'M']]);
	});
});

describe('Collider stratification and selection bias (Hernán, Hernández-Díaz & Robins, Epidemiology 2004; structures from memory)', () => {
	it('Hernán et al.: with no effect of X on Y, a common effect C leaves X and Y independent, conditioning on C does not', () => {
		const d = diagram({ arrows: ['X->C', 'Y->C'], exposures: ['X'], outcomes: ['Y'] });
		expect(dSeparation(d, ['X'], ['Y'], []).separated).toBe(true);
		expect(dSeparation(d, ['X'], ['Y'], ['C'])).toEqual({ separated: false, path: ['X', 'C', 'Y'] });
		const c = checkAdjustment(d, { adjusted: ['C'] });
		expect(c.valid).toBe(false);
		expect(openPaths(c)).toEqual(['X-C-Y']);
		expect(adjustmentSets(d).sets).toEqual([[]]);
		expect(rolesOf(d, 'C')).toContain('collider');
	});

	it('Hernán et al.: selecting on S, an effect of the common effect C, biases too', () => {
		const d = diagram({ arrows: ['X->C', 'Y->C', 'C->S'], exposures: ['X'], outcomes: ['Y'] });
		expect(dSeparation(d, ['X'], ['Y'], ['S']).separated).toBe(false);
		expect(checkAdjustment(d, { adjusted: ['S'] }).valid).toBe(false);
	});

	it('Hernán et al.: censoring C caused by X and by an unmeasured cause U of Y opens X→C←U→Y', () => {
		const d = diagram({ arrows: ['X->C', 'U->C', 'U->Y', 'X->Y'], exposures: ['X'], outcomes: ['Y'], unmeasured: ['U'] });
		expect(checkAdjustment(d, { adjusted: [] }).valid).toBe(true);
		const c = checkAdjustment(d, { adjusted: ['C'] });
		expect(c.valid).toBe(false);
		// C descends from X but from no node of a causal path, so the adjustment criterion does
		// not forbid it: the problem is the path it opens.
		expect(c.problems).toEqual([{ kind: 'open-path', path: ['X', 'C', 'U', 'Y'] }]);
		expect(exposureOutcomePaths(d, { adjusted: ['C'] }).paths.find((p) => p.nodes.join('-') === 'X-C-U-Y')?.open).toBe(true);
	});
});

describe('Confounder as a member of some minimal sufficient set (VanderWeele & Shpitser, Ann Stat 2013)', () => {
	it('c→x, c→m, m→y, x→y: {c} and {m} are both minimal, so m is a confounder without being a common cause', () => {
		const d = diagram({ arrows: ['c->x', 'c->m', 'm->y', 'x->y'], exposures: ['x'], outcomes: ['y'] });
		expect(adjustmentSets(d).sets).toEqual([['c'], ['m']]);
		expect(rolesOf(d, 'm')).toEqual(['confounder']);
		expect(rolesOf(d, 'c')).toEqual(['confounder', 'common-cause']);
	});
	it('with c unmeasured, m is still a confounder (roles count every variable as adjustable)', () => {
		const d = diagram({ arrows: ['c->x', 'c->m', 'm->y', 'x->y'], exposures: ['x'], outcomes: ['y'], unmeasured: ['c'] });
		expect(rolesOf(d, 'm')).toEqual(['confounder']);
	});
	it('a common cause that no minimal set needs: c→a→x, c→b→y, a→y, x→y (only {a} is minimal)', () => {
		const d = diagram({ arrows: ['c->a', 'a->x', 'c->b', 'b->y', 'a->y', 'x->y'], exposures: ['x'], outcomes: ['y'] });
		expect(adjustmentSets(d).sets).toEqual([['a']]);
		expect(rolesOf(d, 'c')).toEqual(['common-cause']);
		expect(rolesOf(d, 'a')).toEqual(['confounder', 'common-cause']);
	});
});

describe('Butterfly bias (Ding & Miratrix, J Causal Inference 2015)', () => {
	// A→X, A→C←B, B→Y, C→X, C→Y, X→Y: C is a confounder and a collider at once.

	it('Ding & Miratrix: neither the empty set nor C alone removes bias; C with A or with B does', () => {
		const d = diagramOf(BUTTERFLY);
		expect(checkAdjustment(d, { adjusted: [] }).valid).toBe(false);
		const c = checkAdjustment(d, { adjusted: ['C'] });
		expect(c.valid).toBe(false);
		expect(openPaths(c)).toEqual(['X-A-C-B-Y']);
		expect(adjustmentSets(d).sets).toEqual([
			['A', 'C'],
			['B', 'C']
		]);
		expect(rolesOf(d, 'C')).toEqual(['confounder', 'common-cause', 'collider']);
		// C's minimal sets are {A, C} and {B, C}: it must be adjusted with one of them.
		const c2 = variableRoles(d).find((r) => r.id === 'C')!;
		expect([['A'], ['B']]).toContainEqual(c2.adjustWith);
		expect(rolesText(c2)).toMatch(/^confounder · common cause · collider: adjust together with [AB]$/);
	});

	it('Ding & Miratrix: with A and B unmeasured, no adjustment set exists', () => {
		const d = diagramOf(BUTTERFLY, { unmeasured: ['A', 'B'] });
		const r = adjustmentSets(d);
		expect(r.identifiable).toBe(false);
		expect(r.sets).toEqual([]);
		expect(r.minimum).toBeNull();
		expect(r.optimal).toBeNull();
	});
});

describe('Front-door structure (Pearl, Biometrika 1995)', () => {
	// U→X, U→Y with U unmeasured; X→M→Y, M shielded from U.

	it('Pearl 1995: with the confounder unmeasured, no adjustment set identifies the effect', () => {
		const d = diagramOf(FRONT_DOOR);
		const r = adjustmentSets(d);
		expect(r.identifiable).toBe(false);
		expect(r.sets).toEqual([]);
		expect(r.minimum).toBeNull();
		const c = checkAdjustment(d, { adjusted: ['M'] });
		expect(c.valid).toBe(false);
		expect(forbidden(c)).toEqual(['M:mediator']);
	});

	it('the same structure with U measured is identified by {U}', () => {
		const d = diagramOf(FRONT_DOOR, { unmeasured: [] });
		expect(adjustmentSets(d).sets).toEqual([['U']]);
	});
});

describe('Demo study: cycling to work and hypertension (static/demo, our own scenario, DESIGN.md)', () => {
	const d = parseDiagramJson(readFileSync(new URL('../../../static/demo/cycling-hypertension.causeway.json', import.meta.url), 'utf8'));

	it('DESIGN.md: {age, diet, income} is the unique minimal sufficient set', () => {
		const r = adjustmentSets(d);
		expect(r.exposures).toEqual(['cycling']);
		expect(r.outcomes).toEqual(['hypertension']);
		expect(r.sets).toEqual([['age', 'diet', 'income']]);
		expect(r.minimum).toEqual(['age', 'diet', 'income']);
		// Henckel et al. (2022), O = pa(cn) \ forb, worked by hand: cn = {fitness, bmi,
		// hypertension}; their parents minus De(cn) ∪ {cycling} = {age, diet, family_history, income}.
		expect(r.optimal).toEqual(['age', 'diet', 'family_history', 'income']);
	});

	it('the planned set in the file is valid; the collider, a mediator or the outcome descendant are not', () => {
		expect(checkAdjustment(d).valid).toBe(true);
		const collider = checkAdjustment(d, { adjusted: ['age', 'diet', 'income', 'app_panel'] });
		expect(collider.valid).toBe(false);
		expect(forbidden(checkAdjustment(d, { adjusted: ['age', 'diet', 'income', 'fitness'] }))).toEqual(['fitness:mediator']);
		expect(forbidden(checkAdjustment(d, { adjusted: ['age', 'diet', 'income', 'antihypertensive'] }))).toEqual([
			'antihypertensive:descendant-of-outcome'
		]);
		// Leaving out diet leaves the back door through the unmeasured trait open.
		expect(openPaths(checkAdjustment(d, { adjusted: ['age', 'income'] }))).toContain('cycling-health_consciousness-diet-hypertension');
	});

	it('DESIGN.md roles: collider, mediators, outcome descendant, instrument-like, precision, confounders', () => {
		expect(rolesOf(d, 'cycling')).toEqual(['exposure']);
		expect(rolesOf(d, 'hypertension')).toEqual(['outcome']);
		expect(rolesOf(d, 'app_panel')).toContain('collider');
		expect(rolesOf(d, 'fitness')).toEqual(['mediator']);
		// bmi is also a collider by definition: on cycling→bmi←diet→hypertension.
		expect(rolesOf(d, 'bmi')).toEqual(['mediator', 'collider']);
		expect(rolesOf(d, 'antihypertensive')).toContain('descendant-of-outcome');
		expect(rolesOf(d, 'distance')).toEqual(['instrument-like']);
		expect(rolesOf(d, 'bikeability')).toEqual(['instrument-like']);
		expect(rolesOf(d, 'family_history')).toEqual(['precision']);
		expect(rolesOf(d, 'age')).toEqual(['confounder', 'common-cause']);
		expect(rolesOf(d, 'income')).toEqual(['confounder', 'common-cause']);
		expect(rolesOf(d, 'health_consciousness')).toEqual(['confounder', 'common-cause']);
	});

	it('analyse() gives the same answers at once', () => {
		const a = analyse(d);
		expect(a.ready).toBe(true);
		expect(a.issues).toEqual([]);
		expect(a.sets?.sets).toEqual([['age', 'diet', 'income']]);
		expect(a.check?.valid).toBe(true);
		expect(a.paths?.paths.some((p) => p.nodes.join('-') === 'cycling-app_panel-hypertension' && !p.open)).toBe(true);
	});
});

describe('Why the efficiency-optimal set is missing', () => {
	it('no causal path from exposure to outcome, everything measured: says so', () => {
		const d = diagram({ arrows: ['c->x', 'c->y'], exposures: ['x'], outcomes: ['y'] });
		const s = adjustmentSets(d);
		expect(s.optimalGap).toEqual({ why: 'no-causal-path' });
		expect(optimalSetSentence(s, (ids) => `{${ids.join(', ')}}`)).toMatch(/no causal path from the exposure to the outcome/);
	});
	it('an unmeasured parent of the outcome: names it', () => {
		const d = diagram({ arrows: ['c->x', 'c->y', 'x->y', 'u->y'], exposures: ['x'], outcomes: ['y'], unmeasured: ['u'] });
		const s = adjustmentSets(d);
		expect(s.optimal).toBeNull();
		expect(s.optimalGap).toEqual({ why: 'unmeasured', unmeasured: ['u'] });
	});
	it('present when it exists', () => {
		const d = diagram({ arrows: ['c->x', 'c->y', 'x->y'], exposures: ['x'], outcomes: ['y'] });
		expect(adjustmentSets(d).optimalGap).toBeUndefined();
	});
});
