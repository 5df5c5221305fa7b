/**
 * `causeway review` (advice, robustness), `compare` and `plan instruments`: JSON shape,
 * plain-text wording, exit codes (review 1 when the stated set is not sufficient; 2 with one line on stderr for bad
 * usage or input), run in-process through main() with injected files.
 */
import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { runCli as run, diagramJson as diagram, MBIAS } from './harness';

const DEMO = 'static/demo/cycling-hypertension.causeway.json';




describe('causeway review', () => {
	it('M-bias, adjusting the collider: exit 1, every reason and the fixes in JSON', async () => {
		const r = await run(['review', 'm.json', '--adjust', 'm', '--json'], { 'm.json': MBIAS });
		expect(r.code).toBe(1);
		expect(r.err).toBe('');
		const j = JSON.parse(r.out);
		expect(j.valid).toBe(false);
		expect(j.reasons).toEqual([
			{ kind: 'open-path', path: ['e', 'u1', 'm', 'u2', 'd'], backDoor: true },
			{ kind: 'collider-bias', variable: 'm', collider: 'm', path: ['e', 'u1', 'm', 'u2', 'd'] }
		]);
		expect(j.nearest).toEqual({ set: [], add: [], drop: ['m'], scanned: 1, truncated: false });
		expect(j.extension).toHaveLength(1);
		// O = pa(cn) \ forb = {u2}, the outcome's other parent (Henckel et al. 2022).
		expect(j.efficiency).toMatchObject({ optimal: ['u2'], plannedIsOptimal: false });
	});

	it('a sufficient set: exit 0, plain words', async () => {
		const r = await run(['review', DEMO, '--adjust', 'age,diet,income']);
		expect(r.code).toBe(0);
		expect(r.out).toContain('Adjusting for age, diet and income is sufficient to estimate the total effect of cycling on hypertension');
		expect(r.out).toContain('Precision variable: adding family_history');
		expect(r.out).toContain('Efficiency-optimal set (Henckel et al. 2022): {age, diet, family_history, income}.');
	});

	it('overadjustment and a consequence of the outcome in words', async () => {
		const r = await run(['review', DEMO, '--adjust', 'age,diet,income,bmi,antihypertensive']);
		expect(r.code).toBe(1);
		expect(r.out).toContain('Overadjustment: bmi is a mediator');
		expect(r.out).toContain('antihypertensive is caused by the outcome');
		expect(r.out).toContain('Nearest minimal sufficient set: {age, diet, income} (drop antihypertensive and bmi).');
	});

	it('an unknown variable: exit 2, one line naming it', async () => {
		const r = await run(['review', DEMO, '--adjust', 'nope']);
		expect(r.code).toBe(2);
		expect(r.out).toBe('');
		expect(r.err.trim().split('\n')).toHaveLength(1);
		expect(r.err).toContain('"nope"');
	});
});

describe('causeway review robustness', () => {
	it('ranks the single changes that break the plan; JSON lists them all with witnesses', async () => {
		const r = await run(['review', 'robustness', 'm.json', '--adjust', '', '--json'], { 'm.json': MBIAS });
		expect(r.code).toBe(0);
		const j = JSON.parse(r.out);
		expect(j.applicable).toBe(true);
		// Reversing e → d leaves the one-arrow path e ← d; then the two-arrow back-door paths.
		expect(j.weaknesses[0]).toEqual({ change: { kind: 'reverse-arrow', from: 'e', to: 'd' }, failure: 'open-path', length: 1, witness: ['e', 'd'] });
		expect(j.weaknesses[1]).toEqual({ change: { kind: 'add-arrow', from: 'u1', to: 'd' }, failure: 'open-path', length: 2, witness: ['e', 'u1', 'd'] });
		expect(j.tried.deletions).toBe(5);
		expect(j.robustSets).toMatchObject({ exhaustive: true });
	});

	it('plain text says what the plan depends on; exit 1 when the set is not sufficient to begin with', async () => {
		const ok = await run(['review', 'robustness', DEMO, '--max', '3']);
		expect(ok.code).toBe(0);
		expect(ok.out).toContain('The plan depends on there being no arrow from cycling to diet');
		expect(ok.out).toMatch(/… \d+ more/);
		const bad = await run(['review', 'robustness', DEMO, '--adjust', 'bmi']);
		expect(bad.code).toBe(1);
		expect(bad.out).toContain('not sufficient to begin with');
	});
});

describe('causeway compare', () => {
	it('renames by label, added arrow, verdict change', async () => {
		const a = diagram([['c', 'x'], ['x', 'y'], ['s', 'x']], { exposures: ['x'], outcomes: ['y'], adjusted: ['c'] }, { s: 'Social class' });
		const b = diagram([['c', 'x'], ['x', 'y'], ['c', 'y'], ['klass', 'x'], ['klass', 'y']], { exposures: ['x'], outcomes: ['y'] }, { klass: 'social_class' });
		const r = await run(['compare', 'a.json', 'b.json', '--json'], { 'a.json': a, 'b.json': b });
		expect(r.code).toBe(0);
		const j = JSON.parse(r.out);
		expect(j.renamed).toEqual([{ first: 's', second: 'klass', how: 'label', firstLabel: 'Social class', secondLabel: 'social_class' }]);
		expect(j.arrowsAdded).toEqual([
			{ from: 'c', to: 'y' },
			{ from: 's', to: 'y' }
		]);
		expect(j.verdicts).toEqual({ planned: ['c'], first: true, second: false, notJudged: null });
		const text = await run(['compare', 'a.json', 'b.json'], { 'a.json': a, 'b.json': b });
		expect(text.out).toContain('Renamed: s → klass (matched by label)');
		expect(text.out).toContain('sufficient under the first, NOT sufficient under the second');
	});

	it('needs exactly two files', async () => {
		const r = await run(['compare', DEMO]);
		expect(r.code).toBe(2);
		expect(r.err).toContain('compare needs two diagram files');
	});
});

describe('causeway plan instruments', () => {
	it('lists the demo study’s instrument-like variables as instruments', async () => {
		const r = await run(['plan', 'instruments', DEMO, '--json']);
		expect(r.code).toBe(0);
		expect(JSON.parse(r.out)).toEqual({
			instruments: [
				{ variable: 'bikeability', given: [] },
				{ variable: 'distance', given: [] }
			]
		});
	});

	it('two exposures: exit 2 with one line', async () => {
		const r = await run(['plan', 'instruments', DEMO, '--exposure', 'cycling,age']);
		expect(r.code).toBe(2);
		expect(r.err).toContain('exactly one exposure and one outcome');
	});
});

describe('the bundled command', () => {
	it('runs review from dist-cli with exit 1 and no stack trace', () => {
		const r = spawnSync(process.execPath, ['bin/causeway.js', 'review', DEMO, '--adjust', 'app_panel'], { encoding: 'utf8' });
		expect(r.status).toBe(1);
		expect(r.stdout).toContain('Collider bias');
		expect(r.stderr).toBe('');
	});
});
