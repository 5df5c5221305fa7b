/**
 * What every language's analysis code needs, worked out once from the data settings: the
 * model (logistic for a binary outcome, linear otherwise, as src/lib/stats/regression/
 * exposure-effect.ts decides), how the outcome is prepared (0/1 as it is, an event indicator, or
 * ordered scores), and for the exposure and each covariate whether it enters as numbers or as
 * a factor with Causeway's reference level — the same design as src/lib/stats/regression/
 * design.ts, so the generated code reproduces Causeway's coefficients. Pure; O(columns).
 */
import type { AnalysedColumn, DataCheckReport, EstimateRole } from '../../datacheck';
import { InputError } from '../../graph/errors';
import type { Diagram } from '../../graph/diagram';
import type { TableFormat } from '../../stats';

export interface CodeColumn extends AnalysedColumn {
	label: string;
}

/** How a predictor enters the model: as it is (numbers, or a 0/1 binary column), or as a factor. */
export interface CodeTerm {
	col: CodeColumn;
	as: 'numeric' | 'factor';
	/** Reference level (factors): the label Causeway uses, written as the file holds it. */
	reference: string | null;
}

export interface CodeSpec {
	software: string;
	diagramTitle: string;
	dataFile: string;
	format: Pick<TableFormat, 'delimiter' | 'decimalComma'>;
	roles: EstimateRole[];
	sufficient: boolean;
	model: 'logistic' | 'linear';
	outcome: { col: CodeColumn; prep: { kind: 'as-is' } | { kind: 'event'; event: string } | { kind: 'scores'; levels: string[] } };
	exposure: CodeTerm;
	covariates: CodeTerm[];
	/** Binary exposure and outcome: the standardized risks are computed; the exposure's levels. */
	standardize: { exposed: string; unexposed: string } | null;
}

/** Every column the model uses, outcome first. */
export const modelColumns = (s: CodeSpec): CodeColumn[] => [s.outcome.col, s.exposure.col, ...s.covariates.map((t) => t.col)];

/** A binary column coded 0/1 in the file enters as it is; every other discrete column as a factor. */
const isZeroOne = (c: AnalysedColumn) => c.kind === 'binary' && c.numbersInFile && c.levels[0] === '0' && c.levels[1] === '1';

/** A level as the file holds it: numbers in their shortest form (R and pandas read "2.0" as 2). */
export function levelLiteral(c: AnalysedColumn, level: string): string {
	return c.numbersInFile ? String(Number(level)) : level;
}

function term(c: CodeColumn): CodeTerm {
	if (c.kind === 'continuous' || isZeroOne(c)) return { col: c, as: 'numeric', reference: null };
	return { col: c, as: 'factor', reference: levelLiteral(c, c.levels[0]) };
}

export interface CodeSetChoice {
	roles: EstimateRole[];
	adjustedFor: readonly string[];
	sufficient: boolean;
}

/**
 * The spec for one set from a data-check report. Throws InputError when the question or a
 * set member has no column, or the outcome cannot be modelled (unordered, over two levels).
 */
export function codeSpec(diagram: Diagram, report: Pick<DataCheckReport, 'columns' | 'format' | 'estimates'>, set: CodeSetChoice, dataFile: string, software: string): CodeSpec {
	const est = report.estimates;
	if (!est) throw new InputError('Analysis code needs one exposure and one outcome with data');
	if (!report.format) throw new InputError('Analysis code needs a data file; a summary matrix has no rows to fit');
	const label = new Map(diagram.variables.map((v) => [v.id, v.label]));
	const byVariable = new Map(report.columns.map((c) => [c.variable, { ...c, label: label.get(c.variable) ?? c.variable }]));
	const col = (id: string): CodeColumn => {
		const c = byVariable.get(id);
		if (!c) throw new InputError(`Analysis code: "${id}" has no column in the data`);
		return c;
	};
	const outcome = col(est.outcome);
	const exposure = col(est.exposure);
	if (outcome.kind === 'categorical' && outcome.levels.length > 2)
		throw new InputError(`Analysis code: the outcome column "${outcome.column}" has ${outcome.levels.length} unordered levels; choose a binary or numeric outcome`);
	const model = outcome.kind === 'binary' ? 'logistic' : 'linear';
	const prep: CodeSpec['outcome']['prep'] =
		outcome.kind === 'continuous' || isZeroOne(outcome)
			? { kind: 'as-is' }
			: outcome.kind === 'binary'
				? { kind: 'event', event: levelLiteral(outcome, outcome.levels[1]) }
				: { kind: 'scores', levels: outcome.levels.map((l) => levelLiteral(outcome, l)) };
	const exposureTerm = term(exposure);
	const standardize =
		model === 'logistic' && exposure.kind === 'binary' ? { exposed: levelLiteral(exposure, exposure.levels[1]), unexposed: levelLiteral(exposure, exposure.levels[0]) } : null;
	return {
		software,
		diagramTitle: diagram.title,
		dataFile,
		format: { delimiter: report.format.delimiter, decimalComma: report.format.decimalComma },
		roles: [...set.roles],
		sufficient: set.sufficient,
		model,
		outcome: { col: outcome, prep },
		exposure: exposureTerm,
		covariates: set.adjustedFor.map((id) => term(col(id))),
		standardize
	};
}

/** What the wording needs for the code's header comments (all but the language). */
export function codeHeader(s: CodeSpec) {
	const role = (i: number) => (i === 0 ? ('outcome' as const) : i === 1 ? ('exposure' as const) : ('covariate' as const));
	return {
		software: s.software,
		diagramTitle: s.diagramTitle,
		dataFile: s.dataFile,
		roles: s.roles,
		sufficient: s.sufficient,
		exposure: { label: s.exposure.col.label, column: s.exposure.col.column },
		outcome: { label: s.outcome.col.label, column: s.outcome.col.column },
		model: s.model,
		columns: modelColumns(s).map((c, i) => ({ column: c.column, label: c.label, kind: c.kind, levels: c.levels, codeValues: c.codeValues, role: role(i) }))
	};
}
