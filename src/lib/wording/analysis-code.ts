/**
 * The sentences of the generated analysis code (R, Stata, SAS, Python): its header — which
 * set, from which diagram, whether the diagram calls it sufficient, how each column enters the
 * model — and the comments above each step. The code generators (src/lib/export/code/) put
 * them behind each language's comment marker; the words are the same in all four.
 */
import type { EstimateRole } from '../datacheck';
import { KIND_IN_MODEL, kindText } from './measures';
import { listNames } from './names';
import type { ColumnKind } from '../stats';

export type CodeLanguage = 'r' | 'stata' | 'sas' | 'python';

export const CODE_LANGUAGE_NAME: Readonly<Record<CodeLanguage, string>> = {
	r: 'R (glm)',
	stata: 'Stata',
	sas: 'SAS',
	python: 'Python (statsmodels)'
};

const ROLE_NAME: Readonly<Record<EstimateRole, string>> = {
	crude: 'no adjustment (crude)',
	minimal: 'minimal sufficient set',
	optimal: 'efficiency-optimal set',
	planned: 'planned set'
};

/** "the planned set and minimal sufficient set {age, diet, income}". */
export function codeSetName(roles: readonly EstimateRole[], columns: readonly string[]): string {
	if (roles.length === 1 && roles[0] === 'crude') return ROLE_NAME.crude;
	const names = roles.filter((r) => r !== 'crude').map((r) => ROLE_NAME[r]);
	return `the ${listNames(names)} {${columns.join(', ')}}`;
}

export interface CodeHeaderInput {
	language: CodeLanguage;
	software: string;
	diagramTitle: string;
	dataFile: string;
	roles: readonly EstimateRole[];
	sufficient: boolean;
	exposure: { label: string; column: string };
	outcome: { label: string; column: string };
	model: 'logistic' | 'linear';
	columns: readonly { column: string; label: string; kind: ColumnKind; levels: readonly string[]; codeValues: readonly number[] | null; role: 'outcome' | 'exposure' | 'covariate' }[];
}

/** The header's lines, without comment markers. O(columns). */
export function codeHeaderLines(h: CodeHeaderInput): string[] {
	const set = h.columns.filter((c) => c.role === 'covariate').map((c) => c.column);
	const lines = [
		`${CODE_LANGUAGE_NAME[h.language]} code made by ${h.software} for ${codeSetName(h.roles, set)}.`,
		`Diagram: ${h.diagramTitle.trim() || 'Causal diagram'}. Data: ${h.dataFile}.`,
		`Effect of ${h.exposure.label} (column ${h.exposure.column}) on ${h.outcome.label} (column ${h.outcome.column}): ${h.model === 'logistic' ? 'odds ratios from logistic regression' : 'differences from linear regression'}, Wald 95 % intervals.`
	];
	if (!(h.roles.length === 1 && h.roles[0] === 'crude'))
		lines.push(
			h.sufficient
				? 'Under the diagram this set is sufficient: it blocks every non-causal path between exposure and outcome and holds no mediator or descendant of the outcome.'
				: 'Under the diagram this set is NOT sufficient: if the diagram is right, the adjusted estimate stays biased.'
		);
	lines.push('Columns as Causeway analyses them (kind, and how each enters the model):');
	for (const c of h.columns) {
		const use = c.role === 'outcome' ? (h.model === 'logistic' ? 'the modelled event is its second level' : 'modelled as numbers') : KIND_IN_MODEL[c.kind];
		lines.push(`  ${c.column} (${c.label}): ${kindText(c)}; ${use}.`);
		if (c.codeValues)
			lines.push(`    Its values look like category codes; if they label categories, change its kind to categorical in Causeway and make this code again.`);
	}
	lines.push('Rows: complete cases over these columns, as Causeway fits them, so the crude and adjusted models use the same rows.');
	return lines;
}

/** Comments above the steps of the code, the same in every language. */
export const CODE_STEP = {
	read: 'Read the data (the missing-value codes Causeway reads: empty, NA, ".", NaN, NULL).',
	complete: 'Keep the complete cases over the model columns.',
	factors: 'Categorical columns as factors, with the reference level Causeway uses.',
	outcomeEvent: 'The outcome as 0/1: 1 at its second level (the event modelled).',
	outcomeScores: 'The ordered outcome as scores 0, 1, 2, … in level order (as Causeway models it).',
	crude: 'Crude model on the same rows.',
	adjusted: 'Adjusted model.',
	oddsRatios: 'Odds ratios with Wald 95 % intervals, as Causeway reports them.',
	standardize:
		'Standardized (marginal) risks by g-computation: predict every person with the exposure set to each level, average; risk difference, risk ratio and marginal odds ratio with delta-method 95 % intervals (the model covariance, covariates held as observed).',
	standardizePoint: 'Standardized (marginal) risks by g-computation: predict every person with the exposure set to each level and average; risk difference, risk ratio and marginal odds ratio.',
	noStandardizedCi: 'Delta-method intervals are not computed here; Causeway reports them beside the estimates.'
} as const;

/** Said in Stata and SAS code about a column name that language cannot use as it is. */
export function unusableNameComment(column: string, usedName: string, language: 'stata' | 'sas'): string {
	return language === 'stata'
		? `Column '${column}' is not a valid Stata name; import delimited renames it (its label keeps the original). Below it is called ${usedName}: check with describe and rename if needed.`
		: `Column '${column}' is not a standard SAS name: it is written as a name literal ${usedName} (needs options validvarname=any).`;
}

/** Said in SAS code, whose PROC IMPORT has no missing-value codes and no decimal comma. */
export const SAS_IMPORT_CAUTION =
	'PROC IMPORT reads a column holding NA, NaN or NULL as text: code missing values as empty cells or "." in the file first.';
export const SAS_DECIMAL_COMMA = 'The file uses a decimal comma, which PROC IMPORT does not read: convert it first (e.g. with the COMMAX informat in a DATA step).';
