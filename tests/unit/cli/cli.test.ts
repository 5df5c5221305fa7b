import { describe, expect, it } from 'vitest';
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli as run, diagramJson as diagram, MBIAS } from './harness';
import { diagramOf, FRONT_DOOR, renamed } from '../reference/published-diagrams';

const DEMO = 'static/demo/cycling-hypertension.causeway.json';




describe('causeway plan sets', () => {
	it('prints the demo study sets as the JSON contract says', async () => {
		const r = await run(['plan', 'sets', DEMO, '--json']);
		expect(r.code).toBe(0);
		expect(r.err).toBe('');
		const j = JSON.parse(r.out);
		expect(Object.keys(j)).toEqual(['exposures', 'outcomes', 'effect', 'identifiable', 'sets', 'truncated', 'max', 'optimal', 'minimum']);
		expect(j.sets).toEqual([['age', 'diet', 'income']]);
		expect(j.identifiable).toBe(true);
		expect(j.effect).toBe('total');
		expect(r.out.trim().split('\n')).toHaveLength(1);
	});

	it('orders sets by size, then lexicographically, and honours --max with a truncated flag', async () => {
		// Two parallel back-door paths, each blockable at two places: 4 minimal sets of size 2.
		const d = diagram(
			[
				['a1', 'a2'],
				['a2', 'x'],
				['a1', 'y'],
				['b1', 'b2'],
				['b2', 'x'],
				['b1', 'y'],
				['x', 'y']
			],
			{ exposures: ['x'], outcomes: ['y'] }
		);
		const all = JSON.parse((await run(['plan', 'sets', 'd.json', '--json'], { 'd.json': d })).out);
		expect(all.sets).toEqual([
			['a1', 'b1'],
			['a1', 'b2'],
			['a2', 'b1'],
			['a2', 'b2']
		]);
		expect(all.truncated).toBe(false);
		const capped = JSON.parse((await run(['plan', 'sets', 'd.json', '--json', '--max', '2'], { 'd.json': d })).out);
		expect(capped.sets).toHaveLength(2);
		expect(capped.truncated).toBe(true);
	});

	it('overrides the question from the command line and reports non-identifiable questions', async () => {
		// Front door (reference/published-diagrams.ts) in lower case: x → m → y with x ← u → y and u unmeasured; no question in the file.
		const frontDoor = diagramOf(renamed(FRONT_DOOR, { U: 'u', X: 'x', M: 'm', Y: 'y' }), { title: 'front door' });
		const fd = JSON.stringify({ format: 'causeway.diagram', version: 1, ...frontDoor, exposures: [], outcomes: [] });
		const r = await run(['plan', 'sets', 'fd.json', '--exposure', 'x', '--outcome', 'y', '--json'], { 'fd.json': fd });
		expect(JSON.parse(r.out)).toMatchObject({ identifiable: false, sets: [], optimal: null, exposures: ['x'], outcomes: ['y'] });
		const text = await run(['plan', 'sets', 'fd.json', '--exposure', 'x', '--outcome', 'y'], { 'fd.json': fd });
		expect(text.out).toMatch(/cannot be identified by adjustment/);
	});

	it('lists direct-effect sets', async () => {
		const r = await run(['plan', 'sets', DEMO, '--effect', 'direct', '--json']);
		expect(r.code).toBe(0);
		expect(JSON.parse(r.out).effect).toBe('direct');
	});
});

