// Round trip through the seeded demo simulator (scripts/simulate-demo.ts): on a large
// simulated sample, the pipeline's estimate for the planned set {age, income, diet} covers
// the simulated effect (the conditional odds ratio in the committed truth file), and
// adjusting also for the collider app_panel does not; no claim of the true diagram is
// contradicted, while a diagram missing a true arrow is contradicted by the data.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { demoCsv, simulateDemo } from '../../../scripts/simulate-demo';
import { runDataChecks } from '../../../src/lib/datacheck';
import { demoDir, readDiagram, tableOf } from './helpers';

const truth = JSON.parse(readFileSync(`${demoDir}cycling-hypertension.truth.json`, 'utf8')).truth;
const diagram = readDiagram(`${demoDir}cycling-hypertension.causeway.json`);
const table = tableOf(demoCsv(simulateDemo(40_000, 11)));

describe('simulated demo study, 40,000 rows, seed 11', () => {
	it('the planned set recovers the simulated conditional odds ratio within its 95 % CI', () => {
		const r = runDataChecks(diagram, table, { parts: { arrows: false, claims: false }, planned: ['age', 'income', 'diet'] });
		const planned = r.estimates!.rows.find((x) => x.roles.includes('planned'))!;
		expect(planned.sufficient).toBe(true);
		expect(planned.ci[0]).toBeLessThan(truth.conditionalOddsRatioGivenAgeIncomeDiet);
		expect(planned.ci[1]).toBeGreaterThan(truth.conditionalOddsRatioGivenAgeIncomeDiet);
		// The crude estimate is confounded: its CI misses the truth.
		const crude = r.estimates!.rows.find((x) => x.roles.includes('crude'))!;
		expect(crude.ci[1] < truth.conditionalOddsRatioGivenAgeIncomeDiet || crude.ci[0] > truth.conditionalOddsRatioGivenAgeIncomeDiet).toBe(true);
	});

	it('adjusting also for the collider app_panel misses it, and the diagram says the set is not sufficient', () => {
		const r = runDataChecks(diagram, table, { parts: { arrows: false, claims: false }, planned: ['age', 'income', 'diet', 'app_panel'] });
		const planned = r.estimates!.rows.find((x) => x.roles.includes('planned'))!;
		expect(planned.sufficient).toBe(false);
		expect(planned.ci[1]).toBeLessThan(truth.conditionalOddsRatioGivenAgeIncomeDiet);
	});

	it('the true diagram: every arrow is found in the data or reported weak/absent, no claim is contradicted', () => {
		const r = runDataChecks(diagram, table, { parts: { estimates: false } });
		expect(r.claims.contradicted).toBe(0);
		expect(r.claims.tested).toBeGreaterThan(40);
		expect(r.arrows.checks.find((c) => c.from === 'cycling' && c.to === 'fitness')!.support).toBe('supported');
	});

	it('a diagram without the true arrow age → hypertension is contradicted, with that arrow suggested', () => {
		const wrong = { ...diagram, arrows: diagram.arrows.filter((a) => !(a.from === 'age' && a.to === 'hypertension')) };
		const r = runDataChecks(wrong, table, { parts: { arrows: false, estimates: false } });
		const c = r.claims.checks.find((x) => [x.a, x.b].sort().join() === 'age,hypertension')!;
		expect(c.status).toBe('contradicted');
		expect(r.claims.checks[0].status).toBe('contradicted');
		expect(c.suggestedArrows).toContainEqual({ from: 'age', to: 'hypertension' });
	});
});
