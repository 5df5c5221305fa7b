// `causeway data tests` and `causeway data estimates`: the same numbers as the pipeline (and
// so as the app), human-readable and --json, exit 0 when done and 2 with one stderr line on bad input.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { runCli as run } from './harness';
import { runDataChecks } from '../../../src/lib/datacheck';
import { parseDiagramJson } from '../../../src/lib/graph/native-json';
import { parseTable } from '../../../src/lib/stats';

const DEMO = 'static/demo/cycling-hypertension.causeway.json';
const DEMO_CSV = 'static/demo/cycling-hypertension.csv';
const MTCARS = 'tests/fixtures/datacheck/mtcars.causeway.json';
const MTCARS_CSV = 'tests/fixtures/datacheck/mtcars.csv';
const MTCARS_COV = 'tests/fixtures/datacheck/mtcars-covariance.csv';


function pipeline(diagramPath: string, csvPath: string) {
	const t = parseTable(readFileSync(csvPath, 'utf8'));
	if (!t.ok) throw new Error(t.error.message);
	return runDataChecks(parseDiagramJson(readFileSync(diagramPath, 'utf8')), t.table);
}

describe('causeway data tests', () => {
	it('--json gives the pipeline report (arrow and claim checks), exit 0', async () => {
		const r = await run(['data', 'tests', MTCARS, MTCARS_CSV, '--json']);
		expect(r.code).toBe(0);
		expect(r.err).toBe('');
		const json = JSON.parse(r.out);
		const direct = pipeline(MTCARS, MTCARS_CSV);
		expect(json.arrows.checks.map((c: { main: { pValue: number } }) => c.main.pValue)).toEqual(direct.arrows.checks.map((c) => c.main!.pValue));
		expect(json.claims.checks.map((c: { pHolm: number }) => c.pHolm)).toEqual(direct.claims.checks.map((c) => c.pHolm));
		expect(json.estimates).toBeUndefined();
	});

	it('prints arrow checks and claims with Holm and BH, and the caution', async () => {
		const r = await run(['data', 'tests', DEMO, DEMO_CSV]);
		expect(r.code).toBe(0);
		expect(r.out).toMatch(/cycling → fitness\s+supported\s+d = 1\.45: mean fitness is 1\.45 SD higher at cycling = 1 than at 0/);
		expect(r.out).toMatch(/health_consciousness → cycling: not checked \(no data for "health_consciousness"\)/);
		expect(r.out).toMatch(/Claim checks: 46 tested, 0 contradicted/);
		expect(r.out).toMatch(/Holm [\d.]+, BH [\d.]+, n = 5,000/);
		expect(r.out).toMatch(/never prove it/);
	});

	it('--map leaves a variable without data, and the output says it is treated as unmeasured', async () => {
		const r = await run(['data', 'tests', MTCARS, MTCARS_CSV, '--map', 'disp=']);
		expect(r.code).toBe(0);
		expect(r.out).toMatch(/No column for "disp": treated as unmeasured/);
	});

	it('--summary reads a covariance matrix', async () => {
		const r = await run(['data', 'tests', MTCARS, MTCARS_COV, '--summary', '--json']);
		expect(r.code).toBe(0);
		expect(JSON.parse(r.out).rowCount).toBe(32);
	});
});

