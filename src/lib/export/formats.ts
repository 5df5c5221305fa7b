/**
 * Every export by name, for the CLI (`causeway export --format …`) and the app's Report
 * section alike: one function from a diagram (and, optionally, the engine results the caller
 * already has) to the file's text, with its usual extension and media type.
 */
import type { Diagram } from '../graph/diagram';
import { InputError } from '../graph/errors';
import { writeDot } from '../graph/dot';
import { writeDiagramJson } from '../graph/native-json';
import { buildReport, reportAnalysis, type ReportAnalysis } from './report';
import type { ReportDataResults } from './report-data';
import { reportHtml } from './report-html';
import { reportMarkdown } from './report-md';
import { writeSvg } from './svg';
import { arrowsCsv, setsCsv, setsMarkdown, variablesCsv } from './tables';
import { writeTikz } from './tikz';

export const EXPORT_FORMATS = {
	svg: { extension: '.svg', mime: 'image/svg+xml', title: 'Figure (SVG)', needsQuestion: false },
	tikz: { extension: '.tex', mime: 'application/x-tex', title: 'Figure (TikZ for LaTeX)', needsQuestion: false },
	dot: { extension: '.dot', mime: 'text/vnd.graphviz', title: 'DOT (Graphviz)', needsQuestion: false },
	json: { extension: '.causeway.json', mime: 'application/json', title: 'Causeway diagram (JSON)', needsQuestion: false },
	'variables-csv': { extension: '.variables.csv', mime: 'text/csv', title: 'Variables (CSV)', needsQuestion: false },
	'arrows-csv': { extension: '.arrows.csv', mime: 'text/csv', title: 'Arrows (CSV)', needsQuestion: false },
	'sets-csv': { extension: '.sets.csv', mime: 'text/csv', title: 'Adjustment sets (CSV)', needsQuestion: true },
	'sets-md': { extension: '.sets.md', mime: 'text/markdown', title: 'Adjustment sets (Markdown)', needsQuestion: true },
	'report-md': { extension: '.report.md', mime: 'text/markdown', title: 'Protocol report (Markdown)', needsQuestion: false },
	'report-html': { extension: '.report.html', mime: 'text/html', title: 'Protocol report (HTML, prints to PDF)', needsQuestion: false }
} as const;

export type ExportFormat = keyof typeof EXPORT_FORMATS;

export const isExportFormat = (name: string): name is ExportFormat => Object.hasOwn(EXPORT_FORMATS, name);

export interface ExportOptions {
	/** Engine results already computed (the app's); computed from the diagram when left out. */
	analysis?: ReportAnalysis;
	/** Black-and-white figure (svg, tikz, reports). */
	mono?: boolean;
	/** Legend under the figure (svg, tikz); default true. */
	legend?: boolean;
	/** TikZ as a complete LaTeX document. */
	standalone?: boolean;
	/** Reports: the team's edited draft paragraph. */
	draft?: string | null;
	/** Reports: data checks and estimates. */
	data?: ReportDataResults | null;
	/** Reports: the date printed (default now). */
	date?: Date;
	/** Markdown report: link the figure to this file instead of embedding it. */
	figureFile?: string;
}

/** The text of one export. Throws InputError when the format needs what the diagram lacks. */
export function exportText(format: ExportFormat, d: Diagram, opts: ExportOptions = {}): string {
	const analysis = () => opts.analysis ?? reportAnalysis(d);
	const report = () => buildReport({ diagram: d, analysis: analysis(), draft: opts.draft, data: opts.data, date: opts.date, mono: opts.mono });
	switch (format) {
		case 'svg':
			return writeSvg(d, analysis().roles, { mono: opts.mono, legend: opts.legend });
		case 'tikz':
			return writeTikz(d, analysis().roles, { mono: opts.mono, legend: opts.legend, standalone: opts.standalone });
		case 'dot':
			return writeDot(d);
		case 'json':
			return writeDiagramJson(d);
		case 'variables-csv':
			return variablesCsv(d, analysis().roles);
		case 'arrows-csv':
			return arrowsCsv(d);
		case 'sets-csv':
		case 'sets-md': {
			const a = analysis();
			if (!a.sets) throw new InputError('The adjustment sets need a valid diagram with an exposure and an outcome');
			return format === 'sets-csv' ? setsCsv(d, { sets: a.sets, check: a.check }) : setsMarkdown(d, { sets: a.sets, check: a.check });
		}
		case 'report-md':
			return reportMarkdown(report(), { figureFile: opts.figureFile });
		case 'report-html':
			return reportHtml(report());
	}
}
