/**
 * `causeway export DIAGRAM --format F [-o OUT]`: every export of the app's Report section from
 * the command line (src/lib/export/formats.ts), byte for byte the same as the app's for the
 * same diagram, options and date. A diagram without positions (a DOT file, hand-written JSON)
 * is laid out first with the app's tidy layout (dagre) so that figures can be drawn.
 */
import { readFile, writeFile } from 'node:fs/promises';
import type { Diagram } from '../../lib/graph/diagram';
import { InputError } from '../../lib/graph/errors';
import { EXPORT_FORMATS, exportText, isExportFormat, type ExportFormat } from '../../lib/export/formats';
import { figureOf } from '../../lib/export/figure';
import { reportAnalysis } from '../../lib/export/report';
import { checkReportData, type ReportDataResults } from '../../lib/export/report-data';
import { reportDataFromChecks } from '../../lib/export/from-datacheck';
import { readDataTable } from './data-input';
import { runDataChecks } from '../../lib/datacheck';
import { labelLookup } from '../../lib/wording';
import { needsLayout, tidyPositions, withPositions } from '../../lib/layout';
import { UsageError } from '../io';
import { QUESTION, QUESTION_HELP, type Command, type Context } from '../command';
import { SUMMARY } from '../summaries';

const FORMAT_NAMES = Object.keys(EXPORT_FORMATS).join('|');

