// Regression, rules of thumb and the E-value, against R and published values (fixtures
// from tests/fixtures/stats/make-fixtures.R). Tolerances are stated beside each check.
import { describe, expect, it } from 'vitest';
import {
	INTERCEPT,
	changeInEstimate,
	codedColumn,
	continuousColumn,
	eValue,
	eValueOfRiskRatio,
	estimateExposureEffect,
	eventsPerVariable,
	linearRegression,
	linearRegressionFromSummary,
	logisticRegression,
	partialCorrelationFromSummary,
	type Coefficient
} from '../../../src/lib/stats';
import { expectAllClose, expectClose, fixture, type Json } from './fixtures';

const mt = fixture('mtcars.json');
const inf = fixture('infert.json');
const esoph = fixture('esoph.json');
const misc = fixture('misc.json');

/**
 * Compare coefficients with an R coefficient table, names mapped by `rename`: estimates
 * within `rel` relative; standard errors, statistics and intervals within `relSe`
 * (p-values within 100·relSe, as they amplify small differences in the statistic).
 */
function expectCoefficients(coefs: readonly Coefficient[], ref: Json, rel: number, rename: (r: string) => string, relSe = rel): void {
	expect(coefs.map((c) => c.name)).toEqual((ref.names as string[]).map(rename));
	expectAllClose(coefs.map((c) => c.estimate), ref.estimate, rel);
	expectAllClose(coefs.map((c) => c.se), ref.se, relSe);
	expectAllClose(coefs.map((c) => c.statistic), ref.statistic, relSe);
	expectAllClose(coefs.map((c) => c.pValue), ref.p, relSe * 100);
	expectAllClose(coefs.map((c) => c.ci[0]), ref.ci_low, relSe, 1e-12);
	expectAllClose(coefs.map((c) => c.ci[1]), ref.ci_high, relSe, 1e-12);
}

const col = (name: string) => continuousColumn(name, mt.data[name]);

describe('linear regression (Householder QR)', () => {
	it('mtcars mpg ~ wt + hp + factor(cyl), dummy coding against cyl = 4 (R lm, confint): 1e-9 relative', () => {
		const fit = linearRegression(col('mpg'), [col('wt'), col('hp'), codedColumn('cyl', mt.data.cyl)]);
		expectCoefficients(fit.coefficients, mt.lm, 1e-9, (r) => (r === '(Intercept)' ? INTERCEPT : r.replace(/^factor\(cyl\)(\d)$/, 'cyl[$1]')));
		expectClose(fit.sigma, mt.lm.sigma, 1e-10);
		expectClose(fit.rSquared, mt.lm.r_squared, 1e-10);
		expectClose(fit.adjustedRSquared, mt.lm.adj_r_squared, 1e-10);
		expectClose(fit.logLik, mt.lm.log_lik, 1e-10);
		expect(fit.dfResidual).toBe(mt.lm.df_residual);
		expect(fit.notes.join(' ')).toContain("reference level '4'");
	});

	it('a column that is a linear combination of others is left out and named (R lm gives it NA)', () => {
		const wt = mt.data.wt as number[];
		const hp = mt.data.hp as number[];
		const combo = continuousColumn('wt_plus_2hp', wt.map((w, i) => w + 2 * hp[i]));
		const fit = linearRegression(col('mpg'), [col('wt'), col('hp'), combo]);
		expect(mt.lm_collinear_na).toBe('I(wt + 2 * hp)');
		expect(fit.dropped.map((d) => d.name)).toEqual(['wt_plus_2hp']);
		expect(fit.dropped[0].relatedTo.sort()).toEqual(['hp', 'wt']);
		expect(fit.warnings[0]).toMatch(/'wt_plus_2hp' is a linear combination of 'wt', 'hp'/);
		expectAllClose(fit.coefficients.map((c) => c.estimate), mt.lm_small.estimate, 1e-9);
	});

	it('a dummy set equal to the intercept (all levels coded) is detected', () => {
		const am = mt.data.am as number[];
		const manual = continuousColumn('manual', am);
		const automatic = continuousColumn('automatic', am.map((v) => 1 - v));
		const fit = linearRegression(col('mpg'), [manual, automatic]);
		expect(fit.dropped.map((d) => d.name)).toEqual(['automatic']);
		expect(fit.dropped[0].relatedTo).toEqual(['manual']);
	});
});

