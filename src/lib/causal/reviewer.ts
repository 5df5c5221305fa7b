/**
 * The reviewer tools in variable ids, exported through the analysis.ts façade: review of a
 * stated set, robustness of the planned set, efficiency advice, conditional instruments and
 * the comparison of two diagrams. Inputs are validated as in analysis.ts (InputError naming
 * the problem); the index-based algorithms live in review.ts, robust.ts, efficiency.ts,
 * instruments.ts and diff.ts.
 */
import type { Diagram } from '../graph/diagram';
import type { CompiledDag } from '../graph/compiled';
import { InputError } from '../graph/errors';
import { adjustmentSets, checkAdjustment } from './analysis';
import { compareSets, indicesFor, prepare, sortIds, type QuestionOptions } from './question';
import { reviewAdjustmentIdx, type ReviewReasonIdx } from './review';
import { plannedSetRobustnessIdx, setsRobustToAdditionsIdx, type AssumptionChangeIdx } from './robust';
import { efficiencyAdviceIdx } from './efficiency';
import { conditionalInstrumentsIdx } from './instruments';
import { diffStructure } from './diff';
import { listMinimalAdjustmentSetsIdx, minimumAdjustmentSetIdx, optimalAdjustmentSetIdx } from './sets';
import { ancestorsOf } from './reach';
import { properCausalStructure } from './proper-causal';
import type {
	AdjustmentReview,
	AssumptionChange,
	DiagramComparison,
	EfficiencyAdvice,
	Instrument,
	PlanRobustness,
	ReviewReason,
	RobustSets
} from './review-types';

type PlannedOptions = QuestionOptions & { adjusted?: string[] };

const names = (g: CompiledDag, list: readonly number[]) => list.map((i) => g.ids[i]);
const sortedNames = (g: CompiledDag, list: readonly number[]) => sortIds(names(g, list));

function planned(d: Diagram, opts: PlannedOptions) {
	const p = prepare(d, opts);
	const adjusted = opts.adjusted ?? d.adjusted;
	const Z = indicesFor(p.g, adjusted, 'adjusted variable');
	return { ...p, Z, adjusted: sortIds(new Set(adjusted)) };
}

function reasonById(g: CompiledDag, r: ReviewReasonIdx): ReviewReason {
	switch (r.kind) {
		case 'open-path':
			return { kind: r.kind, path: names(g, r.path), backDoor: r.backDoor };
		case 'collider-bias':
			return { kind: r.kind, variable: g.ids[r.variable], collider: g.ids[r.collider], path: names(g, r.path) };
		case 'overadjustment':
			return { kind: r.kind, variable: g.ids[r.variable], why: r.why };
		case 'exposure-or-outcome':
			return { kind: r.kind, variable: g.ids[r.variable], which: r.which };
		default:
			return { kind: r.kind, variable: g.ids[r.variable] };
	}
}

/** Verdict on a stated set with every reason, what could be dropped or added, and the nearest minimal set. */
export function reviewAdjustment(d: Diagram, opts: PlannedOptions & { maxPaths?: number; maxSets?: number } = {}): AdjustmentReview {
	const { g, X, Y, Z, exposures, outcomes, adjusted } = planned(d, opts);
	const byIds = (a: readonly number[], b: readonly number[]) => compareSets(sortedNames(g, a), sortedNames(g, b));
	const r = reviewAdjustmentIdx(g, X, Y, Z, { maxPaths: opts.maxPaths, maxSets: opts.maxSets, tieBreak: byIds });
	return {
		exposures,
		outcomes,
		adjusted,
		valid: r.valid,
		identifiable: r.identifiable,
		reasons: r.reasons.map((x) => reasonById(g, x)),
		openPathsTruncated: r.openPathsTruncated,
		droppable: sortedNames(g, r.droppable),
		minimalSubset: r.minimalSubset && sortedNames(g, r.minimalSubset),
		extension: r.extension && sortedNames(g, r.extension),
		extensionBlockedBy: sortedNames(g, r.extensionBlockedBy),
		nearest: r.nearest && {
			set: sortedNames(g, r.nearest.set),
			add: sortedNames(g, r.nearest.add),
			drop: sortedNames(g, r.nearest.drop),
			scanned: r.nearest.scanned,
			truncated: r.nearest.truncated
		}
	};
}

function changeById(g: CompiledDag, c: AssumptionChangeIdx): AssumptionChange {
	return c.kind === 'unmeasure' ? { kind: c.kind, variable: g.ids[c.variable] } : { kind: c.kind, from: g.ids[c.from], to: g.ids[c.to] };
}

/** Every single change of the assumptions that would make the planned set invalid, ranked. */
export function planRobustness(
	d: Diagram,
	opts: PlannedOptions & { maxWitnesses?: number; onProgress?: (fraction: number) => void } = {}
): PlanRobustness {
	const { g, X, Y, Z, exposures, outcomes, adjusted } = planned(d, opts);
	const r = plannedSetRobustnessIdx(g, X, Y, Z, { maxWitnesses: opts.maxWitnesses, onProgress: opts.onProgress });
	return {
		exposures,
		outcomes,
		adjusted,
		applicable: r.applicable,
		tried: r.tried,
		weaknesses: r.weaknesses.map((w) => ({
			change: changeById(g, w.change),
			failure: w.failure,
			length: w.length,
			witness: w.witness && names(g, w.witness),
			...(w.fallback !== undefined ? { fallback: w.fallback && sortedNames(g, w.fallback) } : {})
		}))
	};
}

