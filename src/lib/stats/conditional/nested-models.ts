/**
 * Conditional independence of mixed-type variables by comparing nested regressions of a
 * response on Z with and without the tested variable, on the same complete cases:
 * - continuous response: the F test of the extra sum of squares,
 *   F = [(RSS₀ − RSS₁)/q] / [RSS₁/(n − p₁)] (e.g. Draper & Smith, 3rd ed., §6.1; R's
 *   anova for two lm fits);
 * - binary response: the likelihood-ratio test, D₀ − D₁ on q df (Wilks 1938; R's
 *   anova(..., test = "Chisq") for two glm fits).
 * q is the number of the tested variable's design columns that survive the collinearity
 * check. Cost: two fits, O(n·p²) each (times the IRLS iterations for logistic) — or, with the
 * table's statistics (src/lib/stats/sufficient), O(p³) for the linear test from the shared
 * cross-products (RSS₀ − RSS₁ read from one Cholesky factor, no subtraction of two RSS), and
 * for the logistic test the reduced fit (shared between claims, on covariate patterns when
 * few) with the full fit started from it.
 */
import { chiSquareSf, fSf, tQuantile } from '../distributions';
import { StatsError } from '../errors';
import { checkCollinearity, selectColumns } from '../regression/collinearity';
import { buildDesign, type Design, type DesignTerm } from '../regression/design';
import { fitLinear } from '../regression/linear';
import { fitLogistic, type LogisticFit } from '../regression/logistic';
import type { TableStatistics } from '../sufficient/table-statistics';
import type { Column } from '../table/types';
import type { EffectSize, TestResult } from '../types';

/** The full design on response ~ given + tested, and the reduced one without `tested`, on the same rows. */
function nestedDesigns(response: Column, tested: Column, given: readonly Column[]): { full: Design; reduced: Design; testedIndices: number[] } {
	const full = buildDesign(response, [...given, tested]);
	const term = testedTerm(full.terms, tested);
	const keep = [...Array(full.p).keys()].filter((j) => !term.indices.includes(j));
	return { full, reduced: selectColumns(full, keep), testedIndices: term.indices };
}

function testedTerm(terms: readonly DesignTerm[], tested: Column): DesignTerm {
	const term = terms.find((t) => t.column === tested.name);
	if (!term) throw new StatsError(`'${tested.name}' has a single observed level in the complete cases; it cannot be tested.`, { column: tested.name });
	return term;
}

function nothingLeft(q: number, tested: Column): void {
	if (q < 1) throw new StatsError(`'${tested.name}' is a linear combination of the conditioning variables; nothing is left to test.`, { column: tested.name });
}

function refuseCategorical(response: Column): void {
	if (response.kind === 'categorical' && response.levels.length > 2)
		throw new StatsError(`No nested-model test for the categorical response '${response.name}' with ${response.levels.length} levels.`, { column: response.name });
}

function describe(response: Column, tested: Column, given: readonly Column[]): string {
	const names = given.map((g) => `'${g.name}'`).join(', ') || 'nothing';
	return `Response '${response.name}', tested '${tested.name}', given ${names}.`;
}

function likelihoodRatio(f0: LogisticFit, f1: LogisticFit, q: number, n: number, testedNames: readonly string[], about: string): TestResult {
	const lr = Math.max(0, f0.deviance - f1.deviance);
	const effects: EffectSize[] = [];
	if (testedNames.length === 1) {
		const c = f1.coefficients.find((co) => co.name === testedNames[0]);
		if (c) effects.push({ name: `odds ratio for '${c.name}'`, value: c.oddsRatio, ci: c.oddsRatioCi });
	}
	return {
		test: 'Likelihood-ratio test of nested logistic regressions',
		statisticName: 'LR',
		statistic: lr,
		df: [q],
		pValue: chiSquareSf(lr, q),
		n,
		effects,
		notes: [about, ...f1.warnings],
		reference: 'Likelihood-ratio test (Wilks 1938) of nested logistic models'
	};
}

