/**
 * The reviewer tools (through the analysis.ts façade) on published examples of adjustment
 * gone wrong. Each expectation names its source; structures reconstructed from memory say so.
 */
import { describe, expect, it } from 'vitest';
import type { Diagram } from '../../../src/lib/graph/diagram';
import {
	adjustmentSets,
	checkAdjustment,
	compareDiagrams,
	conditionalInstruments,
	efficiencyAdvice,
	planRobustness,
	reviewAdjustment,
	setsRobustToAdditions,
	variableRoles
} from '../../../src/lib/causal';
import type { AdjustmentReview, PlanWeakness } from '../../../src/lib/causal/review-types';
import { compileDiagram } from '../../../src/lib/graph/compiled';
import { dSeparatedOracle } from '../reference/brute-force';
import { BUTTERFLY, diagramOf, M_BIAS, OVERADJUSTMENT, PEARL_BACK_DOOR, renamed } from '../reference/published-diagrams';

function diagram(spec: { arrows: string[]; exposures: string[]; outcomes: string[]; unmeasured?: string[]; adjusted?: string[]; labels?: Record<string, string> }): Diagram {
	const arrows = spec.arrows.map((a) => {
		const [from, to] = a.split('->');
		return { from, to };
	});
	const ids: string[] = [];
	for (const id of [...spec.exposures, ...spec.outcomes, ...arrows.flatMap((a) => [a.from, a.to])]) if (!ids.includes(id)) ids.push(id);
	return {
		title: 'published example',
		variables: ids.map((id) => ({ id, label: spec.labels?.[id] ?? id, measured: !(spec.unmeasured ?? []).includes(id) })),
		arrows,
		exposures: spec.exposures,
		outcomes: spec.outcomes,
		adjusted: spec.adjusted ?? []
	};
}

const kinds = (r: AdjustmentReview) => r.reasons.map((x) => ('variable' in x ? `${x.kind}:${x.variable}` : `${x.kind}:${x.path.join('-')}${x.backDoor ? ' (back-door)' : ''}`));
const changeText = (w: PlanWeakness) => (w.change.kind === 'unmeasure' ? `unmeasure ${w.change.variable}` : `${w.change.kind} ${w.change.from}->${w.change.to}`);

describe('M-bias (Greenland, Pearl & Robins, Epidemiology 1999; Greenland, Epidemiology 2003)', () => {
	// X ← A → M ← B → Y, X → Y: M is a pre-exposure collider.
	const d = diagramOf(M_BIAS);

	it('a paper adjusting for M alone: collider bias on the back-door path X ← A → M ← B → Y', () => {
		const r = reviewAdjustment(d, { adjusted: ['M'] });
		expect(r.valid).toBe(false);
		expect(kinds(r)).toEqual(['open-path:X-A-M-B-Y (back-door)', 'collider-bias:M']);
		expect(r.reasons[1]).toMatchObject({ collider: 'M', path: ['X', 'A', 'M', 'B', 'Y'] });
	});

	it('the fix: drop M (nearest minimal set is the empty set), or add A or B (smallest extension, one variable)', () => {
		const r = reviewAdjustment(d, { adjusted: ['M'] });
		expect(r.nearest).toMatchObject({ set: [], add: [], drop: ['M'] });
		expect(r.extension).toHaveLength(1);
		expect(['A', 'B']).toContain(r.extension![0]);
		expect(checkAdjustment(d, { adjusted: ['M', ...r.extension!] }).valid).toBe(true);
	});

	it('adjusting for nothing is valid but rests on the absence of A → Y and B → X (2-arrow paths), M → X and M → Y (3-arrow paths)', () => {
		const rob = planRobustness(d, { adjusted: [] });
		expect(rob.applicable).toBe(true);
		expect(rob.weaknesses.filter((w) => w.length === 2).map(changeText)).toEqual(['add-arrow A->Y', 'add-arrow B->X']);
		const three = rob.weaknesses.filter((w) => w.length === 3).map(changeText);
		for (const c of ['add-arrow M->X', 'add-arrow M->Y']) expect(three).toContain(c);
		expect(rob.weaknesses.find((w) => changeText(w) === 'add-arrow M->X')?.witness).toEqual(['X', 'M', 'B', 'Y']);
		// Deleting arrows never breaks a valid set; nothing measured is planned.
		expect(rob.weaknesses.some((w) => w.change.kind === 'delete-arrow' || w.change.kind === 'unmeasure')).toBe(false);
	});
});

