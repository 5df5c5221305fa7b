/**
 * The documents of `causeway export` (export.ts chooses the format): figures, tables and the
 * protocol report, byte for byte the same as the app's Report section for the same diagram,
 * options and date (src/lib/export/formats.ts). A diagram without positions (a DOT file,
 * hand-written JSON) is laid out first with the app's tidy layout so that figures can be drawn.
 * Loaded only for these formats: it brings in the figure, report, data and layout code.
 */
import { readFile, writeFile } from 'node:fs/promises';
import { InputError } from '../../../lib/graph/errors';
import { EXPORT_FORMATS, exportText, isExportFormat, type ExportFormat } from '../../../lib/export/formats';
import { figureOf } from '../../../lib/export/figure';
import { reportAnalysis } from '../../../lib/export/report';
import { checkReportData, type ReportDataResults } from '../../../lib/export/report-data';
import { reportDataFromChecks } from '../../../lib/export/from-datacheck';
import { readDataTable } from '../data/input';
import { runDataChecks } from '../../../lib/datacheck';
import { labelLookup } from '../../../lib/wording';
import { needsLayout, tidyPositions, withPositions } from '../../../lib/layout';
import { UsageError } from '../../io';
import type { Context } from '../../command';
import { withQuestion } from './export';

const FORMAT_NAMES = Object.keys(EXPORT_FORMATS).join('|');

async function readText(ctx: Context, path: string, what: string): Promise<string> {
	try {
		return await (ctx.io.readFile ?? ((p: string) => readFile(p, 'utf8')))(path);
	} catch (e) {
		const code = (e as { code?: unknown } | null)?.code;
		throw new UsageError(`cannot read the ${what} file "${path}"${code === 'ENOENT' ? ': no such file' : ''}`);
	}
}

/** Writes one document export (`named` as the user gave it) to `out` ("-" = standard output). */
export async function writeDocument(ctx: Context, named: string, out: string): Promise<void> {
	if (!isExportFormat(named)) throw new UsageError(`--format must be one of ${FORMAT_NAMES}, not "${named}"`);
	const format: ExportFormat = named;
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
}