describe('causeway review verdict', () => {
	it('exits 0 for a sufficient set and 1 with every reason for an insufficient one', async () => {
		const ok = await run(['review', 'verdict', 'm.json', '--adjust', '', '--json'], { 'm.json': MBIAS });
		expect(ok.code).toBe(0);
		expect(JSON.parse(ok.out)).toEqual({ adjusted: [], valid: true, problems: [] });
		const bad = await run(['review', 'verdict', 'm.json', '--adjust', 'm', '--json'], { 'm.json': MBIAS });
		expect(bad.code).toBe(1);
		expect(JSON.parse(bad.out)).toEqual({ adjusted: ['m'], valid: false, problems: [{ kind: 'open-path', path: ['e', 'u1', 'm', 'u2', 'd'] }] });
		const text = await run(['review', 'verdict', 'm.json', '--adjust', 'm'], { 'm.json': MBIAS });
		// A non-causal path that starts with an arrow into the exposure is named a back-door path, as in the app.
		expect(text.out).toContain('open back-door path: e ← u1 → m ← u2 → d');
	});

	it('names a mediator as forbidden (overadjustment, Schisterman et al. 2009)', async () => {
		const r = await run(['review', 'verdict', DEMO, '--adjust', 'age,income,diet,bmi', '--json']);
		expect(r.code).toBe(1);
		expect(JSON.parse(r.out).problems).toContainEqual({ kind: 'forbidden', variable: 'bmi', why: 'mediator' });
	});
});

describe('causeway diagram separation and claims, plan paths and roles', () => {
	it('gives an open path as witness', async () => {
		const r = await run(['diagram', 'separation', 'm.json', '--from', 'u1', '--to', 'u2', '--given', 'm', '--json'], { 'm.json': MBIAS });
		expect(JSON.parse(r.out)).toEqual({ separated: false, path: ['u1', 'm', 'u2'] });
		const s = await run(['diagram', 'separation', 'm.json', '--from', 'u1', '--to', 'u2', '--json'], { 'm.json': MBIAS });
		expect(JSON.parse(s.out)).toEqual({ separated: true, path: null });
	});

	it('lists paths with status and reasons', async () => {
		const r = await run(['plan', 'paths', 'm.json', '--adjust', 'm', '--json'], { 'm.json': MBIAS });
		const j = JSON.parse(r.out);
		expect(j.paths).toEqual([
			{ nodes: ['e', 'd'], causal: true, open: true, reasons: [] },
			{ nodes: ['e', 'u1', 'm', 'u2', 'd'], causal: false, open: true, reasons: [{ node: 'm', reason: 'collider-adjusted' }] }
		]);
		expect(j.truncated).toBe(false);
	});

	it('lists claims and roles', async () => {
		const c = JSON.parse((await run(['diagram', 'claims', 'm.json', '--json'], { 'm.json': MBIAS })).out);
		expect(c.claims).toContainEqual({ a: 'u1', b: 'u2', given: [] });
		const roles = JSON.parse((await run(['plan', 'roles', 'm.json', '--json'], { 'm.json': MBIAS })).out).roles;
		expect(roles).toContainEqual({ id: 'm', roles: ['collider'] });
		// u1 causes the outcome only through the exposure; u2 causes the outcome only (M-bias,
		// Greenland, Pearl & Robins 1999): neither is a common cause, so neither is a confounder.
		expect(roles).toContainEqual({ id: 'u1', roles: ['instrument-like'] });
		expect(roles).toContainEqual({ id: 'u2', roles: ['precision'] });
	});
});

