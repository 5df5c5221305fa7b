/**
 * Validity of an adjustment set for the total effect of X on Y, by the adjustment criterion
 * (Shpitser, VanderWeele & Robins, UAI 2010; arXiv:1203.3515) in its constructive form
 * (van der Zander, Liśkiewicz & Textor 2019, Theorem 4.4 "CBC"): Z is an adjustment set iff
 *   (a) Z contains no variable of Dpcp(X, Y), and
 *   (b) Z d-separates X and Y in the proper back-door graph G^pbd(X, Y).
 * Pearl's back-door criterion (1995) is the special case with one exposure and Z free of
 * descendants of X. Deciding validity is O(n + m); listing the reasons adds a bounded search
 * for open non-causal paths (open-paths.ts).
 */
import type { CompiledDag } from '../graph/compiled';
import type { ForbiddenWhy } from './types';
import { dSeparated } from './dsep';
import { properBackDoorGraph, properCausalStructure, type ProperCausalStructure } from './proper-causal';
import { descendantsOf, membersOf } from './reach';
import { openNonCausalPathsIdx, type OpenNonCausalListing, type OpenPathCount } from './open-paths';

export interface ForbiddenMember {
	variable: number;
	why: ForbiddenWhy;
}

export interface AdjustmentValidity {
	valid: boolean;
	openPaths: number[][];
	/** True when more open non-causal paths exist than were listed. */
	openPathsTruncated: boolean;
	/** How many open non-causal paths there are (the same count the path listing gives). */
	openPathCount: OpenPathCount;
	forbidden: ForbiddenMember[];
}

/** Why each forbidden variable is forbidden, most specific reason first. O(n + m). */
export function forbiddenReasons(g: CompiledDag, s: ProperCausalStructure, Z: readonly number[]): ForbiddenMember[] {
	const out: ForbiddenMember[] = [];
	const mediators = membersOf(s.causalNodes).filter((v) => !s.inY[v]);
	const reachedOutcomes = membersOf(s.causalNodes).filter((v) => s.inY[v]);
	const belowMediators = descendantsOf(g, mediators);
	const belowOutcomes = descendantsOf(g, reachedOutcomes);
	for (const z of Z) {
		let why: ForbiddenWhy | null = null;
		if (s.inX[z]) why = 'exposure';
		else if (s.inY[z]) why = 'outcome';
		else if (s.causalNodes[z]) why = 'mediator';
		else if (s.forbidden[z]) why = belowOutcomes[z] ? 'descendant-of-outcome' : belowMediators[z] ? 'descendant-of-mediator' : 'descendant-of-exposure';
		else if (!g.measured[z]) why = 'unmeasured';
		if (why) out.push({ variable: z, why });
	}
	return out;
}

/**
 * Checks a planned set Z for the total effect of X on Y and gives every reason it fails:
 * each forbidden member and the open proper non-causal paths (up to `maxPaths`). `open`, when
 * given, is openNonCausalPathsIdx's answer for the same question (the path listing's), so the
 * two are computed once and cannot differ.
 */
export function checkAdjustmentIdx(
	g: CompiledDag,
	X: readonly number[],
	Y: readonly number[],
	Z: readonly number[],
	maxPaths = 50,
	open?: OpenNonCausalListing
): AdjustmentValidity {
	const s = properCausalStructure(g, X, Y);
	const forbidden = forbiddenReasons(g, s, Z);
	const usable = Z.filter((z) => !s.inX[z] && !s.inY[z]);
	const pbd = properBackDoorGraph(g, s);
	const separated = dSeparated(pbd, X, Y, usable);
	const listing = open ?? openNonCausalPathsIdx(g, X, Y, usable, { keep: maxPaths });
	const openPaths = listing.paths.slice(0, maxPaths);
	// Only when the listing's step budget ran out before the first path: CBC's witness.
	if (!separated.separated && openPaths.length === 0 && separated.path) openPaths.push(separated.path);
	return {
		valid: forbidden.length === 0 && separated.separated,
		openPaths,
		openPathsTruncated: listing.count > openPaths.length || listing.bound !== 'exact',
		openPathCount: { count: Math.max(listing.count, openPaths.length), bound: listing.bound },
		forbidden
	};
}

/** Just the yes/no answer of checkAdjustmentIdx, without reasons. O(n + m). */
export function isAdjustmentSet(g: CompiledDag, X: readonly number[], Y: readonly number[], Z: readonly number[]): boolean {
	const s = properCausalStructure(g, X, Y);
	for (const z of Z) if (s.inX[z] || s.inY[z] || s.forbidden[z] || !g.measured[z]) return false;
	return dSeparated(properBackDoorGraph(g, s), X, Y, Z).separated;
}
