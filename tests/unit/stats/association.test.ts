// Pairwise association tests against published values and R (fixtures from
// tests/fixtures/stats/make-fixtures.R). Tolerances are stated beside each check.
import { describe, expect, it } from 'vitest';
import {
	associate,
	chiSquareTest,
	codedColumn,
	continuousColumn,
	fisherExactP,
	gTest,
	groupedValues,
	kruskalWallis,
	oddsRatioWoolf,
	oneWayAnova,
	pearsonTest,
	pointBiserialTest,
	spearmanTest,
	tableFromCounts
} from '../../../src/lib/stats';
import { expectClose, fixture, type Json } from './fixtures';

const party = fixture('agresti-party.json');
const fisher = fixture('fisher.json');
const ucb = fixture('ucb-admissions.json');
const mt = fixture('mtcars.json');
const esoph = fixture('esoph.json');

describe('chi-square and G-test', () => {
	it('Agresti (An Introduction to Categorical Data Analysis, 2nd ed.) party identification by gender: X² ≈ 30.1, G² ≈ 30.0, df 2 (from memory)', () => {
		const t = tableFromCounts([
			[762, 327, 468],
			[484, 239, 477]
		]);
		const x2 = chiSquareTest(t);
		const g2 = gTest(t);
		// Published values are rounded to one decimal: tolerance 0.05.
		expectClose(x2.statistic, 30.1, 0, 0.05);
		expectClose(g2.statistic, 30.0, 0, 0.05);
		expect(x2.df).toEqual([2]);
		expect(g2.df).toEqual([2]);
		// R chisq.test on the same table: 1e-10 relative.
		expectClose(x2.statistic, party.chisq.statistic, 1e-10);
		expectClose(x2.pValue, party.chisq.p, 1e-8);
		expectClose(g2.statistic, party.g2, 1e-10);
		expect(x2.n).toBe(2757);
		// Cramér's V = √(X²/n) for a 2-row table.
		expectClose(x2.effects[0].value, Math.sqrt(party.chisq.statistic / 2757), 1e-10);
	});

	it('UCBAdmissions, admission by gender (R chisq.test, correct = FALSE): 1e-10 relative', () => {
		const t = tableFromCounts(ucb.marginal.counts);
		const r = chiSquareTest(t);
		expectClose(r.statistic, ucb.marginal.chisq.statistic, 1e-10);
		expectClose(r.pValue, ucb.marginal.chisq.p, 1e-8);
		expectClose(gTest(t).statistic, ucb.marginal.g2, 1e-10);
	});

	it('esoph, alcohol group by case status (R chisq.test): 1e-10 relative', () => {
		const alc = codedColumn('alcgp', esoph.data.alcgp, { levels: esoph.data.alcgp_levels });
		const cas = codedColumn('case', esoph.data.case);
		const r = associate(alc, cas).main;
		expect(r.test).toBe('Pearson chi-square test');
		expectClose(r.statistic, esoph.chisq_alcgp_case.statistic, 1e-10);
		expect(r.df).toEqual([esoph.chisq_alcgp_case.parameter]);
		expectClose(r.pValue, esoph.chisq_alcgp_case.p, 1e-8);
	});
});

describe("Fisher's exact test and the odds ratio", () => {
	it('two-sided p-values agree with R fisher.test (1e-9 relative); tea-tasting table p = 0.4857 (Fisher 1935)', () => {
		expectClose(fisherExactP(3, 1, 1, 3), 0.4857, 0, 5e-5);
		for (const t of fisher.tables as Json[]) {
			const [[a, b], [c, d]] = t.counts;
			expectClose(fisherExactP(a, b, c, d), t.fisher_p, 1e-9);
		}
	});

	it('Woolf interval and Haldane correction only when a cell is 0 (formula values computed in R): 1e-10 relative', () => {
		for (const t of fisher.tables as Json[]) {
			const or = oddsRatioWoolf(tableFromCounts(t.counts));
			expectClose(or.value, t.woolf[0], 1e-10);
			expectClose(or.ci?.[0] ?? NaN, t.woolf[1], 1e-10);
			expectClose(or.ci?.[1] ?? NaN, t.woolf[2], 1e-10);
			const hasZero = (t.counts as number[][]).flat().includes(0);
			expect(or.note?.includes('Haldane')).toBe(hasZero);
		}
	});

	it('the dispatcher picks Fisher when an expected count is below 5, chi-square otherwise', () => {
		const small = associate(codedColumn('a', [0, 0, 0, 0, 1, 1, 1, 1]), codedColumn('b', [0, 0, 0, 1, 1, 1, 1, 0]));
		expect(small.main.test).toBe("Fisher's exact test");
		expectClose(small.main.pValue, fisherExactP(3, 1, 1, 3), 1e-12);
		expect(small.main.effects[0].name).toBe('odds ratio');
		const rows: number[][] = [];
		const [[a, b], [c, d]] = [
			[40, 20],
			[25, 35]
		];
		for (const [x, y, k] of [
			[0, 0, a],
			[0, 1, b],
			[1, 0, c],
			[1, 1, d]
		])
			for (let i = 0; i < k; i++) rows.push([x, y]);
		const big = associate(codedColumn('a', rows.map((r) => r[0])), codedColumn('b', rows.map((r) => r[1])));
		expect(big.main.test).toBe('Pearson chi-square test');
		expect(big.main.effects.map((e) => e.name)).toEqual(['odds ratio', "Cramér's V"]);
		expectClose(big.main.effects[0].value, (40 * 35) / (20 * 25), 1e-12);
		expect(big.main.n).toBe(120);
	});
});

