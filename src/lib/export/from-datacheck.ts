/**
 * The report's data input (ReportDataResults) from the data-check pipeline's result
 * (src/lib/datacheck DataCheckReport), so the app or a script can put the checks and estimates
 * into the protocol report: claim checks, the arrow checks of the exposure and the outcome
 * with their two-way tables, the confounder check of every candidate, crude vs adjusted
 * estimates with the crude on each row's own rows, standardized estimates, category-code
 * notices and — given the diagram — the analysis code of the planned set. Only copies and
 * words (src/lib/wording); computes nothing. O(size of the result).
 */
import { dataSourceText } from '../wording/warehouse';
import type { CandidateCheck, DataCheckReport, PairSummary } from '../datacheck';
import type { Diagram } from '../graph/diagram';
import {
	categoryCodeNotice,
	countText,
	eValueText,
	changeText,
	chiSquareText,
	claimSentence,
	columnLabels,
	effectModification,
	formatCi,
	formatCount,
	formatNumber,
	kindsSummary,
	kindText,
	levelOddsRatioCells,
	listNames,
	measureCi,
	measureShort,
	notCandidateReason,
	pText,
	resultText,
	rolesText,
	SUPPORT_TEXT,
	tableRiskDifferenceText,
	testSummary,
	twoWayCells,
	type LabelOf
} from '../wording';
import { analysisCode, CODE_LANGUAGE_NAME, CODE_LANGUAGES, codeSpec } from './code';
import type { ReportArrowCheck, ReportCode, ReportConfounderRow, ReportDataResults } from './report-data';
import { SOFTWARE_NAME, SOFTWARE_VERSION } from './version';

const ROLE_WORD: Record<string, string> = { crude: 'crude', minimal: 'minimal set', optimal: 'optimal set', planned: 'planned set' };

const capitalise = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/** What the data were, for the report: grouped counts, a summary of moments or correlations, or rows. */
function dataSourceKind(report: DataCheckReport): string | undefined {
	if (report.grouped) return dataSourceText({ grouped: report.grouped });
	if (report.format === null) return dataSourceText('summary');
	return undefined;
}

/** A data source's file name as the analysis code reads it ("x.csv (demo)" → "x.csv"). */
export const dataFileName = (name: string | undefined) => (name ?? 'data.csv').replace(/^(.*\.\w+) \(.*\)$/, '$1');

function arrowChecks(report: DataCheckReport, labelOf: LabelOf, question: ReadonlySet<string>): ReportArrowCheck[] {
	const name = columnLabels(report.columns, labelOf);
	const kind = new Map(report.columns.map((c) => [c.column, kindText(c)]));
	return report.arrows.checks
		.filter((c) => question.has(c.from) || question.has(c.to))
		.map((c) => {
			const cells = c.table ? twoWayCells(c.table, name) : null;
			const ors = c.table ? levelOddsRatioCells(c.table, name) : null;
			const rd = c.table ? tableRiskDifferenceText(c.table, name) : null;
			return {
				arrow: `${labelOf(c.from)} → ${labelOf(c.to)}`,
				kinds: `${labelOf(c.from)}: ${kind.get(c.columns[0]) ?? c.kinds[0]}; ${labelOf(c.to)}: ${kind.get(c.columns[1]) ?? c.kinds[1]}`,
				result: c.main ? (c.measure ? resultText(c.measure, c.main.pValue, c.main.n, name) : testSummary(c.main)) : (c.message ?? 'not tested'),
				verdict: SUPPORT_TEXT[c.support],
				...(cells && c.table ? { table: { ...cells, tests: [`${chiSquareText(c.table)}.`, ...(rd ? [rd] : [])], ...(ors ? { oddsRatios: ors } : {}) } } : {})
			};
		});
}

function pairCell(p: PairSummary | null): string {
	if (!p) return '';
	if (p.message) return `not tested: ${p.message}`;
	const ci = p.measure ? measureCi(p.measure) : '';
	return `${p.measure ? `${measureShort(p.measure)}${ci ? ` (${ci})` : ''}, ` : ''}${pText(p.pValue)}, n = ${formatCount(p.n)}`;
}

