// The data checks against R (tests/fixtures/datacheck/make-datacheck-fixtures.R →
// datacheck.json): Pearson arrow checks (cor.test), partial-correlation claim checks with
// Holm and BH (p.adjust), linear estimates (lm, confint) on mtcars; logistic odds ratios
// with Wald intervals (glm, confint.default) on infert. Tolerances: 1e-9 relative for
// closed-form values, 1e-6 for iterative fits (IRLS stops at R's deviance rule), 2e-5 for
// their intervals (see below).
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { runDataChecks } from '../../../src/lib/datacheck';
import { expectClose } from '../stats/fixtures';
import { fixtureDir, readDiagram, readTable } from './helpers';

const ref = JSON.parse(readFileSync(`${fixtureDir}datacheck.json`, 'utf8'));
const rename = (id: string) => (id === 'wt' ? 'weight' : id);

describe('mtcars diagram (R 4.2 reference)', () => {
	const diagram = readDiagram(`${fixtureDir}mtcars.causeway.json`);
	const report = runDataChecks(diagram, readTable(`${fixtureDir}mtcars.csv`));

	it('maps "weight" to column wt by its label, and leaves am unused', () => {
		expect(report.mapping.columns.weight).toBe('wt');
		expect(report.mapping.by.weight).toBe('label');
		expect(report.mapping.unusedColumns).toEqual(['am']);
		expect(report.mapping.unmapped).toEqual([]);
	});

	it('arrow checks equal cor.test (r and p), with n = 32', () => {
		expect(report.arrows.checks).toHaveLength(ref.mtcars.arrows.length);
		for (const a of ref.mtcars.arrows) {
			const c = report.arrows.checks.find((x) => x.from === rename(a.from) && x.to === rename(a.to));
			expect(c, `${a.from} → ${a.to}`).toBeDefined();
			expect(c!.main!.n).toBe(32);
			expectClose(c!.main!.effects[0].value, a.r, 1e-9);
			expectClose(c!.main!.pValue, a.p, 1e-6);
			expect(c!.support).toBe('supported');
		}
	});

	it('claim checks equal partial correlations with Fisher z, Holm and BH from p.adjust', () => {
		expect(report.claims.tested).toBe(ref.mtcars.claims.length);
		for (const r of ref.mtcars.claims) {
			const c = report.claims.checks.find((x) => x.a === rename(r.a) && x.b === rename(r.b));
			expect(c, `${r.a} ⟂ ${r.b}`).toBeDefined();
			expect(c!.given).toEqual(r.given.map(rename));
			expectClose(c!.main!.effects[0].value, r.r, 1e-9);
			expectClose(c!.p, r.p, 1e-9);
			expectClose(c!.pHolm, r.holm, 1e-9);
			expectClose(c!.pBH, r.bh, 1e-9);
			expect(c!.status).toBe(r.holm < 0.05 ? 'contradicted' : 'consistent');
		}
	});

	it('claims are ordered by status, then p', () => {
		const ps = report.claims.checks.map((c) => c.p);
		expect([...ps].sort((a, b) => a - b)).toEqual(ps);
	});

	it('linear estimates equal lm: crude, minimal {disp} (also planned), minimal and optimal {hp}', () => {
		const e = report.estimates!;
		expect(e.measure).toBe('difference');
		const row = (set: string[]) => e.rows.find((r) => r.adjustedFor.join() === set.join())!;
		for (const [set, key] of [
			[[], 'crude'],
			[['disp'], 'disp'],
			[['hp'], 'hp']
		] as const) {
			const r = row([...set]);
			const want = ref.mtcars.linear[key];
			expectClose(r.estimate, want.estimate, 1e-9);
			expectClose(r.ci[0], want.ci[0], 1e-9);
			expectClose(r.ci[1], want.ci[1], 1e-9);
			expectClose(r.pValue, want.p, 1e-7);
		}
		expect(row(['disp']).roles).toEqual(['minimal', 'planned']);
		expect(row(['hp']).roles).toEqual(['minimal', 'optimal']);
		const change = (100 * (ref.mtcars.linear.disp.estimate - ref.mtcars.linear.crude.estimate)) / ref.mtcars.linear.crude.estimate;
		expectClose(row(['disp']).changePercent!, change, 1e-9);
		expect(row(['disp']).changeMarked).toBe(Math.abs(change) >= 10);
	});
});

describe('infert diagram (R 4.2 reference)', () => {
	const diagram = readDiagram(`${fixtureDir}infert.causeway.json`);
	const report = runDataChecks(diagram, readTable(`${fixtureDir}infert.csv`));

	it('logistic odds ratios and Wald intervals equal glm + confint.default', () => {
		const e = report.estimates!;
		expect(e.model).toBe('logistic');
		expect(e.nullValue).toBe(1);
		for (const [set, key] of [
			['', 'crude'],
			['age,parity', 'age_parity'],
			['age,induced,parity', 'age_induced_parity']
		] as const) {
			const r = e.rows.find((x) => x.adjustedFor.join() === set)!;
			const want = ref.infert.logistic[key];
			expect(r.n).toBe(ref.infert.n);
			expectClose(r.estimate, want.or, 1e-6);
			// Standard errors: R's summary.glm uses the weights of the last IRLS step, we use those
			// at the final estimates; they differ by about the convergence tolerance (≤ 1e-5 here).
			expectClose(r.ci[0], want.ci[0], 2e-5);
			expectClose(r.ci[1], want.ci[1], 2e-5);
			expectClose(r.pValue, want.p, 2e-3); // a p of 1e-10 moves by ~1e-3 of itself with those standard errors
		}
	});

	it('the planned set {age, parity} gets an E-value (common outcome: square-root conversion)', () => {
		const e = report.estimates!;
		const planned = e.rows.find((r) => r.roles.includes('planned'))!;
		expect(planned.adjustedFor).toEqual(['age', 'parity']);
		expect(e.eValue).not.toBeNull();
		// RR ≈ √OR for a common outcome (83 of 248 cases), E = RR + √(RR(RR − 1)) (VanderWeele & Ding 2017).
		const rr = Math.sqrt(planned.estimate);
		expectClose(e.eValue!.point, rr + Math.sqrt(rr * (rr - 1)), 1e-12);
		expect(e.eValue!.notes.join(' ')).toMatch(/square root/);
	});

	it('the text column education is left unused; the arrow checks name the test used', () => {
		expect(report.mapping.unusedColumns).toEqual(['education']);
		const ac = report.arrows.checks.find((c) => c.from === 'spontaneous' && c.to === 'case')!;
		expect(ac.main!.test).toMatch(/Point-biserial/);
	});
});
