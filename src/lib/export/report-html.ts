/**
 * The protocol report as one self-contained HTML file: inline CSS, the figure as inline SVG,
 * no script and nothing loaded from anywhere (a Content-Security-Policy meta tag forbids
 * scripts and remote loads even if a browser found something to run). Prints to PDF from the
 * browser (A4/Letter, figure kept on one page). Every piece of user text is escaped with
 * escapeXml; the SVG is made by writeSvg, which escapes its own text. O(size of the report).
 */
import { escapeXml as h } from './escape';
import type { Block, ReportModel } from './report';
import { palette } from '../palette';

export const REPORT_CSP = "default-src 'none'; style-src 'unsafe-inline'; img-src data:; base-uri 'none'; form-action 'none'";

const CSS = `
:root { color-scheme: light; }
* { box-sizing: border-box; }
body { margin: 0; background: ${palette.page}; color: ${palette.text}; font: 15px/1.55 "Source Serif Pro", Georgia, "DejaVu Serif", serif; }
main { max-width: 52rem; margin: 2rem auto; background: ${palette.surface}; padding: 2.5rem 3rem 2rem; border: 1px solid ${palette.ruleSoft}; }
header { border-bottom: 2px solid ${palette.text}; margin-bottom: 1.5rem; padding-bottom: 0.8rem; }
h1 { font: 700 1.7rem/1.25 Arial, "Liberation Sans", Helvetica, sans-serif; margin: 0 0 0.3rem; }
.meta { font: 0.85rem Arial, "Liberation Sans", Helvetica, sans-serif; color: ${palette.hint}; margin: 0; }
h2 { font: 700 1.15rem/1.3 Arial, "Liberation Sans", Helvetica, sans-serif; margin: 2rem 0 0.6rem; padding-top: 0.4rem; border-top: 1px solid ${palette.ruleSoft}; }
h2 .num { color: ${palette.accentText}; margin-right: 0.4rem; }
h3 { font: 700 0.98rem Arial, "Liberation Sans", Helvetica, sans-serif; margin: 1.2rem 0 0.4rem; }
p { margin: 0.5rem 0; }
ul { margin: 0.4rem 0; padding-left: 1.3rem; }
li { margin: 0.25rem 0; }
table { border-collapse: collapse; width: 100%; margin: 0.6rem 0; font: 0.86rem/1.4 Arial, "Liberation Sans", Helvetica, sans-serif; }
th, td { text-align: left; vertical-align: top; padding: 0.35rem 0.5rem; border-bottom: 1px solid ${palette.tableRule}; }
thead th { border-bottom: 1.5px solid ${palette.text}; font-weight: 700; }
td.num, th.num { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
table.facts th { width: 12rem; font-weight: 700; }
caption { text-align: left; font-style: italic; color: ${palette.textSoft}; padding-bottom: 0.3rem; }
pre.code { font: 0.78rem/1.4 "DejaVu Sans Mono", Menlo, Consolas, monospace; background: ${palette.control}; border: 1px solid ${palette.ruleSoft}; padding: 0.7rem 0.9rem; overflow-x: auto; white-space: pre; }
figure { margin: 1rem -2rem; text-align: center; break-inside: avoid; page-break-inside: avoid; }
figcaption { margin-left: 2rem; margin-right: 2rem; }
figure svg { max-width: 100%; height: auto; }
figcaption { font: 0.85rem/1.45 Arial, "Liberation Sans", Helvetica, sans-serif; color: ${palette.textSoft}; text-align: left; margin-top: 0.5rem; }
.verdict { border-left: 5px solid; padding: 0.6rem 0.9rem; margin: 0.6rem 0; font-weight: 600; }
.verdict.ok { border-color: ${palette.accent}; background: ${palette.info}; }
.verdict.bad { border-color: ${palette.warning}; background: ${palette.warningSurface}; }
.verdict strong { display: block; font: 700 0.8rem Arial, "Liberation Sans", Helvetica, sans-serif; letter-spacing: 0.04em; text-transform: uppercase; }
.draft { border: 1px dashed ${palette.border}; background: ${palette.draft}; padding: 0.8rem 1rem; margin: 0.6rem 0; }
.hint { font: italic 0.85rem Arial, "Liberation Sans", Helvetica, sans-serif; color: ${palette.hint}; }
footer { margin-top: 2rem; font: 0.8rem Arial, "Liberation Sans", Helvetica, sans-serif; color: ${palette.hint}; }
@media print {
  @page { margin: 18mm 16mm; }
  body { background: ${palette.surface}; font-size: 10.5pt; }
  main { margin: 0; padding: 0; border: 0; max-width: none; }
  h2, h3 { break-after: avoid; page-break-after: avoid; }
  tr, li, .verdict { break-inside: avoid; page-break-inside: avoid; }
  pre.code { white-space: pre-wrap; overflow-wrap: anywhere; }
  .draft { border-style: solid; }
  figure { margin: 0.8rem 0; }
  figcaption { margin-left: 0; margin-right: 0; }
  .verdict.ok, .verdict.bad { -webkit-print-color-adjust: exact; print-color-adjust: exact; }
}
`;

