/**
 * `causeway export`: every format from the command line equals the library's output for the
 * same diagram and date, the format comes from -o's extension when not given, a DOT file
 * without positions is laid out before drawing, and bad usage is one line on stderr, exit 2.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { runCli as run } from '../cli/harness';
import { EXPORT_FORMATS, exportText, type ExportFormat } from '../../../src/lib/export/formats';
import { SOFTWARE_VERSION } from '../../../src/lib/export/version';
import { demo, DEMO_PATH } from './helpers';


const DATE = new Date(2026, 2, 1);

describe('causeway export', () => {
	it('writes every format exactly as the library makes it', async () => {
		for (const format of Object.keys(EXPORT_FORMATS) as ExportFormat[]) {
			const r = await run(['export', DEMO_PATH, '--format', format, '-o', `out${EXPORT_FORMATS[format].extension}`, '--date', '2026-03-01']);
			expect(r.err).toBe('');
			expect(r.code).toBe(0);
			expect(r.written[`out${EXPORT_FORMATS[format].extension}`]).toBe(exportText(format, demo(), { date: DATE }));
		}
	});

	it('takes the format from the output name and applies the style options', async () => {
		const r = await run(['export', DEMO_PATH, '-o', 'fig.svg', '--mono', '--no-legend']);
		expect(r.code).toBe(0);
		expect(r.written['fig.svg']).toBe(exportText('svg', demo(), { mono: true, legend: false }));
		const h = await run(['export', DEMO_PATH, '--to', 'html', '--date', '2026-03-01']);
		expect(h.out).toBe(exportText('report-html', demo(), { date: DATE }));
		const t = await run(['export', DEMO_PATH, '--format', 'tikz', '--standalone']);
		expect(t.out).toContain('\\documentclass{article}');
	});

	it('lays out a DOT file without positions before drawing it', async () => {
		const dot = 'digraph { a [role=exposure]; y [role=outcome]; c -> a; c -> y; a -> y }';
		const r = await run(['export', 'g.dot', '--format', 'svg'], { 'g.dot': dot });
		expect(r.code).toBe(0);
		const xs = [...r.out.matchAll(/<g class="variable" data-id="(\w)"><rect x="([\d.-]+)" y="([\d.-]+)"/g)].map((m) => [Number(m[2]), Number(m[3])]);
		expect(xs).toHaveLength(3);
		// Three distinct places (not all stacked at one point).
		expect(new Set(xs.map((p) => p.join(','))).size).toBe(3);
	});

	it('puts data results and the draft into the report', async () => {
		const results = JSON.stringify({ estimates: [{ label: 'Adjusted', adjustedFor: ['age'], measure: 'odds ratio', estimate: 0.8, lower: 0.7, upper: 0.9 }] });
		const r = await run(['export', DEMO_PATH, '--format', 'report-md', '--results', 'r.json', '--draft', 'd.txt'], { 'r.json': results, 'd.txt': 'Our own plan.' });
		expect(r.code).toBe(0);
		expect(r.out).toContain('| Adjusted | Age | odds ratio | 0.8 | 0.7 to 0.9 (95 %) |');
		expect(r.out).toContain('> Our own plan.');
		expect(r.out).toContain(`Causeway ${SOFTWARE_VERSION}`);
	});

	it('writes the figure beside a Markdown report that links it', async () => {
		const r = await run(['export', DEMO_PATH, '--format', 'report-md', '-o', 'docs/plan.md', '--figure-file', 'plan-figure.svg']);
		expect(r.code).toBe(0);
		expect(r.written['docs/plan.md']).toContain('](plan-figure.svg)');
		expect(r.written['docs/plan-figure.svg']).toBe(exportText('svg', demo()));
	});

	it('refuses bad usage in one line with exit 2', async () => {
		const cases: [string[], RegExp, Record<string, string>?][] = [
			[['export', DEMO_PATH, '--format', 'pdf'], /--format must be one of svg\|tikz/],
			[['export', DEMO_PATH], /export needs --format/],
			[['export', DEMO_PATH, '-o', 'x.pdf'], /export needs --format/],
			[['export', DEMO_PATH, '--format', 'report-md', '--date', '1 March'], /--date must be a date/],
			[['export', DEMO_PATH, '--format', 'report-md', '--date', '2026-02-30'], /--date must be a date like 2026-03-01, not "2026-02-30"/],
			[['export', DEMO_PATH, '--format', 'report-md', '--results', 'r.json'], /r\.json: estimates\[0\]\.estimate must be a number/, { 'r.json': '{"estimates":[{"label":"a","measure":"OR","adjustedFor":[],"estimate":"x"}]}' }],
			[['export', DEMO_PATH, '--format', 'report-md', '--results', 'r.json'], /r\.json: not valid JSON/, { 'r.json': '{' }],
			[['export', 'g.dot', '--format', 'sets-csv'], /sets-csv needs a valid diagram with an exposure and an outcome/, { 'g.dot': 'digraph { a -> b }' }]
		];
		for (const [args, message, files] of cases) {
			const r = await run(args, files);
			expect(r.code, args.join(' ')).toBe(2);
			expect(r.err).toMatch(message);
			expect(r.err.trim().split('\n')).toHaveLength(1);
		}
	});

	it('keeps the version in step with package.json', () => {
		expect(SOFTWARE_VERSION).toBe(JSON.parse(readFileSync('package.json', 'utf8')).version);
	});
});
