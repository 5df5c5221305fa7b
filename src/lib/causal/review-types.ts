/**
 * Result types of the reviewer tools (review, robustness, efficiency, instruments, diagram
 * comparison) in variable ids, as the CLI prints them and the app shows them.
 */
import type { DiagramDiffStructure } from './diff';

export type ReviewReason =
	/** A non-causal path left open; a back-door path when its first arrow points into the exposure. */
	| { kind: 'open-path'; path: string[]; backDoor: boolean }
	/** An adjusted mediator, or descendant of one: part of the effect is removed. */
	| { kind: 'overadjustment'; variable: string; why: 'mediator' | 'descendant-of-mediator' }
	/** An adjusted collider (variable = collider) or descendant of one, opening `path`. */
	| { kind: 'collider-bias'; variable: string; collider: string; path: string[] }
	| { kind: 'descendant-of-outcome'; variable: string }
	| { kind: 'exposure-or-outcome'; variable: string; which: 'exposure' | 'outcome' }
	| { kind: 'unmeasured'; variable: string };

export interface AdjustmentReview {
	exposures: string[];
	outcomes: string[];
	/** The stated set, sorted. */
	adjusted: string[];
	valid: boolean;
	/** False when no set of measured variables is sufficient. */
	identifiable: boolean;
	reasons: ReviewReason[];
	/** More open paths exist than were listed. */
	openPathsTruncated: boolean;
	/** Valid sets only: members that can each be dropped alone. */
	droppable: string[];
	/** Valid sets only: a minimal sufficient set inside the stated one. */
	minimalSubset: string[] | null;
	/** Variables to add for the smallest valid superset ([] when valid; null when none exists). */
	extension: string[] | null;
	/** Members that rule out every valid superset. */
	extensionBlockedBy: string[];
	/** The minimal sufficient set with the fewest additions plus removals. */
	nearest: { set: string[]; add: string[]; drop: string[]; scanned: number; truncated: boolean } | null;
}

export type AssumptionChange =
	| { kind: 'add-arrow' | 'reverse-arrow' | 'delete-arrow'; from: string; to: string }
	| { kind: 'unmeasure'; variable: string };

export interface PlanWeakness {
	change: AssumptionChange;
	failure: 'open-path' | 'forbidden' | 'unmeasured';
	/** Arrows on the witness path (rank key). */
	length: number;
	witness: string[] | null;
	/** unmeasure only: a smallest valid set without that variable, or null when none. */
	fallback?: string[] | null;
}

export interface PlanRobustness {
	exposures: string[];
	outcomes: string[];
	adjusted: string[];
	/** False when the planned set is not valid to begin with. */
	applicable: boolean;
	weaknesses: PlanWeakness[];
	tried: { additions: number; deletions: number; reversals: number; unmeasured: number };
}

export interface RobustSets {
	sets: string[][];
	exhaustive: boolean;
	tried: number;
}

export interface EfficiencyAdvice {
	adjusted: string[];
	applicable: boolean;
	add: { variable: string; helps: boolean }[];
	drop: { variable: string; helps: boolean }[];
	optimal: string[] | null;
	plannedIsOptimal: boolean;
}

export interface Instrument {
	variable: string;
	given: string[];
}

export interface DiagramComparison extends Omit<DiagramDiffStructure, 'matches'> {
	/** Minimal sets of each diagram, the second's written in first-diagram ids where matched. */
	sets: { first: string[][] | null; second: string[][] | null; onlyFirst: string[][]; onlySecond: string[][]; common: string[][] };
	/** The first diagram's planned set judged under each diagram (null: not judged, with why). */
	verdicts: {
		planned: string[];
		first: boolean | null;
		second: boolean | null;
		/** Why the second diagram could not judge it: ids of the question or of the planned set it lacks (wording: notJudgedText). */
		notJudged: { why: 'question-missing' | 'planned-missing'; ids: string[] } | null;
	};
}