/** The SVG document without its XML declaration, for inline use. */
export function inlineSvg(svg: string): string {
	return svg.replace(/^<\?xml[^>]*\?>\s*/, '');
}

function blockHtml(b: Block): string {
	switch (b.kind) {
		case 'paragraph':
			return `<p>${h(b.text)}</p>`;
		case 'subheading':
			return `<h3>${h(b.text)}</h3>`;
		case 'list':
			return `<ul>${b.items.map((i) => `<li>${h(i)}</li>`).join('')}</ul>`;
		case 'verdict':
			return `<div class="verdict ${b.valid ? 'ok' : 'bad'}"><strong>${b.valid ? 'Sufficient' : 'Not sufficient'}</strong>${h(b.text)}</div>`;
		case 'draft':
			return `<p class="hint">${h(b.hint)} In this file you can click into the box and edit before printing.</p><div class="draft" contenteditable="true">${b.text
				.split(/\n\s*\n/)
				.map((p) => `<p>${h(p).replace(/\n/g, '<br>')}</p>`)
				.join('')}</div>`;
		case 'code':
			return `<pre class="code" aria-label="${h(b.language)} code"><code>${h(b.text)}</code></pre>`;
		case 'figure':
			return `<figure>${inlineSvg(b.svg)}<figcaption>${h(b.caption)}</figcaption></figure>`;
		case 'table': {
			const num = (i: number) => (b.numeric?.[i] ? ' class="num"' : '');
			if (b.head.every((x) => x === '')) {
				return `<table class="facts"><tbody>${b.rows.map((r) => `<tr><th scope="row">${h(r[0])}</th>${r.slice(1).map((c) => `<td>${h(c)}</td>`).join('')}</tr>`).join('')}</tbody></table>`;
			}
			return `<table>${b.caption ? `<caption>${h(b.caption)}</caption>` : ''}<thead><tr>${b.head.map((c, i) => `<th scope="col"${num(i)}>${h(c)}</th>`).join('')}</tr></thead><tbody>${b.rows
				.map((r) => `<tr>${r.map((c, i) => `<td${num(i)}>${h(c)}</td>`).join('')}</tr>`)
				.join('')}</tbody></table>`;
		}
	}
}

export function reportHtml(model: ReportModel): string {
	const sections = model.sections
		.map((s, i) => `<section id="${h(s.id)}">\n<h2><span class="num">${i + 1}.</span>${h(s.heading)}</h2>\n${s.blocks.map(blockHtml).join('\n')}\n</section>`)
		.join('\n');
	return `<!DOCTYPE html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta http-equiv="Content-Security-Policy" content="${REPORT_CSP}">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="generator" content="${h(model.meta)}">
<title>${h(model.title)}</title>
<style>${CSS}</style>
</head>
<body>
<main>
<header>
<h1>${h(model.title)}</h1>
<p class="meta">Causal diagram and adjustment plan · ${h(model.meta)}</p>
</header>
${sections}
<footer>Generated by ${h(model.meta)}. The diagram encodes assumptions; have them reviewed by qualified epidemiologists or statisticians.</footer>
</main>
</body>
</html>
`;
}

/** A page holding only the figure, for printing it on its own (print to PDF from the browser). */
export function figurePageHtml(title: string, svg: string): string {
	return `<!DOCTYPE html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta http-equiv="Content-Security-Policy" content="${REPORT_CSP}">
<title>${h(title)}</title>
<style>
body { margin: 0; padding: 12mm; background: ${palette.surface}; }
svg { max-width: 100%; height: auto; display: block; margin: 0 auto; }
@media print { @page { margin: 12mm; size: landscape; } body { padding: 0; } svg { max-height: 180mm; } }
</style>
</head>
<body>
${inlineSvg(svg)}
</body>
</html>
`;
}
