/**
 * The malformed-input corpus (tests/fixtures/bad: committed files + large inputs made at
 * test time) through every reader and through the `causeway` command:
 * - a refused file gives an InputError (tables: `{ ok: false }`) whose one-line message holds
 *   the expected fragment, which names the problem and where;
 * - a readable file with diagram-level problems is shown by validateDiagram and refused by the
 *   analysis with the same message;
 * - a hostile but legal file reads as plain text (labels exactly as written);
 * - the command exits 2 with exactly one line on stderr and no stack trace for each bad
 *   file, and 0 for each legal one;
 * - nothing is ever written into Object.prototype.
 */
import { spawn } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { adjustmentSets, analyse } from '../../../src/lib/causal/analysis';
import { InputError } from '../../../src/lib/graph/errors';
import { readDiagramBytes } from '../../../src/lib/graph/read-file';
import { validateDiagram } from '../../../src/lib/graph/validate';
import { MAX_TABLE_BYTES } from '../../../src/lib/limits';
import { parseTable, parseTableStream } from '../../../src/lib/stats/table/read-table';
import type { CorpusEntry } from '../../fixtures/bad/large';
import { CORPUS_DIR, committedCorpus, isTable, prototypeIsClean, prototypeKeys, wholeCorpus } from './corpus';

const corpus = wholeCorpus();
const diagrams = corpus.filter((e) => !isTable(e));
const tables = corpus.filter(isTable);
const before = prototypeKeys();

afterAll(() => {
	expect(prototypeIsClean(before)).toBe(true);
});

function expectOneLine(message: string) {
	expect(message).not.toMatch(/[\r\n]/);
	expect(message).not.toMatch(/\bat .+:\d+:\d+/); // no stack frame
	expect(message.length).toBeLessThan(400); // one hostile value cannot flood the line
}

describe('the corpus', () => {
	it('has at least 60 committed malformed inputs, of every kind the brief names, plus the large ones', () => {
		const committed = committedCorpus();
		expect(committed.filter((e) => e.expect !== 'ok').length).toBeGreaterThanOrEqual(60);
		for (const dir of ['json/', 'dot/', 'csv/', 'other/']) expect(committed.some((e) => e.name.startsWith(dir))).toBe(true);
		expect(corpus.some((e) => e.bytes.length >= 10 * 1024 * 1024)).toBe(true);
	});
});

describe('diagram reader (readDiagramBytes, as the app and the command read files)', () => {
	it.each(diagrams.map((e) => [e.name, e] as const))('%s', (name, e) => {
		if (e.expect === 'error') {
			let caught: unknown;
			try {
				readDiagramBytes(name, e.bytes);
			} catch (err) {
				caught = err;
			}
			expect(caught).toBeInstanceOf(InputError);
			const message = (caught as InputError).message;
			expect(message.startsWith(`${name}: `)).toBe(true);
			expect(message).toContain(e.message);
			expectOneLine(message);
			return;
		}
		const d = readDiagramBytes(name, e.bytes);
		if (e.expect === 'invalid') {
			const issues = validateDiagram(d, { needQuestion: true });
			expect(issues[0]?.message).toContain(e.message);
			expectOneLine(issues[0].message);
			// The analysis explains instead of failing: nothing computed, the issues listed.
			const a = analyse(d);
			expect(a.ready).toBe(false);
			expect(a.issues.map((i) => i.message)).toContain(issues[0].message);
			if (e.analysisRuns) expect(adjustmentSets(d).identifiable).toBe(true);
			else expect(() => adjustmentSets(d)).toThrow(InputError);
			return;
		}
		expect(validateDiagram(d)).toEqual([]);
		const labels = d.variables.map((v) => v.label);
		for (const label of e.labels ?? []) expect(labels).toContain(label);
	});
});

