/**
 * Arrow checks: for every arrow whose two ends have a column, the marginal association the
 * arrow implies (src/lib/stats/association/associate.ts chooses the test by column kinds),
 * with its effect size and the n used, and a plain verdict (types.ts, ArrowSupport).
 * A weak or absent association is reported, never hidden. Cost: one association test per
 * arrow, O(n) or O(n log n) each.
 */
import type { Diagram } from '../graph/diagram';
import { own, associate, completeRows, StatsError, TableStatistics, type Column, type TestResult } from '../stats';
import { drain, type Steps } from './steps';
import { pictureData } from './pictures';
import { twoWayTable, type TwoWayTable } from './two-way';
import type { ArrowCheck, ArrowChecks, ArrowSupport, ReadMeasure, VariableMapping } from './types';

/** Cohen (1988): r = 0.1 is a "small" correlation (common practice). */
export const SMALL_STRENGTH = 0.1;
export const DEFAULT_ALPHA = 0.05;

export interface ArrowCheckOptions {
	alpha?: number;
	/** Add the numbers for the small pictures (the app wants them, the CLI does not). */
	pictures?: boolean;
	/** Called after each arrow with (done, total). */
	onProgress?: (done: number, total: number) => void;
	/** The table's shared statistics (and the run's interrupt); made for this call when absent. */
	statistics?: TableStatistics;
}

/**
 * Strength of an association on a 0…1 scale comparable across tests: |r| for correlations,
 * Cramér's V for tables, √η² or √ε² for group tests (the correlation ratio). Looks in the
 * main test first, then the others (Fisher's test reports an odds ratio only). O(1).
 */
export function associationStrength(tests: readonly TestResult[]): { value: number; name: string } | null {
	for (const t of tests)
		for (const e of t.effects) {
			if (/(^| )r$|rho$/.test(e.name)) return { value: Math.abs(e.value), name: e.name };
			if (e.name === "Cramér's V") return { value: e.value, name: e.name };
			if (e.name === 'eta squared' || e.name === 'epsilon squared') return { value: Math.sqrt(Math.max(0, e.value)), name: `√${e.name}` };
		}
	return null;
}

/**
 * The verdict. "weak" is decided in the measure the user reads, never on Cramér's V alone when
 * an odds ratio is shown: |r|, ρ or the correlation ratio below 0.1 and |d| below 0.2 are
 * Cohen's (1988) "small" (rules of thumb); an odds ratio has no such cut — a small V can hide
 * an odds ratio of 1.6 when the outcome is rare — so a detected odds ratio is "supported" and
 * its size is shown. `strength` is the old 0…1 scale, used when no measure is given.
 */
export function supportOf(p: number, strength: number | null, alpha: number, measure?: ReadMeasure | null): ArrowSupport {
	if (!Number.isFinite(p)) return 'untested';
	if (p >= alpha) return 'absent';
	if (measure) return measure.smallBelow !== null && Math.abs(measure.value) < measure.smallBelow ? 'weak' : 'supported';
	return strength !== null && strength < SMALL_STRENGTH ? 'weak' : 'supported';
}

/** Cohen's d: difference in means of the numeric column between the binary one's levels, over the pooled SD. O(n). */
function standardizedDifference(group: Column, numeric: Column, stats?: TableStatistics): number {
	if (group.kind === 'continuous' || numeric.kind !== 'continuous') return NaN;
	const rows = stats ? stats.rows([group, numeric]) : completeRows([group, numeric]);
	const sum = [0, 0];
	const sq = [0, 0];
	const count = [0, 0];
	for (const r of rows) {
		const g = group.codes[r];
		const v = numeric.values[r];
		sum[g] += v;
		sq[g] += v * v;
		count[g]++;
	}
	const mean = sum.map((s, g) => s / count[g]);
	const ss = sq.map((q, g) => q - count[g] * mean[g] * mean[g]);
	const sd = Math.sqrt((ss[0] + ss[1]) / (count[0] + count[1] - 2));
	return (mean[1] - mean[0]) / sd;
}

