/**
 * `causeway export DIAGRAM --format F [-o OUT]`: the diagram in another form — the native JSON
 * file or DOT (what `convert` did), the figure, tables or the protocol report (documents.ts,
 * loaded only for those: the figure, report, data and layout code took 0.1–0.2 s to load,
 * measured against the old `convert` on the demo and on a 3,000-variable file).
 */
import { writeFile } from 'node:fs/promises';
import type { Diagram } from '../../../lib/graph/diagram';
import { writeDiagramJson } from '../../../lib/graph/native-json';
import { QUESTION, QUESTION_HELP, type Command } from '../../command';
import { UsageError } from '../../io';

/** Every format, in the order the help lists them (a test holds it to src/lib/export/formats.ts). */
export const FORMAT_LIST = ['svg', 'tikz', 'dot', 'json', 'variables-csv', 'arrows-csv', 'sets-csv', 'sets-md', 'report-md', 'report-html'] as const;

/** Format from the output file's extension, for `-o figure.svg` without --format. */
function formatFromName(name: string): string | null {
	const lower = name.toLowerCase();
	const byEnd: [string, string][] = [
		['.report.html', 'report-html'],
		['.html', 'report-html'],
		['.report.md', 'report-md'],
		['.sets.md', 'sets-md'],
		['.sets.csv', 'sets-csv'],
		['.variables.csv', 'variables-csv'],
		['.arrows.csv', 'arrows-csv'],
		['.svg', 'svg'],
		['.tex', 'tikz'],
		['.dot', 'dot'],
		['.gv', 'dot'],
		['.json', 'json']
	];
	return byEnd.find(([end]) => lower.endsWith(end))?.[1] ?? null;
}

/** The diagram asked another question (--exposure, --outcome); the planned set keeps the rest. */
export function withQuestion(d: Diagram, q: { exposures?: string[]; outcomes?: string[] }): Diagram {
	const exposures = q.exposures ?? d.exposures;
	const outcomes = q.outcomes ?? d.outcomes;
	return { ...d, exposures, outcomes, adjusted: d.adjusted.filter((id) => !exposures.includes(id) && !outcomes.includes(id)) };
}

export const exportView: Command = {
	usage: `causeway export DIAGRAM --format ${FORMAT_LIST.join('|')} [-o OUT] [options]`,
	details: `Writes the diagram in one form (to OUT, or to standard output when -o is left out or "-"):
  json           the native Causeway diagram file
  dot            DOT for Graphviz, roles as node attributes
  svg            the figure (vector, text as text, role badges and legend)
  tikz           the figure as a TikZ picture for LaTeX (--standalone: a whole document)
  variables-csv  id,label,measured,roles
  arrows-csv     from,to,from_label,to_label
  sets-csv       the minimal sufficient sets, smallest, optimal and planned set
  sets-md        the same as a Markdown table
  report-md      the protocol report in Markdown (figure embedded as an SVG data URI)
  report-html    the protocol report as one self-contained HTML file (prints to PDF)
  --format F         which form (md and html stand for report-md and report-html; --to is
                     the same option); when left out, taken from OUT's extension (.json,
                     .dot, .gv, .svg, .tex, .html, .report.md, .sets.csv …)
  -o, --output OUT   the file to write
  --mono             plain black-and-white figure
  --no-legend        figure without legend
  --standalone       tikz: a complete LaTeX document
  --draft FILE       reports: the draft paragraph to print (text file) instead of the generated one
  --data FILE        reports: run the data checks and estimates on this CSV/TSV (as
                     "causeway data tests" and "causeway data estimates" do) and include them
  --results FILE     reports: data checks and estimates from a JSON file (docs/export.md)
  --figure-file NAME report-md: write the figure to NAME beside OUT and link it, instead of
                     embedding it (for renderers that refuse SVG data URIs, e.g. GitHub)
  --date YYYY-MM-DD  reports: the date printed (default today)
${QUESTION_HELP}`,
	options: {
		...QUESTION,
		format: { type: 'string' },
		to: { type: 'string' },
		output: { type: 'string', short: 'o' },
		mono: { type: 'boolean' },
		'no-legend': { type: 'boolean' },
		standalone: { type: 'boolean' },
		draft: { type: 'string' },
		results: { type: 'string' },
		data: { type: 'string' },
		'figure-file': { type: 'string' },
		date: { type: 'string' }
	},
	async run(ctx) {
		const out = typeof ctx.values.output === 'string' ? ctx.values.output : '-';
		const named = ctx.values.format ?? ctx.values.to;
		let format: string;
		// Short names of the design's contract: md and html are the report, csv the adjustment sets.
		const SHORT: Record<string, string> = { md: 'report-md', html: 'report-html', csv: 'sets-csv' };
		if (typeof named === 'string') format = Object.hasOwn(SHORT, named) ? SHORT[named] : named;
		else {
			const guessed = out === '-' ? null : formatFromName(out);
			if (!guessed) throw new UsageError(`${ctx.name} needs --format (${FORMAT_LIST.join('|')})`);
			format = guessed;
		}
		if (format !== 'json' && format !== 'dot') {
			await (await import('./documents')).writeDocument(ctx, format, out);
			return 0;
		}
		const read = await ctx.diagram();
		const q = ctx.question();
		const d = q.exposures || q.outcomes ? withQuestion(read, q) : read;
		// The DOT writer (and its parser library) is loaded only when DOT is asked for.
		const text = format === 'dot' ? (await import('../../../lib/graph/dot')).writeDot(d) : writeDiagramJson(d);
		if (out === '-') ctx.io.stdout(text);
		else await (ctx.io.writeFile ?? writeFile)(out, text);
		return 0;
	}
};
