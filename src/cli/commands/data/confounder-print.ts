/**
 * The text of `causeway data estimates` beyond the estimate rows: the confounder check of every
 * candidate (associations in the measure read, two-way tables of discrete pairs, crude →
 * adjusted on the same rows, Mantel–Haenszel with Breslow–Day–Tarone) and the standardized
 * estimates with the split of the odds ratio's change. Words from src/lib/wording.
 */
import type { CandidateCheck, ConfounderChecks, Estimates, PairSummary } from '../../../lib/datacheck';
import {
	changeText,
	formatNumber,
	collapsibilitySentence,
	CONFOUNDER_CHECK_INTRO,
	effectModification,
	fifthsCaution,
	homogeneityText,
	notCandidateReason,
	resultText,
	rolesText,
	standardizedText,
	STANDARDIZED_METHOD,
	stratifiedText
} from '../../../lib/wording';
import type { Context } from '../../command';
import { twoWayLines } from './print';

function pairLine(p: PairSummary | null, what: string): string[] {
	if (!p) return [];
	if (p.message) return [`    with the ${what}: not tested (${p.message})`];
	const lines = [`    with the ${what}: ${resultText(p.measure, p.pValue, p.n)}  [${p.test}]`];
	if (p.table) lines.push(...twoWayLines(p.table, '      '));
	return lines;
}

function candidateLines(c: CandidateCheck, x: ConfounderChecks, kind: (column: string) => string, alpha: number): string[] {
	const head = `  ${c.id} (column ${c.column}: ${kind(c.column)}) — ${rolesText(c) || 'no role for this question'}`;
	const not = notCandidateReason(c.roles);
	if (!c.preExposure) return [`${head}; ${not ?? 'not a candidate'}`];
	const lines = [head, ...pairLine(c.withExposure, `exposure ${x.exposure}`), ...pairLine(c.withOutcome, `outcome ${x.outcome}`)];
	if (c.change) lines.push('message' in c.change ? `    crude → adjusted for ${c.id} alone: not estimated (${c.change.message})` : `    crude → adjusted for ${c.id} alone, same rows: ${changeText(c.change)}`);
	if (c.stratified) {
		if ('message' in c.stratified) lines.push(`    Mantel–Haenszel: not possible (${c.stratified.message})`);
		else {
			lines.push(`    ${stratifiedText(c.stratified, c.id)}${effectModification(c.stratified, alpha) ? '  [EFFECT MODIFICATION?]' : ''}`);
			lines.push(`    ${homogeneityText(c.stratified, alpha)}.`);
			if (c.stratified.by === 'fifths') lines.push(`    ${fifthsCaution(c.id)}`);
		}
	}
	return lines;
}

export function printConfounderCheck(ctx: Context, x: ConfounderChecks, kind: (column: string) => string, alpha = 0.05): void {
	ctx.print(`\nConfounder check (exposure ${x.exposure}, outcome ${x.outcome}; alpha = ${formatNumber(alpha)}):`);
	ctx.print(`  ${CONFOUNDER_CHECK_INTRO}`);
	for (const c of x.candidates) for (const line of candidateLines(c, x, kind, alpha)) ctx.print(line);
	if (x.candidates.length === 0) ctx.print('  No other variable has data.');
}

export function printStandardized(ctx: Context, e: Estimates, levels: { exposed: string; unexposed: string }): void {
	const rows = e.rows.filter((r) => r.standardized);
	if (rows.length === 0) return;
	ctx.print(`\nStandardized (marginal) estimates:`);
	for (const r of rows) {
		ctx.print(`  ${r.label}: ${standardizedText(r.standardized!, e.exposure, levels)}`);
		const split = collapsibilitySentence(r.standardized!);
		if (split) ctx.print(`    ${split}`);
	}
	ctx.print(`  ${STANDARDIZED_METHOD}`);
}