describe('causeway data estimates', () => {
	it('--json equals the pipeline estimates; --adjust replaces the planned set', async () => {
		const r = await run(['data', 'estimates', DEMO, DEMO_CSV, '--json', '--adjust', 'age,income,diet,app_panel']);
		expect(r.code).toBe(0);
		const e = JSON.parse(r.out).estimates;
		const planned = e.rows.find((x: { roles: string[] }) => x.roles.includes('planned'));
		expect(planned.adjustedFor).toEqual(['age', 'app_panel', 'diet', 'income']);
		expect(planned.sufficient).toBe(false);
		const direct = pipeline(DEMO, DEMO_CSV).estimates!;
		expect(e.rows[0].estimate).toBe(direct.rows[0].estimate);
	});

	it('prints crude and adjusted odds ratios, the 10 % marker as common practice, and the E-value', async () => {
		const r = await run(['data', 'estimates', DEMO, DEMO_CSV]);
		expect(r.code).toBe(0);
		expect(r.out).toMatch(/Effect of cycling on hypertension: odds ratio \(logistic regression\)/);
		expect(r.out).toMatch(/Crude \(no adjustment\)\s+0\.474 \(0\.411 to 0\.546\), n = 5,000/);
		expect(r.out).toMatch(/common-practice marker/);
		expect(r.out).toMatch(/E-value of the planned estimate: 1\.88/);
	});

	it('with a variable left without a column, sufficiency is judged for the diagram as the data see it', async () => {
		const full = await run(['data', 'estimates', DEMO, DEMO_CSV]);
		expect(full.out).toContain('sufficient under the diagram.');
		// Without diet, health consciousness (unmeasured) keeps a path open: no set of columns is sufficient.
		const r = await run(['data', 'estimates', DEMO, DEMO_CSV, '--map', 'diet=']);
		expect(r.code).toBe(0);
		expect(r.out).toContain('NOT sufficient for the diagram as the data see it (variables without a column count as unmeasured).');
		expect(r.out).not.toContain('sufficient under the diagram');
	});

	it('--exposure and --outcome override the file', async () => {
		const r = await run(['data', 'estimates', MTCARS, MTCARS_CSV, '--exposure', 'hp', '--outcome', 'mpg', '--json']);
		expect(r.code).toBe(0);
		expect(JSON.parse(r.out).estimates.exposure).toBe('hp');
	});
});

describe('bad input: one line on stderr, exit 2', () => {
	const cases: [string, string, RegExp][] = [
		['ragged rows', 'cyl,disp\n4,100\n6,200,9\n', /bad\.csv: Row 3 has 3 fields but the header has 2/],
		['text in a numeric column', 'cyl,disp\n4,100\n6,200\n8,lots\n4,120\n', /Row 4, column 'disp': 'lots' is not a number/],
		['no data rows', 'cyl,disp\n', /header row but no data rows/],
		['binary file', '\u0000\u0001PK\u0003\u0004\u0000\u0000garbage', /binary data/],
		['duplicate headers', 'cyl,cyl\n4,6\n', /Duplicate column name 'cyl'/]
	];
	for (const [what, text, message] of cases)
		it(what, async () => {
			for (const view of ['tests', 'estimates']) {
				const r = await run(['data', view, MTCARS, 'bad.csv'], { 'bad.csv': text });
				expect(r.code).toBe(2);
				expect(r.out).toBe('');
				expect(r.err).toMatch(message);
				expect(r.err.trim().split('\n')).toHaveLength(1);
			}
		});

	it('a missing data file, a wrong --type, a missing argument', async () => {
		const missing = await run(['data', 'tests', MTCARS, 'nowhere.csv'], {});
		expect(missing.code).toBe(2);
		expect(missing.err).toMatch(/cannot read "nowhere.csv": no such file/);
		const kind = await run(['data', 'tests', MTCARS, MTCARS_CSV, '--type', 'cyl=nominal']);
		expect(kind.err).toMatch(/binary, categorical, ordinal or continuous/);
		const one = await run(['data', 'estimates', MTCARS]);
		expect(one.code).toBe(2);
		expect(one.err).toMatch(/expected a diagram file and a data file/);
	});

	it('data estimates agrees with review verdict on exit statuses: an unknown --adjust variable or data without the outcome is exit 2', async () => {
		const unknown = await run(['data', 'estimates', DEMO, DEMO_CSV, '--adjust', 'age,nosuch']);
		const check = await run(['review', 'verdict', DEMO, '--adjust', 'age,nosuch']);
		expect([unknown.code, check.code]).toEqual([2, 2]);
		expect(unknown.out).toBe('');
		expect(unknown.err.trim()).toBe('causeway: The adjusted variable "nosuch" is not a variable of the diagram');
		for (const json of [[], ['--json']]) {
			const noOutcome = await run(['data', 'estimates', DEMO, DEMO_CSV, '--map', 'hypertension=', ...json]);
			expect(noOutcome.code).toBe(2);
			expect(noOutcome.out).toBe('');
			expect(noOutcome.err.trim()).toBe(`causeway: ${DEMO_CSV}: No estimate: the outcome "hypertension" has no column in the data.`);
		}
	});

	it('one reading path: a UTF-16 data file is read alike by data tests, data estimates and export --data (export called it binary)', async () => {
		const { spawnSync } = await import('node:child_process');
		const { mkdtempSync, writeFileSync } = await import('node:fs');
		const { join } = await import('node:path');
		const { tmpdir } = await import('node:os');
		const dir = mkdtempSync(join(tmpdir(), 'causeway-utf16-'));
		const utf16 = join(dir, 'mtcars-utf16.csv');
		writeFileSync(utf16, Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(readFileSync(MTCARS_CSV, 'utf8'), 'utf16le')]));
		const cli = (...args: string[]) => spawnSync('node', ['bin/causeway.js', ...args], { encoding: 'utf8' });
		const plain = cli('data', 'estimates', MTCARS, MTCARS_CSV, '--json');
		const wide = cli('data', 'estimates', MTCARS, utf16, '--json');
		expect([plain.status, wide.status]).toEqual([0, 0]);
		expect(JSON.parse(wide.stdout).estimates).toEqual(JSON.parse(plain.stdout).estimates);
		expect(cli('data', 'tests', MTCARS, utf16).status).toBe(0);
		const report = cli('export', MTCARS, '--data', utf16, '--format', 'report-md', '-o', join(dir, 'r.md'));
		expect(report.stderr).toBe('');
		expect(report.status).toBe(0);
		expect(readFileSync(join(dir, 'r.md'), 'utf8')).toContain('mtcars-utf16.csv');
	});

	it('the built command streams a file from disk and keeps to one line on bad input', async () => {
		const { spawnSync } = await import('node:child_process');
		const ok = spawnSync('node', ['bin/causeway.js', 'data', 'estimates', MTCARS, MTCARS_CSV, '--json'], { encoding: 'utf8' });
		expect(ok.status).toBe(0);
		expect(JSON.parse(ok.stdout).estimates.rows.length).toBeGreaterThan(1);
		const bad = spawnSync('node', ['bin/causeway.js', 'data', 'tests', MTCARS, 'package.json'], { encoding: 'utf8' });
		expect(bad.status).toBe(2);
		expect(bad.stderr.trim().split('\n')).toHaveLength(1);
	});
});

