/**
 * The report's data input (ReportDataResults) from the data-check pipeline's result
 * (src/lib/datacheck DataCheckReport), so the app or a script can put the claim checks and the
 * crude vs adjusted estimates into the protocol report. Only copies and words; computes
 * nothing. O(size of the result).
 */
import type { DataCheckReport } from '../datacheck';
import type { LabelOf } from '../wording';
import { claimSentence, listNames } from '../wording';
import type { ReportDataResults } from './report-data';

const ROLE_WORD: Record<string, string> = { crude: 'crude', minimal: 'minimal set', optimal: 'optimal set', planned: 'planned set' };

const capitalise = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/** A file name as one shell word: as it is when plain, else in single quotes (POSIX shells). */
export function shellWord(name: string): string {
	return /^[A-Za-z0-9._/+-]+$/.test(name) ? name : `'${name.replace(/'/g, "'\\''")}'`;
}

/**
 * The commands that reproduce a report's checks and estimates: `causeway test` (claim checks)
 * and `causeway estimate` (estimates) on the saved diagram file, which carries the data
 * settings, and the data file, with no flags.
 */
export function reproduceCommands(diagramFile: string, dataFile: string): string[] {
	const files = `${shellWord(diagramFile)} ${shellWord(dataFile)}`;
	return [`npx causeway test ${files}`, `npx causeway estimate ${files}`];
}

export function reportDataFromChecks(report: DataCheckReport, labelOf: LabelOf, sourceName?: string, files?: { diagram: string; data: string }): ReportDataResults {
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
			note: r.changeMarked && r.changePercent !== null ? `${Math.round(r.changePercent)} % change from crude` : undefined
		}));
	const notes = [...report.notes, ...(report.estimatesMessage ? [report.estimatesMessage] : []), ...(est?.notes ?? [])];
	if (est?.eValue) notes.push(`E-value of the planned estimate (VanderWeele & Ding 2017): ${est.eValue.point.toPrecision(3)}${est.eValue.ciBound !== null ? ` (confidence limit: ${est.eValue.ciBound.toPrecision(3)})` : ''}.`);
	if (report.claims.tested > 0) notes.push(`Adjusted p is Holm's (family-wise), over the ${report.claims.tested} tested claims.`);
	const columns = (report.columnsUsed ?? []).map((u) => ({ variable: u.variable, column: u.column, kind: u.kind, chosen: u.kindChosen, reference: u.reference }));
	return {
		source: { name: sourceName, rows: report.rowCount },
		checks,
		estimates,
		notes,
		...(columns.length ? { columns } : {}),
		...(files ? { reproduce: { diagramFile: files.diagram, dataFile: files.data, commands: reproduceCommands(files.diagram, files.data) } } : {})
	};
}
