// The report's promise: every figure of its data section is reproduced by the commands it
// prints. The report is built as the app builds it (the diagram's data settings, the data
// checks in the app's mode, reportDataFromChecks with the file names Save and the data file
// have), then exactly the printed commands are run in a shell, in a folder holding the two
// files, and their output is compared with the report's numbers. The settings are chosen so
// that they change the numbers (the exposure's reference level is flipped, a variable is left
// without data), so a command that ignored the file's settings would fail here.
import { execSync } from 'node:child_process';
import { copyFileSync, mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { runDataChecks } from '../../../src/lib/datacheck';
import { applyCommand, type Command } from '../../../src/lib/editor/commands';
import { buildReport } from '../../../src/lib/export/report';
import { reportMarkdown } from '../../../src/lib/export/report-md';
import { reportDataFromChecks, shellWord } from '../../../src/lib/export/from-datacheck';
import type { Diagram } from '../../../src/lib/graph/diagram';
import { writeDiagramJson } from '../../../src/lib/graph/native-json';
import { labelLookup } from '../../../src/lib/wording';
import { demoDir, readDiagram, readTable } from '../datacheck/helpers';

const CSV = `${demoDir}cycling-hypertension.csv`;

function edit(d: Diagram, ...cmds: Command[]): Diagram {
	for (const c of cmds) {
		const r = applyCommand(d, c);
		if (!r.ok) throw new Error(r.message);
		d = r.diagram;
	}
	return d;
}

const study = edit(
	readDiagram(`${demoDir}cycling-hypertension.causeway.json`),
	{ kind: 'set-variable-data', id: 'cycling', data: { kind: 'binary', reference: '1', labels: [{ value: '0', label: 'other commute' }, { value: '1', label: 'bicycle' }] } },
	{ kind: 'set-variable-data', id: 'family_history', data: { column: null } },
	{ kind: 'set-variable-data', id: 'diet', data: { column: 'diet', kind: 'continuous' } }
);

/** Numbers as printed (true minus, grouped thousands) → numbers. */
const num = (s: string) => Number(s.replace('−', '-').replace(/,/g, '').replace(/^< /, ''));

function reportOf(d: Diagram, diagramFile: string, dataFile: string) {
	const checks = runDataChecks(d, readTable(CSV), { settingProblems: 'note' });
	const data = reportDataFromChecks(checks, labelLookup(d), dataFile, { files: { diagram: diagramFile, data: dataFile } });
	return { md: reportMarkdown(buildReport({ diagram: d, data, date: new Date(2026, 0, 5) })), data };
}

/** The commands between the fences of the report's reproduction block. */
function printedCommands(md: string): string[] {
	const m = /```sh\n([^`]*)\n```/.exec(md);
	if (!m) throw new Error('the report prints no commands');
	return m[1].split('\n');
}

/** The header cells of the Markdown table whose header starts with `first`. */
function tableHead(md: string, first: string): string[] {
	const line = md.split('\n').find((l) => l.startsWith(`| ${first} |`))!;
	return line.slice(2, -2).split(' | ');
}

/** The rows of the Markdown table whose header starts with `first`. */
function tableRows(md: string, first: string): string[][] {
	const lines = md.split('\n');
	const start = lines.findIndex((l) => l.startsWith(`| ${first} |`));
	const rows: string[][] = [];
	for (let i = start + 2; i < lines.length && lines[i].startsWith('|'); i++) rows.push(lines[i].slice(2, -2).split(' | '));
	return rows;
}

const folder = join('test-results', `reproduce-${process.pid}`);
afterAll(() => rmSync(folder, { recursive: true, force: true }));

describe('the report prints the commands that reproduce its figures', () => {
	const diagramFile = 'cycling study.causeway.json';
	const dataFile = 'cycling-hypertension.csv';
	const { md } = reportOf(study, diagramFile, dataFile);
	mkdirSync(folder, { recursive: true });
	writeFileSync(join(folder, diagramFile), writeDiagramJson(study));
	copyFileSync(CSV, join(folder, dataFile));
	const commands = printedCommands(md);
	const run = (command: string) => execSync(command, { cwd: folder, encoding: 'utf8', timeout: 120_000 });

	it('prints `npx causeway data tests` and `npx causeway data estimates` on the two files, with no flags', () => {
		expect(commands).toEqual([`npx causeway data tests 'cycling study.causeway.json' cycling-hypertension.csv`, `npx causeway data estimates 'cycling study.causeway.json' cycling-hypertension.csv`]);
		expect(shellWord("it's.csv")).toBe(`'it'\\''s.csv'`);
		expect(md).toContain('| Commutes by bicycle | cycling | binary (chosen) | bicycle |');
		// The variables table carries the settings themselves (what the file holds).
		expect(md).toContain('binary; reference "1"; 0 = "other commute", 1 = "bicycle"');
		expect(md).toContain('no data (treated as unmeasured by the checks)');
	});

	it('the estimate command gives the report\'s estimates, intervals and rows', () => {
		const out = run(commands[1]);
		// Each estimate row starts with its label and the estimate (the crude on the same rows follows it).
		const printed = [...out.matchAll(/^ {2}\S.*? {2,}(\S+) \((\S+) to (\S+)\), n = ([\d,]+)/gm)].map((m) => [num(m[1]), num(m[2]), num(m[3]), Number(m[4].replace(/,/g, ''))]);
		const head = tableHead(md, 'Estimate');
		const [value, interval, rows] = ['Value', 'Interval', 'Rows'].map((h) => head.indexOf(h));
		const reported = tableRows(md, 'Estimate').map((r) => {
			const [lo, hi] = r[interval].replace(/ \(95 %\)$/, '').split(' to ').map(num);
			return [num(r[value]), lo, hi, Number(r[rows])];
		});
		expect(reported.length).toBeGreaterThanOrEqual(2);
		expect(printed).toHaveLength(reported.length);
		for (const [k, row] of reported.entries())
			for (const [i, x] of row.entries()) expect(Math.abs(printed[k][i] - x) / Math.abs(x)).toBeLessThan(5e-3);
		// The flipped reference is in the numbers: cycling protects, so the odds ratio of the other commute is above 1.
		expect(reported[0][0]).toBeGreaterThan(1);
		// family_history has no data by the file's setting: the command says so too.
		expect(out).toMatch(/No column for "family_history"/);
	});

	it('the test command gives the report\'s claim checks (count, p and Holm-adjusted p)', () => {
		const out = run(commands[0]);
		const tested = Number(/Claim checks: (\d+) tested/.exec(out)![1]);
		const rows = tableRows(md, 'Implied independence');
		expect(rows).toHaveLength(tested);
		const cli = [...out.matchAll(/[:,] p (?:= |< )?([^,]+), Holm ([^,]+), BH/g)].map((m) => [num(m[1]), num(m[2])]).sort((a, b) => a[0] - b[0] || a[1] - b[1]);
		const rep = rows.map((r) => [num(r[4]), num(r[5])]).sort((a, b) => a[0] - b[0] || a[1] - b[1]);
		expect(cli).toHaveLength(rep.length);
		// The command prints two significant digits, the report three decimals.
		for (const [k, [p, holm]] of rep.entries()) {
			expect(Math.abs(cli[k][0] - p)).toBeLessThan(Math.max(0.006, 0.06 * p));
			expect(Math.abs(cli[k][1] - holm)).toBeLessThan(0.006);
		}
	});

	it('without the settings the numbers differ, so the match above is the settings\' doing', () => {
		const plain = reportOf(readDiagram(`${demoDir}cycling-hypertension.causeway.json`), 'demo.causeway.json', dataFile).md;
		expect(tableRows(plain, 'Estimate')[0][3]).not.toBe(tableRows(md, 'Estimate')[0][3]);
	});
});
