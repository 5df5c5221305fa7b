/**
 * The confounder check and the new estimate columns through the whole pipeline
 * (runDataChecks), on UCBAdmissions expanded to one row per person (tests/fixtures/stats/
 * make-confounding-fixtures.R): gender → admitted with department as the confounder. The
 * numbers must equal R's — mantelhaen.test for the stratified odds ratio, glm with the
 * department as a factor for the per-level odds ratios of the arrow check, glm + predict for
 * the standardized risk difference — and the category codes of infert's 'spontaneous' are
 * named.
 */
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { runDataChecks } from '../../../src/lib/datacheck';
import type { Diagram } from '../../../src/lib/graph/diagram';
import { expectAllClose, expectClose, fixture } from '../stats/fixtures';
import { readTable, tableOf } from './helpers';

const R = fixture('confounding.json');
const stats = fileURLToPath(new URL('../../fixtures/stats/', import.meta.url));

const ucbDiagram: Diagram = {
	title: 'UCB admissions',
	variables: ['female', 'admitted', 'dept'].map((id) => ({ id, label: id, measured: true })),
	arrows: [
		{ from: 'female', to: 'admitted' },
		{ from: 'dept', to: 'female' },
		{ from: 'dept', to: 'admitted' }
	],
	exposures: ['female'],
	outcomes: ['admitted'],
	adjusted: ['dept']
};

describe('confounder check on UCBAdmissions (against R)', () => {
	const report = runDataChecks(ucbDiagram, readTable(`${stats}ucb-admissions-people.csv`), { parts: { claims: false } });

	it('department is a confounder; its stratified odds ratio is mantelhaen.test’s, with Tarone’s homogeneity test', () => {
		const dept = report.confounders!.candidates.find((c) => c.id === 'dept')!;
		expect(dept.roles).toContain('confounder');
		expect(dept.kind).toBe('categorical');
		const s = dept.stratified as { oddsRatio: number; ci: [number, number]; homogeneity: { pValue: number; df: number } };
		expectClose(s.oddsRatio, R.ucb.mh.estimate, 1e-10);
		expectAllClose(s.ci, R.ucb.mh.ci, 1e-10);
		expect(s.homogeneity.df).toBe(5);
		expect(s.homogeneity.pValue).toBeLessThan(0.01);
	});

	it('the arrow check dept → admitted shows counts, row proportions, X² on 5 df and glm’s per-level odds ratios', () => {
		const c = report.arrows.checks.find((a) => a.from === 'dept' && a.to === 'admitted')!;
		const t = c.table!;
		expect(t.counts).toEqual(R.ucb.chisq_dept.counts);
		expect(t.rowProportions[0][1]).toBeCloseTo(601 / 933, 12);
		expectClose(t.chiSquare!.statistic, R.ucb.chisq_dept.statistic, 1e-10);
		expect(t.chiSquare!.df).toBe(5);
		R.ucb.level_ors_dept.levels.forEach((level: string, i: number) => expectClose(t.levelOddsRatios!.levels.find((l) => l.level === level)!.oddsRatio, R.ucb.level_ors_dept.or[i], 1e-6));
		// Strength is read as an odds ratio, never "weak" on Cramér's V.
		expect(c.measure!.name).toMatch(/^odds ratio/);
		expect(c.support).toBe('supported');
	});

	it('the planned row carries the standardized risk difference of R’s g-computation and the crude estimate on its own rows', () => {
		const planned = report.estimates!.rows.find((r) => r.roles.includes('planned'))!;
		expectClose(planned.standardized!.riskDifference.estimate, R.ucb.gcomp.rd, 1e-6);
		expectAllClose(planned.standardized!.riskDifference.ci, R.ucb.gcomp.rd_ci, 1e-5);
		expectClose(planned.standardized!.riskRatio.estimate, R.ucb.gcomp.rr, 1e-6);
		expectClose(planned.crudeSameRows!, R.ucb.gcomp.crude_or, 1e-6);
		expect(planned.crudeSameRowsCi).toHaveLength(2);
		// The change is computed on the numbers shown.
		expectClose(planned.changePercent!, (planned.estimate / planned.crudeSameRows! - 1) * 100, 1e-9);
	});
});

describe('"weak" is not decided on Cramér\'s V when an odds ratio is read', () => {
	it('an odds ratio of 1.62 (p < 0.001) with a rare outcome is supported, though V < 0.1 (the issue\'s example, built here)', () => {
		// 20,000 unexposed with 400 events (2 %), 20,000 exposed with 640 (3.2 %): OR = (640·19,600)/(400·19,360) ≈ 1.62.
		const lines = ['x,y'];
		for (const [x, events] of [
			[0, 400],
			[1, 640]
		])
			for (let i = 0; i < 20000; i++) lines.push(`${x},${i < events ? 1 : 0}`);
		const d: Diagram = { title: 'rare', variables: ['x', 'y'].map((id) => ({ id, label: id, measured: true })), arrows: [{ from: 'x', to: 'y' }], exposures: [], outcomes: [], adjusted: [] };
		const report = runDataChecks(d, tableOf(lines.join('\n')), { parts: { claims: false, estimates: false } });
		const c = report.arrows.checks[0];
		expect(c.main!.pValue).toBeLessThan(0.001);
		const v = [c.main!, ...c.others].flatMap((t) => t.effects).find((e) => e.name === "Cramér's V")!.value;
		expect(v).toBeLessThan(0.1);
		expect(c.measure!.type).toBe('odds-ratio');
		// Logistic regression (IRLS) against the closed-form 2 × 2 odds ratio.
		expectClose(c.measure!.value, (640 * 19600) / (400 * 19360), 1e-6);
		expect(c.support).toBe('supported');
	});
});

describe('category codes', () => {
	it("infert's spontaneous (0/1/2) read as numbers is named with its values", () => {
		const d: Diagram = {
			title: 'infert',
			variables: ['spontaneous', 'case', 'age'].map((id) => ({ id, label: id, measured: true })),
			arrows: [{ from: 'spontaneous', to: 'case' }, { from: 'age', to: 'case' }, { from: 'age', to: 'spontaneous' }],
			exposures: ['spontaneous'],
			outcomes: ['case'],
			adjusted: []
		};
		const report = runDataChecks(d, readTable(`${stats}infert-people.csv`), { parts: { claims: false } });
		expect(report.categoryCodes).toEqual([{ column: 'spontaneous', values: [0, 1, 2] }]);
		expect(report.arrows.checks.find((c) => c.from === 'spontaneous')!.kinds[0]).toBe('continuous');
	});
});
