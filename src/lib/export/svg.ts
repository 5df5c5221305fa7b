/**
 * The diagram as a standalone SVG 1.1 figure for papers, protocols and slides: vector shapes,
 * text as text (searchable, selectable, editable in a drawing program), a font stack with a
 * generic fallback, every label XML-escaped, role badges under the names and a legend.
 *
 * Visual language (DESIGN.md): exposure orange fill, outcome reddish purple fill (Okabe & Ito
 * 2008; the values are in src/lib/palette.ts), unmeasured dashed outline with grey name, planned (adjusted)
 * variables inside a square box; roles are written as text, never shown by colour alone.
 * The black-and-white style drops the fills (exposure and outcome keep their bold names and
 * badges) for journals that print in greyscale. O(n + m).
 */
import type { Diagram } from '../graph/diagram';
import type { VariableRoles } from '../causal';
import { BADGE_MEANING, countText } from '../wording';
import { escapeXml } from './escape';
import { palette } from '../palette';
import { BADGE_PX, badgeLine, figureOf, LABEL_PX, LINE_GAP, PLANNED_OFFSET, type Figure, type FigureNode, type FigureOptions } from './figure';
import { arialWidth, FIGURE_FONT_STACK } from './text-width';

export interface SvgOptions extends FigureOptions {
	/** Plain black-and-white journal style: no fills, black ink. */
	mono?: boolean;
	/** Draw the legend under the diagram (default true). */
	legend?: boolean;
	/** Text for the <desc> element (screen readers); a summary of the diagram by default. */
	description?: string;
}

const INK = palette.text;
const GREY = palette.unmeasured;
const ARROW = palette.arrow;
const FILL = { exposure: palette.exposure, outcome: palette.outcome } as const;
const PAPER = palette.surface;
const BLACK = palette.monoInk;
const MARGIN = 16;
const LEGEND_PX = 11;

/** Rounds to 0.01 px so output is short and the same on every machine. */
const n2 = (v: number) => String(Math.round(v * 100) / 100);

interface Ink {
	fill(n: FigureNode): string;
	label(n: FigureNode): string;
	border(n: FigureNode): string;
	arrow: string;
}

function inkFor(mono: boolean): Ink {
	if (mono) return { fill: () => PAPER, label: () => BLACK, border: () => BLACK, arrow: BLACK };
	return {
		fill: (n) => (n.exposure ? FILL.exposure : n.outcome ? FILL.outcome : PAPER),
		// An unmeasured exposure or outcome keeps dark ink on its fill, for contrast.
		label: (n) => (n.unmeasured && !n.exposure && !n.outcome ? GREY : INK),
		border: (n) => (n.unmeasured ? GREY : INK),
		arrow: ARROW
	};
}

function nodeSvg(n: FigureNode, ink: Ink, mono: boolean): string {
	const left = n.x - n.w / 2;
	const top = n.y - n.h / 2;
	const strong = n.exposure || n.outcome;
	const parts: string[] = [];
	const dash = n.unmeasured ? ' stroke-dasharray="6 4"' : '';
	const rx = n.planned ? '0' : '6';
	const borderWidth = n.planned ? 2.5 : strong && mono ? 2.5 : n.unmeasured ? 2 : 1.5;
	parts.push(
		`<rect x="${n2(left)}" y="${n2(top)}" width="${n2(n.w)}" height="${n2(n.h)}" rx="${rx}" fill="${ink.fill(n)}" stroke="${ink.border(n)}" stroke-width="${borderWidth}"${dash}/>`
	);
	if (n.planned) {
		const o = PLANNED_OFFSET;
		parts.push(`<rect x="${n2(left - o)}" y="${n2(top - o)}" width="${n2(n.w + 2 * o)}" height="${n2(n.h + 2 * o)}" fill="none" stroke="${mono ? BLACK : INK}" stroke-width="2"/>`);
	}
	const blockH = n.lines.length * LABEL_PX * LINE_GAP + (n.badges.length ? BADGE_PX * LINE_GAP : 0);
	let baseline = n.y - blockH / 2 + LABEL_PX * LINE_GAP * 0.5 + LABEL_PX * 0.35;
	const tspans: string[] = [];
	for (const line of n.lines) {
		tspans.push(`<tspan x="${n2(n.x)}" y="${n2(baseline)}">${escapeXml(line)}</tspan>`);
		baseline += LABEL_PX * LINE_GAP;
	}
	const weight = strong ? ' font-weight="bold"' : '';
	const style = n.unmeasured ? ' font-style="italic"' : '';
	parts.push(`<text text-anchor="middle" font-size="${LABEL_PX}" fill="${ink.label(n)}"${weight}${style}>${tspans.join('')}</text>`);
	if (n.badges.length) {
		const y = baseline - LABEL_PX * LINE_GAP + (LABEL_PX + BADGE_PX) * LINE_GAP * 0.5 - BADGE_PX * 0.05;
		parts.push(`<text x="${n2(n.x)}" y="${n2(y)}" text-anchor="middle" font-size="${BADGE_PX}" font-style="italic" fill="${mono ? BLACK : palette.textSoft}">${escapeXml(badgeLine(n.badges))}</text>`);
	}
	return `<g class="variable" data-id="${escapeXml(n.id)}">${parts.join('')}</g>`;
}