/** Sufficient sets that stay sufficient whichever single arrow is added (see robust.ts for the search). */
export function setsRobustToAdditions(d: Diagram, opts: QuestionOptions & { maxMinimal?: number; exhaustiveUpTo?: number } = {}): RobustSets {
	const { g, X, Y } = prepare(d, opts);
	const family = () => {
		const out = listMinimalAdjustmentSetsIdx(g, X, Y, { max: opts.maxMinimal ?? 20 }).sets;
		const optimal = optimalAdjustmentSetIdx(g, X, Y);
		if (optimal) out.push(optimal);
		const minimum = minimumAdjustmentSetIdx(g, X, Y);
		if (minimum) out.push(minimum);
		const s = properCausalStructure(g, X, Y);
		const anc = ancestorsOf(g, [...X, ...Y]);
		const largest: number[] = [];
		for (let v = 0; v < g.n; v++) if (anc[v] && g.measured[v] && !s.inX[v] && !s.inY[v] && !s.forbidden[v]) largest.push(v);
		out.push(largest);
		return out;
	};
	const r = setsRobustToAdditionsIdx(g, X, Y, family, { exhaustiveUpTo: opts.exhaustiveUpTo });
	return { sets: r.sets.map((s) => sortedNames(g, s)).sort(compareSets), exhaustive: r.exhaustive, tried: r.tried };
}

/** Precision and instrument-like variables relative to the planned set, and the optimal set. */
export function efficiencyAdvice(d: Diagram, opts: PlannedOptions = {}): EfficiencyAdvice {
	const { g, X, Y, Z, adjusted } = planned(d, opts);
	const r = efficiencyAdviceIdx(g, X, Y, Z);
	const byId = (p: { variable: string }, q: { variable: string }) => (p.variable < q.variable ? -1 : p.variable > q.variable ? 1 : 0);
	const optimal = r.optimal && sortedNames(g, r.optimal);
	return {
		adjusted,
		applicable: r.applicable,
		add: r.add.map((a) => ({ variable: g.ids[a.variable], helps: a.helps })).sort(byId),
		drop: r.drop.map((a) => ({ variable: g.ids[a.variable], helps: a.helps })).sort(byId),
		optimal,
		plannedIsOptimal: optimal !== null && compareSets(optimal, adjusted) === 0
	};
}

/** Conditional (ancestral) instruments for one exposure and one outcome, with their conditioning sets. */
export function conditionalInstruments(d: Diagram, opts: QuestionOptions = {}): Instrument[] {
	const { g, X, Y } = prepare(d, opts);
	if (X.length !== 1 || Y.length !== 1) throw new InputError('Instruments need exactly one exposure and one outcome');
	return conditionalInstrumentsIdx(g, X[0], Y[0])
		.map((i) => ({ variable: g.ids[i.variable], given: sortedNames(g, i.given) }))
		.sort((p, q) => compareSets(p.given, q.given) || (p.variable < q.variable ? -1 : 1));
}

/** Minimal sets of a diagram, or null when it is not ready (no question, not identifiable…). */
function setsOrNull(d: Diagram, maxSets: number): string[][] | null {
	try {
		const r = adjustmentSets(d, { max: maxSets });
		return r.identifiable ? r.sets : [];
	} catch (e) {
		if (e instanceof InputError) return null;
		throw e;
	}
}

/**
 * Compares two diagrams: variables matched by the rule in diff.ts, arrow changes, minimal
 * sets of each and the verdict on the first diagram's planned set under both.
 */
export function compareDiagrams(first: Diagram, second: Diagram, opts: { maxSets?: number } = {}): DiagramComparison {
	const structure = diffStructure(first, second);
	const toFirst = new Map(structure.matches.map((m) => [m.second, m.first]));
	const toSecond = new Map(structure.matches.map((m) => [m.first, m.second]));
	const maxSets = opts.maxSets ?? 500;
	const plannedIds = sortIds(new Set(first.adjusted));
	const missing = plannedIds.filter((id) => !toSecond.has(id));
	const question = [...first.exposures, ...first.outcomes].filter((id) => !toSecond.has(id));
	// The second diagram is asked the first one's question whenever its variables match.
	const secondAsked: Diagram =
		question.length === 0
			? { ...second, exposures: first.exposures.map((id) => toSecond.get(id)!), outcomes: first.outcomes.map((id) => toSecond.get(id)!) }
			: second;
	const setsA = setsOrNull(first, maxSets);
	const setsBRaw = setsOrNull(secondAsked, maxSets);
	const setsB = setsBRaw && setsBRaw.map((s) => sortIds(s.map((id) => toFirst.get(id) ?? `${id} (new)`))).sort(compareSets);
	const key = (s: readonly string[]) => s.join('\u0000');
	const inA = new Set((setsA ?? []).map(key));
	const inB = new Set((setsB ?? []).map(key));
	const judge = (d: Diagram, adjusted: string[]): boolean | null => {
		try {
			return checkAdjustment(d, { adjusted }).valid;
		} catch (e) {
			if (e instanceof InputError) return null;
			throw e;
		}
	};
	let notJudged: DiagramComparison['verdicts']['notJudged'] = null;
	let verdictSecond: boolean | null = null;
	if (question.length > 0) notJudged = { why: 'question-missing', ids: question };
	else if (missing.length > 0) notJudged = { why: 'planned-missing', ids: missing };
	else verdictSecond = judge(secondAsked, plannedIds.map((id) => toSecond.get(id)!));
	const { matches: _matches, ...changes } = structure;
	return {
		...changes,
		sets: {
			first: setsA,
			second: setsB,
			onlyFirst: (setsA ?? []).filter((s) => !inB.has(key(s))),
			onlySecond: (setsB ?? []).filter((s) => !inA.has(key(s))),
			common: (setsA ?? []).filter((s) => inB.has(key(s)))
		},
		verdicts: { planned: plannedIds, first: judge(first, plannedIds), second: verdictSecond, notJudged }
	};
}
