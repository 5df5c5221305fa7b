/**
 * Conditional independence of mixed-type variables by comparing nested regressions of a
 * response on Z with and without the tested variable, on the same complete cases:
 * - continuous response: the F test of the extra sum of squares,
 *   F = [(RSS₀ − RSS₁)/q] / [RSS₁/(n − p₁)] (e.g. Draper & Smith, 3rd ed., §6.1; R's
 *   anova for two lm fits);
 * - binary response: the likelihood-ratio test, D₀ − D₁ on q df (Wilks 1938; R's
 *   anova(..., test = "Chisq") for two glm fits).
 * q is the number of the tested variable's design columns that survive the collinearity
 * check. Cost: two fits, O(n·p²) each (times the IRLS iterations for logistic).
 */
import { chiSquareSf, fSf } from '../distributions';
import { StatsError } from '../errors';
import { checkCollinearity, selectColumns } from '../regression/collinearity';
import { buildDesign, type Design } from '../regression/design';
import { fitLinear } from '../regression/linear';
import { fitLogistic } from '../regression/logistic';
import type { Column } from '../table/types';
import type { EffectSize, TestResult } from '../types';

/** The full design on response ~ given + tested, and the reduced one without `tested`, on the same rows. */
function nestedDesigns(response: Column, tested: Column, given: readonly Column[]): { full: Design; reduced: Design; testedIndices: number[] } {
	const full = buildDesign(response, [...given, tested]);
	const term = full.terms.find((t) => t.column === tested.name);
	if (!term) throw new StatsError(`'${tested.name}' has a single observed level in the complete cases; it cannot be tested.`, { column: tested.name });
	const keep = [...Array(full.p).keys()].filter((j) => !term.indices.includes(j));
	return { full, reduced: selectColumns(full, keep), testedIndices: term.indices };
}

export function nestedModelTest(response: Column, tested: Column, given: readonly Column[]): TestResult {
	const { full, reduced, testedIndices } = nestedDesigns(response, tested, given);
	const keptFull = checkCollinearity(full).keep.length;
	const keptReduced = checkCollinearity(reduced).keep.length;
	const q = keptFull - keptReduced;
	if (q < 1) throw new StatsError(`'${tested.name}' is a linear combination of the conditioning variables; nothing is left to test.`, { column: tested.name });
	const given_ = given.map((g) => `'${g.name}'`).join(', ') || 'nothing';
	if (response.kind === 'binary') {
		const f1 = fitLogistic(full);
		const f0 = fitLogistic(reduced);
		const lr = Math.max(0, f0.deviance - f1.deviance);
		const effects: EffectSize[] = [];
		if (testedIndices.length === 1) {
			const c = f1.coefficients.find((co) => co.name === full.names[testedIndices[0]]);
			if (c) effects.push({ name: `odds ratio for '${c.name}'`, value: c.oddsRatio, ci: c.oddsRatioCi });
		}
		return {
			test: 'Likelihood-ratio test of nested logistic regressions',
			statisticName: 'LR',
			statistic: lr,
			df: [q],
			pValue: chiSquareSf(lr, q),
			n: full.n,
			effects,
			notes: [`Response '${response.name}', tested '${tested.name}', given ${given_}.`, ...f1.warnings],
			reference: 'Likelihood-ratio test (Wilks 1938) of nested logistic models'
		};
	}
	if (response.kind === 'categorical' && response.levels.length > 2)
		throw new StatsError(`No nested-model test for the categorical response '${response.name}' with ${response.levels.length} levels.`, { column: response.name });
	const f1 = fitLinear(full);
	const f0 = fitLinear(reduced);
	const f = (Math.max(0, f0.rss - f1.rss) / q) / (f1.rss / f1.dfResidual);
	const effects: EffectSize[] = [{ name: 'partial R²', value: Math.max(0, f0.rss - f1.rss) / f0.rss }];
	if (testedIndices.length === 1) {
		const c = f1.coefficients.find((co) => co.name === full.names[testedIndices[0]]);
		if (c) effects.push({ name: `coefficient of '${c.name}'`, value: c.estimate, ci: c.ci });
	}
	return {
		test: 'F test of nested linear regressions',
		statisticName: 'F',
		statistic: f,
		df: [q, f1.dfResidual],
		pValue: fSf(f, q, f1.dfResidual),
		n: full.n,
		effects,
		notes: [`Response '${response.name}', tested '${tested.name}', given ${given_}.`, ...f1.warnings],
		reference: 'Extra-sum-of-squares F test of nested linear models'
	};
}