describe('bad usage and bad input: one line on stderr, exit 2, no stack trace', () => {
	const cases: [string, string[], Record<string, string>][] = [
		['no command', [], {}],
		['unknown command', ['frobnicate', DEMO], {}],
		['unknown option', ['plan', 'sets', DEMO, '--bogus'], {}],
		['missing file', ['plan', 'sets', 'nope.json'], {}],
		['unknown exposure', ['plan', 'sets', DEMO, '--exposure', 'nosuch'], {}],
		['exposure equals outcome', ['plan', 'sets', DEMO, '--exposure', 'age', '--outcome', 'age'], {}],
		['bad --max', ['plan', 'sets', DEMO, '--max', 'many'], {}],
		['bad --effect', ['plan', 'sets', DEMO, '--effect', 'partial'], {}],
		['malformed JSON', ['plan', 'sets', 'bad.json'], { 'bad.json': '{"format": "causeway.diagram", ' }],
		['cyclic diagram', ['plan', 'cyc.json'], { 'cyc.json': diagram([['a', 'b'], ['b', 'c'], ['c', 'a']], { exposures: ['a'], outcomes: ['c'] }) }],
		['separation without --from', ['diagram', 'separation', DEMO, '--to', 'age'], {}],
		['two files', ['plan', 'roles', DEMO, DEMO], {}],
		['export without a format', ['export', DEMO], {}]
	];
	for (const [what, args, files] of cases) {
		it(what, async () => {
			const r = await run(args, files);
			expect(r.code).toBe(2);
			expect(r.err.trim().split('\n')).toHaveLength(1);
			expect(r.err).toMatch(/^causeway: /);
			expect(r.err).not.toMatch(/\n\s+at /);
		});
	}

	it('names the cycle', async () => {
		const r = await run(['plan', 'sets', 'cyc.json'], { 'cyc.json': diagram([['a', 'b'], ['b', 'c'], ['c', 'a']], { exposures: ['a'], outcomes: ['c'] }) });
		expect(r.err).toMatch(/cycle/i);
		expect(r.err).toMatch(/a → b → c → a|b → c → a → b|c → a → b → c/);
	});
});

describe('export to JSON and DOT, and the installed command', () => {
	it('converts JSON to DOT and back without loss', async () => {
		const toDot = await run(['export', DEMO, '-o', 'demo.dot']);
		expect(toDot.code).toBe(0);
		const back = await run(['export', 'demo.dot', '-o', 'demo.json'], { 'demo.dot': toDot.written['demo.dot'] });
		expect(back.code).toBe(0);
		const original = JSON.parse(readFileSync(DEMO, 'utf8'));
		const again = JSON.parse(back.written['demo.json']);
		expect(again.variables).toEqual(original.variables);
		expect(again.arrows).toEqual(original.arrows);
		expect(again.exposures).toEqual(original.exposures);
	});

	it('runs as `npx causeway` from the bundled command with the documented exit codes', () => {
		const dir = mkdtempSync(join(tmpdir(), 'causeway-cli-'));
		const file = join(dir, 'm.json');
		writeFileSync(file, MBIAS);
		const out = execFileSync('node', ['bin/causeway.js', 'plan', 'sets', file, '--json'], { encoding: 'utf8' });
		expect(JSON.parse(out).sets).toEqual([[]]);
		const bad = spawnSync('node', ['bin/causeway.js', 'review', 'verdict', file, '--adjust', 'm'], { encoding: 'utf8' });
		expect(bad.status).toBe(1);
		const broken = spawnSync('node', ['bin/causeway.js', 'plan', 'sets', join(dir, 'missing.json')], { encoding: 'utf8' });
		expect(broken.status).toBe(2);
		expect(broken.stderr.trim().split('\n')).toHaveLength(1);
	});
});

describe('the bundled command in a pipeline', () => {
	it('says in one line, exit 2, when the reader closes the pipe early (`causeway diagram claims big.json | head -1`)', () => {
		const dir = mkdtempSync(join(tmpdir(), 'causeway-pipe-'));
		const file = join(dir, 'chain.json');
		// A 400-variable chain implies 79,401 claims: far more output than one pipe buffer.
		const ids = Array.from({ length: 400 }, (_, i) => `v${i}`);
		writeFileSync(
			file,
			JSON.stringify({
				format: 'causeway.diagram',
				version: 1,
				variables: ids.map((id) => ({ id })),
				arrows: ids.slice(1).map((id, i) => ({ from: ids[i], to: id }))
			})
		);
		const run = spawnSync('bash', ['-c', `node bin/causeway.js diagram claims "${file}" | head -1; echo "status \${PIPESTATUS[0]}" >&2`], { encoding: 'utf8' });
		expect(run.stdout).toMatch(/^v0 ⟂ v2 \| v1\n$/);
		// Output that did not reach its reader is a failure a pipeline must be able to see.
		expect(run.stderr).toBe('causeway: cannot write the output: the reader closed the pipe (EPIPE)\nstatus 2\n');
	});
});
