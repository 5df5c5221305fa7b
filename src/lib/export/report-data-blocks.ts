/**
 * The report's data section as blocks: the source, notices (columns that look like category
 * codes), the arrow checks of the exposure and the outcome with their two-way tables, the
 * claim checks, the confounder check of every candidate, the crude vs adjusted estimates with
 * the crude on each row's own rows and the change, the standardized estimates with the split of
 * the odds ratio's change, and notes; and the appendix of analysis code. Shows what it is
 * given (ReportDataResults); the words of the new parts come from src/lib/wording.
 * O(size of the data results).
 */
import {
	collapsibilitySentence,
	CONFOUNDER_CHECK_INTRO,
	countText,
	formatCi,
	formatNumber as formatReadable,
	formatP,
	formatPercent,
	listNames,
	MISSING,
	riskPercent,
	STANDARDIZED_METHOD,
	type LabelOf
} from '../wording';
import type { Block } from './report';
import { reproducibilityBlocks } from './report-study';
import type { ReportCode, ReportDataResults, ReportStandardized } from './report-data';

/** Numbers for display: the app's format (three significant digits, never e-notation). */
export const formatNumber = (x: number | null | undefined): string => formatReadable(x);
/** p-values as the app and the command line write them (two significant digits, "< 0.001"). */
export { formatP };

const given = (x: number | null | undefined): x is number => x !== null && x !== undefined && Number.isFinite(x);

function arrowBlocks(data: ReportDataResults): Block[] {
	const checks = data.arrowChecks ?? [];
	if (!checks.length) return [];
	const blocks: Block[] = [
		{ kind: 'subheading', text: 'Arrow checks of the exposure and the outcome' },
		{
			kind: 'paragraph',
			text: 'Each arrow into or out of the exposure or the outcome, with the association it implies in the measure one reads (odds ratio per level against the reference, Cohen\'s d, or a correlation), p and n, and the kind each column is analysed as. "Weak" means below Cohen\'s (1988) "small" size, a rule of thumb; odds ratios are never called weak.'
		},
		{ kind: 'table', head: ['Arrow', 'Kinds', 'Size, p, n', 'Data'], rows: checks.map((c) => [c.arrow, c.kinds, c.result, c.verdict]) }
	];
	for (const c of checks) {
		if (!c.table) continue;
		blocks.push({ kind: 'table', caption: `${c.arrow}. ${c.table.caption}`, head: c.table.head, rows: c.table.rows, numeric: c.table.head.map((_, j) => j > 0) });
		blocks.push({ kind: 'paragraph', text: c.table.tests.join(' ') });
		const o = c.table.oddsRatios;
		if (o) blocks.push({ kind: 'table', caption: o.caption, head: o.head, rows: o.rows, numeric: o.head.map((_, j) => j > 0) });
	}
	return blocks;
}

function claimBlocks(data: ReportDataResults): Block[] {
	if (!data.checks?.length) return [];
	const adjusted = data.checks.some((c) => c.adjustedP !== undefined && c.adjustedP !== null);
	return [
		{ kind: 'subheading', text: 'Checks of the independencies the diagram implies' },
		{
			kind: 'paragraph',
			text: 'Each row tests one independence that the diagram implies. "Not consistent" means the data contradict it, which points to a missing arrow or another wrong assumption; "consistent" does not prove the diagram right.'
		},
		{
			kind: 'table',
			head: ['Implied independence', 'Test', 'Statistic', 'df', 'p', ...(adjusted ? ['Adjusted p'] : []), 'Data'],
			numeric: [false, false, true, true, true, ...(adjusted ? [true] : []), false],
			rows: data.checks.map((c) => [
				c.statement,
				c.test,
				formatNumber(c.statistic),
				c.df === null || c.df === undefined ? MISSING : Array.isArray(c.df) ? c.df.join(', ') : String(c.df),
				formatP(c.pValue),
				...(adjusted ? [formatP(c.adjustedP)] : []),
				(c.verdict === 'consistent' ? 'consistent' : c.verdict === 'inconsistent' ? 'not consistent' : 'not tested') + (c.detail ? ` (${c.detail})` : '')
			])
		}
	];
}

function confounderBlocks(data: ReportDataResults): Block[] {
	const c = data.confounders;
	if (!c) return [];
	return [
		{ kind: 'subheading', text: 'Confounder check of every candidate' },
		{ kind: 'paragraph', text: c.intro ?? CONFOUNDER_CHECK_INTRO },
		{
			kind: 'table',
			head: ['Candidate', 'Kind', 'Role under the diagram', 'With the exposure', 'With the outcome', 'Crude → adjusted for it (same rows)', 'Mantel–Haenszel odds ratio', 'Homogeneity (Breslow–Day–Tarone)'],
			rows: c.rows.map((r) => [r.candidate, r.kind, r.roles, r.withExposure, r.withOutcome, r.change, r.stratified, r.homogeneity])
		},
		...(c.notes ?? []).map((text): Block => ({ kind: 'paragraph', text }))
	];
}