describe('table reader (parseTableStream on the file bytes, as the data pane reads a file)', () => {
	it.each(tables.map((e) => [e.name, e] as const))('%s', async (_name, e) => {
		const r = await parseTableStream(new Blob([e.bytes]));
		// The whole-text reader must never throw either, whatever the decoded text.
		const whole = parseTable(new TextDecoder().decode(e.bytes));
		expect(typeof whole.ok).toBe('boolean');
		if (e.expect === 'error') {
			expect(r.ok).toBe(false);
			if (r.ok) return;
			expect(r.error.message).toContain(e.message);
			expectOneLine(r.error.message);
			return;
		}
		expect(r.ok).toBe(true);
		if (!r.ok) return;
		expect([...r.table.columns.map((c) => c.name), ...r.table.skipped.map((c) => c.name)]).toEqual(e.columns);
	});

	it('refuses a data file larger than the stated limit before reading it', async () => {
		const chunks = (function* () {
			yield 'a,b\n1,2\n';
		})();
		const r = await parseTableStream(chunks, { totalBytes: MAX_TABLE_BYTES + 1 });
		expect(r.ok).toBe(false);
		if (!r.ok) expect(r.error.message).toContain('The data file is too large (512 MiB or more); Causeway reads data files of at most 512 MiB.');
	});
});

// ——— The command line ———
// Every file goes through the shipped bundle's main() (dist-cli/causeway.mjs, reading the
// file from disk as bytes, exactly as `npx causeway` does); a sample of each kind also runs as
// a real process, to show the exit code and stderr of the installed command.

/**
 * The command line reads past the app's limits (CLI_MAX_* in src/lib/limits.ts), so a file the
 * app refuses for its size is read by the command, which then refuses it for what follows (a
 * label still too long, no exposure chosen) or for its own, larger limit.
 */
const CLI_MESSAGES: Record<string, string> = {
	'json/ten-megabyte-label.json': 'The label of Variable 1 ("a") is too long: 10,485,760 characters',
	'json/ten-megabyte-id.json': 'The id of variable 1',
	'json/too-many-variables.json': 'No exposure is chosen',
	'json/too-many-arrows.json': 'No exposure is chosen',
	'dot/ten-megabyte-label.dot': 'is too long: 10,485,760 characters',
	'dot/too-many-nodes.dot': 'No exposure is chosen',
	'dot/too-many-edges.dot': 'No exposure is chosen',
	'dot/edge-group-blowup.dot': 'No exposure is chosen', // 90,601 arrows: within the command's limit
	'dot/chain-over-variable-limit.dot': 'No exposure is chosen', // 2,001 variables: within the command's limit
	'dot/subgraph-chain-blowup.dot': 'No exposure is chosen' // 10,800 arrows: within the command's limit
};

interface Run {
	code: number | null;
	stdout: string;
	stderr: string;
}

type Main = (argv: readonly string[], io: { stdout: (s: string) => void; stderr: (s: string) => void }) => Promise<number>;

function spawnCli(args: string[]): Promise<Run> {
	return new Promise((resolve) => {
		const child = spawn(process.execPath, ['bin/causeway.js', ...args], { stdio: ['ignore', 'pipe', 'pipe'] });
		let stdout = '';
		let stderr = '';
		child.stdout.on('data', (c: Buffer) => (stdout += c.toString()));
		child.stderr.on('data', (c: Buffer) => (stderr += c.toString()));
		child.on('close', (code) => resolve({ code, stdout, stderr }));
	});
}