function confounderRow(c: CandidateCheck, labelOf: LabelOf, kind: string, alpha: number): ReportConfounderRow {
	const base = { candidate: labelOf(c.id), kind, roles: rolesText(c, labelOf) || 'no role for this question' };
	if (!c.preExposure) return { ...base, withExposure: notCandidateReason(c.roles) ?? 'not a candidate', withOutcome: '', change: '', stratified: '', homogeneity: '' };
	const s = c.stratified && !('message' in c.stratified) ? c.stratified : null;
	const h = s?.homogeneity;
	return {
		...base,
		withExposure: pairCell(c.withExposure),
		withOutcome: pairCell(c.withOutcome),
		change: !c.change ? '' : 'message' in c.change ? `not estimated: ${c.change.message}` : changeText(c.change),
		stratified: s ? `${formatNumber(s.oddsRatio)} (${formatCi(s.ci)}) over ${s.by === 'fifths' ? 'fifths' : countText(s.strata.length, 'level')}` : c.stratified && 'message' in c.stratified ? `not possible: ${c.stratified.message}` : '',
		homogeneity: s ? (h ? `X² = ${formatNumber(h.statistic)}, ${h.df} df, ${pText(h.pValue)}${effectModification(s, alpha) ? ': effect modification?' : ''}` : (s.homogeneityMessage ?? '')) : ''
	};
}

function codeFor(report: DataCheckReport, diagram: Diagram, file: string): ReportCode[] {
	const rows = report.estimates?.rows.filter((r) => !r.message) ?? [];
	const row = rows.find((r) => r.roles.includes('planned'));
	if (!row || !report.format) return [];
	try {
		const spec = codeSpec(diagram, report, row, file, `${SOFTWARE_NAME} ${SOFTWARE_VERSION}`);
		return CODE_LANGUAGES.map((l) => ({ language: CODE_LANGUAGE_NAME[l], tag: l, text: analysisCode(l, spec) }));
	} catch {
		// No code when the question cannot be modelled; the estimates say why.
		return [];
	}
}

/** A file name as one shell word: as it is when plain, else in single quotes (POSIX shells). */
export function shellWord(name: string): string {
	return /^[A-Za-z0-9._/+-]+$/.test(name) ? name : `'${name.replace(/'/g, "'\\''")}'`;
}

/**
 * The commands that reproduce a report's checks and estimates: `causeway data tests` (claim
 * checks) and `causeway data estimates` (estimates) on the saved diagram file, which carries the data
 * settings, and the data file, with no flags.
 */
export function reproduceCommands(diagramFile: string, dataFile: string): string[] {
	const files = `${shellWord(diagramFile)} ${shellWord(dataFile)}`;
	return [`npx causeway data tests ${files}`, `npx causeway data estimates ${files}`];
}

/** What the report knows beyond the checks: the diagram (for the analysis code) and the files (for the commands that reproduce it). */
export interface ReportDataContext {
	diagram?: Diagram;
	files?: { diagram: string; data: string };
}

