/**
 * The report's data section filled from the data-check pipeline (src/lib/datacheck) run on the
 * demo study's simulated data: every claim check and every estimate arrives, with the
 * pipeline's own numbers, and the report shows them; `causeway export --data` does the same.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { runDataChecks } from '../../../src/lib/datacheck';
import { parseTable } from '../../../src/lib/stats';
import { reportDataFromChecks } from '../../../src/lib/export/from-datacheck';
import { buildReport } from '../../../src/lib/export/report';
import { reportMarkdown } from '../../../src/lib/export/report-md';
import { checkReportData } from '../../../src/lib/export/report-data';
import { labelLookup } from '../../../src/lib/wording';
import { main } from '../../../src/cli/main';
import { demo, DEMO_PATH } from './helpers';

const CSV = 'static/demo/cycling-hypertension.csv';

describe('data results from the data-check pipeline', () => {
	const d = demo();
	const parsed = parseTable(readFileSync(CSV, 'utf8'));
	if (!parsed.ok) throw new Error(parsed.error.message);
	const checks = runDataChecks(d, parsed.table);
	const data = reportDataFromChecks(checks, labelLookup(d), 'cycling-hypertension.csv');

	it('carries every claim check and estimate with the pipeline’s numbers', () => {
		expect(checkReportData(JSON.parse(JSON.stringify(data)))).toBeTruthy();
		expect(data.source).toEqual({ name: 'cycling-hypertension.csv', rows: checks.rowCount });
		expect(data.checks).toHaveLength(checks.claims.checks.length);
		checks.claims.checks.forEach((c, i) => {
			const got = data.checks![i];
			expect(got.verdict).toBe(c.status === 'contradicted' ? 'inconsistent' : c.status === 'consistent' ? 'consistent' : 'not-tested');
			if (Number.isFinite(c.p)) expect(got.pValue).toBe(c.p);
		});
		const rows = checks.estimates!.rows.filter((r) => r.message === undefined);
		expect(data.estimates!.map((e) => [e.estimate, e.lower, e.upper, e.n])).toEqual(rows.map((r) => [r.estimate, r.ci[0], r.ci[1], r.n]));
		expect(data.estimates![0].label).toBe('Crude');
	});

	it('shows them in the report', () => {
		const md = reportMarkdown(buildReport({ diagram: d, data, date: new Date(2026, 2, 1) }));
		expect(md).toContain('## 8. Data checks and estimates');
		expect(md).toContain(`Data: cycling-hypertension.csv, ${checks.rowCount} rows.`);
		expect(md).toContain('E-value of the planned estimate');
	});

	it('runs from the command line with --data', async () => {
		let out = '';
		let err = '';
		const code = await main(['export', DEMO_PATH, '--format', 'report-md', '--data', CSV, '--date', '2026-03-01'], {
			stdout: (s) => (out += s),
			stderr: (s) => (err += s)
		});
		expect(err).toBe('');
		expect(code).toBe(0);
		// The command's report also prints the commands that reproduce it, with the paths it was given.
		const withFiles = reportDataFromChecks(checks, labelLookup(d), 'cycling-hypertension.csv', { diagram: DEMO_PATH, data: CSV });
		expect(out).toBe(reportMarkdown(buildReport({ diagram: d, data: withFiles, date: new Date(2026, 2, 1) })));
		expect(out).toContain(`npx causeway estimate ${DEMO_PATH} ${CSV}`);
	});

	it('states how each variable met the data (column, kind, reference level)', () => {
		const md = reportMarkdown(buildReport({ diagram: d, data, date: new Date(2026, 2, 1) }));
		expect(md).toContain('| Variable | Column | Analysed as | Reference level |');
		expect(md).toContain('| Commutes by bicycle | cycling | binary (detected) | 0 |');
		expect(md).toContain('| Age | age | continuous (detected) | – |');
		expect(data.columns).toHaveLength(12);
	});

	it('lists the reasons given for arrows among the assumptions', () => {
		const md = reportMarkdown(buildReport({ diagram: d, date: new Date(2026, 2, 1) }));
		expect(md).toContain('### Why the arrows are assumed');
		expect(md).toContain('| Age → Hypertension | Assumed: blood pressure rises with age in adults. |');
	});
});