describe('the causeway command on the corpus', () => {
	let dir = '';
	const pathOf = new Map<string, string>();
	const results = new Map<string, Run[]>();
	let hasTestCommand = false;

	beforeAll(async () => {
		const bundle = resolve('dist-cli/causeway.mjs');
		expect(existsSync(bundle)).toBe(true); // built by `npm run test:unit`
		const main = ((await import(/* @vite-ignore */ pathToFileURL(bundle).href)) as { main: Main }).main;
		const inProcess = async (args: string[]): Promise<Run> => {
			let stdout = '';
			let stderr = '';
			const code = await main(args, { stdout: (t) => (stdout += t), stderr: (t) => (stderr += t) });
			return { code, stdout, stderr };
		};
		dir = mkdtempSync(join(tmpdir(), 'causeway-corpus-'));
		for (const e of corpus) {
			const committed = join(CORPUS_DIR, e.name);
			if (existsSync(committed)) pathOf.set(e.name, committed);
			else {
				const file = join(dir, e.name);
				mkdirSync(dirname(file), { recursive: true });
				writeFileSync(file, e.bytes);
				pathOf.set(e.name, file);
			}
		}
		hasTestCommand = (await inProcess(['data', 'tests', '--help'])).code === 0;
		const record = (name: string, r: Run) => results.set(name, [...(results.get(name) ?? []), r]);
		for (const e of diagrams) {
			const file = pathOf.get(e.name) as string;
			if (e.expect === 'ok') record(e.name, await inProcess(['export', file, '--format', 'json']));
			else {
				record(e.name, await inProcess(['plan', 'roles', file]));
				if (e.expect === 'invalid') record(e.name, await inProcess(['plan', 'sets', file, '--json']));
			}
		}
		if (hasTestCommand) for (const e of tables) record(e.name, await inProcess(['data', 'tests', 'static/demo/cycling-hypertension.causeway.json', pathOf.get(e.name) as string]));
		// Real processes: the first refused and the first legal file of each folder.
		const sample = ['json/', 'dot/', 'other/'].flatMap((d) => ['error', 'invalid', 'ok'].map((k) => diagrams.find((e) => e.name.startsWith(d) && e.expect === k && !e.analysisRuns)));
		const runs = await Promise.all(sample.filter((e) => e !== undefined).map(async (e) => [e.name, await spawnCli(e.expect === 'ok' ? ['export', pathOf.get(e.name) as string, '--format', 'json'] : ['plan', 'roles', pathOf.get(e.name) as string])] as const));
		expect(runs.length).toBeGreaterThanOrEqual(6);
		for (const [name, r] of runs) record(name, r);
	}, 120_000);

	afterAll(() => {
		if (dir) rmSync(dir, { recursive: true, force: true });
	});

	const check = (e: CorpusEntry) => {
		const runs = results.get(e.name) ?? [];
		expect(runs.length).toBeGreaterThan(0);
		for (const r of runs) {
			if (e.analysisRuns) {
				expect(r.stderr).toBe('');
				expect(r.code).toBe(0);
				continue;
			}
			if (e.expect === 'ok') {
				expect(r.stderr).toBe('');
				expect(r.code).toBe(0);
				const back = readDiagramBytes('back.json', new TextEncoder().encode(r.stdout));
				for (const label of e.labels ?? []) expect(back.variables.map((v) => v.label)).toContain(label);
				continue;
			}
			expect(r.code).toBe(2);
			expect(r.stdout).toBe('');
			expect(r.stderr.endsWith('\n')).toBe(true);
			const lines = r.stderr.slice(0, -1).split('\n');
			expect(lines).toHaveLength(1);
			expect(lines[0]).toMatch(/^causeway: /);
			expect(lines[0]).not.toMatch(/internal error|\bat .+:\d+:\d+|Error:/);
			if (e.expect === 'error') expect(lines[0]).toContain(CLI_MESSAGES[e.name] ?? e.message);
		}
	};

	it.each(diagrams.map((e) => [e.name, e] as const))('%s', (_name, e) => check(e));

	it.each(tables.map((e) => [e.name, e] as const))('%s (causeway data tests DIAGRAM DATA)', (_name, e) => {
		if (!hasTestCommand) {
			// The data commands are not registered yet (src/cli/commands, another area): nothing to run.
			expect(results.has(e.name)).toBe(false);
			return;
		}
		const runs = results.get(e.name) ?? [];
		for (const r of runs) {
			if (e.expect === 'ok') continue; // a legal table may still fail to match the demo diagram's columns
			expect(r.code).toBe(2);
			expect(r.stderr.trimEnd().split('\n')).toHaveLength(1);
			expect(r.stderr).not.toMatch(/internal error|\bat .+:\d+:\d+/);
			expect(r.stderr).toContain(e.message);
		}
	});
});