describe('Butterfly bias (Ding & Miratrix, J Causal Inference 2015)', () => {
	// A → X, A → M, B → M, B → Y, M → X, M → Y, X → Y: M is both a confounder and a collider.
	// The collider (C in reference/published-diagrams.ts) is named M here.
	const d = diagramOf(renamed(BUTTERFLY, { C: 'M' }));

	it('Ding & Miratrix: adjusting M alone blocks X ← M → Y but opens X ← A → M ← B → Y', () => {
		const r = reviewAdjustment(d, { adjusted: ['M'] });
		expect(r.valid).toBe(false);
		expect(kinds(r)).toEqual(['open-path:X-A-M-B-Y (back-door)', 'collider-bias:M']);
		expect(r.extension).toHaveLength(1);
		expect(r.nearest).toMatchObject({ set: ['A', 'M'], add: ['A'], drop: [] });
	});

	it('Ding & Miratrix: the valid sets add A or B to M; with nothing adjusted, two variables are missing', () => {
		expect(adjustmentSets(d).sets).toEqual([
			['A', 'M'],
			['B', 'M']
		]);
		const none = reviewAdjustment(d, { adjusted: [] });
		expect(none.valid).toBe(false);
		expect(kinds(none)).toContain('open-path:X-M-Y (back-door)');
		expect(none.extension).toHaveLength(2);
		expect(none.extension).toContain('M');
	});
});

describe('Overadjustment (Schisterman, Cole & Platt, Epidemiology 2009)', () => {
	// C → X, C → Y, X → M → Y, X → Y, M → D.
	const d = diagramOf(OVERADJUSTMENT);

	it('Schisterman et al.: adjusting the intermediate M is overadjustment; no superset can repair it', () => {
		const r = reviewAdjustment(d, { adjusted: ['C', 'M'] });
		expect(r.valid).toBe(false);
		expect(kinds(r)).toEqual(['overadjustment:M']);
		expect(r.extension).toBeNull();
		expect(r.extensionBlockedBy).toEqual(['M']);
		expect(r.nearest).toMatchObject({ set: ['C'], add: [], drop: ['M'] });
	});

	it('Schisterman et al.: a descendant of the intermediate is overadjustment too', () => {
		const r = reviewAdjustment(d, { adjusted: ['C', 'D'] });
		expect(r.reasons).toEqual([{ kind: 'overadjustment', variable: 'D', why: 'descendant-of-mediator' }]);
	});

	it('a descendant of the outcome is named as such', () => {
		const e = diagram({ arrows: ['C->X', 'C->Y', 'X->Y', 'Y->T'], exposures: ['X'], outcomes: ['Y'] });
		expect(kinds(reviewAdjustment(e, { adjusted: ['C', 'T'] }))).toEqual(['descendant-of-outcome:T']);
	});

	it('a valid but redundant set: what can be dropped without harm', () => {
		const e = diagram({ arrows: ['C->X', 'C->Y', 'X->Y', 'P->Y', 'A->C'], exposures: ['X'], outcomes: ['Y'] });
		const r = reviewAdjustment(e, { adjusted: ['A', 'C', 'P'] });
		expect(r.valid).toBe(true);
		expect(r.droppable).toEqual(['A', 'P']);
		expect(r.minimalSubset).toEqual(['C']);
		expect(r.extension).toEqual([]);
	});
});

describe('Z-bias: adjusting an instrument (Pearl, UAI 2010; Myers et al., Am J Epidemiol 174, 2011)', () => {
	// Z → X, C → X, C → Y, X → Y; U → X, U → Y with U unmeasured (residual confounding).
	const withU = diagram({ arrows: ['Z->X', 'C->X', 'C->Y', 'U->X', 'U->Y', 'X->Y'], exposures: ['X'], outcomes: ['Y'], unmeasured: ['U'] });
	const noU = diagram({ arrows: ['Z->X', 'C->X', 'C->Y', 'X->Y'], exposures: ['X'], outcomes: ['Y'] });

	it('Myers et al.: with no residual confounding, {C, Z} is valid but Z only adds variance — the advice is to drop it', () => {
		const advice = efficiencyAdvice(noU, { adjusted: ['C', 'Z'] });
		expect(advice.applicable).toBe(true);
		expect(advice.drop).toEqual([{ variable: 'Z', helps: true }]);
		expect(advice.optimal).toEqual(['C']);
		expect(advice.plannedIsOptimal).toBe(false);
		expect(variableRoles(noU).find((r) => r.id === 'Z')?.roles).toEqual(['instrument-like']);
	});

	it('Pearl 2010: with U unmeasured no set is valid, and adjusting Z does not repair it (the open path stays)', () => {
		const r = reviewAdjustment(withU, { adjusted: ['C', 'Z'] });
		expect(r.valid).toBe(false);
		expect(r.identifiable).toBe(false);
		expect(kinds(r)).toEqual(['open-path:X-U-Y (back-door)']);
		expect(r.extension).toBeNull();
	});

	it('Z is an (unconditional) instrument for X → Y, usable instead of adjustment', () => {
		expect(conditionalInstruments(withU)).toEqual([{ variable: 'Z', given: [] }]);
	});
});