describe('linear regression from summary statistics', () => {
	const s = mt.summary_input;
	it('covariance matrix + means + n reproduce lm(mpg ~ wt + hp) (R lm): 1e-8 relative', () => {
		const fit = linearRegressionFromSummary({ names: s.names, matrix: s.covariance, type: 'covariance', n: s.n, means: s.means }, 'mpg', ['wt', 'hp']);
		expectCoefficients(fit.coefficients, mt.lm_small, 1e-8, (r) => (r === '(Intercept)' ? INTERCEPT : r));
	});
	it('correlation matrix + SDs + means give the same; correlation alone gives standardized coefficients (R lm on scale()): 1e-8 relative', () => {
		const withSd = linearRegressionFromSummary({ names: s.names, matrix: s.correlation, type: 'correlation', n: s.n, means: s.means, sds: s.sds }, 'mpg', ['wt', 'hp']);
		expectAllClose(withSd.coefficients.map((c) => c.estimate), mt.lm_small.estimate, 1e-8);
		const std = linearRegressionFromSummary({ names: s.names, matrix: s.correlation, type: 'correlation', n: s.n }, 'mpg', ['wt', 'hp']);
		expect(std.scale).toBe('standardized');
		expectAllClose(std.coefficients.map((c) => c.estimate), mt.lm_standardized, 1e-8);
	});
	it('partial correlation from the correlation matrix equals the residual correlation (R): 1e-9 relative', () => {
		const r = partialCorrelationFromSummary({ names: s.names, matrix: s.correlation, type: 'correlation', n: s.n }, 'mpg', 'wt', ['hp', 'qsec']);
		expectClose(r.effects[0].value, mt.partial_mpg_wt_given_hp_qsec.r, 1e-9);
		expectClose(r.pValue, mt.partial_mpg_wt_given_hp_qsec.p, 1e-7);
	});
	it('rejects a matrix of the wrong shape with a message', () => {
		expect(() => linearRegressionFromSummary({ names: ['a', 'b'], matrix: [[1, 0.5]], type: 'correlation', n: 10 }, 'a', ['b'])).toThrow(/2 × 2/);
	});
});