function estimateBlocks(data: ReportDataResults, label: LabelOf): Block[] {
	const rows = data.estimates ?? [];
	if (!rows.length) return [];
	const withCrude = rows.some((e) => given(e.crudeSameRows));
	const withKinds = rows.some((e) => e.kinds);
	const interval = (lo: number | null | undefined, hi: number | null | undefined, level = 0.95) => (given(lo) && given(hi) ? `${formatNumber(lo)} to ${formatNumber(hi)} (${Math.round(level * 100)} %)` : MISSING);
	const blocks: Block[] = [{ kind: 'subheading', text: 'Effect estimates' }];
	if (withCrude)
		blocks.push({
			kind: 'paragraph',
			text: 'The crude estimate is shown twice: on all rows (the crude row) and on each adjusted row\'s own complete cases, so that the change is computed on the numbers shown. A change of 10 % or more is a common-practice marker, not a test of confounding.'
		});
	blocks.push({
		kind: 'table',
		head: ['Estimate', 'Adjusted for', 'Measure', 'Value', 'Interval', ...(withCrude ? ['Crude, same rows', 'Change'] : []), 'Rows', ...(withKinds ? ['Kinds'] : [])],
		numeric: [false, false, false, true, true, ...(withCrude ? [true, true] : []), true, ...(withKinds ? [false] : [])],
		rows: rows.map((e) => [
			e.label + (e.note ? ` (${e.note})` : ''),
			e.adjustedFor.length ? listNames(e.adjustedFor.map(label)) : 'nothing',
			e.measure,
			formatNumber(e.estimate),
			interval(e.lower, e.upper, e.level),
			...(withCrude ? [given(e.crudeSameRows) ? `${formatNumber(e.crudeSameRows)} (${interval(e.crudeLower, e.crudeUpper)})` : MISSING, given(e.changePercent) ? formatPercent(e.changePercent) : MISSING] : []),
			e.n === undefined ? MISSING : String(e.n),
			...(withKinds ? [e.kinds ?? ''] : [])
		])
	});
	return blocks;
}

function standardizedBlocks(rows: readonly ReportStandardized[], label: LabelOf): Block[] {
	if (!rows.length) return [];
	const ci = (lo: number, hi: number) => formatCi([lo, hi]);
	const blocks: Block[] = [
		{ kind: 'subheading', text: 'Standardized (marginal) estimates' },
		{
			kind: 'table',
			head: ['Adjusted for', 'Risk, exposed / unexposed', 'Risk difference (points)', 'Risk ratio', 'Marginal odds ratio', 'Conditional odds ratio'],
			numeric: [false, true, true, true, true, true],
			rows: rows.map((s) => [
				`${s.label}: ${s.adjustedFor.length ? listNames(s.adjustedFor.map(label)) : 'nothing'}`,
				`${riskPercent(s.risk1)} / ${riskPercent(s.risk0)}`,
				`${formatReadable(s.riskDifference * 100)} (${formatReadable(s.rdLower * 100)} to ${formatReadable(s.rdUpper * 100)})`,
				`${formatReadable(s.riskRatio)} (${ci(s.rrLower, s.rrUpper)})`,
				`${formatReadable(s.marginalOddsRatio)} (${ci(s.orLower, s.orUpper)})`,
				formatReadable(s.conditionalOddsRatio)
			])
		}
	];
	for (const s of rows) {
		const sentence = collapsibilitySentence({
			marginalOddsRatio: { estimate: s.marginalOddsRatio, ci: [s.orLower, s.orUpper] },
			conditionalOddsRatio: s.conditionalOddsRatio,
			crudeOddsRatio: s.crudeOddsRatio ?? null
		});
		if (sentence) blocks.push({ kind: 'paragraph', text: `${s.label}: ${sentence}` });
	}
	blocks.push({ kind: 'paragraph', text: STANDARDIZED_METHOD });
	return blocks;
}

export function dataBlocks(data: ReportDataResults, label: LabelOf): Block[] {
	const blocks: Block[] = [];
	const s = data.source;
	if (s && (s.name || s.rows !== undefined)) {
		const parts = [s.name ? `Data: ${s.name}` : 'Data', s.rows !== undefined ? countText(s.rows, 'row') : '', s.columns !== undefined ? countText(s.columns, 'column') : ''].filter(Boolean);
		blocks.push({ kind: 'paragraph', text: `${parts.join(', ')}.` });
		if (s.kind) blocks.push({ kind: 'paragraph', text: s.kind });
	}
	blocks.push(...reproducibilityBlocks(data, label));
	for (const n of data.notices ?? []) blocks.push({ kind: 'paragraph', text: `Notice: ${n}` });
	blocks.push(...arrowBlocks(data), ...claimBlocks(data), ...confounderBlocks(data), ...estimateBlocks(data, label), ...standardizedBlocks(data.standardized ?? [], label));
	for (const note of data.notes ?? []) blocks.push({ kind: 'paragraph', text: note });
	if (blocks.length === 0) blocks.push({ kind: 'paragraph', text: 'Data were loaded, but no checks or estimates were made.' });
	return blocks;
}

export function codeBlocks(code: readonly ReportCode[]): Block[] {
	return [
		{
			kind: 'paragraph',
			text: 'The models of the planned set in the software of the analysis plan, made from the diagram and the data settings (columns, kinds, reference levels). The R and Python code reproduces the estimates above; check the Stata and SAS code before use.'
		},
		...code.flatMap((c): Block[] => [
			{ kind: 'subheading', text: c.language },
			{ kind: 'code', language: c.language, tag: c.tag, text: c.text }
		])
	];
}
