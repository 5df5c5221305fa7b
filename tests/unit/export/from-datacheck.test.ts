/**
 * The report's data section filled from the data-check pipeline (src/lib/datacheck) run on the
 * demo study's simulated data: every claim check and every estimate arrives, with the
 * pipeline's own numbers, and the report shows them — with the arrow checks of the exposure
 * and the outcome (two-way tables), the confounder check of every candidate, the crude on each
 * row's own rows, the standardized estimates and the analysis code of the planned set as an
 * appendix; `causeway export --data` does the same. The numbers themselves are held to R
 * elsewhere (tests/unit/stats/confounding.test.ts, tests/unit/cli/confounder-commands.test.ts).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { runDataChecks } from '../../../src/lib/datacheck';
import { parseTable } from '../../../src/lib/stats';
import { reportDataFromChecks } from '../../../src/lib/export/from-datacheck';
import { buildReport } from '../../../src/lib/export/report';
import { reportMarkdown } from '../../../src/lib/export/report-md';
import { checkReportData } from '../../../src/lib/export/report-data';
import { reportHtml } from '../../../src/lib/export/report-html';
import { labelLookup } from '../../../src/lib/wording';
import { main } from '../../../src/cli/main';
import { demo, DEMO_PATH } from './helpers';

const CSV = 'static/demo/cycling-hypertension.csv';

describe('data results from the data-check pipeline', () => {
	const d = demo();
	const parsed = parseTable(readFileSync(CSV, 'utf8'));
	if (!parsed.ok) throw new Error(parsed.error.message);
	const checks = runDataChecks(d, parsed.table);
	const label = labelLookup(d);
	const data = reportDataFromChecks(checks, label, 'cycling-hypertension.csv', { diagram: d });

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
		expect(checks.rowCount).toBe(5000);
		expect(md).toContain('Data: cycling-hypertension.csv, 5,000 rows.');
		expect(md).toContain('E-value of the planned estimate');
	});

	it('carries the arrow checks of the exposure and outcome, the confounder check, the crude on the same rows, the standardized estimates and the code', () => {
		const arrows = data.arrowChecks!;
		// Every arrow touching cycling or hypertension, and no other.
		expect(arrows.map((a) => a.arrow)).toEqual(
			checks.arrows.checks.filter((c) => ['cycling', 'hypertension'].includes(c.from) || ['cycling', 'hypertension'].includes(c.to)).map((c) => `${label(c.from)} → ${label(c.to)}`)
		);
		const family = arrows.find((a) => a.arrow === 'Family history of hypertension → Hypertension')!;
		const table = checks.arrows.checks.find((c) => c.from === 'family_history' && c.to === 'hypertension')!.table!;
		expect(family.table!.rows.map((r) => r.slice(1, 3))).toEqual(table.counts.map((row, i) => row.map((n, j) => `${n.toLocaleString('en-GB')} (${Math.round(table.rowProportions[i][j] * 100)} %)`)));
		expect(family.table!.tests[0]).toMatch(/^Pearson X² = 75\.4, 1 df, p < 0\.001\.$/);
		expect(family.table!.oddsRatios!.rows).toEqual([['1 vs 0', '1.77', '1.56 to 2.02', '< 0.001']]);
		expect(family.kinds).toBe('Family history of hypertension: binary (reference 0); Hypertension: binary (reference 0)');
		const rows = data.confounders!.rows;
		expect(rows.map((r) => r.candidate)).toEqual(checks.confounders!.candidates.map((c) => label(c.id)));
		expect(rows.find((r) => r.candidate === 'Age')!.stratified).toBe('0.523 (0.453 to 0.605) over fifths');
		expect(rows.find((r) => r.candidate === 'Cardiorespiratory fitness')!.withExposure).toBe('not a candidate: a mediator (adjusting for it removes part of the effect)');
		const planned = checks.estimates!.rows.find((r) => r.roles.includes('planned'))!;
		const reportPlanned = data.estimates!.find((e) => /planned/i.test(e.label))!;
		expect([reportPlanned.crudeSameRows, reportPlanned.changePercent]).toEqual([planned.crudeSameRows, planned.changePercent]);
		expect(reportPlanned.kinds).toBe('continuous: Age, Diet quality, Household income');
		const std = data.standardized!.find((x) => /planned/i.test(x.label))!;
		expect([std.riskDifference, std.rdLower, std.rdUpper]).toEqual([planned.standardized!.riskDifference.estimate, ...planned.standardized!.riskDifference.ci]);
		expect(data.code!.map((c) => c.tag)).toEqual(['r', 'stata', 'sas', 'python']);
		expect(data.code![0].text).toContain('fit_adjusted <- glm(hypertension ~ cycling + age + diet + income, family = binomial, data = d)');
		expect(checkReportData(JSON.parse(JSON.stringify(data)))).toBeTruthy();
	});

	it('the report shows them: tables with captions, the collapsibility sentence, the code appendix fenced (Markdown) and escaped (HTML)', () => {
		const model = buildReport({ diagram: d, data, date: new Date(2026, 2, 1) });
		const md = reportMarkdown(model);
		expect(md).toContain('### Arrow checks of the exposure and the outcome');
		expect(md).toContain('| Family history of hypertension \\\\ Hypertension | 0 | 1 | total |');
		expect(md).toContain('### Confounder check of every candidate');
		expect(md).toMatch(/\| Age \| continuous \| confounder · common cause \| d = −0\.268, p \\< 0\.001, n = 5,000 \|/);
		expect(md).toContain('is non-collapsibility');
		expect(md).toContain('## 11. Appendix: analysis code');
		expect(md).toContain('```r\n# R (glm) code made by Causeway');
		const html = reportHtml(model);
		expect(html).toContain('<pre class="code" aria-label="R (glm) code"><code># R (glm) code made by Causeway');
		expect(html).toContain('d &lt;- read.csv(');
		expect(html).toContain('<caption>Family history of hypertension → Hypertension. Counts of');
	});

	it('a results file with a wrong new part names the field', () => {
		expect(() => checkReportData({ confounders: { rows: [{ candidate: 'Age' }] } })).toThrow('confounders.rows[0].kind must be text, found undefined');
		expect(() => checkReportData({ standardized: [{ label: 'x', adjustedFor: [], risk1: '0.2' }] })).toThrow('standardized[0].risk1 must be a number, found the text "0.2"');
		expect(() => checkReportData({ code: [{ language: 'R', tag: 'r' }] })).toThrow('code[0].text must be text, found undefined');
		expect(() => checkReportData({ arrowChecks: [{ arrow: 'a', kinds: 'k', result: 'r', verdict: 'v', table: { caption: 'c', head: ['x'], rows: [[1]], tests: [] } }] })).toThrow(
			'arrowChecks[0].table.rows must be a list of rows of texts'
		);
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
		const withFiles = reportDataFromChecks(checks, labelLookup(d), 'cycling-hypertension.csv', { diagram: d, files: { diagram: DEMO_PATH, data: CSV } });
		expect(out).toBe(reportMarkdown(buildReport({ diagram: d, data: withFiles, date: new Date(2026, 2, 1) })));
		expect(out).toContain(`npx causeway data estimates ${DEMO_PATH} ${CSV}`);
	});

	it('states how each variable met the data (column, kind, reference level)', () => {
		const md = reportMarkdown(buildReport({ diagram: d, data, date: new Date(2026, 2, 1) }));
		expect(md).toContain('| Variable | Column | Analysed as | Reference level |');
		expect(md).toContain('| Commutes by bicycle | cycling | binary (detected) | 0 |');
		expect(md).toContain('| Age | age | continuous (detected) | — |');
		expect(data.columns).toHaveLength(12);
	});

	it('lists the reasons given for arrows among the assumptions', () => {
		const md = reportMarkdown(buildReport({ diagram: d, date: new Date(2026, 2, 1) }));
		expect(md).toContain('### Why the arrows are assumed');
		expect(md).toContain('| Age → Hypertension | Assumed: blood pressure rises with age in adults. |');
	});
});
