/**
 * Result shapes of the data checks: what the CLI prints (`causeway test`, `causeway
 * estimate`), what the data worker sends to the app, and what benchmarks time. Plain data
 * (numbers, strings, arrays), so it can be posted to a worker and written as JSON.
 */
import type { Role } from '../causal';
import type { ColumnKind, TableFormat, TestResult } from '../stats';
import type { PictureData } from './pictures';
import type { TwoWayTable } from './two-way';
import type { ColumnUse } from './settings';
export type { TwoWayTable } from './two-way';
export type { ColumnUse, SettingProblems, SettingsInput } from './settings';

/**
 * The size of an association in the measure a practitioner reads: an odds ratio (per level
 * against the reference, the strongest shown), a standardized difference d, a correlation,
 * or Cramér's V for tables without a binary variable. `smallBelow` is Cohen's (1988) "small"
 * for that measure (a rule of thumb), or null where none is used (odds ratios).
 */
export interface ReadMeasure {
	name: string;
	/** Which measure, for the wording: an odds ratio, Cohen's d, a correlation (r or ρ), Cramér's V, or √η² / √ε². */
	type: 'odds-ratio' | 'standardized-difference' | 'correlation' | 'cramers-v' | 'correlation-ratio';
	value: number;
	ci?: readonly [number, number];
	smallBelow: number | null;
	/**
	 * Odds ratio: `level` against `reference` of `variable`, for the odds of `of` (the binary
	 * column at its second level). d: the group column's `level` against its `reference`, for
	 * the means of `of.variable`.
	 */
	contrast?: { variable: string; level: string; reference: string; of: { variable: string; level: string | null } };
}

/**
 * How a linked column was analysed, for stating the kind beside every result and for the
 * analysis code: its kind, its levels (first = the reference level) and whether the file
 * holds numbers there (so code reading the file sees numbers, not text).
 */
export interface AnalysedColumn {
	variable: string;
	column: string;
	kind: ColumnKind;
	/** Level labels of a coded column, first = the reference; empty for numbers. */
	levels: string[];
	/** True when every value in the file is a number (read as numbers by R, pandas, Stata, SAS). */
	numbersInFile: boolean;
	/** Whole numbers 3–10 distinct values analysed as numbers: they look like category codes. */
	codeValues: number[] | null;
}

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
	/** The kind each column was analysed as (stated beside the result). */
	kinds: [ColumnKind, ColumnKind];
	support: ArrowSupport;
	/** The size in the measure the user reads; the verdict's "weak" is decided on it. */
	measure: ReadMeasure | null;
	/** Two discrete columns: counts, row proportions, X², df, odds ratios per level. */
	table: TwoWayTable | null;
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
	/** Crude estimate on the same complete cases (with its CI), and the change from it in percent. */
	crudeSameRows: number | null;
	crudeSameRowsCi: [number, number] | null;
	changePercent: number | null;
	/** |change| ≥ 10 % (common-practice marker). */
	changeMarked: boolean;
	/**
	 * Binary exposure and outcome: standardized (marginal) risks over the sample's covariate
	 * distribution (g-computation), risk difference, risk ratio and marginal odds ratio with
	 * delta-method 95 % intervals, beside the model's conditional odds ratio and the crude odds
	 * ratio on the same rows (crude → marginal is confounding, marginal → conditional is
	 * non-collapsibility).
	 */
	standardized: {
		risk1: number;
		risk0: number;
		riskDifference: EstimateWithCi;
		riskRatio: EstimateWithCi;
		marginalOddsRatio: EstimateWithCi;
		conditionalOddsRatio: number;
		crudeOddsRatio: number | null;
		method: 'delta';
	} | null;
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
	/** The confounder check of every candidate (one exposure and one outcome with data). */
	confounders: ConfounderChecks | null;
	/** Numeric columns whose values look like category codes (3–10 whole numbers), with them. */
	categoryCodes: { column: string; values: number[] }[];
	/** Each linked column as analysed (diagram order), for kinds beside results and the analysis code. */
	columns: AnalysedColumn[];
	/** How the file was read (delimiter, decimal comma); null for a summary matrix. */
	format: TableFormat | null;
	estimatesMessage: string | null;
	rowCount: number;
	/** Each variable with data as the checks used it: column, kind (chosen or detected), reference level. */
	columnsUsed?: ColumnUse[];
	notes: string[];
	/** Set when the rows were read from grouped counts (e.g. a database's GROUP BY): the lines and the count column. */
	grouped?: { lines: number; countColumn: string };
}

/** One association of the confounder check (candidate × exposure, or × outcome). */
export interface PairSummary {
	columns: [string, string];
	test: string;
	statisticName: string;
	statistic: number;
	df: number[];
	pValue: number;
	n: number;
	measure: ReadMeasure | null;
	table: TwoWayTable | null;
	message: string | null;
}

export interface EstimateWithCi {
	estimate: number;
	ci: [number, number];
}

export interface CandidateCheck {
	id: string;
	column: string;
	/** The kind the column was analysed as; `codeValues` when it looks like category codes. */
	kind: ColumnKind;
	codeValues: number[] | null;
	/** Roles in the diagram as the data see it; a confounder is a member of some minimal sufficient set. */
	roles: Role[];
	adjustWith?: string[];
	/** False for mediators and descendants of the exposure or outcome: not candidates. */
	preExposure: boolean;
	withExposure: PairSummary | null;
	withOutcome: PairSummary | null;
	/** The exposure's estimate crude and adjusted for this candidate alone, on the same rows. */
	change: { measure: 'odds ratio' | 'difference'; n: number; crude: EstimateWithCi; adjusted: EstimateWithCi; percent: number } | { message: string } | null;
	/** Binary exposure and outcome: Mantel–Haenszel over the candidate's levels or fifths. */
	stratified:
		| {
				by: 'levels' | 'fifths';
				strata: string[];
				n: number;
				oddsRatio: number;
				ci: [number, number];
				pValue: number;
				/** Breslow–Day with Tarone's correction. */
				homogeneity: { statistic: number; df: number; pValue: number; strataUsed: number } | null;
				homogeneityMessage: string | null;
		  }
		| { message: string }
		| null;
}

export interface ConfounderChecks {
	exposure: string;
	outcome: string;
	exposureKind: ColumnKind;
	outcomeKind: ColumnKind;
	candidates: CandidateCheck[];
}
