// Conditional-independence tests and multiplicity adjustments against R (fixtures from
// tests/fixtures/stats/make-fixtures.R). Tolerances are stated beside each check.
import { describe, expect, it } from 'vitest';
import {
	benjaminiHochbergAdjust,
	cochranMantelHaenszel,
	codedColumn,
	continuousColumn,
	holmAdjust,
	nestedModelTest,
	partialCorrelationTest,
	stratifiedFromCounts,
	stratifiedGTest,
	testConditionalIndependence
} from '../../../src/lib/stats';
import { expectAllClose, expectClose, fixture } from './fixtures';

const ucb = fixture('ucb-admissions.json');
const inf = fixture('infert.json');
const mt = fixture('mtcars.json');
const misc = fixture('misc.json');

describe('Cochran–Mantel–Haenszel and stratified G-test', () => {
	it('UCBAdmissions (R mantelhaen.test, with and without continuity correction): statistic, p, MH OR and its RBG interval, 1e-9 relative', () => {
		const t = stratifiedFromCounts(ucb.strata);
		for (const [r, ref] of [
			[cochranMantelHaenszel(t), ucb.cmh_corrected],
			[cochranMantelHaenszel(t, { continuityCorrection: false }), ucb.cmh_uncorrected]
		] as const) {
			expectClose(r.statistic, ref.statistic, 1e-9);
			expectClose(r.pValue, ref.p, 1e-9);
			expectClose(r.effects[0].value, ref.estimate, 1e-9);
			expectClose(r.effects[0].ci?.[0] ?? NaN, ref.conf_int[0], 1e-9);
			expectClose(r.effects[0].ci?.[1] ?? NaN, ref.conf_int[1], 1e-9);
		}
	});

	it('UCBAdmissions stratified G² equals the deviance of the log-linear model [AD][GD] (R glm, poisson): 1e-8 relative', () => {
		const r = stratifiedGTest(stratifiedFromCounts(ucb.strata));
		expectClose(r.statistic, ucb.stratified_g2.deviance, 1e-8);
		expect(r.df).toEqual([ucb.stratified_g2.df]);
		expectClose(r.pValue, ucb.stratified_g2.p, 1e-7);
	});

	it('infert, spontaneous abortion × case by education, built from the raw rows (R mantelhaen.test): 1e-9 relative', () => {
		const spont = codedColumn('spont', (inf.data.spontaneous as number[]).map((v) => (v > 0 ? 'TRUE' : 'FALSE')));
		const cas = codedColumn('case', inf.data.case);
		const edu = codedColumn('education', inf.data.education);
		const result = testConditionalIndependence(spont, cas, [edu]);
		expect(result.main.test).toBe('Stratified likelihood-ratio G-test');
		const cmh = result.others[0];
		const ref = inf.cmh_spontaneous_case_by_education.corrected;
		expectClose(cmh.statistic, ref.statistic, 1e-9);
		expectClose(cmh.pValue, ref.p, 1e-9);
		expectClose(cmh.effects[0].value, ref.estimate, 1e-9);
		expectClose(cmh.effects[0].ci?.[0] ?? NaN, ref.conf_int[0], 1e-9);
		expect(cmh.n).toBe(248);
	});
});

describe('partial correlation with Fisher z (mtcars)', () => {
	const col = (name: string) => continuousColumn(name, mt.data[name]);
	it('mpg–wt given hp and qsec equals the correlation of residuals (R lm residuals), p by Fisher z: 1e-10 relative', () => {
		const r = partialCorrelationTest(col('mpg'), col('wt'), [col('hp'), col('qsec')]);
		expectClose(r.effects[0].value, mt.partial_mpg_wt_given_hp_qsec.r, 1e-10);
		expectClose(r.statistic, mt.partial_mpg_wt_given_hp_qsec.z, 1e-10);
		expectClose(r.pValue, mt.partial_mpg_wt_given_hp_qsec.p, 1e-8);
		const one = testConditionalIndependence(col('mpg'), col('qsec'), [col('wt')]).main;
		expect(one.test).toBe("Partial correlation, Fisher's z test");
		expectClose(one.effects[0].value, mt.partial_mpg_qsec_given_wt.r, 1e-10);
		expectClose(one.pValue, mt.partial_mpg_qsec_given_wt.p, 1e-8);
	});
});

describe('nested regressions for mixed types', () => {
	it('logistic likelihood-ratio test for induced given age and spontaneous (R anova(glm, glm, test = "Chisq")): 1e-7 relative', () => {
		const given = [continuousColumn('age', inf.data.age), continuousColumn('spontaneous', inf.data.spontaneous)];
		const r = nestedModelTest(codedColumn('case', inf.data.case), continuousColumn('induced', inf.data.induced), given);
		expect(r.test).toBe('Likelihood-ratio test of nested logistic regressions');
		expectClose(r.statistic, inf.lrt_induced.deviance, 1e-7);
		expect(r.df).toEqual([inf.lrt_induced.df]);
		expectClose(r.pValue, inf.lrt_induced.p, 1e-6);
		// The dispatcher, given a binary and a continuous variable, regresses the continuous one.
		const d = testConditionalIndependence(codedColumn('case', inf.data.case), continuousColumn('induced', inf.data.induced), given).main;
		expect(d.test).toBe('F test of nested linear regressions');
		expect(d.notes[0]).toContain("Response 'induced'");
	});

	it('F test for wt given hp, and for cylinders (2 df) given hp (R anova(lm, lm)): 1e-9 relative', () => {
		const mpg = continuousColumn('mpg', mt.data.mpg);
		const hp = continuousColumn('hp', mt.data.hp);
		const a = nestedModelTest(mpg, continuousColumn('wt', mt.data.wt), [hp]);
		expectClose(a.statistic, mt.nested_f_wt_given_hp.f, 1e-9);
		expect(a.df).toEqual([mt.nested_f_wt_given_hp.df1, mt.nested_f_wt_given_hp.df2]);
		expectClose(a.pValue, mt.nested_f_wt_given_hp.p, 1e-8);
		// Dispatcher: categorical x, continuous y, continuous Z → F test with y as response.
		const b = testConditionalIndependence(codedColumn('cyl', mt.data.cyl), mpg, [hp]).main;
		expect(b.test).toBe('F test of nested linear regressions');
		expectClose(b.statistic, mt.nested_f_cyl_given_hp.f, 1e-9);
		expect(b.df).toEqual([2, mt.nested_f_cyl_given_hp.df2]);
	});

	it('refuses two multi-level categorical variables given a continuous one, with a message', () => {
		expect(() =>
			testConditionalIndependence(codedColumn('cyl', mt.data.cyl), codedColumn('gear', mt.data.gear), [continuousColumn('hp', mt.data.hp)])
		).toThrow(/multinomial/);
	});
});

describe('multiplicity (R p.adjust)', () => {
	it('Holm and Benjamini–Hochberg, NA passed through: 1e-12 relative', () => {
		const p = misc.padjust.p as number[];
		const holm = holmAdjust(p);
		const bh = benjaminiHochbergAdjust(p);
		expect(Number.isNaN(holm[8]) && Number.isNaN(bh[8])).toBe(true);
		expectAllClose(holm.slice(0, 8), misc.padjust.holm.slice(0, 8), 1e-12);
		expectAllClose(bh.slice(0, 8), misc.padjust.bh.slice(0, 8), 1e-12);
	});
});
