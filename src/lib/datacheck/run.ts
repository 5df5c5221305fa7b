/**
 * The data checks in one call — the entry point shared by the app's data worker, the
 * `causeway test` / `causeway estimate` commands and the benchmarks, so all show the same
 * numbers:
 *   runDataChecks(diagram, table, options) → DataCheckReport
 * diagram + parsed table (+ each variable's data settings in the diagram — column, kind,
 * reference level, value labels — with the caller's mapping and kinds on top, settings.ts)
 * → arrow checks, claim checks and crude vs adjusted estimates. Variables without a column
 * are treated as unmeasured (and the report says so). Throws InputError for a diagram that
 * cannot be analysed (cycle, unknown arrow ends) or a bad mapping, StatsError for a bad
 * column kind. Cost: one test per arrow and per claim, two fits per estimate row.
 */
import type { Diagram } from '../graph/diagram';
import { InputError } from '../graph/errors';
import { validateDiagram } from '../graph/validate';
import { own, categoryCodeValues, interruptWhen, NEVER, TableStatistics, type Column, type Table } from '../stats';
import { arrowCheckSteps } from './arrow-checks';
import { claimCheckSteps } from './claim-checks';
import { confounderSteps } from './confounding';
import { estimateSteps } from './estimates';
import { drain, drainAsync, type Steps } from './steps';
import { dataDiagram } from './mapping';
import { retypeTable } from './retype';
import { applyDataSettings, type SettingProblems } from './settings';
import type { AnalysedColumn, ArrowChecks, ClaimChecks, DataCheckReport, MappingOverrides, TypeOverrides, VariableMapping } from './types';

export interface DataCheckOptions {
	/** Variable id → column name (null: leave the variable without data), over the diagram's settings; the rest is matched by name. */
	mapping?: MappingOverrides;
	/** Column name → kind, over the diagram's settings and the detected kinds. */
	types?: TypeOverrides;
	/** A diagram setting the data cannot honour: refused (default, the CLI) or left out with a note (the app). */
	settingProblems?: SettingProblems;
	/** Significance level for the verdicts (default 0.05). */
	alpha?: number;
	/** The planned set for the estimates (default: the diagram's). */
	planned?: readonly string[];
	/** Which parts to compute (default all); the confounder check comes with the estimates unless `confounders` is false. */
	parts?: { arrows?: boolean; claims?: boolean; estimates?: boolean; confounders?: boolean };
	/** Include the numbers for the pictures beside each arrow check. */
	pictures?: boolean;
	maxClaims?: number;
	maxSets?: number;
	/** Progress by stage: arrows, claims, then estimates; `fraction` of that stage done. */
	onProgress?: (p: DataCheckProgress) => void;
	/**
	 * Statistics of the table computed once and shared by every check (src/lib/stats/sufficient);
	 * keep one per table across runs (the data worker does). Made for this run when absent.
	 */
	statistics?: TableStatistics;
	/** Asked between checks and inside long loops; when it says so the run throws Cancelled. */
	isCancelled?: () => boolean;
}

export interface DataCheckProgress {
	stage: 'arrows' | 'claims' | 'estimates';
	fraction: number;
}

const STRUCTURAL = new Set(['duplicate-id', 'unknown-arrow-end', 'self-loop', 'cycle']);

/** The table's columns by name, after the user's kind overrides. */
export function prepareTable(table: Table, types: TypeOverrides = {}): { table: Table; columnOf: (name: string) => Column } {
	const t = retypeTable(table, types);
	const byName = new Map(t.columns.map((c) => [c.name, c]));
	return {
		table: t,
		columnOf: (name) => {
			const c = byName.get(name);
			if (!c) throw new InputError(`Column "${name}" is not in the data`);
			return c;
		}
	};
}

/** Whether every value of the column as read from the file is a number. O(levels). */
function numbersInFile(c: Column): boolean {
	return c.kind === 'continuous' || c.levels.every((l) => l.trim() !== '' && Number.isFinite(Number(l)));
}

