/**
 * `causeway data estimates DIAGRAM DATA.csv`: crude versus adjusted estimates of the exposure's
 * effect — for each minimal sufficient set, the efficiency-optimal set and the planned set —
 * with 95 % CIs, the change from crude, warnings and the E-value of the planned estimate.
 * Same pipeline as the app's data pane.
 */
import { InputError } from '../../../lib/graph/errors';
import { own } from '../../../lib/stats';
import { braces } from '../../../lib/wording/command-line';
import { DATA_VIEW_TEXT, eValueText, formatCi, formatCount, formatNumber, formatPercent } from '../../../lib/wording';
import { QUESTION, QUESTION_HELP } from '../../command';
import { printConfounderCheck, printStandardized } from './confounder-print';
import { COMMON_DATA_PRINT, kindOf, type Command } from './print';
import { CAUTION, DATA_HELP, DATA_OPTIONS, printSummarySql, reportJson, runOnData, SQL_HELP, SQL_OPTION } from './input';

const USAGE = 'causeway data estimates DIAGRAM DATA.csv [--adjust a,b] [--exposure x] [--outcome y] [--map …] [--type …] [--max N] [--summary] [--count COLUMN] [--sql DIALECT[:TABLE]] [--json]';

export const estimates: Command = {
	usage: USAGE,
	details: `Estimates the effect of the exposure on the outcome: an odds ratio from logistic regression
for a binary outcome, a difference from linear regression otherwise; crude, then adjusted for
each minimal sufficient set, the efficiency-optimal set and the planned set (the file's
"adjusted" list, or --adjust), with 95 % CIs, the change from the crude estimate on the same
rows (a 10 % change is marked: a common-practice rule of thumb, not a test of confounding),
warnings (separation, collinearity, fewer than about 10 events per variable — Peduzzi et al.
1996, a rule of thumb) and the E-value of the planned estimate (VanderWeele & Ding 2017).
Each adjusted row shows the crude estimate on its own complete cases beside the crude one on
all rows, and the kind each adjusted column is analysed as. For a binary exposure and outcome:
standardized (marginal) risk difference, risk ratio and odds ratio by g-computation with
delta-method intervals, and which part of the odds ratio's change is confounding (crude →
marginal) and which is non-collapsibility (marginal → conditional; Greenland, Robins & Pearl
1999). Then the confounder check of every candidate: its association with the exposure and
with the outcome in the measure read (two-way tables for discrete pairs), the estimate crude
and adjusted for it alone on the same rows, and the Mantel–Haenszel odds ratio over its
levels (fifths of a numeric one) with the Breslow–Day test, Tarone's correction.
${DATA_HELP}
${SQL_HELP}
  --adjust a,b    the planned set, replacing the file's (use --adjust "" for none)
  --max N         show at most N minimal sets (default 20)
${QUESTION_HELP}
  --json          {"mapping", "estimates", "estimatesMessage", "confounders", "columns", …}`,
	options: { ...DATA_OPTIONS, ...SQL_OPTION, ...QUESTION, adjust: { type: 'string', multiple: true }, max: { type: 'string' } },
	async run(ctx) {
		if (await printSummarySql(ctx, USAGE)) return 0;
		const { report, dataName } = await runOnData(ctx, USAGE, { planned: ctx.list('adjust'), maxSets: ctx.count('max'), parts: { arrows: false, claims: false } });
		// Nothing could be estimated (the data lack the exposure or the outcome): bad input, exit 2
		// as for every other input the command cannot answer, not "done".
		const e = report.estimates;
		if (!e) throw new InputError(`${dataName}: ${report.estimatesMessage ?? 'No estimate could be made.'}`);
		if (ctx.json) {
			const { mapping, estimates, estimatesMessage, confounders, categoryCodes, columns, format, rowCount, notes } = reportJson(report);
			ctx.printJson({ mapping, estimates, estimatesMessage, confounders, categoryCodes, columns, format, rowCount, notes });
			return 0;
		}
		COMMON_DATA_PRINT.header(ctx, report, dataName);
		const kind = kindOf(report);
		const columnOf = (id: string) => own(report.mapping.columns, id) ?? id;
		ctx.print(`\nEffect of ${e.exposure} on ${e.outcome}: ${e.measure} (${e.model} regression), 95 % CI`);
		const width = Math.max(...e.rows.map((r) => r.label.length));
		// Sufficiency is judged on the diagram as the data see it: variables without a column are unmeasured.
		const judged = DATA_VIEW_TEXT.judgedUnder(report.mapping.unmapped.length > 0);
		for (const r of e.rows) {
			if (r.message) {
				ctx.print(`  ${r.label.padEnd(width)}  ${r.message}`);
				continue;
			}
			const crude = r.crudeSameRows === null ? '' : `; crude on the same rows ${formatNumber(r.crudeSameRows)}${r.crudeSameRowsCi ? ` (${formatCi(r.crudeSameRowsCi)})` : ''}`;
			const change = r.changePercent === null ? '' : `, change ${formatPercent(r.changePercent)}${r.changeMarked ? ' (≥ 10 %*)' : ''}`;
			const verdict = r.sufficient ? '' : r.roles.includes('crude') && r.roles.length === 1 ? '' : `  [not sufficient ${judged}]`;
			ctx.print(`  ${r.label.padEnd(width)}  ${formatNumber(r.estimate)} (${formatCi(r.ci)}), n = ${formatCount(r.n)}${crude}${change}${verdict}`);
			if (r.adjustedFor.length) ctx.print(`  ${' '.repeat(width)}  kinds: ${r.adjustedFor.map((id) => `${id} ${kind(columnOf(id))}`).join('; ')}`);
		}
		const exposureColumn = report.columns.find((c) => c.variable === e.exposure);
		const levels = exposureColumn && exposureColumn.levels.length === 2 ? { exposed: exposureColumn.levels[1], unexposed: exposureColumn.levels[0] } : { exposed: '1', unexposed: '0' };
		printStandardized(ctx, e, levels);
		if (e.eValue) ctx.print(`${eValueText(e.eValue)}${e.eValue.notes.length ? ` — ${e.eValue.notes.join(' ')}` : ''}`);
		for (const n of e.notes) ctx.print(`Note: ${n}`);
		for (const w of e.warnings) ctx.print(`Warning: ${w}`);
		if (e.rows.some((r) => r.changeMarked)) ctx.print('* A 10 % change from crude is a common-practice marker, not a test of confounding: the diagram decides what to adjust for.');
		const planned = e.rows.find((r) => r.roles.includes('planned'));
		if (planned) ctx.print(`Planned set ${braces(planned.adjustedFor)}: ${planned.sufficient ? 'sufficient' : 'NOT sufficient'} ${judged}.`);
		if (report.confounders) printConfounderCheck(ctx, report.confounders, kind);
		ctx.print(`\n${CAUTION}`);
		return 0;
	}
};