/** Format from the output file's extension, for `-o figure.svg` without --format. */
function formatFromName(name: string): ExportFormat | null {
	const lower = name.toLowerCase();
	const byEnd: [string, ExportFormat][] = [
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

async function readText(ctx: Context, path: string, what: string): Promise<string> {
	try {
		return await (ctx.io.readFile ?? ((p: string) => readFile(p, 'utf8')))(path);
	} catch (e) {
		const code = (e as { code?: unknown } | null)?.code;
		throw new UsageError(`cannot read the ${what} file "${path}"${code === 'ENOENT' ? ': no such file' : ''}`);
	}
}

function withQuestion(d: Diagram, q: { exposures?: string[]; outcomes?: string[] }): Diagram {
	const exposures = q.exposures ?? d.exposures;
	const outcomes = q.outcomes ?? d.outcomes;
	return { ...d, exposures, outcomes, adjusted: d.adjusted.filter((id) => !exposures.includes(id) && !outcomes.includes(id)) };
}

export const exportCommand: Command = {
	summary: SUMMARY.export,
	usage: `causeway export DIAGRAM --format ${FORMAT_NAMES} [-o OUT] [options]`,
	details: `Writes one export of the diagram (to OUT, or to standard output when -o is left out or "-"):
  svg            the figure (vector, text as text, role badges and legend)
  tikz           the figure as a TikZ picture for LaTeX (--standalone: a whole document)
  dot            DOT for Graphviz, roles as node attributes
  json           the native Causeway diagram file
  variables-csv  id,label,measured,roles
  arrows-csv     from,to,from_label,to_label
  sets-csv       the minimal sufficient sets, smallest, optimal and planned set
  sets-md        the same as a Markdown table
  report-md      the protocol report in Markdown (figure embedded as an SVG data URI)
  report-html    the protocol report as one self-contained HTML file (prints to PDF)
  --format F         which export (md and html stand for report-md and report-html; --to is
                     the same option); when left out, taken from OUT's extension
  -o, --output OUT   the file to write
  --mono             plain black-and-white figure
  --no-legend        figure without legend
  --standalone       tikz: a complete LaTeX document
  --draft FILE       reports: the draft paragraph to print (text file) instead of the generated one
  --data FILE        reports: run the data checks and estimates on this CSV/TSV (as
                     "causeway test" and "causeway estimate" do) and include them
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
		let format: ExportFormat;
		if (typeof named === 'string') {
			if (named === 'md' || named === 'html') format = named === 'md' ? 'report-md' : 'report-html';
			else if (!isExportFormat(named)) throw new UsageError(`--format must be one of ${FORMAT_NAMES}, not "${named}"`);
			else format = named;
		} else {
			const guessed = out === '-' ? null : formatFromName(out);
			if (!guessed) throw new UsageError(`export needs --format (${FORMAT_NAMES})`);
			format = guessed;
		}
		let date: Date | undefined;
		if (typeof ctx.values.date === 'string') {
			const [y, m, day] = ctx.values.date.split('-').map(Number);
			date = new Date(y, m - 1, day);
			if (!/^\d{4}-\d{2}-\d{2}$/.test(ctx.values.date) || date.getMonth() !== m - 1 || date.getDate() !== day) {
				throw new UsageError(`--date must be a date like 2026-03-01, not "${ctx.values.date}"`);
			}
		}
		let data: ReportDataResults | undefined;
		if (typeof ctx.values.results === 'string') {
			const path = ctx.values.results;
			const text = await readText(ctx, path, 'results');
			let parsed: unknown;
			try {
				parsed = JSON.parse(text);
			} catch (e) {
				throw new InputError(`${path}: not valid JSON (${(e as Error).message})`);
			}
			try {
				data = checkReportData(parsed);
			} catch (e) {
				throw new InputError(`${path}: ${(e as Error).message}`);
			}
		}
		const draft = typeof ctx.values.draft === 'string' ? await readText(ctx, ctx.values.draft, 'draft') : undefined;

		let d = withQuestion(await ctx.diagram(), ctx.question());
		if (typeof ctx.values.data === 'string') {
			if (data) throw new UsageError('use either --data or --results, not both');
			const path = ctx.values.data;
			const table = await readDataTable(ctx, path);
			// The report prints the commands that reproduce its figures (not when --exposure/--outcome changed the question).
			const q = ctx.question();
			const files = q.exposures || q.outcomes ? undefined : { diagram: ctx.positionals[0], data: path };
			data = reportDataFromChecks(runDataChecks(d, table), labelLookup(d), path.replace(/^.*[/\\]/, ''), { diagram: d, files });
		}
		const question = d.exposures.length > 0 && d.outcomes.length > 0;
		const analysis = question || EXPORT_FORMATS[format].needsQuestion ? reportAnalysis(d) : { sets: null, check: null, roles: [] };
		if (EXPORT_FORMATS[format].needsQuestion && !analysis.sets) {
			throw new InputError(`${format} needs a valid diagram with an exposure and an outcome (use --exposure and --outcome)`);
		}
		if (['svg', 'tikz', 'report-md', 'report-html'].includes(format) && needsLayout(d)) {
			const fig = figureOf({ ...d, variables: d.variables.map((v) => ({ ...v, x: 0, y: 0 })) }, analysis.roles);
			d = withPositions(d, tidyPositions({ nodes: fig.nodes.map((n) => ({ id: n.id, w: n.w, h: n.h })), arrows: d.arrows.map((a) => ({ from: a.from, to: a.to })) }));
		}
		const text = exportText(format, d, {
			analysis,
			mono: ctx.values.mono === true,
			legend: ctx.values['no-legend'] !== true,
			standalone: ctx.values.standalone === true,
			draft,
			data,
			date,
			figureFile: typeof ctx.values['figure-file'] === 'string' ? ctx.values['figure-file'] : undefined
		});
		const write = ctx.io.writeFile ?? writeFile;
		if (out === '-') ctx.io.stdout(text);
		else await write(out, text);
		// The linked figure goes beside the report (or into the working folder for stdout).
		const figureFile = ctx.values['figure-file'];
		if (format === 'report-md' && typeof figureFile === 'string') {
			const folder = out === '-' ? '' : out.replace(/[^/\\]*$/, '');
			await write(folder + figureFile, exportText('svg', d, { analysis, mono: ctx.values.mono === true, legend: true }));
		}
		return 0;
	}
};
