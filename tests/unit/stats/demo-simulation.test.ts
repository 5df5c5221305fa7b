// The demo data simulator (scripts/simulate-demo.ts): the estimator recovers the known
// effect, the collider moves the estimate away, and the committed demo files are the
// simulator's output. Reference fits on the committed CSV are R's glm
// (tests/fixtures/stats/make-demo-fixture.R → demo-glm.json).
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { CSV_COLUMNS, demoCsv, demoTruth, simulateDemo, structuralTotalEffect, type DemoData } from '../../../scripts/simulate-demo';
import { codedColumn, continuousColumn, estimateExposureEffect, parseTable, type Column, type Table } from '../../../src/lib/stats';
import { expectClose, fixture } from './fixtures';

const SEED = 7;
const ROWS = 50_000;

function columnsOf(d: DemoData): (name: keyof DemoData) => Column {
	return (name) => (['cycling', 'hypertension', 'app_panel', 'family_history', 'antihypertensive'].includes(name) ? codedColumn(name, d[name]) : continuousColumn(name, d[name]));
}

function logOr(outcome: Column, exposure: Column, adjust: Column[]) {
	const r = estimateExposureEffect(outcome, exposure, adjust);
	const c = r.fits.adjusted.coefficients.find((x) => x.name === 'cycling');
	if (!c) throw new Error('no cycling coefficient');
	return c;
}

describe('simulated demo study', () => {
	const data = simulateDemo(ROWS, SEED);
	const col = columnsOf(data);
	const truth = demoTruth(200_000, SEED + 1);
	const confounders = [col('age'), col('income'), col('diet')];

	it('the structural total effect is the path-tracing sum of the simulated coefficients', () => {
		// −0.04·6 (via fitness) + 0.1·(−0.8 − 0.15·6) (via BMI) = −0.41.
		expectClose(structuralTotalEffect(), -0.41, 1e-12);
		// Non-collapsibility: the conditional effect lies between the structural one and 0.
		expect(truth.conditionalLogOddsGivenAgeIncomeDiet).toBeLessThan(0);
		expect(truth.conditionalLogOddsGivenAgeIncomeDiet).toBeGreaterThan(structuralTotalEffect());
	});

	it('adjusting for {age, income, diet} recovers the direction and its 95 % CI covers the true conditional log-OR (50,000 rows, seed 7)', () => {
		const adjusted = logOr(col('hypertension'), col('cycling'), confounders);
		expect(Math.sign(adjusted.estimate)).toBe(Math.sign(structuralTotalEffect()));
		expect(adjusted.ci[0]).toBeLessThan(truth.conditionalLogOddsGivenAgeIncomeDiet);
		expect(adjusted.ci[1]).toBeGreaterThan(truth.conditionalLogOddsGivenAgeIncomeDiet);
	});

	it('adding the collider app_panel moves the estimate away (outside the adjusted 95 % CI); the crude estimate is confounded', () => {
		const adjusted = logOr(col('hypertension'), col('cycling'), confounders);
		const collider = logOr(col('hypertension'), col('cycling'), [...confounders, col('app_panel')]);
		const t = truth.conditionalLogOddsGivenAgeIncomeDiet;
		expect(Math.abs(collider.estimate - t)).toBeGreaterThan(4 * adjusted.se + Math.abs(adjusted.estimate - t));
		expect(collider.ci[1]).toBeLessThan(t);
		const crude = logOr(col('hypertension'), col('cycling'), []);
		expect(Math.abs(crude.estimate - t)).toBeGreaterThan(4 * adjusted.se);
	});

	it('the truth is stable across the draws used to compute it (Monte Carlo error < 1e-3 on the log-OR)', () => {
		const other = demoTruth(100_000, SEED + 2);
		expect(Math.abs(other.conditionalLogOddsGivenAgeIncomeDiet - truth.conditionalLogOddsGivenAgeIncomeDiet)).toBeLessThan(1e-3);
	});
});

describe('committed demo files', () => {
	const path = (f: string) => fileURLToPath(new URL(`../../../static/demo/${f}`, import.meta.url));
	const csv = readFileSync(path('cycling-hypertension.csv'), 'utf8');
	const sidecar = JSON.parse(readFileSync(path('cycling-hypertension.truth.json'), 'utf8'));
	const seed = Number(/seed (\d+)/.exec(sidecar.generator)?.[1]);
	const demoGlm = fixture('demo-glm.json');

	it('the CSV is exactly the simulator output for the seed stated in the sidecar, without the unmeasured variable', () => {
		expect(demoCsv(simulateDemo(5000, seed))).toBe(csv);
		expect(csv.split('\n')[0]).toBe(CSV_COLUMNS.join(','));
		expect(csv).not.toContain('health_consciousness');
		expect(sidecar.unmeasured).toEqual(['health_consciousness']);
		expectClose(sidecar.truth.structuralTotalEffectLogOdds, structuralTotalEffect(), 1e-12);
	});

	it('reads with parseTable and the crude, adjusted, collider and mediator fits agree with R glm (log-OR 1e-7, SE at the estimates 1e-7, summary.glm SE and Wald CI 1e-4 relative)', () => {
		const r = parseTable(csv);
		if (!r.ok) throw new Error(r.error.message);
		const t: Table = r.table;
		expect(t.rowCount).toBe(demoGlm.rows);
		expect(t.columns.map((c) => c.name)).toEqual(demoGlm.columns);
		const get = (n: string) => t.columns.find((c) => c.name === n) as Column;
		expect(['cycling', 'hypertension', 'app_panel', 'family_history', 'antihypertensive'].map((n) => get(n).kind)).toEqual(Array(5).fill('binary'));
		const y = get('hypertension');
		const x = get('cycling');
		const base = ['age', 'income', 'diet'].map(get);
		for (const [adjust, ref] of [
			[[], demoGlm.crude],
			[base, demoGlm.adjusted_age_income_diet],
			[[...base, get('app_panel')], demoGlm.adjusted_plus_app_panel],
			[[...base, get('fitness'), get('bmi')], demoGlm.adjusted_plus_mediators]
		] as const) {
			const c = logOr(y, x, [...adjust]);
			expectClose(c.estimate, ref.log_or, 1e-7);
			expectClose(c.se, ref.se_at_estimates, 1e-7);
			expectClose(c.se, ref.se, 1e-4);
			expectClose(c.ci[0], ref.ci_low, 1e-4);
			expectClose(c.ci[1], ref.ci_high, 1e-4);
		}
	});
});