interface LegendPart {
	svg: string;
	height: number;
	width: number;
}

/** Legend keys for what the figure shows, wrapped to `maxWidth`, then the badges' meanings. */
function legendSvg(fig: Figure, ink: Ink, mono: boolean, maxWidth: number): LegendPart {
	const keys: { draw: (x: number, y: number) => string; text: string; w: number }[] = [];
	const swatch = (fill: string, opts: { dash?: boolean; boxed?: boolean; bold?: boolean } = {}) => (x: number, y: number) => {
		const r = `<rect x="${n2(x)}" y="${n2(y - 8)}" width="22" height="14" rx="${opts.boxed ? 0 : 3}" fill="${fill}" stroke="${opts.dash && !mono ? GREY : mono ? BLACK : INK}" stroke-width="${opts.bold ? 2.5 : 1.5}"${opts.dash ? ' stroke-dasharray="4 3"' : ''}/>`;
		const outer = opts.boxed ? `<rect x="${n2(x - 3)}" y="${n2(y - 11)}" width="28" height="20" fill="none" stroke="${mono ? BLACK : INK}" stroke-width="1.5"/>` : '';
		return r + outer;
	};
	const has = (p: (n: FigureNode) => boolean) => fig.nodes.some(p);
	if (has((n) => n.exposure)) keys.push({ draw: swatch(mono ? PAPER : FILL.exposure, { bold: mono }), text: mono ? 'exposure (bold name)' : 'exposure', w: 0 });
	if (has((n) => n.outcome)) keys.push({ draw: swatch(mono ? PAPER : FILL.outcome, { bold: mono }), text: mono ? 'outcome (bold name)' : 'outcome', w: 0 });
	if (has((n) => n.unmeasured)) keys.push({ draw: swatch(PAPER, { dash: true }), text: 'unmeasured (dashed, italic name)', w: 0 });
	if (has((n) => n.planned)) keys.push({ draw: swatch(PAPER, { boxed: true }), text: 'adjusted for (planned set; boxed)', w: 0 });
	keys.push({ draw: (x, y) => `<line x1="${n2(x)}" y1="${n2(y - 1)}" x2="${n2(x + 20)}" y2="${n2(y - 1)}" stroke="${ink.arrow}" stroke-width="1.6" marker-end="url(#cw-arrowhead)"/>`, text: 'assumed direct effect', w: 0 });
	for (const k of keys) k.w = 30 + arialWidth(k.text, LEGEND_PX) + 18;
	const out: string[] = [];
	let x = 0;
	let y = 10;
	for (const k of keys) {
		if (x > 0 && x + k.w > maxWidth) {
			x = 0;
			y += 22;
		}
		out.push(k.draw(x + 3, y), `<text x="${n2(x + 32)}" y="${n2(y + 3)}" font-size="${LEGEND_PX}" fill="${mono ? BLACK : INK}">${escapeXml(k.text)}</text>`);
		x += k.w;
	}
	let width = Math.max(...keys.map((k) => k.w));
	const meanings = BADGE_MEANING.filter(([badge]) => fig.badgesUsed.includes(badge));
	if (meanings.length) y += 8;
	for (const [badge, meaning] of meanings) {
		y += 16;
		out.push(
			`<text x="0" y="${n2(y + 3)}" font-size="${LEGEND_PX}" fill="${mono ? BLACK : INK}"><tspan font-style="italic">${escapeXml(badge)}</tspan>: ${escapeXml(meaning)}</text>`
		);
		width = Math.max(width, arialWidth(`${badge}: ${meaning}`, LEGEND_PX));
	}
	return { svg: `<g class="legend" font-size="${LEGEND_PX}">${out.join('')}</g>`, height: y + 10, width };
}

