/**
 * The diagram as a TikZ picture for LaTeX documents (PGF/TikZ 3, library arrows.meta),
 * in the same visual language as the SVG figure: Okabe–Ito fills for exposure and outcome,
 * dashed unmeasured variables, a double square box around adjusted variables, role badges
 * in small italics under the names, and a legend in words under the picture.
 *
 * Positions are the canvas's, at 0.75 pt per pixel (CSS pixels at 96 dpi), y flipped; TikZ
 * draws the arrows between node borders itself. Labels are escaped for pdflatex (escapeLatex);
 * letters outside Latin-1/T1 need LuaLaTeX or XeLaTeX. O(n + m).
 */
import type { Diagram } from '../graph/diagram';
import type { VariableRoles } from '../causal';
import { BADGE_MEANING } from '../wording';
import { escapeLatex } from './escape';
import { palette } from '../palette';
import { badgeLine, figureOf, type FigureOptions } from './figure';
import { SOFTWARE_NAME, SOFTWARE_VERSION } from './version';

export interface TikzOptions extends FigureOptions {
	/** Plain black-and-white journal style: no fills. */
	mono?: boolean;
	/** Add the legend under the picture (default true). */
	legend?: boolean;
	/** A complete LaTeX document around the picture (article class; compiles with pdflatex). */
	standalone?: boolean;
}

const PT_PER_PX = 0.75;
const num = (v: number) => String(Math.round(v * PT_PER_PX * 100) / 100);

/** The tikzpicture environment, preceded by comments naming the packages it needs. */
/** A palette colour as xcolor's `{rgb,255:red,R;green,G;blue,B}` (TikZ reads no hex). */
function tikzRgb(hex: string): string {
	const [r, g, b] = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16));
	return `{rgb,255:red,${r};green,${g};blue,${b}}`;
}

export function writeTikz(d: Diagram, roles: readonly VariableRoles[], opts: TikzOptions = {}): string {
	const mono = opts.mono ?? false;
	const fig = figureOf(d, roles, opts);
	const name = new Map(fig.nodes.map((n, i) => [n.id, `v${i + 1}`]));
	const lines: string[] = [
		`% ${SOFTWARE_NAME} ${SOFTWARE_VERSION}: ${escapeComment(d.title || 'causal diagram')}`,
		'% Needs \\usepackage{tikz} and \\usetikzlibrary{arrows.meta} in the preamble.',
		'% To fit the text width: \\resizebox{\\linewidth}{!}{...} around the picture (package graphicx).',
		'\\begin{tikzpicture}[x=1pt, y=-1pt, >={Stealth[length=7pt, width=5pt]},',
		'  cwvar/.style={draw=black!90, rounded corners=3pt, line width=0.8pt, inner xsep=6pt, inner ysep=4pt, align=center, font=\\normalsize},',
		'  cwexposure/.style={' + (mono ? 'line width=1.6pt, font=\\normalsize\\bfseries' : 'fill=' + tikzRgb(palette.exposure) + ', font=\\normalsize\\bfseries') + '},',
		'  cwoutcome/.style={' + (mono ? 'line width=1.6pt, font=\\normalsize\\bfseries' : 'fill=' + tikzRgb(palette.outcome) + ', font=\\normalsize\\bfseries') + '},',
		'  cwunmeasured/.style={dashed, draw=black!' + (mono ? '90' : '65') + ', font=\\normalsize\\itshape},',
		'  cwadjusted/.style={rectangle, rounded corners=0pt, double=white, double distance=2pt, line width=0.9pt},',
		'  cwbadge/.style={font=\\footnotesize\\itshape}]'
	];
	for (const n of fig.nodes) {
		const styles = ['cwvar', n.exposure && 'cwexposure', n.outcome && 'cwoutcome', n.unmeasured && 'cwunmeasured', n.planned && 'cwadjusted'].filter(Boolean).join(', ');
		const label = n.lines.map(escapeLatex).join(' \\\\ ');
		const badge = n.badges.length ? ` \\\\ {\\footnotesize\\itshape\\mdseries ${escapeLatex(badgeLine(n.badges))}}` : '';
		const textColour = n.unmeasured && !mono && !n.exposure && !n.outcome ? ', text=black!70' : '';
		lines.push(`  % ${escapeComment(n.id)}`);
		lines.push(`  \\node[${styles}${textColour}] (${name.get(n.id)}) at (${num(n.x)}, ${num(n.y)}) {${label}${badge}};`);
	}
	for (const a of fig.arrows) lines.push(`  \\draw[->, line width=0.8pt] (${name.get(a.from)}) -- (${name.get(a.to)});`);
	if (opts.legend !== false && fig.nodes.length > 0) {
		lines.push(`  \\node[anchor=north west, align=left, font=\\footnotesize, text width=${num(Math.max(fig.maxX - fig.minX, 360))}pt] at (${num(fig.minX)}, ${num(fig.maxY + 18)}) {${legendText(fig, mono)}};`);
	}
	lines.push('\\end{tikzpicture}');
	const picture = lines.join('\n') + '\n';
	if (!opts.standalone) return picture;
	return `\\documentclass{article}
\\usepackage{graphicx}
\\usepackage{tikz}
\\usetikzlibrary{arrows.meta}
\\pagestyle{empty}
\\begin{document}
\\noindent\\resizebox{\\ifdim\\width>\\linewidth\\linewidth\\else\\width\\fi}{!}{%
${picture}}
\\end{document}
`;
}

function legendText(fig: ReturnType<typeof figureOf>, mono: boolean): string {
	const keys: string[] = [];
	if (fig.nodes.some((n) => n.exposure)) keys.push(mono ? 'exposure: bold name' : 'exposure: orange fill');
	if (fig.nodes.some((n) => n.outcome)) keys.push(mono ? 'outcome: bold name' : 'outcome: reddish-purple fill');
	if (fig.nodes.some((n) => n.unmeasured)) keys.push('unmeasured: dashed outline, italic name');
	if (fig.nodes.some((n) => n.planned)) keys.push('adjusted for (planned set): double square box');
	keys.push('arrow: assumed direct effect');
	const meanings = BADGE_MEANING.filter(([b]) => fig.badgesUsed.includes(b)).map(([b, m]) => `\\textit{${escapeLatex(b)}}: ${escapeLatex(m)}`);
	return [keys.map(escapeLatex).join('; ') + '.', ...meanings].join(' \\\\ ');
}

/** A TeX comment runs to the end of the line, so only line breaks need removing. */
function escapeComment(text: string): string {
	return text.replace(/[\r\n\u2028\u2029]+/g, ' ');
}
