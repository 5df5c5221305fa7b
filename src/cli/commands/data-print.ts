/** Text output shared by `causeway test` and `causeway estimate`. */
import type { DataCheckReport } from '../../lib/datacheck';
import type { Context } from '../command';
export type { Command } from '../command';

export const COMMON_DATA_PRINT = {
	header(ctx: Context, report: DataCheckReport, dataName: string): void {
		const mapped = Object.keys(report.mapping.columns).length;
		const measured = mapped + report.mapping.unmapped.length;
		ctx.print(`Data: ${dataName}, ${report.rowCount} rows; ${mapped} of ${measured} measured variables have a column.`);
		for (const n of report.notes) ctx.print(`  ${n}`);
		for (const a of report.mapping.ambiguous) ctx.print(`  "${a.variableId}" matches several columns (${a.columns.join(', ')}); choose one with --map.`);
	}
};
