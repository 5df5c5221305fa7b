/**
 * `causeway data [tests] DIAGRAM DATA.csv` (the data job's default view): checks the diagram
 * against data — each arrow's marginal association, and each implied independence tested
 * with Holm and Benjamini–Hochberg adjusted p-values (contradicted claims first). Same
 * pipeline as the app's data pane.
 */
import { COMMON_DATA_PRINT, kindOf, twoWayLines, type Command } from './print';
import { formatCount, formatNumber, formatP, pText, resultText, smallSizeRule, testSummary, countText } from '../../../lib/wording';
import { CAUTION, DATA_HELP, DATA_OPTIONS, printSummarySql, reportJson, runOnData, SQL_HELP, SQL_OPTION } from './input';
import { UsageError } from '../../io';

const USAGE = 'causeway data [tests] DIAGRAM DATA.csv [--map var=column,…] [--type column=kind,…] [--alpha 0.05] [--max N] [--summary] [--count COLUMN] [--sql DIALECT[:TABLE]] [--json]';

const SUPPORT_WORD = { supported: 'supported', weak: 'weak', absent: 'not found', untested: 'not tested' } as const;

export const tests: Command = {
	usage: USAGE,
	details: `For every arrow between two variables with data: the marginal association (test chosen by
the column kinds), its size in the measure one reads (odds ratio per level against the
reference, Cohen's d, or a correlation), p-value and the n used, the kind each column is
analysed as, and whether the data support it (supported: p < alpha and at least Cohen's
"small" size, |r| 0.1 or |d| 0.2 — a rule of thumb; an odds ratio is never called weak;
weak; not found). Arrows into or out of the exposure or the outcome between two discrete
columns also get their two-way table: counts with row proportions, X² with df and p, and the
odds ratio of each level against the reference. Columns whose values look like category
codes (3–10 whole numbers) are named. For every independence the diagram implies among
variables with data ("causeway diagram claims"): a conditional-independence test, with Holm
and Benjamini–Hochberg adjusted p-values; a claim is contradicted when its Holm-adjusted
p-value is below alpha, and the arrow that would remove it is suggested.
${DATA_HELP}
${SQL_HELP}
  --alpha A     significance level (default 0.05)
  --max N       test at most N claims
  --json        {"mapping", "columns", "arrows", "claims", "categoryCodes", "rowCount", …}`,
	options: { ...DATA_OPTIONS, ...SQL_OPTION, alpha: { type: 'string' }, max: { type: 'string' } },
	async run(ctx) {
		if (await printSummarySql(ctx, USAGE)) return 0;
		const alphaText = ctx.values.alpha;
		const alpha = typeof alphaText === 'string' ? Number(alphaText) : 0.05;
		if (!(alpha > 0 && alpha < 1)) throw new UsageError(`--alpha must be a number between 0 and 1, not "${String(alphaText)}"`);
		const { report, dataName, diagram } = await runOnData(ctx, USAGE, { alpha, maxClaims: ctx.count('max'), parts: { estimates: false } });
		if (ctx.json) {
			const { estimates: _e, estimatesMessage: _m, confounders: _c, ...rest } = reportJson(report);
			ctx.printJson(rest);
			return 0;
		}
		COMMON_DATA_PRINT.header(ctx, report, dataName);
		const { arrows, claims } = report;
		const kind = kindOf(report);
		const question = new Set([...diagram.exposures, ...diagram.outcomes]);
		ctx.print(`\nArrow checks (alpha = ${formatNumber(alpha)}):`);
		const width = Math.max(0, ...arrows.checks.map((c) => `${c.from} → ${c.to}`.length));
		for (const c of arrows.checks) {
			const name = `${c.from} → ${c.to}`.padEnd(width);
			if (!c.main) {
				ctx.print(`  ${name}  ${SUPPORT_WORD[c.support].padEnd(10)}  ${c.message}`);
				continue;
			}
			ctx.print(`  ${name}  ${SUPPORT_WORD[c.support].padEnd(10)}  ${c.measure ? resultText(c.measure, c.main.pValue, c.main.n) : testSummary(c.main)}  [${c.main.test}; ${c.columns[0]}: ${kind(c.columns[0])}, ${c.columns[1]}: ${kind(c.columns[1])}]`);
			if (c.support === 'weak') ctx.print(`  ${' '.repeat(width)}  ${' '.repeat(10)}  (${smallSizeRule(c.measure)})`);
			if (c.table && (question.has(c.from) || question.has(c.to))) for (const line of twoWayLines(c.table)) ctx.print(line);
		}
		for (const s of arrows.skipped) ctx.print(`  ${s.from} → ${s.to}: not checked (${s.why})`);
		if (arrows.checks.length + arrows.skipped.length === 0) ctx.print('  The diagram has no arrows.');
		ctx.print(`\nClaim checks: ${formatCount(claims.tested)} tested, ${formatCount(claims.contradicted)} contradicted (Holm-adjusted p < ${formatNumber(alpha)}):`);
		for (const c of claims.checks) {
			const claim = `${c.a} ⟂ ${c.b}${c.given.length ? ` | ${c.given.join(', ')}` : ''}`;
			if (!c.main) {
				ctx.print(`  not tested    ${claim}: ${c.message}`);
				continue;
			}
			const tag = c.status === 'contradicted' ? 'CONTRADICTED' : 'consistent';
			const effect = c.main.effects[0] ? `${c.main.effects[0].name} = ${formatNumber(c.main.effects[0].value)}, ` : '';
			const suggestion = c.suggestedArrows.length ? `; missing arrow? ${c.suggestedArrows.map((a) => `${a.from} → ${a.to}`).join(' or ')}` : '';
			ctx.print(`  ${tag.padEnd(12)}  ${claim}: ${effect}${pText(c.p)}, Holm ${formatP(c.pHolm)}, BH ${formatP(c.pBH)}, n = ${formatCount(c.main.n)}${suggestion}`);
		}
		if (claims.truncated) ctx.print(`  … stopped after ${countText(claims.checks.length, 'claim')} (--max)`);
		for (const p of claims.noTestableClaim) ctx.print(`  ${p.a} and ${p.b}: not adjacent, but no set of variables with data makes them independent (nothing to test)`);
		ctx.print(`\n${CAUTION}`);
		return 0;
	}
};
