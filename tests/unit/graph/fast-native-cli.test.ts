/**
 * The fast reader through the `causeway` command: every core command prints exactly the same
 * (output, error line, exit status) for a version 2 file, which the fast path reads, as for the
 * same diagram written as version 1, which it leaves to the full reader. In-process runs hand
 * the command text, which takes the fast path at any size (src/cli/read-input.ts); one real
 * process reads a file past FAST_READ_MIN_BYTES, the size from which files take it.
 * The d-separation answers of the fast path are also checked against networkx by
 * tests/unit/cli/large-diagrams.test.ts (its 3,000-variable fixture is version 2).
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { readNativeFast } from '../../../src/lib/graph/fast-native';
import { FAST_READ_MIN_BYTES } from '../../../src/lib/graph/fast-native/min-bytes';
import { CLI_READ_LIMITS } from '../../../src/lib/graph/size-limits';
import { randomDiagramJson } from '../../../bench/cli-diagram';
import { runCli } from '../cli/harness';
import { diagramOf, M_BIAS_LOWER_CASE, withArrows } from '../reference/published-diagrams';

const asVersion1 = (text: string) => text.replace('"version":2', '"version":1');
const enc = new TextEncoder();

function takesFastPath(text: string): boolean {
	return readNativeFast(enc.encode(text), CLI_READ_LIMITS, () => {
		throw new Error('not needed');
	}).ok;
}

// M-bias (reference/published-diagrams.ts) with a mediator k and a planned set that is not sufficient.
const SMALL = (() => {
	const d = diagramOf(withArrows(M_BIAS_LOWER_CASE, ['e->k', 'k->d'], 'a mediator k added (ours)'), { title: 'M-bias and a mediator', unmeasured: ['u1', 'u2'], adjusted: ['m'] });
	return JSON.stringify({ format: 'causeway.diagram', version: 2, ...d, variables: d.variables.map((v) => ({ ...v, label: v.id.toUpperCase() })) });
})();
const MEDIUM = randomDiagramJson(400, 7);

const COMMANDS: string[][] = [
	['dsep', '--from', 'e', '--to', 'd'],
	['dsep', '--from', 'u1', '--to', 'u2', '--json'],
	['dsep', '--from', 'u1', '--to', 'u2', '--given', 'm'],
	['check'],
	['check', '--json'],
	['check', '--adjust', ''],
	['sets'],
	['sets', '--json', '--effect', 'direct'],
	['paths', '--max', '20'],
	['claims', '--max', '20'],
	['roles'],
	['roles', '--only', 'm,k', '--json'],
	['convert', '-o', '-'],
	['dsep', '--from', 'e', '--to', 'nothing'],
	['check', '--exposure', 'd', '--outcome', 'd']
];

/** The 0.1 verbs in the lists above, spelled as the job and view they now are. */
const VIEW: Record<string, string[]> = { dsep: ['diagram', 'separation'], check: ['review', 'verdict'], sets: ['plan', 'sets'], paths: ['plan', 'paths'], claims: ['diagram', 'claims'], roles: ['plan', 'roles'] };
const spell = (verb: string): string[] => VIEW[verb] ?? [verb];

async function sameOutput(v2: string, args: string[]) {
	const [command, ...rest] = args;
	const fast = await runCli([...spell(command), 'd.json', ...rest], { 'd.json': v2 });
	const full = await runCli([...spell(command), 'd.json', ...rest], { 'd.json': asVersion1(v2) });
	// convert writes the file's version (always 2) whichever version it read
	expect(fast).toEqual(full);
	return fast;
}

describe('the command with the fast reader prints what it prints with the full reader', () => {
	it('reads the test diagrams by the fast path (version 2) and not their version 1 copies', () => {
		expect(takesFastPath(SMALL)).toBe(true);
		expect(takesFastPath(MEDIUM)).toBe(true);
		expect(takesFastPath(asVersion1(SMALL))).toBe(false);
	});

	it.each(COMMANDS.map((args) => [args.join(' '), args] as const))('small diagram: %s', async (_name, args) => {
		await sameOutput(SMALL, args);
	});

	it.each(
		[
			['dsep', '--from', 'v1', '--to', 'v2', '--given', 'v3,v4'],
			['dsep', '--from', 'v1', '--to', 'v2', '--json'],
			['check'],
			['sets', '--max', '5', '--json'],
			['paths', '--max', '10'],
			['claims', '--max', '10'],
			['roles', '--only', 'v1,v2,v3']
		].map((args) => [args.join(' '), args] as const)
	)('400-variable diagram: %s', async (_name, args) => {
		const r = await sameOutput(MEDIUM, args);
		expect(r.err).toBe('');
	});

	it('refuses a cycle, a repeated id and an unknown arrow end with the full reader’s message', async () => {
		const broken = [
			SMALL.replace('{"from":"e","to":"d"}', '{"from":"d","to":"u1"}'),
			SMALL.replace('{"id":"k"', '{"id":"e"'),
			SMALL.replace('{"from":"k","to":"d"}', '{"from":"k","to":"z"}')
		];
		for (const text of broken) {
			expect(takesFastPath(text)).toBe(false);
			const r = await sameOutput(text, ['dsep', '--from', 'e', '--to', 'd']);
			expect(r.code).toBe(2);
			expect(r.err).toMatch(/^causeway: d\.json: |^causeway: /);
		}
	});
});

describe('a real process on a file past FAST_READ_MIN_BYTES', () => {
	const dir = mkdtempSync(join(tmpdir(), 'causeway-fast-'));
	afterAll(() => rmSync(dir, { recursive: true, force: true }));
	it('answers dsep and check as it does for the same diagram as version 1', () => {
		const text = randomDiagramJson(20_000);
		expect(enc.encode(text).length).toBeGreaterThan(FAST_READ_MIN_BYTES);
		const v2 = join(dir, 'd2.json');
		const v1 = join(dir, 'd1.json');
		writeFileSync(v2, text);
		writeFileSync(v1, asVersion1(text));
		for (const args of [
			['dsep', '--from', 'v1', '--to', 'v2', '--given', 'v3,v4'],
			['check', '--json']
		]) {
			const run = (file: string) => spawnSync(process.execPath, ['bin/causeway.js', ...spell(args[0]), file, ...args.slice(1)], { encoding: 'utf8', maxBuffer: 1 << 26 });
			const fast = run(v2);
			const full = run(v1);
			expect(fast.stderr).toBe('');
			expect({ status: fast.status, stdout: fast.stdout }).toEqual({ status: full.status, stdout: full.stdout });
		}
	});
});