function extraSumOfSquares(rss0: number, rss1: number, q: number, df: number, n: number, coefficient: EffectSize | null, about: string, warnings: readonly string[]): TestResult {
	const f = (Math.max(0, rss0 - rss1) / q) / (rss1 / df);
	const effects: EffectSize[] = [{ name: 'partial R²', value: Math.max(0, rss0 - rss1) / rss0 }];
	if (coefficient) effects.push(coefficient);
	return {
		test: 'F test of nested linear regressions',
		statisticName: 'F',
		statistic: f,
		df: [q, df],
		pValue: fSf(f, q, df),
		n,
		effects,
		notes: [about, ...warnings],
		reference: 'Extra-sum-of-squares F test of nested linear models'
	};
}

export function nestedModelTest(response: Column, tested: Column, given: readonly Column[], stats?: TableStatistics): TestResult {
	if (stats) return nestedFromStatistics(response, tested, given, stats);
	const { full, reduced, testedIndices } = nestedDesigns(response, tested, given);
	const keptFull = checkCollinearity(full).keep.length;
	const keptReduced = checkCollinearity(reduced).keep.length;
	const q = keptFull - keptReduced;
	nothingLeft(q, tested);
	const about = describe(response, tested, given);
	const testedNames = testedIndices.map((j) => full.names[j]);
	if (response.kind === 'binary') return likelihoodRatio(fitLogistic(reduced), fitLogistic(full), q, full.n, testedNames, about);
	refuseCategorical(response);
	const f1 = fitLinear(full);
	const f0 = fitLinear(reduced);
	let coefficient: EffectSize | null = null;
	if (testedNames.length === 1) {
		const c = f1.coefficients.find((co) => co.name === testedNames[0]);
		if (c) coefficient = { name: `coefficient of '${c.name}'`, value: c.estimate, ci: c.ci };
	}
	return extraSumOfSquares(f0.rss, f1.rss, q, f1.dfResidual, full.n, coefficient, about, f1.warnings);
}

/** The same test from the table's shared statistics. */
function nestedFromStatistics(response: Column, tested: Column, given: readonly Column[], stats: TableStatistics): TestResult {
	const plan = stats.plan(response, [...given, tested]);
	const term = testedTerm(plan.terms, tested);
	const all = [...Array(plan.p).keys()];
	const check = stats.collinearity(plan, all);
	// The check is sequential and the tested columns come last: the reduced model keeps the same others.
	const q = check.keep.filter((j) => term.indices.includes(j)).length;
	nothingLeft(q, tested);
	const about = describe(response, tested, given);
	const testedNames = term.indices.map((j) => plan.names[j]);
	if (response.kind === 'binary') {
		const f0 = stats.logistic(plan, all.filter((j) => !term.indices.includes(j)));
		return likelihoodRatio(f0, stats.logistic(plan, all, { start: f0 }), q, plan.n, testedNames, about);
	}
	refuseCategorical(response);
	const { ls } = stats.leastSquares(plan, all);
	const p = check.keep.length;
	if (plan.n <= p) throw new StatsError(`Too few complete cases (${plan.n}) for ${p} coefficients.`);
	const df = plan.n - p;
	const kept = check.keep.slice(1);
	let drop = 0;
	kept.forEach((j, a) => {
		if (term.indices.includes(j)) drop += ls.w[a] * ls.w[a];
	});
	let coefficient: EffectSize | null = null;
	const a = testedNames.length === 1 ? kept.indexOf(term.indices[0]) : -1;
	if (a >= 0) {
		const k = kept.length;
		const se = Math.sqrt((ls.rss / df) * ls.inverse[a * k + a]);
		const t = tQuantile(0.975, df);
		coefficient = { name: `coefficient of '${testedNames[0]}'`, value: ls.beta[a], ci: [ls.beta[a] - t * se, ls.beta[a] + t * se] };
	}
	return extraSumOfSquares(ls.rss + drop, ls.rss, q, df, plan.n, coefficient, about, check.dropped.map((d) => d.message));
}