describe('Conditional instruments (van der Zander, Textor & Liśkiewicz, IJCAI 2015; structures from memory)', () => {
	it('Brito & Pearl 2002: Z shares a cause C with Y, so Z is an instrument given C', () => {
		const d = diagram({ arrows: ['Z->X', 'C->Z', 'C->Y', 'U->X', 'U->Y', 'X->Y'], exposures: ['X'], outcomes: ['Y'], unmeasured: ['U'] });
		expect(conditionalInstruments(d)).toEqual([{ variable: 'Z', given: ['C'] }]);
	});

	it('vdZ et al.: the nearest separator (near Y) keeps Z–X open where the one near Z would not', () => {
		// Z ← A → B → Y, A → X: {A} and {B} both separate Z from Y; only {B} leaves Z ← A → X open.
		const d = diagram({ arrows: ['A->Z', 'A->B', 'B->Y', 'A->X', 'U->X', 'U->Y', 'X->Y'], exposures: ['X'], outcomes: ['Y'], unmeasured: ['U'] });
		const found = conditionalInstruments(d);
		expect(found).toContainEqual({ variable: 'Z', given: ['B'] });
	});

	it('vdZ et al.: Z independent of X can be a conditional instrument given a collider W, while W itself is an ancestral instrument', () => {
		// Z → W ← V → X (V unmeasured), U → X, U → Y (U unmeasured), X → Y.
		const d = diagram({ arrows: ['Z->W', 'V->W', 'V->X', 'U->X', 'U->Y', 'X->Y'], exposures: ['X'], outcomes: ['Y'], unmeasured: ['U', 'V'] });
		const g = compileDiagram(d);
		const i = (id: string) => g.indexOf.get(id)!;
		// Brute force: Z is a conditional instrument given {W} (d-connected to X given W, separated from Y
		// given W once X → Y is cut), but W is a descendant of Z, outside An(Y ∪ Z).
		expect(dSeparatedOracle(g, [i('Z')], [i('X')], [i('W')])).toBe(false);
		expect(dSeparatedOracle(g, [i('Z')], [i('X')], [])).toBe(true);
		expect(conditionalInstruments(d)).toEqual([{ variable: 'W', given: [] }]);
	});
});

describe('Robustness on Pearl’s back-door example (Causality, 2nd ed. 2009, §3.3.1; graph from memory)', () => {
	const d = diagramOf(PEARL_BACK_DOOR);

	it('the plan {X4, X5} rests most directly on there being no arrow X3 → Y or X6 → X5, and X → X6 not reversed', () => {
		const r = planRobustness(d, { adjusted: ['X4', 'X5'] });
		expect(r.applicable).toBe(true);
		const short = r.weaknesses.filter((w) => w.length === 2).map(changeText);
		// X ← X3 → Y opens; X5 would descend from the mediator X6; X ← X6 → Y opens.
		expect(short).toEqual(['add-arrow X3->Y', 'add-arrow X6->X5', 'reverse-arrow X->X6']);
		expect(r.weaknesses.find((w) => changeText(w) === 'add-arrow X6->X5')).toMatchObject({ failure: 'forbidden', witness: ['X', 'X6', 'X5'] });
		// X2 → X would not matter: X ← X2 → X4 and X ← X2 → X5 are blocked by the plan.
		expect(r.weaknesses.some((w) => changeText(w) === 'add-arrow X2->X')).toBe(false);
		const unmeasured = r.weaknesses.filter((w) => w.failure === 'unmeasured');
		expect(unmeasured.map(changeText)).toEqual(['unmeasure X4', 'unmeasure X5']);
		// Without X5, a two-variable set such as {X1, X4} still works (Pearl's list of minimal sets).
		expect(unmeasured[1].fallback).toHaveLength(2);
		expect(checkAdjustment(d, { adjusted: unmeasured[1].fallback! }).valid).toBe(true);
		// Ranked by witness length; the witness of the X3 → Y addition is X ← X3 → Y.
		expect(r.weaknesses.find((w) => changeText(w) === 'add-arrow X3->Y')?.witness).toEqual(['X', 'X3', 'Y']);
	});

	it('the exhaustive search for sets robust to every added arrow returns only valid sets', () => {
		const robust = setsRobustToAdditions(d);
		expect(robust.exhaustive).toBe(true);
		for (const s of robust.sets) expect(checkAdjustment(d, { adjusted: s }).valid).toBe(true);
	});
});

