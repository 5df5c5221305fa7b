/**
 * Result shapes of the data checks: what the CLI prints (`causeway test`, `causeway
 * estimate`), what the data worker sends to the app, and what benchmarks time. Plain data
 * (numbers, strings, arrays), so it can be posted to a worker and written as JSON.
 */
import type { ColumnKind, TestResult } from '../stats';
import type { PictureData } from './pictures';

/** How the diagram's variables meet the table's columns. */
export interface VariableMapping {
	/** Variable id → column name, for every variable checked against data. */
	columns: Record<string, string>;
	/** How each mapped variable was linked. */
	by: Record<string, 'id' | 'label' | 'manual'>;
	/** Measured variables of the diagram with no column: treated as unmeasured for the checks. */
	unmapped: string[];
	/** Variables the diagram marks unmeasured (never mapped). */
	unmeasured: string[];
	/** Columns linked to no variable, in file order. */
	unusedColumns: string[];
	/** Variables matching several columns equally well (left unmapped until chosen). */
	ambiguous: { variableId: string; columns: string[] }[];
	/** Plain-language notes (e.g. which variables are treated as unmeasured). */
	notes: string[];
}

/** A user's choices over the automatic mapping: variable id → column name, or null to leave it out. */
export type MappingOverrides = Readonly<Record<string, string | null>>;

/** A user's column kinds over the detected ones: column name → kind. */
export type TypeOverrides = Readonly<Record<string, ColumnKind>>;

/**
 * What the data say about one arrow, on a plain scale of strength (|r|, Cramér's V, or the
 * square root of eta² / epsilon²):
 * - supported: p < α and strength ≥ 0.1;
 * - weak: p < α but strength < 0.1 (detectable, tiny);
 * - absent: p ≥ α (no association detected — not proof of no effect);
 * - untested: the test could not run (reason in `message`).
 * 0.1 is Cohen's (1988) "small" correlation, a common-practice marker, not a law.
 */
export type ArrowSupport = 'supported' | 'weak' | 'absent' | 'untested';

export interface ArrowCheck {
	from: string;
	to: string;
	/** Column names used. */
	columns: [string, string];
	support: ArrowSupport;
	/** The test to read first (null when untested). */
	main: TestResult | null;
	others: TestResult[];
	/** Strength on the 0…1 scale described above (null when untested). */
	strength: number | null;
	strengthName: string | null;
	message: string | null;
	picture?: PictureData;
}

export interface ArrowChecks {
	alpha: number;
	checks: ArrowCheck[];
	/** Arrows with an end that has no column (not checked). */
	skipped: { from: string; to: string; why: string }[];
}

export type ClaimStatus = 'contradicted' | 'consistent' | 'untested';

export interface ClaimCheck {
	a: string;
	b: string;
	given: string[];
	status: ClaimStatus;
	main: TestResult | null;
	others: TestResult[];
	/** Unadjusted p-value (NaN when untested). */
	p: number;
	/** Holm-adjusted p-value over the tested claims (family-wise error). */
	pHolm: number;
	/** Benjamini–Hochberg adjusted p-value (false discovery rate). */
	pBH: number;
	/** Arrows that would remove this claim without closing a cycle ("a → b"). */
	suggestedArrows: { from: string; to: string }[];
	message: string | null;
}

export interface ClaimChecks {
	alpha: number;
	/** Contradicted first (smallest p first), then consistent, then untested. */
	checks: ClaimCheck[];
	/** Non-adjacent pairs no set of checked variables separates (nothing to test). */
	noTestableClaim: { a: string; b: string }[];
	tested: number;
	contradicted: number;
	truncated: boolean;
}

export type EstimateRole = 'crude' | 'minimal' | 'optimal' | 'planned';

export interface EstimateRow {
	/** Why this set is shown (a set can be several at once, e.g. minimal and planned). */
	roles: EstimateRole[];
	label: string;
	adjustedFor: string[];
	/** Complete cases over outcome, exposure and the set. */
	n: number;
	/** Term of the exposure (exposure[level] for a categorical exposure). */
	term: string;
	estimate: number;
	ci: [number, number];
	pValue: number;
	/** Crude estimate on the same complete cases, and the change from it in percent. */
	crudeSameRows: number | null;
	changePercent: number | null;
	/** |change| ≥ 10 % (common-practice marker). */
	changeMarked: boolean;
	/** Whether the diagram says this set is sufficient (planned set only may be false). */
	sufficient: boolean;
	warnings: string[];
	/** Set when this row could not be estimated. */
	message?: string;
}

export interface EValueSummary {
	point: number;
	ciBound: number | null;
	notes: string[];
}

export interface Estimates {
	exposure: string;
	outcome: string;
	model: 'logistic' | 'linear';
	measure: 'odds ratio' | 'difference';
	/** Null value of the measure (1 for ratios, 0 for differences). */
	nullValue: number;
	rows: EstimateRow[];
	/** E-value of the planned estimate (VanderWeele & Ding 2017), when it could be estimated. */
	eValue: EValueSummary | null;
	identifiable: boolean;
	notes: string[];
	warnings: string[];
}

export interface DataCheckReport {
	mapping: VariableMapping;
	arrows: ArrowChecks;
	claims: ClaimChecks;
	/** Null with a reason when no estimate can be made. */
	estimates: Estimates | null;
	estimatesMessage: string | null;
	rowCount: number;
	notes: string[];
}
