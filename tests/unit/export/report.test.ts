/**
 * The protocol report, read back by independent parsers: the HTML by parse5 (the WHATWG HTML
 * parsing algorithm browsers use) and the Markdown by markdown-it (CommonMark). Labels that are
 * markup must come out as text: no script, no event handler, no element from a label.
 */
import { describe, expect, it } from 'vitest';
import { parse, type DefaultTreeAdapterMap } from 'parse5';
import MarkdownIt from 'markdown-it';
import { buildReport, reportAnalysis, formatNumber, formatP } from '../../../src/lib/export/report';
import { figurePageHtml, reportHtml, REPORT_CSP } from '../../../src/lib/export/report-html';
import { writeSvg } from '../../../src/lib/export/svg';
import { reportMarkdown } from '../../../src/lib/export/report-md';
import type { ReportDataResults } from '../../../src/lib/export/report-data';
import { checkReportData } from '../../../src/lib/export/report-data';
import { demo, hostileDemo, HOSTILE_LABELS } from './helpers';

type Node = DefaultTreeAdapterMap['node'];
type Element = DefaultTreeAdapterMap['element'];

function elements(node: Node, out: Element[] = []): Element[] {
	if ('tagName' in node) out.push(node);
	const kids = 'childNodes' in node ? node.childNodes : [];
	for (const c of kids) elements(c, out);
	if ('content' in node && node.content) elements(node.content as unknown as Node, out);
	return out;
}
function textOf(node: Node): string {
	if (node.nodeName === '#text') return (node as DefaultTreeAdapterMap['textNode']).value;
	return 'childNodes' in node ? node.childNodes.map(textOf).join('') : '';
}

const DATE = new Date(2026, 2, 1);
const DATA: ReportDataResults = {
	source: { name: 'cycling-hypertension.csv', rows: 2000, columns: 13 },
	checks: [{ statement: 'Age is independent of Distance to work', test: "partial correlation (Fisher's z)", statistic: 0.512, df: null, pValue: 0.0004, verdict: 'inconsistent' }],
	estimates: [
		{ label: 'Crude', adjustedFor: [], measure: 'odds ratio', estimate: 0.612345, lower: 0.5, upper: 0.75, n: 2000 },
		{ label: 'Adjusted', adjustedFor: ['age', 'income', 'diet'], measure: 'odds ratio', estimate: 0.8, lower: 0.66, upper: 0.97, n: 2000 }
	],
	notes: ['Complete cases only. <b>not bold</b>']
};