function defaultDescription(d: Diagram): string {
	const label = new Map(d.variables.map((v) => [v.id, v.label]));
	const names = (ids: string[]) => ids.map((id) => label.get(id) ?? id).join(', ') || 'none chosen';
	return `Causal diagram with ${countText(d.variables.length, 'variable')} and ${countText(d.arrows.length, 'arrow')}. Exposure: ${names(d.exposures)}. Outcome: ${names(d.outcomes)}. Adjusted for: ${names(d.adjusted) === 'none chosen' ? 'nothing' : names(d.adjusted)}.`;
}

/** The figure as an SVG document (UTF-8, with XML declaration). */
export function writeSvg(d: Diagram, roles: readonly VariableRoles[], opts: SvgOptions = {}): string {
	const mono = opts.mono ?? false;
	const ink = inkFor(mono);
	const fig = figureOf(d, roles, opts);
	const diagramW = fig.maxX - fig.minX;
	const diagramH = fig.maxY - fig.minY;
	const legend = opts.legend === false ? null : legendSvg(fig, ink, mono, Math.max(diagramW, 420));
	const contentW = Math.max(diagramW, legend ? legend.width : 0);
	const width = Math.ceil(contentW + 2 * MARGIN);
	const legendGap = legend ? 24 : 0;
	const height = Math.ceil(diagramH + 2 * MARGIN + (legend ? legendGap + legend.height : 0));
	const dx = MARGIN - fig.minX;
	const dy = MARGIN - fig.minY;
	const arrows = fig.arrows
		.map((a) => `<line x1="${n2(a.x1)}" y1="${n2(a.y1)}" x2="${n2(a.x2)}" y2="${n2(a.y2)}" data-from="${escapeXml(a.from)}" data-to="${escapeXml(a.to)}"/>`)
		.join('\n');
	const nodes = fig.nodes.map((n) => nodeSvg(n, ink, mono)).join('\n');
	const title = d.title.trim() || 'Causal diagram';
	return `<?xml version="1.0" encoding="UTF-8"?>
<svg xmlns="http://www.w3.org/2000/svg" version="1.1" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}" font-family="${escapeXml(FIGURE_FONT_STACK)}" role="img" aria-labelledby="cw-title cw-desc">
<title id="cw-title">${escapeXml(title)}</title>
<desc id="cw-desc">${escapeXml(opts.description ?? defaultDescription(d))}</desc>
<defs><marker id="cw-arrowhead" viewBox="0 0 10 8" refX="10" refY="4" markerUnits="userSpaceOnUse" markerWidth="10" markerHeight="8" orient="auto"><path d="M0,0 L10,4 L0,8 z" fill="${ink.arrow}"/></marker></defs>
<rect width="100%" height="100%" fill="${PAPER}"/>
<g transform="translate(${n2(dx)} ${n2(dy)})">
<g class="arrows" stroke="${ink.arrow}" stroke-width="1.6" marker-end="url(#cw-arrowhead)">
${arrows}
</g>
<g class="variables">
${nodes}
</g>
</g>
${legend ? `<g transform="translate(${MARGIN} ${n2(MARGIN + diagramH + legendGap)})">${legend.svg}</g>\n` : ''}</svg>
`;
}