describe('the diagram file carries the data settings (R 4.2 on infert, make-settings-fixtures.R)', () => {
	const SETTINGS = 'tests/fixtures/datacheck/infert-settings.causeway.json';
	const INFERT = 'tests/fixtures/datacheck/infert.csv';
	const ref = JSON.parse(readFileSync('tests/fixtures/datacheck/settings.json', 'utf8'));

	it('`causeway data estimates DIAGRAM DATA` with no flags uses the column link, kind and value labels of the file', async () => {
		const r = await run(['data', 'estimates', SETTINGS, INFERT, '--json']);
		expect(r.code).toBe(0);
		const planned = JSON.parse(r.out).estimates.rows.find((x: { roles: string[] }) => x.roles.includes('planned'));
		expect(Math.abs(planned.estimate / ref.spontaneousCategorical.or - 1)).toBeLessThan(1e-6);
		const text = await run(['data', 'estimates', SETTINGS, INFERT]);
		expect(text.out).toMatch(/abortions/);
	});

	it('flags override the file; a linked column the data lack is refused in one line', async () => {
		const r = await run(['data', 'estimates', SETTINGS, INFERT, '--json', '--type', 'spontaneous=continuous']);
		expect(r.code).toBe(0);
		expect(JSON.parse(r.out).notes).toContain('The reference level and value labels of "abortions" are not used: its column \'spontaneous\' is analysed as continuous.');
		const missing = await run(['data', 'estimates', SETTINGS, 'tests/fixtures/datacheck/mtcars.csv']);
		expect(missing.code).toBe(2);
		expect(missing.err).toBe('causeway: tests/fixtures/datacheck/mtcars.csv: The diagram links "abortions" to column "spontaneous", which is not in the data (--map overrides the diagram\'s link)\n');
	});
});
