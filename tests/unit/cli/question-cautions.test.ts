// An exposure or outcome marked unmeasured: the graphical answer stands, and every view that
// gives it says that no estimate can be made without the variable (hostile input: "sufficient"
// with no word about it).
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { runCli } from './harness';

const demo = JSON.parse(readFileSync('static/demo/cycling-hypertension.causeway.json', 'utf8')) as { variables: { id: string; measured: boolean }[] };
const unmeasuredExposure = JSON.stringify({ ...demo, variables: demo.variables.map((v) => (v.id === 'cycling' ? { ...v, measured: false } : v)) });
const NOTE = 'Note: cycling (the exposure) is marked unmeasured: the adjustment sets hold for the diagram, but the effect cannot be estimated from data without it.';

describe('a question whose exposure is marked unmeasured', () => {
	for (const view of [['plan', 'sets'], ['review', 'verdict'], ['review', 'advice']])
		it(`${view.join(' ')} says so beside its answer`, async () => {
			const r = await runCli([...view, 'd.json'], { 'd.json': unmeasuredExposure });
			expect(r.out.split('\n')).toContain(NOTE);
			const measured = await runCli([...view, 'd.json'], { 'd.json': JSON.stringify(demo) });
			expect(measured.out).not.toContain('marked unmeasured');
		});
});