describe('correlations and group comparisons (mtcars, R)', () => {
	const mpg = Float64Array.from(mt.data.mpg as number[]);
	const wt = Float64Array.from(mt.data.wt as number[]);
	const am = Float64Array.from(mt.data.am as number[]);

	it('Pearson r, t, p and Fisher-z interval (R cor.test): 1e-10 relative', () => {
		const r = pearsonTest(mpg, wt);
		expectClose(r.effects[0].value, mt.pearson_mpg_wt.estimate, 1e-10);
		expectClose(r.statistic, mt.pearson_mpg_wt.statistic, 1e-10);
		expectClose(r.pValue, mt.pearson_mpg_wt.p, 1e-8);
		expectClose(r.effects[0].ci?.[0] ?? NaN, mt.pearson_mpg_wt.conf_int[0], 1e-10);
		expectClose(r.effects[0].ci?.[1] ?? NaN, mt.pearson_mpg_wt.conf_int[1], 1e-10);
		expect(r.n).toBe(32);
	});

	it('Spearman rho with ties and its t-approximation p (R cor.test, exact = FALSE): 1e-10 relative', () => {
		const r = spearmanTest(mpg, wt);
		expectClose(r.effects[0].value, mt.spearman_mpg_wt.estimate, 1e-10);
		expectClose(r.pValue, mt.spearman_mpg_wt.p, 1e-8);
	});

	it('point-biserial r (R cor.test with the 0/1 variable): 1e-10 relative', () => {
		const r = pointBiserialTest(am, mpg);
		expectClose(r.effects[0].value, mt.pointbiserial_am_mpg.estimate, 1e-10);
		expectClose(r.pValue, mt.pointbiserial_am_mpg.p, 1e-8);
	});

	it('one-way ANOVA and Kruskal–Wallis of mpg by cylinders (R aov, kruskal.test with ties): 1e-10 relative', () => {
		const cyl = codedColumn('cyl', mt.data.cyl);
		const { values, groups, levels } = groupedValues(cyl, continuousColumn('mpg', mt.data.mpg));
		const f = oneWayAnova(values, groups, levels.length);
		expectClose(f.statistic, mt.aov_mpg_cyl.f, 1e-10);
		expect(f.df).toEqual([mt.aov_mpg_cyl.df1, mt.aov_mpg_cyl.df2]);
		expectClose(f.pValue, mt.aov_mpg_cyl.p, 1e-8);
		const h = kruskalWallis(values, groups, levels.length);
		expectClose(h.statistic, mt.kruskal_mpg_cyl.statistic, 1e-10);
		expectClose(h.pValue, mt.kruskal_mpg_cyl.p, 1e-8);
		const gear = groupedValues(codedColumn('gear', mt.data.gear), continuousColumn('mpg', mt.data.mpg));
		expectClose(kruskalWallis(gear.values, gear.groups, 3).statistic, mt.kruskal_mpg_gear.statistic, 1e-10);
	});

	it('the dispatcher: continuous pair → Pearson + Spearman; categorical × continuous → ANOVA + Kruskal–Wallis; binary × continuous → point-biserial', () => {
		const mpgC = continuousColumn('mpg', mt.data.mpg);
		expect(associate(mpgC, continuousColumn('wt', mt.data.wt)).main.test).toBe("Pearson's correlation test");
		const cat = associate(codedColumn('cyl', mt.data.cyl), mpgC);
		expect([cat.main.test, cat.others[0].test]).toEqual(['One-way ANOVA F test', 'Kruskal–Wallis rank-sum test']);
		expectClose(cat.main.statistic, mt.aov_mpg_cyl.f, 1e-10);
		const bin = associate(mpgC, codedColumn('am', mt.data.am));
		expect(bin.main.test).toBe('Point-biserial correlation test');
		expectClose(bin.main.effects[0].value, mt.pointbiserial_am_mpg.estimate, 1e-10);
		const ord = associate(codedColumn('gear', mt.data.gear, { kind: 'ordinal' }), mpgC);
		expect(ord.main.test).toBe("Spearman's rank correlation test");
	});

	it('complete cases: missing values are left out and counted', () => {
		const x = continuousColumn('x', [1, 2, NaN, 4, 5, 6]);
		const y = continuousColumn('y', [2, 1, 4, null, 6, 5]);
		const r = associate(x, y).main;
		expect(r.n).toBe(4);
		expect(r.notes.join(' ')).toContain('2 of 6 rows left out');
		expectClose(r.effects[0].value, pearsonTest(Float64Array.of(1, 2, 5, 6), Float64Array.of(2, 1, 6, 5)).effects[0].value, 1e-14);
	});

	it('says why when a variable does not vary', () => {
		expect(() => associate(continuousColumn('x', [1, 1, 1, 1, 1]), continuousColumn('y', [1, 2, 3, 4, 5]))).toThrow(
			"'x' has the single value 1 in the complete cases; no association can be tested."
		);
		expect(() => associate(codedColumn('a', ['x', 'x', 'y']), codedColumn('b', ['p', 'q', null]))).toThrow("'a' has a single observed level ('x')");
	});
});
