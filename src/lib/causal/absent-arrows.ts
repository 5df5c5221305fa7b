/**
 * The assumptions a diagram makes, for the protocol report: every arrow drawn (an assumed
 * direct effect), and the absent arrows that the adjustment choice depends on.
 *
 * An absent arrow u → v "matters" when adding it (keeping the graph acyclic) would make the
 * planned set, or one of the minimal sufficient sets, no longer sufficient by the adjustment
 * criterion (Shpitser, VanderWeele & Robins 2010). Those are the structural assumptions a
 * reviewer should challenge first: the validity of the adjustment rests on them.
 *
 * Only arrows into An(X ∪ Y ∪ S) can matter, S being the union of the sets checked: when v is
 * outside it, adding u → v leaves that ancestral graph, and so every d-separation statement
 * between X, Y and any S, unchanged, and v is in no set. Cost: O(p · k · (n + m)) for p
 * candidate pairs and k sets checked (the criterion is O(n + m) per set, via the proper
 * back-door graph; van der Zander et al. 2019). A budget on p·k keeps large diagrams fast;
 * the result says when it was reached.
 */
import type { Diagram } from '../graph/diagram';
import { compileDag, compileDiagram } from '../graph/compiled';
import { isAdjustmentSet } from './adjustment';
import { ancestorsOf, descendantsOf, hasArrow } from './reach';
import { checkAdjustment } from './analysis';
import type { AdjustmentProblem, AdjustmentSets } from './types';

export interface CriticalAbsentArrow {
	from: string;
	to: string;
	/** The planned set is sufficient now and would not be with this arrow. */
	breaksPlanned: boolean;
	/** The minimal sufficient sets (as listed) that would no longer be sufficient. */
	breaksSets: string[][];
	/** Why the planned set would fail (when breaksPlanned): the engine's reasons. */
	plannedProblems: AdjustmentProblem[];
}

export interface AbsentArrowReport {
	items: CriticalAbsentArrow[];
	/** Candidate arrows examined, and how many there were. */
	checked: number;
	candidates: number;
	/** True when the budget stopped the search before every candidate was examined. */
	truncated: boolean;
}

export interface AbsentArrowOptions {
	/** Most set checks to run (pairs × sets); default 60 000, about a second on a laptop. */
	budget?: number;
}

/**
 * The absent arrows whose presence would change the verdict on the planned set or on a
 * minimal set, most consequential first (breaking the planned set, then most sets broken).
 * `sets` are the minimal sets for the total effect; `plannedValid` the current verdict.
 */
export function criticalAbsentArrows(d: Diagram, sets: AdjustmentSets, plannedValid: boolean, opts: AbsentArrowOptions = {}): AbsentArrowReport {
	const g = compileDiagram(d);
	const idx = (ids: readonly string[]) => ids.map((id) => g.indexOf.get(id)).filter((i): i is number => i !== undefined);
	const X = idx(sets.exposures);
	const Y = idx(sets.outcomes);
	const planned = idx(d.adjusted);
	const checked: number[][] = sets.sets.map(idx);
	if (plannedValid) checked.push(planned);
	if (checked.length === 0) return { items: [], checked: 0, candidates: 0, truncated: false };
	const relevant = ancestorsOf(g, [...X, ...Y, ...checked.flat()]);
	const measured = g.ids.map((_, i) => g.measured[i] === 1);
	const budget = opts.budget ?? 60_000;
	const items: CriticalAbsentArrow[] = [];
	let candidates = 0;
	let examined = 0;
	let spent = 0;
	let truncated = false;
	for (let v = 0; v < g.n; v++) {
		if (!relevant[v]) continue;
		// Adding u → v closes a cycle exactly when u is a descendant of v.
		const below = descendantsOf(g, [v]);
		for (let u = 0; u < g.n; u++) {
			if (u === v || below[u] || hasArrow(g, u, v) || hasArrow(g, v, u)) continue;
			candidates++;
			if (truncated) continue;
			if (spent + checked.length > budget) {
				truncated = true;
				continue;
			}
			spent += checked.length;
			examined++;
			const g2 = compileDag(g.ids, [...d.arrows, { from: g.ids[u], to: g.ids[v] }], measured);
			const brokenSets = sets.sets.filter((_, i) => !isAdjustmentSet(g2, X, Y, checked[i]));
			const breaksPlanned = plannedValid && !isAdjustmentSet(g2, X, Y, planned);
			if (!breaksPlanned && brokenSets.length === 0) continue;
			items.push({ from: g.ids[u], to: g.ids[v], breaksPlanned, breaksSets: brokenSets, plannedProblems: [] });
		}
	}
	// Ties: arrows into the exposure or the outcome first (the classic "no unmeasured common
	// cause" assumptions), then diagram order (the sort is stable).
	const intoQuestion = (x: CriticalAbsentArrow) => Number(sets.exposures.includes(x.to) || sets.outcomes.includes(x.to));
	items.sort(
		(a, b) => Number(b.breaksPlanned) - Number(a.breaksPlanned) || b.breaksSets.length - a.breaksSets.length || intoQuestion(b) - intoQuestion(a)
	);
	return { items, checked: examined, candidates, truncated };
}

/** Adds the engine's reasons to the first `limit` items that break the planned set (for wording). */
export function withPlannedReasons(d: Diagram, report: AbsentArrowReport, limit: number): AbsentArrowReport {
	const items = report.items.map((item, i) => {
		if (i >= limit || !item.breaksPlanned) return item;
		const check = checkAdjustment({ ...d, arrows: [...d.arrows, { from: item.from, to: item.to }] }, { maxPaths: 3 });
		return { ...item, plannedProblems: check.problems };
	});
	return { ...report, items };
}
