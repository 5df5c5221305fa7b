/**
 * The command tree (src/cli/jobs.ts): jobs, their views and default views, the help at each
 * level, and the verbs of version 0.1 kept as hidden aliases for one version — each still
 * works with the same standard output and exit status, and says its new spelling in one line
 * on stderr (never beside a failure, which stays the only line).
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { EXPORT_FORMATS } from '../../../src/lib/export/formats';
import { FORMAT_LIST } from '../../../src/cli/commands/export/export';
import { JOBS, RENAMED } from '../../../src/cli/jobs';
import { MBIAS, runCli as run } from './harness';

const DEMO = 'static/demo/cycling-hypertension.causeway.json';
const CSV = 'static/demo/cycling-hypertension.csv';
const files = { 'm.json': MBIAS };

/** Each old verb with arguments, and the new spelling it stands for. */
const OLD: [string, string[], string[]][] = [
	['sets', ['m.json', '--json'], ['plan', 'sets']],
	['roles', ['m.json', '--json'], ['plan', 'roles']],
	['paths', ['m.json', '--adjust', 'm'], ['plan', 'paths']],
	['instruments', [DEMO, '--json'], ['plan', 'instruments']],
	['check', ['m.json', '--adjust', 'm', '--json'], ['review', 'verdict']],
	['robust', ['m.json', '--adjust', '', '--json'], ['review', 'robustness']],
	['diff', [DEMO, DEMO, '--json'], ['compare']],
	['claims', ['m.json', '--json'], ['diagram', 'claims']],
	['dsep', ['m.json', '--from', 'u1', '--to', 'u2', '--given', 'm', '--json'], ['diagram', 'separation']],
	['test', [DEMO, CSV, '--max', '3', '--json'], ['data', 'tests']],
	['estimate', [DEMO, CSV, '--json'], ['data', 'estimates']],
	['code', [DEMO, CSV, '--language', 'r'], ['data', 'code']],
	['convert', [DEMO, '--to', 'dot', '-o', '-'], ['export']]
];

