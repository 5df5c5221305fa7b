/** Text output shared by `causeway data tests` and `causeway data estimates`: header, notices, tables. */
import type { DataCheckReport, TwoWayTable } from '../../../lib/datacheck';
import { categoryCodeNotice, chiSquareText, kindText, levelOddsRatioCells, tableRiskDifferenceText, twoWayCells, countText, formatCount } from '../../../lib/wording';
import type { Context } from '../../command';
export type { Command } from '../../command';

/** Columns padded to their widest cell; `right` columns aligned right (numbers). O(cells). */
export function textTable(head: readonly string[], rows: readonly (readonly string[])[], right: (column: number) => boolean = (j) => j > 0): string[] {
	const width = head.map((h, j) => Math.max(h.length, ...rows.map((r) => (r[j] ?? '').length)));
	const line = (cells: readonly string[]) =>
		cells
			.map((c, j) => (right(j) ? c.padStart(width[j]) : c.padEnd(width[j])))
			.join('  ')
			.trimEnd();
	return [line(head), line(width.map((w) => '-'.repeat(w))), ...rows.map(line)];
}

/** A two-way table with its X² and per-level odds ratios, indented. */
export function twoWayLines(t: TwoWayTable, indent = '    '): string[] {
	const cells = twoWayCells(t);
	const out = [cells.caption, ...textTable(cells.head, cells.rows), chiSquareText(t)];
	const rd = tableRiskDifferenceText(t);
	if (rd) out.push(rd);
	const ors = levelOddsRatioCells(t);
	if (ors) out.push(ors.caption, ...textTable(ors.head, ors.rows));
	return out.map((l) => indent + l);
}

/** The kind of a column as analysed, by column name ("continuous", "binary (reference 0)", …). */
export function kindOf(report: DataCheckReport): (column: string) => string {
	const byColumn = new Map(report.columns.map((c) => [c.column, kindText(c)]));
	return (column) => byColumn.get(column) ?? '';
}

export const COMMON_DATA_PRINT = {
	header(ctx: Context, report: DataCheckReport, dataName: string): void {
		const mapped = Object.keys(report.mapping.columns).length;
		const measured = mapped + report.mapping.unmapped.length;
		const have = measured === 1 ? 'measured variable has' : 'measured variables have';
		ctx.print(`Data: ${dataName}, ${countText(report.rowCount, 'row')}; ${formatCount(mapped)} of ${formatCount(measured)} ${have} a column.`);
		for (const n of report.notes) ctx.print(`  ${n}`);
		for (const a of report.mapping.ambiguous) ctx.print(`  "${a.variableId}" matches several columns (${a.columns.join(', ')}); choose one with --map.`);
		for (const c of report.categoryCodes) ctx.print(`  Notice: ${categoryCodeNotice(c.column, c.values, 'cli')}`);
	}
};
