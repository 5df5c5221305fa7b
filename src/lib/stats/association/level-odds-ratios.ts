/**
 * The odds ratio of each level of a discrete variable against its reference level (the first),
 * for a binary outcome: logistic regression of the outcome on the variable as a factor
 * (treatment coding), with Wald intervals — R's glm(y ~ factor(x), binomial) with
 * confint.default. With one factor the model is saturated, so each odds ratio equals the
 * 2 × 2 odds ratio of that level against the reference (and for a binary outcome by a
 * categorical variable the roles may be swapped without changing the numbers).
 * Cost: one IRLS fit, O(n·L²) per iteration for L levels.
 */
import { StatsError } from '../errors';
import { buildDesign } from '../regression/design';
import { fitLogistic, type LogisticFit } from '../regression/logistic';
import type { TableStatistics } from '../sufficient/table-statistics';
import { completeRows, observedLevels } from '../table/columns';
import type { CodedColumn } from '../table/types';

export interface LevelOddsRatio {
	level: string;
	oddsRatio: number;
	ci: [number, number];
	pValue: number;
	/** People at this level, and among them those at the outcome's second level. */
	n: number;
	events: number;
}

export interface LevelOddsRatios {
	outcome: string;
	/** The outcome level whose odds are modelled (its second level). */
	outcomeLevel: string;
	variable: string;
	reference: { level: string; n: number; events: number };
	levels: LevelOddsRatio[];
	n: number;
	warnings: string[];
}

/** With the table's statistics the fit is made on the L covariate patterns (the counts), O(n + L³·iterations). */
export function levelOddsRatios(outcome: CodedColumn, variable: CodedColumn, stats?: TableStatistics): LevelOddsRatios {
	if (outcome.kind !== 'binary') throw new StatsError(`Odds ratios per level need a binary outcome; '${outcome.name}' is ${outcome.kind}.`, { column: outcome.name });
	const rows = stats ? stats.rows([outcome, variable]) : completeRows([outcome, variable]);
	const observe = (c: CodedColumn) => (stats ? stats.observed(c, rows) : observedLevels(c, rows));
	const { codes, levels } = observe(variable);
	const oy = observe(outcome);
	if (levels.length < 2) throw new StatsError(`'${variable.name}' has a single observed level; no odds ratio can be formed.`, { column: variable.name });
	if (oy.levels.length < 2) throw new StatsError(`'${outcome.name}' has a single observed level; no odds ratio can be formed.`, { column: outcome.name });
	const n = new Float64Array(levels.length);
	const events = new Float64Array(levels.length);
	for (let k = 0; k < rows.length; k++) {
		n[codes[k]]++;
		events[codes[k]] += oy.codes[k];
	}
	// A binary variable's design column carries the column's name; a factor's, name[level].
	let fit: LogisticFit;
	if (stats) {
		const plan = stats.plan(outcome, [variable]);
		fit = stats.logistic(plan, [...Array(plan.p).keys()]);
	} else fit = fitLogistic(buildDesign(outcome, [variable]));
	const byName = new Map(fit.coefficients.map((c) => [c.name, c]));
	const out: LevelOddsRatio[] = levels.slice(1).map((level, i) => {
		const c = byName.get(`${variable.name}[${level}]`) ?? (levels.length === 2 ? fit.coefficients[1] : undefined);
		return {
			level,
			oddsRatio: c ? c.oddsRatio : NaN,
			ci: c ? c.oddsRatioCi : [NaN, NaN],
			pValue: c ? c.pValue : NaN,
			n: n[i + 1],
			events: events[i + 1]
		};
	});
	return {
		outcome: outcome.name,
		outcomeLevel: oy.levels[1],
		variable: variable.name,
		reference: { level: levels[0], n: n[0], events: events[0] },
		levels: out,
		n: rows.length,
		warnings: fit.warnings
	};
}