describe('old verbs: hidden aliases for one version', () => {
	it('the table covers every renamed verb', () => {
		expect(OLD.map(([old]) => old).sort()).toEqual(Object.keys(RENAMED).sort());
	});

	for (const [old, args, now] of OLD) {
		it(`${old} → ${now.join(' ')}: same output and status, and one line saying the new spelling`, async () => {
			const before = await run([old, ...args], files);
			const after = await run([...now, ...args], files);
			expect(after.err).toBe('');
			expect(before.out).toBe(after.out);
			expect(before.code).toBe(after.code);
			expect(before.out.length).toBeGreaterThan(0);
			expect(before.err).toBe(`causeway: note: "causeway ${old}" is now "causeway ${now.join(' ')}"; the old name goes in the next version\n`);
		});
	}

	it('convert -o - still writes native JSON (export asks for a format otherwise)', async () => {
		const old = await run(['convert', DEMO, '-o', '-']);
		expect(old.code).toBe(0);
		expect(old.out).toBe((await run(['export', DEMO, '--format', 'json'])).out);
		expect(JSON.parse(old.out).format).toBe('causeway.diagram');
		const toFile = await run(['convert', DEMO, '-o', 'demo.gv']);
		expect(toFile.written['demo.gv']).toMatch(/^\/\/ Causeway diagram[^\n]*\ndigraph \{/);
	});

	it('check keeps exit 1 for a negative verdict; a failure stays one line, without the notice', async () => {
		const bad = await run(['check', 'm.json', '--adjust', 'm'], files);
		expect(bad.code).toBe(1);
		expect(bad.err).toMatch(/^causeway: note: "causeway check" is now "causeway review verdict"/);
		const broken = await run(['sets', 'missing.json']);
		expect(broken.code).toBe(2);
		expect(broken.err).toBe('causeway: cannot read "missing.json": no such file\n');
	});

	it('are not in the help', async () => {
		const help = (await run(['--help'])).out;
		const jobs = help.slice(help.indexOf('Jobs:'), help.indexOf('Options of every view'));
		for (const old of Object.keys(RENAMED)) expect(jobs).not.toMatch(new RegExp(`^  ${old}\\b`, 'm'));
	});
});

describe('jobs and views', () => {
	it('the top-level help lists every job with its views', async () => {
		const r = await run(['--help']);
		expect(r.code).toBe(0);
		for (const job of JOBS) {
			expect(r.out).toMatch(new RegExp(`^  ${job.name} +${job.summary.replace(/[()]/g, '\\$&')}$`, 'm'));
			if (job.views.length > 1) expect(r.out).toContain(`views: ${job.views[0].name} (default), ${job.views.slice(1).map((v) => v.name).join(', ')}`);
		}
		expect(r.out).toContain('Exit status: 0 done, 1 negative verdict (review), 2 bad usage or bad input.');
	});

	it("each job's help lists its views, then the default view's options", async () => {
		for (const job of JOBS.filter((j) => j.views.length > 1)) {
			const r = await run([job.name, '--help']);
			expect(r.code).toBe(0);
			for (const v of job.views) expect(r.out).toContain(`  ${v.name}`);
			expect(r.out).toContain(`Run "causeway ${job.name} VIEW --help" for a view's options.`);
			expect(r.out).toContain((await run([job.name, job.views[0].name, '--help'])).out.trim());
		}
		const single = await run(['compare', '--help']);
		expect(single.out).toMatch(/^Usage: causeway compare FIRST SECOND/);
		expect((await run(['help', 'plan', 'roles'])).out).toBe((await run(['plan', 'roles', '--help'])).out);
		expect((await run(['help'])).out).toBe((await run(['--help'])).out);
	});

	it('a job without a view word runs its default view', async () => {
		for (const job of JOBS.filter((j) => j.views.length > 1 && j.name !== 'data')) {
			const args = job.name === 'review' ? ['m.json', '--adjust', 'm', '--json'] : ['m.json', '--json'];
			const plain = await run([job.name, ...args], files);
			const named = await run([job.name, job.views[0].name, ...args], files);
			expect(plain).toEqual(named);
		}
		const data = await run(['data', DEMO, CSV, '--max', '2', '--json']);
		expect(data).toEqual(await run(['data', 'tests', DEMO, CSV, '--max', '2', '--json']));
	});

	it('every review view exits 1 when the set is not sufficient, 0 when it is', async () => {
		for (const view of ['advice', 'verdict', 'robustness']) {
			expect((await run(['review', view, 'm.json', '--adjust', 'm'], files)).code).toBe(1);
			expect((await run(['review', view, 'm.json', '--adjust', ''], files)).code).toBe(0);
		}
	});

	it('an unknown job or view: one line naming the choices, exit 2', async () => {
		const view = await run(['plan', 'sest', DEMO]);
		expect(view.code).toBe(2);
		expect(view.err).toBe('causeway: unknown view "sest" of plan; its views: sets, roles, paths, instruments (a file with that name: write ./sest)\n');
		const job = await run(['frobnicate', DEMO]);
		expect(job.err).toBe('causeway: unknown job "frobnicate"; run "causeway --help" for the list\n');
		expect((await run([])).code).toBe(2);
	});

	it('export lists every format the library writes', () => {
		expect([...FORMAT_LIST].sort()).toEqual(Object.keys(EXPORT_FORMATS).sort());
	});
});

describe('the words the command composes', () => {
	it('counts agree with their nouns and are never in e-notation', async () => {
		// Two back-door paths, each blockable at two places: 4 minimal sets.
		const d = JSON.stringify({
			format: 'causeway.diagram',
			version: 2,
			variables: ['a1', 'a2', 'b1', 'b2', 'x', 'y'].map((id) => ({ id })),
			arrows: [['a1', 'a2'], ['a2', 'x'], ['a1', 'y'], ['b1', 'b2'], ['b2', 'x'], ['b1', 'y'], ['x', 'y']].map(([from, to]) => ({ from, to })),
			exposures: ['x'],
			outcomes: ['y']
		});
		const one = await run(['plan', 'sets', 'd.json', '--max', '1'], { 'd.json': d });
		expect(one.out).toContain('… stopped after 1 set (the cap, --max 1); more exist');
		const paths = await run(['plan', 'paths', 'd.json', '--max', '1'], { 'd.json': d });
		expect(paths.out).toContain('… stopped after 1 path (--max); more exist');
		const claims = await run(['diagram', 'claims', 'd.json'], { 'd.json': d });
		expect(claims.out).not.toMatch(/\de[+-]\d/);
		const stress = await run(['review', 'robustness', 'm.json', '--adjust', 'u1'], files);
		expect(stress.out).toMatch(/tried \d+ added arrows, 5 reversals and 1 unmeasured variable \(5 deletions cannot break it\)/);
	});

	it('paths name a back-door path only when it starts with an arrow into the exposure', async () => {
		const r = await run(['plan', 'paths', 'm.json', '--adjust', 'm'], files);
		expect(r.out).toContain('e ← u1 → m ← u2 → d   [back-door path, open through m (a collider, adjusted for)]');
		expect(r.out).toContain('e → d   [causal path, open]');
		expect(r.out).not.toMatch(/biasing/i);
	});
});

describe('the command’s source', () => {
	it('has no hand-written file over 450 lines (house rule)', () => {
		const walk = (dir: string): string[] => readdirSync(dir).flatMap((f) => (statSync(join(dir, f)).isDirectory() ? walk(join(dir, f)) : [join(dir, f)]));
		const long = walk('src/cli')
			.map((f) => [f, readFileSync(f, 'utf8').split('\n').length] as const)
			.filter(([, n]) => n > 450);
		expect(long).toEqual([]);
	});
});