describe('Sets robust to every added arrow (our construction)', () => {
	it('when every variable not adjacent to the exposure lies upstream of the planned confounder, that confounder is a robust plan', () => {
		// A → C → X, C → Y, X → Y: A → X and A → Y would both be blocked by C; other additions close cycles.
		const d = diagram({ arrows: ['A->C', 'C->X', 'C->Y', 'X->Y'], exposures: ['X'], outcomes: ['Y'] });
		expect(setsRobustToAdditions(d)).toEqual({ sets: [['C']], exhaustive: true, tried: 4 });
		const weaknesses = planRobustness(d, { adjusted: ['C'] }).weaknesses.map(changeText);
		expect(weaknesses.filter((w) => w.startsWith('add-arrow'))).toEqual([]);
		expect(weaknesses).toContain('reverse-arrow C->X'); // X → C would make C a mediator
	});
});

describe('Comparing the authors’ diagram with a reviewer’s', () => {
	const authors = diagram({
		arrows: ['age->smoking', 'age->cancer', 'smoking->tar', 'tar->cancer', 'ses->smoking'],
		exposures: ['smoking'],
		outcomes: ['cancer'],
		adjusted: ['age'],
		labels: { ses: 'Socio-economic status' }
	});
	// The reviewer renamed ses (same label), added ses → cancer, reversed nothing, added a gene variable.
	const reviewer = diagram({
		arrows: ['age->smoking', 'age->cancer', 'smoking->tar', 'tar->cancer', 'income_class->smoking', 'income_class->cancer', 'gene->cancer'],
		exposures: ['smoking'],
		outcomes: ['cancer'],
		labels: { income_class: 'socio economic  status' }
	});

	it('matches renamed variables by label, lists arrow changes, and says the planned set fails under the reviewer’s diagram', () => {
		const c = compareDiagrams(authors, reviewer);
		expect(c.renamed).toEqual([{ first: 'ses', second: 'income_class', how: 'label', firstLabel: 'Socio-economic status', secondLabel: 'socio economic  status' }]);
		expect(c.added).toEqual(['gene']);
		expect(c.removed).toEqual([]);
		expect(c.arrowsAdded).toEqual([{ from: 'ses', to: 'cancer' }]);
		expect(c.arrowsOfAdded).toEqual([{ from: 'gene', to: 'cancer' }]);
		expect(c.arrowsRemoved).toEqual([]);
		expect(c.verdicts).toEqual({ planned: ['age'], first: true, second: false, notJudged: null });
		expect(c.sets.first).toEqual([['age']]);
		expect(c.sets.second).toEqual([['age', 'ses']]);
		expect(c.sets.onlyFirst).toEqual([['age']]);
	});

	it('reversed arrows and neighbourhood matches', () => {
		const a = diagram({ arrows: ['C->X', 'X->Y', 'C->Y', 'M->Y'], exposures: ['X'], outcomes: ['Y'] });
		const b = diagram({ arrows: ['K->X', 'X->Y', 'K->Y', 'Y->M'], exposures: ['X'], outcomes: ['Y'] });
		const c = compareDiagrams(a, b);
		expect(c.renamed.map((r) => `${r.first}=${r.second}:${r.how}`)).toEqual(['C=K:neighbours']);
		expect(c.arrowsReversed).toEqual([{ from: 'M', to: 'Y' }]);
		expect(c.arrowsAdded).toEqual([]);
	});
});