describe('HTML report', () => {
	const d = hostileDemo();
	const html = reportHtml(buildReport({ diagram: d, date: DATE, data: DATA, draft: 'Our plan <script>alert(1)</script>\n\nSecond paragraph.' }));
	const doc = parse(html);
	const els = elements(doc as unknown as Node);

	it('has no script, no event handler and no javascript: URL, whatever the labels', () => {
		expect(els.filter((e) => e.tagName === 'script')).toEqual([]);
		expect(els.filter((e) => e.tagName === 'img' || e.tagName === 'iframe' || e.tagName === 'object' || e.tagName === 'b')).toEqual([]);
		for (const e of els) {
			for (const a of e.attrs) {
				expect(a.name.startsWith('on'), `${e.tagName} ${a.name}`).toBe(false);
				expect(/^\s*javascript:/i.test(a.value)).toBe(false);
			}
		}
	});

	it('forbids scripts and remote loads by its own Content-Security-Policy', () => {
		const meta = els.find((e) => e.tagName === 'meta' && e.attrs.some((a) => a.name === 'http-equiv' && a.value === 'Content-Security-Policy'));
		expect(meta?.attrs.find((a) => a.name === 'content')?.value).toBe(REPORT_CSP);
		expect(REPORT_CSP).toContain("default-src 'none'");
		expect(REPORT_CSP).not.toContain('script-src');
		expect(els.filter((e) => e.tagName === 'link')).toEqual([]);
	});

	it('shows each label as text in the variable table and the inline SVG figure', () => {
		const rows = els.filter((e) => e.tagName === 'tr');
		for (const label of HOSTILE_LABELS) {
			expect(rows.some((r) => textOf(r as unknown as Node).startsWith(label))).toBe(true);
		}
		const svg = els.find((e) => e.tagName === 'svg')!;
		const svgTexts = elements(svg as unknown as Node).filter((e) => e.tagName === 'text').map((e) => textOf(e as unknown as Node));
		for (const label of HOSTILE_LABELS) expect(svgTexts).toContain(label);
	});

	it('has every section, in order, with the draft, data, cautions, version and date', () => {
		const headings = els.filter((e) => e.tagName === 'h2').map((e) => textOf(e as unknown as Node));
		expect(headings).toEqual([
			'1.Question',
			'2.Causal diagram',
			'3.Variables',
			'4.Assumptions',
			'5.Adjustment sets',
			'6.Planned adjustment and verdict',
			'7.Draft text for the analysis plan',
			'8.Data checks and estimates',
			'9.Cautions',
			'10.Software'
		]);
		const all = textOf(doc as unknown as Node);
		expect(all).toContain('Our plan <script>alert(1)</script>');
		expect(all).toContain('Made with Causeway 0.1.0 on 2026-03-01');
		expect(all).toContain('supports, and does not replace, review by qualified epidemiologists or statisticians');
		expect(all).toContain('0.612'); // three significant digits
		expect(all).toContain('< 0.001');
		expect(all).toContain('Complete cases only. <b>not bold</b>');
		const draft = els.find((e) => e.attrs.some((a) => a.name === 'class' && a.value === 'draft'))!;
		expect(draft.childNodes.filter((c) => c.nodeName === 'p')).toHaveLength(2);
	});
});

describe('figure print page', () => {
	it('holds only the escaped figure, under the same policy, with no script', () => {
		const d = hostileDemo();
		const page = figurePageHtml(d.variables[0].label, writeSvg(d, []));
		const els = elements(parse(page) as unknown as Node);
		expect(els.filter((e) => ['script', 'img'].includes(e.tagName))).toEqual([]);
		expect(els.find((e) => e.tagName === 'title') && textOf(els.find((e) => e.tagName === 'title') as unknown as Node)).toBe(d.variables[0].label);
		expect(els.filter((e) => e.tagName === 'svg')).toHaveLength(1);
		expect(page).toContain(REPORT_CSP);
	});
});

describe('report content', () => {
	it('states the question, the sets, the verdict and its reasons for the demo study', () => {
		const d = demo();
		const model = buildReport({ diagram: d, date: DATE });
		const md = reportMarkdown(model);
		expect(md).toContain('**Exposure:** Commutes by bicycle');
		expect(md).toContain('**Outcome:** Hypertension');
		expect(md).toContain('- {Age, Diet quality, Household income}');
		expect(md).toContain('**Sufficient.**');
		// Every arrow is stated in words.
		const assumptions = model.sections.find((s) => s.id === 'assumptions')!;
		const drawn = assumptions.blocks[1];
		expect(drawn.kind).toBe('list');
		const sentences = drawn.kind === 'list' ? drawn.items.join('\n') : '';
		const label = new Map(d.variables.map((v) => [v.id, v.label]));
		for (const a of d.arrows) expect(sentences).toMatch(new RegExp(`^${label.get(a.from)} directly affects .*${label.get(a.to)}`, 'm'));
	});

	it('gives the reasons when the planned set fails (overadjustment: Schisterman, Cole & Platt 2009)', () => {
		const d = demo();
		d.adjusted = ['age', 'income', 'diet', 'bmi'];
		const model = buildReport({ diagram: d, date: DATE });
		const planned = model.sections.find((s) => s.id === 'planned')!;
		expect(planned.blocks[0]).toMatchObject({ kind: 'verdict', valid: false });
		expect(JSON.stringify(planned.blocks[1])).toContain('Body-mass index is a mediator');
	});

	it('says what is missing when there is no question yet, and still draws the figure', () => {
		const d = demo();
		d.exposures = [];
		const model = buildReport({ diagram: d, date: DATE });
		const md = reportMarkdown(model);
		expect(md).toContain('not yet defined');
		expect(md).toContain('data:image/svg+xml;base64,');
		expect(reportAnalysis(d).sets).toBeNull();
	});
});

