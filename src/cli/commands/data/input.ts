/**
 * What the views of `causeway data` (tests, estimates, code) share: reading DIAGRAM and DATA (two
 * positionals), the --map / --type / --summary options, and running the same pipeline as
 * the app (src/lib/datacheck). The diagram file's data settings (each variable's column,
 * kind, reference level, value labels) are used as the app used them; --map and --type
 * override them. Every bad input becomes one UsageError/InputError line.
 */
import { createReadStream } from 'node:fs';
import { open, readFile, stat } from 'node:fs/promises';
import type { Diagram } from '../../../lib/graph/diagram';
import { InputError } from '../../../lib/graph/errors';
import { expandGroupedTable, parseTable, parseTableStream, StatsError, suggestCountColumn, type ColumnKind, type Table, type TableSource } from '../../../lib/stats';
import { countColumnHint } from '../../../lib/wording/warehouse';
import { isParquetMagic, type ParquetBytes } from '../../../lib/stats/table/parquet-bytes';
import { groupedCountsSql, isMomentsText, momentsSql, parseSqlTarget, readMoments, summaryPlan } from '../../../lib/datacheck/warehouse';
import { parseSummaryMatrix, runDataChecks, runSummaryChecks, SETTINGS_WHERE, type DataCheckOptions, type DataCheckReport } from '../../../lib/datacheck';
import { UsageError } from '../../io';
import { describeFsError, readDiagramInput } from '../../read-input';
import type { Context, Options } from '../../command';

export const DATA_OPTIONS: Options = {
	map: { type: 'string', multiple: true },
	type: { type: 'string', multiple: true },
	summary: { type: 'boolean' },
	count: { type: 'string' }
};

/** `--sql DIALECT[:TABLE]`, on the views whose checks a summary can carry (tests, estimates). */
export const SQL_OPTION: Options = { sql: { type: 'string' } };

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
                          numbers ≥ 0, at most 10,000,000 rows in all), e.g. GROUP BY … COUNT(*)`;

export const SQL_HELP = `  --sql DIALECT[:TABLE]   print the SQL that summarizes TABLE (default "data") where it lives for
                          these checks — grouped counts, and sums and cross-products when every
                          linked column is continuous — for duckdb, postgres or spark; DATA is
                          then optional (a sample gives the kinds). Read the result back with
                          --count n, or the moments with --summary`;

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
	const parquet = await parquetFile(path);
	const file = parquet || ctx.io.readFile ? null : await streamFile(path);
	const parsed = parquet ? await (await import('../../../lib/stats/table/read-parquet')).parseParquet(parquet) : file ? await parseTableStream(file.source, { totalBytes: file.size }) : parseTable(await readText(ctx, path));
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

/** --map and --type as the pipeline's overrides. */
function overrides(ctx: Context): { mapping: Record<string, string | null>; types: Record<string, ColumnKind> } {
	const mapping: Record<string, string | null> = {};
	for (const [v, c] of pairs(ctx, 'map')) mapping[v] = c === '' ? null : c;
	const types: Record<string, ColumnKind> = {};
	for (const [c, k] of pairs(ctx, 'type')) {
		if (!KINDS.has(k as ColumnKind)) throw new UsageError(`--type ${c}=${k}: the kind must be binary, categorical, ordinal or continuous`);
		types[c] = k as ColumnKind;
	}
	return { mapping, types };
}

/**
 * With --sql: prints the summary SQL for the diagram and its column mapping
 * (src/lib/datacheck/warehouse) and returns true; DATA, when given, gives the column names
 * and kinds (a sample or an empty file with the header is enough). False without --sql.
 */
export async function printSummarySql(ctx: Context, usage: string): Promise<boolean> {
	const target = ctx.values.sql;
	if (typeof target !== 'string') return false;
	if (ctx.positionals.length < 1 || ctx.positionals.length > 2) throw new UsageError(`expected a diagram file, and optionally a data file (usage: ${usage} --sql DIALECT[:TABLE])`);
	const { dialect, table } = parseSqlTarget(target);
	let diagram = await readDiagramInput(ctx.io, ctx.positionals[0]);
	const q = ctx.question();
	diagram = { ...diagram, exposures: q.exposures ?? diagram.exposures, outcomes: q.outcomes ?? diagram.outcomes };
	const { mapping, types } = overrides(ctx);
	const dataPath = ctx.positionals[1];
	const columns = dataPath === undefined ? undefined : (await readDataTable(ctx, dataPath)).columns.map((c) => ({ name: c.name, kind: c.kind }));
	const plan = summaryPlan(diagram, { table: columns, mapping, types });
	const moments = momentsSql(plan, dialect, table);
	if (ctx.json) {
		ctx.printJson({ dialect, table, columns: plan.columns, countColumn: plan.countName, groupedCounts: groupedCountsSql(plan, dialect, table), moments });
		return true;
	}
	ctx.print(groupedCountsSql(plan, dialect, table));
	if (moments) ctx.print(`-- Or, every linked column being continuous, one line of moments:
${moments}`);
	return true;
}

/**
 * The file as hyparquet's byte source when it is Parquet (its first bytes are "PAR1"), read by
 * range from disk (always from disk: Parquet is binary, never text); null otherwise. A file
 * that cannot be opened is left to the text reader, which names the problem.
 */
async function parquetFile(path: string): Promise<ParquetBytes | null> {
	let handle;
	try {
		handle = await open(path, 'r');
	} catch {
		return null;
	}
	const head = new Uint8Array(4);
	const { size } = await handle.stat();
	await handle.read(head, 0, 4, 0);
	await handle.close();
	if (size < 12 || !isParquetMagic(head)) return null;
	return {
		byteLength: size,
		slice: async (start: number, end?: number) => {
			const h = await open(path, 'r');
			try {
				const length = (end ?? size) - start;
				const buffer = new Uint8Array(length);
				await h.read(buffer, 0, length, start);
				return buffer.buffer;
			} finally {
				await h.close();
			}
		}
	};
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
	const { mapping, types } = overrides(ctx);
	const where = (e: StatsError | { message: string }) => `${dataPath}: ${e.message}`;
	try {
		if (ctx.values.summary === true) {
			const text = await readText(ctx, dataPath);
			const summary = isMomentsText(text) ? readMoments(text) : parseSummaryMatrix(text);
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
