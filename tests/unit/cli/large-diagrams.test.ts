/**
 * The command line in pipelines: its own limits (CLI_* in src/lib/limits.ts, larger than the
 * app's 2,000 variables) enforced while reading, the caps it states, the answers on a diagram
 * the app would refuse checked against networkx, and one-line failures when the output cannot
 * be written. Speed is measured in bench/cli.ts, never here.
 */
import { spawnSync } from 'node:child_process';
import { closeSync, existsSync, mkdtempSync, openSync, readFileSync, rmSync, writeFileSync, ftruncateSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { parseDiagramJson } from '../../../src/lib/graph/native-json';
import { CLI_DEFAULT_LISTED_SETS, CLI_MAX_DIAGRAM_BYTES, CLI_MAX_VARIABLES, MAX_VARIABLES } from '../../../src/lib/limits';
import { main } from '../../../src/cli/main';
import { eagerOutputs, readBundleMeta } from './bundle-meta';
import { runCli } from './harness';

const BIG = 'tests/fixtures/networkx/cli-dsep-3000.causeway.json';
const dir = mkdtempSync(join(tmpdir(), 'causeway-large-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** The bundled command as a real process (dist-cli is built by `npm run test:unit`). */
function spawnCli(args: string[], input?: string) {
	return spawnSync(process.execPath, ['bin/causeway.js', ...args], { encoding: 'utf8', input, maxBuffer: 1 << 26 });
}

function oneLine(stderr: string): string {
	expect(stderr.endsWith('\n')).toBe(true);
	const lines = stderr.slice(0, -1).split('\n');
	expect(lines).toHaveLength(1);
	expect(lines[0]).toMatch(/^causeway: /);
	expect(lines[0]).not.toMatch(/internal error|\bat .+:\d+:\d+/);
	return lines[0];
}

describe('diagrams past the app’s limit', () => {
	it('the app refuses the 3,000-variable fixture; the command reads it', async () => {
		const text = readFileSync(BIG, 'utf8');
		expect(() => parseDiagramJson(text)).toThrow(`Causeway handles at most ${MAX_VARIABLES.toLocaleString('en-GB')}`);
		const r = await runCli(['diagram', 'separation', BIG, '--from', 'v1', '--to', 'v2', '--json']);
		expect(r.err).toBe('');
		expect(r.code).toBe(0);
	});

	// networkx 2.8.8 (Debian 12's python3-networkx, nx.d_separated) answered these 40 queries on
	// the same file: tests/fixtures/networkx/{cli-dsep-3000.answers.json, make_cli_dsep_fixture.py}.
	const answers = JSON.parse(readFileSync('tests/fixtures/networkx/cli-dsep-3000.answers.json', 'utf8')) as {
		networkx: string;
		queries: { from: string[]; to: string[]; given: string[]; separated: boolean }[];
	};
	it(`answers dsep as networkx ${answers.networkx} does, on both answers`, async () => {
		expect(answers.queries.filter((q) => q.separated).length).toBeGreaterThan(5);
		expect(answers.queries.filter((q) => !q.separated).length).toBeGreaterThan(5);
		for (const q of answers.queries) {
			const args = ['diagram', 'separation', BIG, '--from', q.from.join(','), '--to', q.to.join(','), '--json'];
			if (q.given.length > 0) args.push('--given', q.given.join(','));
			const r = await runCli(args);
			expect(r.code).toBe(0);
			expect(JSON.parse(r.out).separated).toBe(q.separated);
		}
	});

	it('reads the same diagram from a pipe as a real process', () => {
		const q = answers.queries[0];
		const r = spawnCli(['diagram', 'separation', '-', '--from', q.from.join(','), '--to', q.to.join(','), '--given', q.given.join(','), '--json'], readFileSync(BIG, 'utf8'));
		expect(r.stderr).toBe('');
		expect(JSON.parse(r.stdout).separated).toBe(q.separated);
	});
});

describe('the command’s own limits, stated in the refusal', () => {
	it('refuses more variables than it handles, naming its limit', async () => {
		const n = CLI_MAX_VARIABLES + 1;
		const text = JSON.stringify({ format: 'causeway.diagram', version: 2, variables: Array.from({ length: n }, (_, i) => ({ id: `v${i}` })), arrows: [] });
		const r = await runCli(['review', 'verdict', 'many.json'], { 'many.json': text });
		expect(r.code).toBe(2);
		expect(oneLine(r.err)).toContain('The diagram has 250,001 variables; the causeway command handles at most 250,000');
	});

	it('refuses a file past its size limit before reading it', () => {
		const file = join(dir, 'huge.json');
		const fd = openSync(file, 'w');
		ftruncateSync(fd, CLI_MAX_DIAGRAM_BYTES + 1); // sparse: no 64 MiB written
		closeSync(fd);
		const r = spawnCli(['review', 'verdict', file]);
		expect(r.status).toBe(2);
		expect(oneLine(r.stderr)).toContain('The file is too large: 64 MiB, but the causeway command reads at most 64 MiB of diagram');
	});

	it('stops reading a pipe once it passes the limit', () => {
		const r = spawnSync('bash', ['-c', `head -c ${CLI_MAX_DIAGRAM_BYTES + 4096} /dev/zero | tr '\\0' ' ' | node bin/causeway.js review verdict -`], { encoding: 'utf8' });
		expect(r.status).toBe(2);
		expect(oneLine(r.stderr)).toContain('stdin: The file is too large: more than 64 MiB');
	});

	it('diagram claims without --max refuses a diagram with too many pairs, and lists the first N with it', async () => {
		const ids = Array.from({ length: 3_200 }, (_, i) => `v${i}`);
		const text = JSON.stringify({ format: 'causeway.diagram', version: 2, variables: ids.map((id) => ({ id })), arrows: ids.slice(1).map((id, i) => ({ from: ids[i], to: id })) });
		const refused = await runCli(['diagram', 'claims', 'chain.json'], { 'chain.json': text });
		expect(refused.code).toBe(2);
		expect(oneLine(refused.err)).toContain('5,118,400 pairs, more than the 5,000,000 the command goes through in full (its limit); give --max N');
		const first = await runCli(['diagram', 'claims', 'chain.json', '--max', '3', '--json'], { 'chain.json': text });
		expect(first.code).toBe(0);
		expect(JSON.parse(first.out).claims).toHaveLength(3);
	});

	it('plan roles refuses past its work limit and answers for chosen variables with --only', async () => {
		const n = 20_000;
		const ids = Array.from({ length: n }, (_, i) => `v${i}`);
		const text = JSON.stringify({
			format: 'causeway.diagram',
			version: 2,
			variables: ids.map((id) => ({ id })),
			arrows: ids.slice(1).map((id, i) => ({ from: ids[i], to: id })),
			exposures: ['v10'],
			outcomes: ['v20']
		});
		const refused = await runCli(['plan', 'roles', 'chain.json'], { 'chain.json': text });
		expect(refused.code).toBe(2);
		// Counts in full, never in e-notation (n × (n + arrows) = 20,000 × 39,999).
		expect(oneLine(refused.err)).toContain("plan roles tests each variable with a search over the whole diagram: 20,000 variables × (20,000 + 19,999 arrows) = 799,980,000 steps, over the command's limit of 600,000,000 (about 20 s); give --only a,b");
		// A chain v0 → … → v19999 (from memory): v5 causes the exposure only, v15 is between them.
		const some = await runCli(['plan', 'roles', 'chain.json', '--only', 'v5,v15,v30', '--json'], { 'chain.json': text });
		expect(some.code).toBe(0);
		expect(JSON.parse(some.out).roles).toEqual([
			{ id: 'v5', roles: ['instrument-like'] },
			{ id: 'v15', roles: ['mediator'] },
			{ id: 'v30', roles: ['descendant-of-outcome', 'descendant-of-exposure'] }
		]);
	});
});

describe('caps stated in the output', () => {
	// Two independent back-door paths of 12 links each (from memory: each path is blocked by
	// any one of its 11 middle variables, so there are 11 × 11 = 121 minimal sets).
	const chainIds = (p: string) => Array.from({ length: 11 }, (_, i) => `${p}${i}`);
	const arrows: [string, string][] = [['x', 'y']];
	for (const p of ['a', 'b']) {
		const c = chainIds(p);
		arrows.push([c[0], 'x']);
		for (let i = 1; i < c.length; i++) arrows.push([c[i], c[i - 1]]);
		arrows.push([c[c.length - 1], 'y']);
	}
	const ids = [...new Set(arrows.flat())];
	const text = JSON.stringify({ format: 'causeway.diagram', version: 2, variables: ids.map((id) => ({ id })), arrows: arrows.map(([from, to]) => ({ from, to })), exposures: ['x'], outcomes: ['y'] });

	it('plan sets lists at most the default cap and says so in text and JSON', async () => {
		const json = await runCli(['plan', 'sets', 'd.json', '--json'], { 'd.json': text });
		const j = JSON.parse(json.out);
		expect(j.max).toBe(CLI_DEFAULT_LISTED_SETS);
		expect(j.sets).toHaveLength(CLI_DEFAULT_LISTED_SETS);
		expect(j.truncated).toBe(true);
		const plain = await runCli(['plan', 'sets', 'd.json'], { 'd.json': text });
		expect(plain.out).toContain(`(at most ${CLI_DEFAULT_LISTED_SETS} listed; --max N to change)`);
		expect(plain.out).toContain(`stopped after ${CLI_DEFAULT_LISTED_SETS} sets (the cap, --max ${CLI_DEFAULT_LISTED_SETS}); more exist`);
		const all = JSON.parse((await runCli(['plan', 'sets', 'd.json', '--json', '--max', '1000'], { 'd.json': text })).out);
		expect(all.sets).toHaveLength(121);
		expect(all.truncated).toBe(false);
		expect(all.max).toBe(1000);
	});
});

describe('output that cannot be written: one line, exit 2', () => {
	it('-o into a folder that does not exist', () => {
		const target = join(dir, 'no-such-folder', 'out.dot');
		const r = spawnCli(['export', BIG, '-o', target]);
		expect(r.status).toBe(2);
		expect(oneLine(r.stderr)).toBe(`causeway: cannot write "${target}": its folder does not exist`);
	});

	it('a full disk (/dev/full) on standard output', () => {
		if (!existsSync('/dev/full')) return; // Linux only
		const r = spawnSync('bash', ['-c', `node bin/causeway.js diagram separation "${BIG}" --from v1 --to v2 > /dev/full`], { encoding: 'utf8' });
		expect(r.status).toBe(2);
		expect(oneLine(r.stderr)).toBe('causeway: cannot write the output: no space left on the device (ENOSPC)');
	});

	it('a failing file writer in-process (no stack trace, no "internal error")', async () => {
		let err = '';
		const code = await main(['export', BIG, '-o', 'out/x.json'], {
			stdout: () => undefined,
			stderr: (t) => (err += t),
			writeFile: async () => {
				throw Object.assign(new Error('ENOSPC: no space left on device, write'), { code: 'ENOSPC' });
			}
		});
		expect(code).toBe(2);
		expect(oneLine(err)).toBe('causeway: cannot write "out/x.json": no space left on the device (ENOSPC)');
	});
});

describe('the bundle', () => {
	it('holds no canvas library and loads each further command as its own chunk (esbuild metafile)', () => {
		const meta = readBundleMeta();
		const inputs = Object.values(meta.outputs).flatMap((o) => Object.keys(o.inputs));
		expect(inputs.some((i) => /cytoscape/i.test(i))).toBe(false);
		expect(inputs.some((i) => i.startsWith('src/lib/ui/'))).toBe(false);
		const entry = meta.outputs['dist-cli/causeway.mjs'];
		expect(entry.imports.filter((i) => i.kind === 'dynamic-import').length).toBeGreaterThanOrEqual(8);
		// What start-up loads (the entry and its static imports) holds neither the data side nor the figure code.
		const eagerInputs = eagerOutputs(meta).flatMap((f) => Object.keys(meta.outputs[f].inputs));
		for (const heavy of ['papaparse', '@dagrejs', 'src/lib/stats/', 'src/lib/export/', 'ts-graphviz']) expect(eagerInputs.some((i) => i.includes(heavy))).toBe(false);
	});
});