/** The measure a practitioner reads for the pair, with Cohen's small size where one applies. O(n). */
export function readMeasure(a: Column, b: Column, main: TestResult, table: TwoWayTable | null, stats?: TableStatistics): ReadMeasure | null {
	const ors = table?.levelOddsRatios;
	if (ors && ors.levels.length > 0) {
		const strongest = ors.levels.reduce((m, l) => (Math.abs(Math.log(l.oddsRatio)) > Math.abs(Math.log(m.oddsRatio)) ? l : m));
		const name = ors.levels.length === 1 ? 'odds ratio' : `odds ratio, ${ors.variable} = ${strongest.level} vs ${ors.reference.level}`;
		return {
			name,
			type: 'odds-ratio',
			value: strongest.oddsRatio,
			ci: strongest.ci,
			smallBelow: null,
			contrast: { variable: ors.variable, level: strongest.level, reference: ors.reference.level, of: { variable: ors.outcome, level: ors.outcomeLevel } }
		};
	}
	if (table) {
		const v = main.effects.find((e) => e.name === "Cramér's V");
		return v ? { name: "Cramér's V", type: 'cramers-v', value: v.value, smallBelow: SMALL_STRENGTH } : null;
	}
	const binary = a.kind === 'binary' && b.kind === 'continuous' ? ([a, b] as const) : b.kind === 'binary' && a.kind === 'continuous' ? ([b, a] as const) : null;
	if (binary) {
		const d = standardizedDifference(binary[0], binary[1], stats);
		const [group, numeric] = binary;
		if (Number.isFinite(d) && group.kind === 'binary')
			return {
				name: `standardized difference d (${numeric.name})`,
				type: 'standardized-difference',
				value: d,
				smallBelow: 0.2,
				contrast: { variable: group.name, level: group.levels[1], reference: group.levels[0], of: { variable: numeric.name, level: null } }
			};
	}
	const s = associationStrength([main]);
	if (!s) return null;
	const e = main.effects[0];
	const isCorrelation = !!e && /(^| )r$|rho$/.test(e.name);
	return {
		name: s.name,
		type: isCorrelation ? 'correlation' : s.name === "Cramér's V" ? 'cramers-v' : 'correlation-ratio',
		value: isCorrelation ? e.value : s.value,
		...(e?.ci && /(^| )r$/.test(e.name) ? { ci: e.ci } : {}),
		smallBelow: SMALL_STRENGTH
	};
}

export function checkArrows(diagram: Diagram, columnOf: (name: string) => Column, mapping: VariableMapping, options: ArrowCheckOptions = {}): ArrowChecks {
	return drain(arrowCheckSteps(diagram, columnOf, mapping, options));
}

/** The arrow checks one arrow per step (steps.ts), with the table's shared statistics. */
export function* arrowCheckSteps(diagram: Diagram, columnOf: (name: string) => Column, mapping: VariableMapping, options: ArrowCheckOptions = {}): Steps<ArrowChecks> {
	const alpha = options.alpha ?? DEFAULT_ALPHA;
	const stats = options.statistics ?? new TableStatistics();
	const checks: ArrowCheck[] = [];
	const skipped: ArrowChecks['skipped'] = [];
	for (const [index, a] of diagram.arrows.entries()) {
		stats.interrupt.poll();
		options.onProgress?.(index, diagram.arrows.length);
		const cf = own(mapping.columns, a.from);
		const ct = own(mapping.columns, a.to);
		if (cf === undefined || ct === undefined) {
			const missing = [a.from, a.to].filter((id) => own(mapping.columns, id) === undefined);
			skipped.push({ from: a.from, to: a.to, why: `no data for ${missing.map((id) => `"${id}"`).join(' and ')}` });
			continue;
		}
		const tail = columnOf(cf);
		const head = columnOf(ct);
		const base = { from: a.from, to: a.to, columns: [cf, ct] as [string, string] };
		try {
			const r = associate(tail, head, stats);
			const strength = associationStrength([r.main, ...r.others]);
			const table = tail.kind !== 'continuous' && head.kind !== 'continuous' ? twoWayTable(tail, head, stats) : null;
			const measure = readMeasure(tail, head, r.main, table, stats);
			checks.push({
				...base,
				kinds: [tail.kind, head.kind],
				support: supportOf(r.main.pValue, strength?.value ?? null, alpha, measure),
				measure,
				table,
				main: r.main,
				others: r.others,
				strength: strength?.value ?? null,
				strengthName: strength?.name ?? null,
				message: null,
				...(options.pictures ? { picture: pictureData(tail, head, stats) } : {})
			});
		} catch (e) {
			if (!(e instanceof StatsError)) throw e;
			checks.push({ ...base, kinds: [tail.kind, head.kind], support: 'untested', main: null, others: [], strength: null, strengthName: null, measure: null, table: null, message: e.message });
		}
		yield;
	}
	return { alpha, checks, skipped };
}
