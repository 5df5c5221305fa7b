/**
 * Diagrams from the literature that several tests check the engine, the reviewer tools, the
 * command and the file readers on, each defined once with its source. "From memory" where the
 * structure was reconstructed without the paper at hand; the expectations beside each use name
 * their own source.
 *
 * A structure is its arrows ("from->to"), its question and what is unmeasured in the source.
 * `diagramOf` makes a Diagram of it (variables in order of first mention: exposures, outcomes,
 * then the arrows); `renamed` gives the same structure under other ids (the command's tests
 * write them in lower case); `withArrows` a variant with more arrows.
 */
import type { Diagram } from '../../../src/lib/graph/diagram';

export interface PublishedDiagram {
	/** Authors, venue and year; "from memory" where reconstructed. */
	readonly citation: string;
	readonly arrows: readonly string[];
	readonly exposures: readonly string[];
	readonly outcomes: readonly string[];
	/** Unmeasured in the source (latent). */
	readonly unmeasured: readonly string[];
}

/**
 * Pearl's back-door example: X1→X3→X, X1→X4←X2, X2→X5→Y, X4→X, X4→Y, X→X6→Y. Minimal
 * sufficient sets {X1,X4}, {X2,X4}, {X3,X4}, {X4,X5}; {X4} alone opens X←X3←X1→X4←X2→X5→Y.
 */
export const PEARL_BACK_DOOR: PublishedDiagram = {
	citation: 'Pearl, Causality (2nd ed., 2009), §3.3.1, the back-door example; graph reconstructed from memory',
	arrows: ['X1->X3', 'X1->X4', 'X2->X4', 'X2->X5', 'X3->X', 'X4->X', 'X4->Y', 'X5->Y', 'X->X6', 'X6->Y'],
	exposures: ['X'],
	outcomes: ['Y'],
	unmeasured: []
};

/** M-bias: X ← A → M ← B → Y, X → Y; M is a pre-exposure collider of two independent causes. */
export const M_BIAS: PublishedDiagram = {
	citation: 'Greenland, Pearl & Robins, Epidemiology 10 (1999); Greenland, Epidemiology 14 (2003); structure from memory',
	arrows: ['A->X', 'A->M', 'B->M', 'B->Y', 'X->Y'],
	exposures: ['X'],
	outcomes: ['Y'],
	unmeasured: []
};

/** M-bias in lower case with an exposure e and a disease d, as the command's tests write it: e ← u1 → m ← u2 → d, e → d. */
export const M_BIAS_LOWER_CASE: PublishedDiagram = renamed(M_BIAS, { X: 'e', A: 'u1', M: 'm', B: 'u2', Y: 'd' });

/** Butterfly bias: M-bias whose collider C also causes X and Y: a confounder and a collider at once. */
export const BUTTERFLY: PublishedDiagram = {
	citation: 'Ding & Miratrix, Journal of Causal Inference 3 (2015); structure from memory',
	arrows: ['A->X', 'A->C', 'B->C', 'B->Y', 'C->X', 'C->Y', 'X->Y'],
	exposures: ['X'],
	outcomes: ['Y'],
	unmeasured: []
};

/** Overadjustment: C confounds; M is an intermediate on X→M→Y; D descends from the intermediate. */
export const OVERADJUSTMENT: PublishedDiagram = {
	citation: 'Schisterman, Cole & Platt, Epidemiology 20 (2009); structure from memory',
	arrows: ['C->X', 'C->Y', 'X->M', 'M->Y', 'X->Y', 'M->D'],
	exposures: ['X'],
	outcomes: ['Y'],
	unmeasured: []
};

/** Front door: U→X, U→Y with U unmeasured; X→M→Y, M shielded from U. No adjustment set exists. */
export const FRONT_DOOR: PublishedDiagram = {
	citation: 'Pearl, Biometrika 82 (1995); structure from memory',
	arrows: ['U->X', 'U->Y', 'X->M', 'M->Y'],
	exposures: ['X'],
	outcomes: ['Y'],
	unmeasured: ['U']
};

/** The ids of a structure's variables, in order of first mention (exposures, outcomes, arrows). */
export function variableIds(p: PublishedDiagram): string[] {
	const ids: string[] = [];
	for (const id of [...p.exposures, ...p.outcomes, ...p.arrows.flatMap((a) => a.split('->'))]) if (!ids.includes(id)) ids.push(id);
	return ids;
}

/** The arrows as pairs. */
export function arrowPairs(p: PublishedDiagram): [string, string][] {
	return p.arrows.map((a) => a.split('->') as [string, string]);
}

export interface DiagramOptions {
	title?: string;
	/** Replaces the source's unmeasured variables. */
	unmeasured?: readonly string[];
	adjusted?: readonly string[];
	labels?: Readonly<Record<string, string>>;
}

/** The structure as a diagram (label = id unless given). */
export function diagramOf(p: PublishedDiagram, opts: DiagramOptions = {}): Diagram {
	const unmeasured = opts.unmeasured ?? p.unmeasured;
	return {
		title: opts.title ?? 'published example',
		variables: variableIds(p).map((id) => ({ id, label: opts.labels?.[id] ?? id, measured: !unmeasured.includes(id) })),
		arrows: arrowPairs(p).map(([from, to]) => ({ from, to })),
		exposures: [...p.exposures],
		outcomes: [...p.outcomes],
		adjusted: [...(opts.adjusted ?? [])]
	};
}

/** The same structure with ids renamed (`names` maps old to new; others keep theirs). */
export function renamed(p: PublishedDiagram, names: Readonly<Record<string, string>>): PublishedDiagram {
	const to = (id: string) => names[id] ?? id;
	return {
		citation: p.citation,
		arrows: arrowPairs(p).map(([a, b]) => `${to(a)}->${to(b)}`),
		exposures: p.exposures.map(to),
		outcomes: p.outcomes.map(to),
		unmeasured: p.unmeasured.map(to)
	};
}

/** A variant with more arrows (written after the source's). */
export function withArrows(p: PublishedDiagram, more: readonly string[], note: string): PublishedDiagram {
	return { ...p, citation: `${p.citation}; ${note}`, arrows: [...p.arrows, ...more] };
}
