/**
 * What the views of `causeway data` (tests, estimates, code) share: reading DIAGRAM and DATA (two
 * positionals), the --map / --type / --summary options, and running the same pipeline as
 * the app (src/lib/datacheck). The diagram file's data settings (each variable's column,
 * kind, reference level, value labels) are used as the app used them; --map and --type
 * override them. Every bad input becomes one UsageError/InputError line.
 */
import { createReadStream } from 'node:fs';
import { readFile, stat } from 'node:fs/promises';
import type { Diagram } from '../../../lib/graph/diagram';
import { InputError } from '../../../lib/graph/errors';
import { expandGroupedTable, parseTable, parseTableStream, StatsError, suggestCountColumn, type ColumnKind, type Table, type TableSource } from '../../../lib/stats';
import { countColumnHint } from '../../../lib/wording/warehouse';
import { parseSummaryMatrix, runDataChecks, runSummaryChecks, SETTINGS_WHERE, type DataCheckOptions, type DataCheckReport } from '../../../lib/datacheck';
import { UsageError } from '../../io';
import { describeFsError, readDiagramInput } from '../../read-input';
import type { Context, Options } from '../../command';

export const DATA_OPTIONS: Options = {
	map: { type: 'string', multiple: true },
	type: { type: 'string', multiple: true },
	summary: { type: 'boolean' },
	count: { type: 'string' },
	sql: { type: 'string' }
};

export const DATA_HELP = `DATA is a CSV or TSV file with a header row (delimiter, decimal comma and missing values
"", NA, ".", NaN are detected), or with --summary a correlation or covariance matrix with n.
The diagram file's data settings are used (each variable's column, kind, reference level and
value labels, as saved by the app); a setting the data cannot honour stops the command.
Other variables are matched to columns by id or label, ignoring case and punctuation;
variables without a column are treated as unmeasured for the checks.
  --map var=column,…      link variables to columns, over the file (var= leaves it without data)
  --type column=kind,…    column kind, over the file: binary, categorical, ordinal or continuous
  --summary               DATA is a summary matrix (see docs/data.md)
  --count COLUMN          DATA is a grouped table: each line stands for COLUMN rows (whole
                          numbers ≥ 0, at most 10,000,000 rows in all), e.g. GROUP BY … COUNT(*)
  --sql DIALECT[:TABLE]   print the SQL that makes the summary these checks need, for duckdb,
                          postgres or spark (DATA optional; run it where the rows are, then
                          read its result with --count n, or with --summary for moments)`;

const KINDS = new Set<ColumnKind>(['binary', 'categorical', 'ordinal', 'continuous']);

function pairs(ctx: Context, name: string): [string, string][] {
	return (ctx.list(name) ?? []).map((item) => {
		const eq = item.indexOf('=');
		if (eq <= 0) throw new UsageError(`--${name} takes name=value pairs, not "${item}"`);
		return [item.slice(0, eq).trim(), item.slice(eq + 1).trim()];
	});
}

async function readText(ctx: Context, path: string): Promise<string> {
	try {
		return ctx.io.readFile ? await ctx.io.readFile(path) : await readFile(path, 'utf8');
	} catch (err) {
		throw new UsageError(describeFsError(err, path));
	}
}

/**
 * Streams a file into typed columns without holding its text (files can be large); its size
 * lets the reader size the columns once instead of growing them.
 */
async function streamFile(path: string): Promise<{ source: TableSource; size: number }> {
	let size: number;
	try {
		const s = await stat(path);
		if (s.isDirectory()) throw Object.assign(new Error('folder'), { code: 'EISDIR' });
		size = s.size;
	} catch (err) {
		throw new UsageError(describeFsError(err, path));
	}
	return { source: createReadStream(path, { highWaterMark: 1 << 20 }) as unknown as AsyncIterable<Uint8Array>, size };
}

/**
 * A data file as typed columns, by the one reading path every command shares (streamed from
 * disk, decoded by the table reader: UTF-8, or UTF-16 after its byte-order mark), so `test`,
 * `estimate` and `export --data` accept and refuse the same files with the same words.
 */