describe('Markdown report, rendered by markdown-it (CommonMark)', () => {
	const md = new MarkdownIt({ html: true });
	const d = hostileDemo();
	const model = buildReport({ diagram: d, date: DATE, data: DATA });
	const text = reportMarkdown(model);
	// markdown-it, like GitHub, refuses SVG data URIs, so the figure is checked as a linked file.
	const rendered = md.render(reportMarkdown(model, { figureFile: 'study figure.svg' }));

	it('renders no element from a label even with raw HTML allowed', () => {
		const doc = parse(rendered);
		const els = elements(doc as unknown as Node);
		expect(els.filter((e) => ['script', 'b', 'iframe'].includes(e.tagName))).toEqual([]);
		// The only image is the figure.
		const imgs = els.filter((e) => e.tagName === 'img');
		expect(imgs).toHaveLength(1);
		expect(imgs[0].attrs.find((a) => a.name === 'src')?.value).toBe('study%20figure.svg');
		expect(els.filter((e) => e.tagName === 'a')).toEqual([]);
		for (const e of els) for (const a of e.attrs) expect(a.name.startsWith('on')).toBe(false);
	});

	it('keeps table rows whole (a "|" in a label does not split a cell) and labels as text', () => {
		const doc = parse(rendered);
		const tables = elements(doc as unknown as Node).filter((e) => e.tagName === 'table');
		const variables = tables[0];
		const rows = elements(variables as unknown as Node).filter((e) => e.tagName === 'tr');
		expect(rows).toHaveLength(d.variables.length + 1);
		for (const r of rows) expect(elements(r as unknown as Node).filter((e) => e.tagName === 'td' || e.tagName === 'th')).toHaveLength(6);
		const firstCells = rows.slice(1).map((r) => textOf(elements(r as unknown as Node).find((e) => e.tagName === 'td') as unknown as Node));
		expect(firstCells).toEqual(d.variables.map((v) => v.label));
	});

	it('embeds a figure whose SVG decodes to the figure of the HTML report', () => {
		const src = /data:image\/svg\+xml;base64,([A-Za-z0-9+/=]+)/.exec(text)![1];
		const svg = Buffer.from(src, 'base64').toString('utf8');
		expect(svg.startsWith('<?xml')).toBe(true);
		const html = reportHtml(buildReport({ diagram: d, date: DATE, data: DATA }));
		expect(html).toContain(svg.replace(/^<\?xml[^>]*\?>\s*/, ''));
	});
});

describe('number formatting and data input', () => {
	it('formats estimates to three significant digits and p-values below 0.001 as "< 0.001"', () => {
		expect(formatNumber(0.612345)).toBe('0.612');
		expect(formatNumber(1234.5)).toBe('1,230');
		expect(formatNumber(0.0000123)).toBe('0.0000123'); // never e-notation
		expect(formatNumber(null)).toBe('—');
		expect(formatP(0.0004)).toBe('< 0.001');
		expect(formatP(0.04321)).toBe('0.043');
	});

	it('names the first wrong field of a results file', () => {
		expect(() => checkReportData({ estimates: [{ label: 'x', measure: 'OR', adjustedFor: [], estimate: '1.2' }] })).toThrow(
			'estimates[0].estimate must be a number, found the text "1.2"'
		);
		expect(() => checkReportData({ checks: [{ statement: 's', test: 't', verdict: 'maybe' }] })).toThrow('checks[0].verdict must be');
		expect(() => checkReportData([])).toThrow('the results must be a JSON object, found a list');
		expect(checkReportData(DATA)).toBe(DATA);
	});
});
