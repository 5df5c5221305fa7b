/**
 * The confounder check's statistics against R and statsmodels on open datasets shipped with
 * R, each expanded to one row per person (tests/fixtures/stats/make-confounding-fixtures.R
 * wrote confounding.json and the *-people.csv files; make_breslow_day.py wrote
 * breslow-day.json from Debian's python3-statsmodels, as R's base packages have no
 * Breslow–Day test):
 * - X² and df: chisq.test(table(x, y), correct = FALSE);
 * - odds ratio per level against the reference: glm(y ~ factor(x), binomial), confint.default;
 * - Mantel–Haenszel odds ratio and Robins–Breslow–Greenland interval, CMH X² with and without
 *   the continuity correction: mantelhaen.test; RGB standard error also from statsmodels'
 *   StratifiedTable.logodds_pooled_se;
 * - Breslow–Day with Tarone's correction: StratifiedTable.test_equal_odds(adjust = TRUE/FALSE);
 * - g-computation risk difference, risk ratio and marginal odds ratio with delta-method
 *   intervals: glm + predict over the sample with a numerical gradient in R.
 * Datasets: UCBAdmissions (6 departments), esoph (6 age groups), infert (3 education levels).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { chiSquareTest, crossTabulate, parseTable, type CodedColumn, type Column, type Table } from '../../../src/lib/stats';
import { levelOddsRatios } from '../../../src/lib/stats/association/level-odds-ratios';
import { breslowDay } from '../../../src/lib/stats/stratified/breslow-day';
import { mantelHaenszel } from '../../../src/lib/stats/stratified/mantel-haenszel';
import { strata2x2 } from '../../../src/lib/stats/stratified/strata';
import { standardize } from '../../../src/lib/stats/standardization/g-computation';
import { retypeTable } from '../../../src/lib/datacheck/retype';
import { expectAllClose, expectClose, fixture } from './fixtures';

const R = fixture('confounding.json');
const PY = fixture('breslow-day.json');

function people(name: string, types: Record<string, 'categorical' | 'binary' | 'continuous'> = {}): (col: string) => Column {
	const text = readFileSync(new URL(`../../fixtures/stats/${name}`, import.meta.url), 'utf8');
	const parsed = parseTable(text);
	if (!parsed.ok) throw new Error(parsed.error.message);
	const t: Table = retypeTable(parsed.table, types);
	return (col) => {
		const c = t.columns.find((x) => x.name === col);
		if (!c) throw new Error(`no column ${col}`);
		return c;
	};
}
const coded = (c: Column) => c as CodedColumn;

const ucb = people('ucb-admissions-people.csv');
const es = people('esoph-people.csv');
const inf = people('infert-people.csv', { spontaneous: 'categorical' });

// Tolerances: closed-form statistics to 1e-10 relative; IRLS fits (R stops at a relative
// deviance change of 1e-8) to 1e-6 relative.
const EXACT = 1e-10;
const FIT = 1e-6;

describe('X² and df of two discrete variables (R chisq.test, correct = FALSE)', () => {
	const cases: [string, () => ReturnType<typeof chiSquareTest>, { statistic: number; df: number; p: number }][] = [
		['UCBAdmissions gender × admitted', () => chiSquareTest(crossTabulate(coded(ucb('female')), coded(ucb('admitted')))), R.ucb.chisq_gender],
		['UCBAdmissions department × admitted (6 × 2)', () => chiSquareTest(crossTabulate(coded(ucb('dept')), coded(ucb('admitted')))), R.ucb.chisq_dept],
		['esoph alcohol group × case (4 × 2)', () => chiSquareTest(crossTabulate(coded(es('alcgp')), coded(es('case')))), R.esoph.chisq_alcohol],
		['infert spontaneous (codes 0/1/2 as categories) × case', () => chiSquareTest(crossTabulate(coded(inf('spontaneous')), coded(inf('case')))), R.infert.chisq_spontaneous]
	];
	for (const [name, run, expected] of cases)
		it(name, () => {
			const t = run();
			expectClose(t.statistic, expected.statistic, EXACT);
			expect(t.df).toEqual([expected.df]);
			expectClose(t.pValue, expected.p, 1e-8);
		});
});

describe('odds ratio per level against the reference (R glm(y ~ factor(x), binomial), confint.default)', () => {
	const cases: [string, () => ReturnType<typeof levelOddsRatios>, { levels: string[]; or: number[]; ci_low: number[]; ci_high: number[]; p: number[] }][] = [
		['UCBAdmissions: admission by department (reference A)', () => levelOddsRatios(coded(ucb('admitted')), coded(ucb('dept'))), R.ucb.level_ors_dept],
		['esoph: case by alcohol group (reference 0-39g/day)', () => levelOddsRatios(coded(es('case')), coded(es('alcgp'))), R.esoph.level_ors_alcohol],
		['infert: case by spontaneous abortions 0/1/2 as a factor', () => levelOddsRatios(coded(inf('case')), coded(inf('spontaneous'))), R.infert.level_ors_spontaneous],
		['infert: case by education (reference 0-5yrs)', () => levelOddsRatios(coded(inf('case')), coded(inf('education'))), R.infert.level_ors_education]
	];
	for (const [name, run, expected] of cases)
		it(name, () => {
			const r = run();
			expect(r.levels.map((l) => l.level).sort()).toEqual([...expected.levels].sort());
			expected.levels.forEach((level, i) => {
				const got = r.levels.find((l) => l.level === level)!;
				expectClose(got.oddsRatio, expected.or[i], FIT);
				expectAllClose(got.ci, [expected.ci_low[i], expected.ci_high[i]], FIT);
				expectClose(got.pValue, expected.p[i], 1e-5, 1e-300);
			});
		});
});

describe('Mantel–Haenszel odds ratio, RGB interval and CMH test (R mantelhaen.test; statsmodels)', () => {
	const cases: [string, () => ReturnType<typeof strata2x2>, Record<string, unknown> & { mh: Record<string, number & number[]> }, string][] = [
		['UCBAdmissions: female vs male, 6 departments', () => strata2x2(ucb('female'), ucb('admitted'), ucb('dept')), R.ucb, 'ucb'],
		['esoph: alcohol ≥ 40 g/day, 6 age groups', () => strata2x2(es('heavy'), es('case'), es('agegp')), R.esoph, 'esoph'],
		['infert: any spontaneous abortion, 3 education levels', () => strata2x2(inf('anyspont'), inf('case'), inf('education')), R.infert, 'infert']
	];
	for (const [name, run, ref, key] of cases)
		it(name, () => {
			const s = run();
			const strata = ref.mh.strata as unknown as string[];
			const byLabel = new Map(s.labels.map((l, k) => [l, [...s.tables[k]]]));
			strata.forEach((label, k) => expect(byLabel.get(label), label).toEqual((ref.mh.tables[k] as unknown as number[][]).flat()));
			const mh = mantelHaenszel(s.tables);
			expectClose(mh.oddsRatio, ref.mh.estimate, EXACT);
			expectAllClose(mh.ci, ref.mh.ci, EXACT);
			expectClose(mh.logSe, PY[key].mh_log_se, 1e-9);
			expectClose(mh.statistic, ref.mh.statistic, EXACT);
			expectClose(mh.pValue, ref.mh.p, 1e-8);
			expectClose(mh.statisticCorrected, ref.mh.statistic_corrected, EXACT);
			expectClose(mh.pValueCorrected, ref.mh.p_corrected, 1e-8);
		});
});

describe('Breslow–Day test with Tarone’s correction (statsmodels StratifiedTable.test_equal_odds)', () => {
	const cases: [string, () => ReturnType<typeof strata2x2>, string][] = [
		['UCBAdmissions (department A differs: effect modification found)', () => strata2x2(ucb('female'), ucb('admitted'), ucb('dept')), 'ucb'],
		['esoph (no evidence against a common odds ratio)', () => strata2x2(es('heavy'), es('case'), es('agegp')), 'esoph'],
		['infert', () => strata2x2(inf('anyspont'), inf('case'), inf('education')), 'infert']
	];
	for (const [name, run, key] of cases)
		it(name, () => {
			const s = run();
			const mh = mantelHaenszel(s.tables);
			const bd = breslowDay(s.tables, mh.oddsRatio);
			const ref = PY[key];
			expect(bd.strataUsed).toBe(ref.strata_used);
			expect(bd.df).toBe(ref.df);
			expectClose(bd.statistic, ref.breslow_day.statistic, 1e-9);
			expectClose(bd.statisticTarone, ref.tarone.statistic, 1e-9);
			expectClose(bd.pValueTarone, ref.tarone.p, 1e-8);
		});
	it('UCBAdmissions: Tarone p is below 0.01, the known department A effect', () => {
		const s = strata2x2(ucb('female'), ucb('admitted'), ucb('dept'));
		expect(breslowDay(s.tables, mantelHaenszel(s.tables).oddsRatio).pValueTarone).toBeLessThan(0.01);
	});
});

describe('g-computation: standardized risk difference, risk ratio, marginal odds ratio (R glm + predict, delta method)', () => {
	const cases: [string, () => ReturnType<typeof standardize>, Record<string, number & number[]>][] = [
		['UCBAdmissions: admitted ~ female + department', () => standardize(ucb('admitted'), ucb('female'), [ucb('dept')]), R.ucb.gcomp],
		['esoph: case ~ heavy + age group + tobacco group', () => standardize(es('case'), es('heavy'), [es('agegp'), es('tobgp')]), R.esoph.gcomp],
		['infert: case ~ any spontaneous + age + education', () => standardize(inf('case'), inf('anyspont'), [inf('age'), inf('education')]), R.infert.gcomp]
	];
	for (const [name, run, ref] of cases)
		it(name, () => {
			const g = run();
			expect(g.n).toBe(ref.n);
			expectClose(g.risk1.estimate, ref.risk1, FIT);
			expectClose(g.risk0.estimate, ref.risk0, FIT);
			expectClose(g.riskDifference.estimate, ref.rd, FIT);
			// The interval from R uses a numerical gradient (h = 1e-6): agreement to 1e-5 relative.
			expectAllClose(g.riskDifference.ci, ref.rd_ci, 1e-5);
			expectClose(g.riskRatio.estimate, ref.rr, FIT);
			expectAllClose(g.riskRatio.ci, ref.rr_ci, 1e-5);
			expectClose(g.marginalOddsRatio.estimate, ref.marginal_or, FIT);
			expectAllClose(g.marginalOddsRatio.ci, ref.marginal_or_ci, 1e-5);
			expectClose(g.conditionalOddsRatio.estimate, ref.conditional_or, FIT);
		});
	it('without confounders the standardized odds ratio is the crude one (collapsible case, by construction)', () => {
		const g = standardize(ucb('admitted'), ucb('female'), []);
		expectClose(g.marginalOddsRatio.estimate, R.ucb.gcomp.crude_or, FIT);
		expectClose(g.conditionalOddsRatio.estimate, R.ucb.gcomp.crude_or, FIT);
	});
});

describe('columns that look like category codes', () => {
	it('infert spontaneous (0/1/2) read as numbers is flagged; age is not', async () => {
		const { categoryCodeValues } = await import('../../../src/lib/stats');
		const raw = people('infert-people.csv');
		expect(raw('spontaneous').kind).toBe('continuous');
		expect(categoryCodeValues(raw('spontaneous'))).toEqual([0, 1, 2]);
		expect(categoryCodeValues(raw('age'))).toBeNull();
		expect(categoryCodeValues(raw('case'))).toBeNull();
	});
});