export async function readDataTable(ctx: Context, path: string): Promise<Table> {
	return (await readDataWithNote(ctx, path)).table;
}

/**
 * The table, with --count the grouped table's rows (stats/table/grouped.ts); the note says
 * how many lines stood for how many rows, or, without --count, that a column named n, count
 * or freq holding only whole numbers ≥ 1 may be counts of rows (a hint, never applied).
 */
async function readDataWithNote(ctx: Context, path: string): Promise<{ table: Table; note: string | null }> {
	const file = ctx.io.readFile ? null : await streamFile(path);
	const parsed = file ? await parseTableStream(file.source, { totalBytes: file.size }) : parseTable(await readText(ctx, path));
	if (!parsed.ok) throw new InputError(`${path}: ${parsed.error.message}`);
	const count = ctx.values.count;
	if (typeof count !== 'string') {
		const hint = suggestCountColumn(parsed.table);
		return { table: parsed.table, note: hint === null ? null : countColumnHint(hint, 'cli') };
	}
	try {
		const table = expandGroupedTable(parsed.table, count);
		return { table, note: table.notes[table.notes.length - 1] };
	} catch (e) {
		if (e instanceof StatsError) throw new InputError(`${path}: ${e.message}`);
		throw e;
	}
}

export interface DataInput {
	diagram: Diagram;
	dataName: string;
	report: DataCheckReport;
}

/** Reads both files and runs the checks; `extra` adds the command's own options. */
export async function runOnData(ctx: Context, usage: string, extra: Partial<DataCheckOptions> = {}): Promise<DataInput> {
	if (ctx.positionals.length !== 2) throw new UsageError(`expected a diagram file and a data file (usage: ${usage})`);
	const [diagramPath, dataPath] = ctx.positionals;
	let diagram = await readDiagramInput(ctx.io, diagramPath);
	const q = ctx.question();
	diagram = { ...diagram, exposures: q.exposures ?? diagram.exposures, outcomes: q.outcomes ?? diagram.outcomes };
	// As `check` does: a planned variable the diagram does not have is bad input, not a row
	// that says "Not estimated".
	const known = new Set(diagram.variables.map((v) => v.id));
	const unknown = (extra.planned ?? []).find((id) => !known.has(id));
	if (unknown !== undefined) throw new InputError(`The adjusted variable "${unknown}" is not a variable of the diagram`);
	const mapping: Record<string, string | null> = {};
	for (const [v, c] of pairs(ctx, 'map')) mapping[v] = c === '' ? null : c;
	const types: Record<string, ColumnKind> = {};
	for (const [c, k] of pairs(ctx, 'type')) {
		if (!KINDS.has(k as ColumnKind)) throw new UsageError(`--type ${c}=${k}: the kind must be binary, categorical, ordinal or continuous`);
		types[c] = k as ColumnKind;
	}
	const where = (e: StatsError | { message: string }) => `${dataPath}: ${e.message}`;
	try {
		if (ctx.values.summary === true) {
			const summary = parseSummaryMatrix(await readText(ctx, dataPath));
			return { diagram, dataName: dataPath, report: runSummaryChecks(diagram, summary, { mapping, ...extra }) };
		}
		const { table, note } = await readDataWithNote(ctx, dataPath);
		const report = runDataChecks(diagram, table, { mapping, types, ...extra });
		return { diagram, dataName: dataPath, report: note === null ? report : { ...report, notes: [note, ...report.notes] } };
	} catch (e) {
		if (e instanceof StatsError) throw new InputError(where(e));
		if (e instanceof InputError && e.where === SETTINGS_WHERE) throw new InputError(`${where(e)} (--map overrides the diagram's link)`);
		throw e;
	}
}

/** The report as JSON: pictures are an app matter and left out. */
export function reportJson(report: DataCheckReport): DataCheckReport {
	return { ...report, arrows: { ...report.arrows, checks: report.arrows.checks.map(({ picture: _p, ...rest }) => rest) } };
}

export const CAUTION =
	'A diagram encodes assumptions; data can contradict a diagram but never prove it. Review by a qualified epidemiologist or statistician is advised.';