/** The linked columns as analysed, in diagram order. O(variables + rows of code-like columns). */
export function analysedColumns(diagram: Diagram, mapping: VariableMapping, columnOf: (name: string) => Column, original: Table): AnalysedColumn[] {
	const read = new Map(original.columns.map((c) => [c.name, c]));
	return diagram.variables.flatMap((v) => {
		const name = own(mapping.columns, v.id);
		if (name === undefined) return [];
		const c = columnOf(name);
		const file = read.get(name) ?? c;
		return [{ variable: v.id, column: name, kind: c.kind, levels: c.kind === 'continuous' ? [] : [...c.levels], numbersInFile: numbersInFile(file), codeValues: categoryCodeValues(c) }];
	});
}

export function runDataChecks(diagram: Diagram, table: Table, options: DataCheckOptions = {}): DataCheckReport {
	return drain(dataCheckSteps(diagram, table, options));
}

/**
 * runDataChecks giving way to the event loop between checks (every `sliceMs` of work), so a
 * worker can take a cancel message: `isCancelled` then says so and the run throws Cancelled.
 */
export function runDataChecksAsync(diagram: Diagram, table: Table, options: DataCheckOptions & { pause: () => Promise<void>; sliceMs?: number; now?: () => number }): Promise<DataCheckReport> {
	return drainAsync(dataCheckSteps(diagram, table, options), options.pause, options.sliceMs, options.now);
}

/** The checks as steps (steps.ts): one per arrow, claim, estimate row and candidate. */
export function* dataCheckSteps(diagram: Diagram, table: Table, options: DataCheckOptions = {}): Steps<DataCheckReport> {
	const structural = validateDiagram(diagram).find((i) => STRUCTURAL.has(i.code));
	if (structural) throw new InputError(structural.message);
	const { table: t, columnOf, mapping, used } = applyDataSettings(diagram, table, options);
	const seen = dataDiagram(diagram, mapping);
	const parts = { arrows: true, claims: true, estimates: true, confounders: true, ...options.parts };
	const alpha = options.alpha ?? 0.05;
	const statistics = options.statistics ?? new TableStatistics();
	const isCancelled = options.isCancelled;
	statistics.interrupt = isCancelled ? interruptWhen(isCancelled) : NEVER;
	statistics.interrupt.poll();
	statistics.expect([...new Set(Object.values(mapping.columns))].map(columnOf));
	const progress = (stage: DataCheckProgress['stage']) => (d: number, total: number) => options.onProgress?.({ stage, fraction: d / total });
	const arrows: ArrowChecks = parts.arrows ? yield* arrowCheckSteps(diagram, columnOf, mapping, { alpha, pictures: options.pictures, onProgress: progress('arrows'), statistics }) : { alpha, checks: [], skipped: [] };
	const claims: ClaimChecks = parts.claims
		? yield* claimCheckSteps(seen, columnOf, mapping, { alpha, max: options.maxClaims, onProgress: progress('claims'), statistics })
		: { alpha, checks: [], noTestableClaim: [], tested: 0, contradicted: 0, truncated: false };
	if (parts.estimates) options.onProgress?.({ stage: 'estimates', fraction: 0 });
	// The estimate rows are the first half of the stage, the confounder check the second.
	const half = (from: number) => (d: number, total: number) => options.onProgress?.({ stage: 'estimates', fraction: from + (parts.confounders ? 0.5 : 1 - from) * (d / total) });
	const est = parts.estimates ? yield* estimateSteps(seen, columnOf, mapping, { planned: options.planned, maxSets: options.maxSets, statistics, onProgress: half(0) }) : { estimates: null, message: 'Not computed.' };
	const confounders = parts.estimates && parts.confounders ? yield* confounderSteps(seen, columnOf, mapping, statistics, half(0.5)) : null;
	const categoryCodes = t.columns.flatMap((c) => {
		const values = categoryCodeValues(c);
		return values ? [{ column: c.name, values }] : [];
	});
	const columns = analysedColumns(diagram, mapping, columnOf, table);
	const skippedColumns = t.skipped.map((s) => s.message);
	return {
		mapping,
		arrows,
		claims,
		estimates: est.estimates,
		estimatesMessage: est.message,
		confounders,
		categoryCodes,
		columns,
		format: { ...t.format },
		rowCount: t.rowCount,
		columnsUsed: used,
		notes: [...mapping.notes, ...skippedColumns],
		...(t.grouped ? { grouped: { ...t.grouped } } : {})
	};
}