describe('logistic regression (IRLS)', () => {
	it('infert case ~ spontaneous + induced + age (R glm binomial, confint.default): estimates 1e-8, SEs 1e-6 relative', () => {
		const fit = logisticRegression(codedColumn('case', inf.data.case), [
			continuousColumn('spontaneous', inf.data.spontaneous),
			continuousColumn('induced', inf.data.induced),
			continuousColumn('age', inf.data.age)
		]);
		// SEs: R's summary.glm uses the weights of its last iteration, one step before the
		// final estimates; ours are at the final estimates, checked against R's (X'WX)^-1
		// at fitted(fit) to 1e-8.
		expectCoefficients(fit.coefficients, inf.glm, 1e-8, (r) => (r === '(Intercept)' ? INTERCEPT : r), 1e-6);
		expectAllClose(fit.coefficients.map((c) => c.se), inf.glm.se_at_estimates, 1e-8);
		expectClose(fit.deviance, inf.glm.deviance, 1e-9);
		expectClose(fit.nullDeviance, inf.glm.null_deviance, 1e-12);
		expectClose(fit.aic, inf.glm.aic, 1e-9);
		expect(fit.converged).toBe(true);
		expect(Math.abs(fit.iterations - inf.glm.iter)).toBeLessThanOrEqual(1);
		expect(fit.separation.detected).toBe(false);
		expectClose(fit.coefficients[1].oddsRatio, Math.exp(inf.glm.estimate[1]), 1e-6);
	});

	it('esoph with two dummy-coded factors (R glm with unordered factors, reference = first level): estimates 1e-8, SEs 1e-8 at the estimates', () => {
		const age = codedColumn('agegp', esoph.data.agegp, { levels: esoph.data.agegp_levels });
		const alc = codedColumn('alcgp', esoph.data.alcgp, { levels: esoph.data.alcgp_levels });
		const fit = logisticRegression(codedColumn('case', esoph.data.case), [age, alc]);
		// summary.glm SEs differ by up to 1e-4 relative here (a sparse cell: 1 case among
		// 116 aged 25-34) because R takes them one iteration early; see the infert test.
		expectCoefficients(fit.coefficients, esoph.glm, 1e-8, (r) => (r === '(Intercept)' ? INTERCEPT : r.replace(/^(agegp|alcgp)(.*)$/, '$1[$2]')), 1e-3);
		expectAllClose(fit.coefficients.map((c) => c.se), esoph.glm.se_at_estimates, 1e-8);
		expectClose(fit.deviance, esoph.glm.deviance, 1e-9);
		expect(fit.notes.join(' ')).toContain("'agegp': dummy coding, reference level '25-34'");
	});

	it('complete separation is detected and the diverging coefficient named (R warns: "fitted probabilities numerically 0 or 1 occurred")', () => {
		const d = misc.separation.data;
		expect(misc.separation.warnings).toContain('fitted probabilities numerically 0 or 1');
		const fit = logisticRegression(codedColumn('y', d.y), [continuousColumn('x', d.x), continuousColumn('z', d.z)]);
		expect(fit.separation.detected).toBe(true);
		expect(fit.separation.fittedAtBounds).toBeGreaterThan(0);
		expect(fit.separation.diverging).toContain('x');
		expect(fit.warnings.join(' ')).toMatch(/separation/);
		// Like R, the slope runs off to a large value (R: 26.8); the exact value is arbitrary.
		expect(fit.coefficients[1].estimate).toBeGreaterThan(10);
	});

	it('warns below 10 events per variable (rule of thumb, Peduzzi et al. 1996)', () => {
		const fit = logisticRegression(codedColumn('am', mt.data.am), [col('wt'), col('hp')]);
		expect(fit.warnings.join(' ')).toMatch(/rule of thumb \(Peduzzi/);
		const epv = eventsPerVariable(13, 19, 2);
		expect(epv.epv).toBe(6.5);
		expect(epv.belowRuleOfThumb).toBe(true);
		expect(eventsPerVariable(200, 800, 10).belowRuleOfThumb).toBe(false);
	});

	it('refuses a non-binary outcome with a message naming it', () => {
		expect(() => logisticRegression(col('mpg'), [col('wt')])).toThrow(/'mpg' is continuous/);
	});
});

describe('crude versus adjusted', () => {
	it('infert: crude and adjusted OR for induced abortions on the same rows, change in estimate and E-value', () => {
		const r = estimateExposureEffect(codedColumn('case', inf.data.case), continuousColumn('induced', inf.data.induced), [
			continuousColumn('spontaneous', inf.data.spontaneous),
			continuousColumn('age', inf.data.age)
		]);
		expect(r.model).toBe('logistic');
		expect(r.n).toBe(248);
		// Adjusted OR = exp of R's glm coefficient for induced (1e-6 relative).
		expectClose(r.adjusted[0].estimate, Math.exp(inf.glm.estimate[2]), 1e-6);
		expectClose(r.change[0].percent, (100 * (r.adjusted[0].estimate - r.crude[0].estimate)) / r.crude[0].estimate, 1e-12);
		expect(r.eValues).toHaveLength(1);
		// case prevalence is 1/3: common outcome, square-root conversion applied.
		expect(r.eValues[0].notes[0]).toMatch(/square root/);
	});
	it('change in estimate flags 10 % as a common-practice marker', () => {
		const c = changeInEstimate(2, 1.7, 'ratio');
		expectClose(c.percent, -15, 1e-12);
		expect(c.atLeastTenPercent).toBe(true);
		expect(c.note).toMatch(/common-practice marker.*Maldonado & Greenland/);
		expect(changeInEstimate(2, 1.9, 'ratio').atLeastTenPercent).toBe(false);
	});
});

describe('E-value (VanderWeele & Ding, Ann Intern Med 2017)', () => {
	it('RR 3.9 → 7.26 and RR 1.8 → 3.0 (published examples, from memory; tolerance 0.005 and 0.05 for their rounding)', () => {
		expectClose(eValueOfRiskRatio(3.9), 7.26, 0, 0.005);
		expectClose(eValueOfRiskRatio(1.8), 3.0, 0, 0.05);
		// Protective estimates use 1/RR.
		expectClose(eValueOfRiskRatio(1 / 3.9), eValueOfRiskRatio(3.9), 1e-12);
	});
	it('CI bound: the limit closer to 1, or 1 when the interval includes 1; OR of a common outcome via √OR', () => {
		const e = eValue(3.9, [1.8, 8.7], { measure: 'RR' });
		expectClose(e.ciBound ?? NaN, eValueOfRiskRatio(1.8), 1e-12);
		expect(eValue(1.3, [0.9, 1.8], { measure: 'RR' }).ciBound).toBe(1);
		const common = eValue(4, [2.25, 9], { measure: 'OR', rareOutcome: false });
		expectClose(common.riskRatio, 2, 1e-12);
		expectClose(common.ciBound ?? NaN, eValueOfRiskRatio(1.5), 1e-12);
		const protective = eValue(0.5, [0.3, 0.8], { measure: 'OR' });
		expectClose(protective.ciBound ?? NaN, eValueOfRiskRatio(1 / 0.8), 1e-12);
	});
});