export function reportDataFromChecks(report: DataCheckReport, labelOf: LabelOf, sourceName?: string, context: ReportDataContext = {}): ReportDataResults {
	const { diagram, files } = context;
	const checks = report.claims.checks.map((c) => ({
		statement: claimSentence({ a: c.a, b: c.b, given: c.given }, labelOf).replace(/\.$/, ''),
		test: c.main?.test ?? 'not tested',
		statistic: c.main ? c.main.statistic : null,
		df: c.main && c.main.df.length > 0 ? c.main.df : null,
		pValue: Number.isFinite(c.p) ? c.p : null,
		adjustedP: Number.isFinite(c.pHolm) ? c.pHolm : null,
		verdict: c.status === 'contradicted' ? ('inconsistent' as const) : c.status === 'consistent' ? ('consistent' as const) : ('not-tested' as const),
		detail: c.message ?? undefined
	}));
	const est = report.estimates;
	const byVariable = new Map(report.columns.map((c) => [c.variable, c]));
	const kindsOf = (ids: readonly string[]) => kindsSummary(ids.flatMap((id) => (byVariable.get(id) ? [{ ...byVariable.get(id)!, label: labelOf(id) }] : [])));
	const estimates = (est?.rows ?? [])
		.filter((r) => r.message === undefined)
		.map((r) => ({
			label: capitalise(listNames(r.roles.map((x) => ROLE_WORD[x] ?? x))),
			adjustedFor: r.adjustedFor,
			measure: est!.measure,
			estimate: r.estimate,
			lower: r.ci[0],
			upper: r.ci[1],
			n: r.n,
			note: r.changeMarked && r.changePercent !== null ? `${Math.round(r.changePercent)} % change from crude` : undefined,
			crudeSameRows: r.crudeSameRows,
			crudeLower: r.crudeSameRowsCi?.[0] ?? null,
			crudeUpper: r.crudeSameRowsCi?.[1] ?? null,
			changePercent: r.changePercent,
			...(r.adjustedFor.length ? { kinds: kindsOf(r.adjustedFor) } : {})
		}));
	const standardized = (est?.rows ?? [])
		.filter((r) => r.standardized && r.adjustedFor.length > 0 && r.message === undefined)
		.map((r) => {
			const g = r.standardized!;
			return {
				label: capitalise(listNames(r.roles.map((x) => ROLE_WORD[x] ?? x))),
				adjustedFor: r.adjustedFor,
				risk1: g.risk1,
				risk0: g.risk0,
				riskDifference: g.riskDifference.estimate,
				rdLower: g.riskDifference.ci[0],
				rdUpper: g.riskDifference.ci[1],
				riskRatio: g.riskRatio.estimate,
				rrLower: g.riskRatio.ci[0],
				rrUpper: g.riskRatio.ci[1],
				marginalOddsRatio: g.marginalOddsRatio.estimate,
				orLower: g.marginalOddsRatio.ci[0],
				orUpper: g.marginalOddsRatio.ci[1],
				conditionalOddsRatio: g.conditionalOddsRatio,
				crudeOddsRatio: g.crudeOddsRatio
			};
		});
	const question = new Set(diagram ? [...diagram.exposures, ...diagram.outcomes] : [est?.exposure, est?.outcome, report.confounders?.exposure, report.confounders?.outcome].filter((x): x is string => !!x));
	const x = report.confounders;
	const kindByColumn = new Map(report.columns.map((c) => [c.column, kindText(c)]));
	const notes = [...report.notes, ...(report.estimatesMessage ? [report.estimatesMessage] : []), ...(est?.notes ?? [])];
	if (est?.eValue) notes.push(`${eValueText(est.eValue)} (VanderWeele & Ding 2017).`);
	if (report.claims.tested > 0) notes.push(`Adjusted p is Holm's (family-wise), over the ${countText(report.claims.tested, 'tested claim')}.`);
	const code = diagram ? codeFor(report, diagram, files ? files.data.replace(/^.*[/\\]/, '') : dataFileName(sourceName)) : [];
	const columns = (report.columnsUsed ?? []).map((u) => ({ variable: u.variable, column: u.column, kind: u.kind, chosen: u.kindChosen, reference: u.reference }));
	return {
		source: { name: sourceName, rows: report.rowCount, ...(dataSourceKind(report) ? { kind: dataSourceKind(report) } : {}) },
		...(report.categoryCodes.length ? { notices: report.categoryCodes.map((c) => categoryCodeNotice(c.column, c.values, 'report')) } : {}),
		...(report.arrows.checks.length && question.size ? { arrowChecks: arrowChecks(report, labelOf, question) } : {}),
		checks,
		...(x
			? {
					confounders: {
						rows: x.candidates.map((c) => confounderRow(c, labelOf, kindByColumn.get(c.column) ?? c.kind, report.arrows.alpha)),
						notes: [
							`Breslow–Day–Tarone p below ${report.arrows.alpha} is marked "effect modification?". Numeric candidates are stratified in fifths; some confounding remains within fifths (Cochran, Biometrics 1968).`
						]
					}
				}
			: {}),
		estimates,
		...(standardized.length ? { standardized } : {}),
		notes,
		...(code.length ? { code } : {}),
		...(columns.length ? { columns } : {}),
		...(files ? { reproduce: { diagramFile: files.diagram, dataFile: files.data, commands: reproduceCommands(files.diagram, files.data) } } : {})
	};
}
