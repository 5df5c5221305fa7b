import { mappedColumn } from './mapping';
/**
 * The classic numeric check of each candidate confounder, for every candidate at once: is it
 * associated with the exposure, is it associated with the outcome (each in the measure a
 * practitioner reads, with the table, X², df and per-level odds ratios for discrete pairs),
 * and how does the exposure's estimate change when adjusting for it alone (crude and adjusted
 * on the same rows, both shown). For a binary exposure and outcome also the stratified
 * estimate over the candidate's levels (fifths of a continuous one; Cochran 1968): the
 * Mantel–Haenszel odds ratio with the Robins–Breslow–Greenland interval and the Breslow–Day
 * test with Tarone's correction for effect modification. The candidate's roles come from the
 * diagram (VanderWeele & Shpitser's definition of a confounder); the data cannot decide
 * whether a variable is a confounder, only describe these associations.
 * Cost per candidate: two association tests, two regression fits, O(n) for the strata.
 */
import type { Diagram } from '../graph/diagram';
import { InputError } from '../graph/errors';
import { variableRoles } from '../causal';
import {
	own,
	associate,
	breslowDay,
	categoryCodeValues,
	estimateExposureEffect,
	mantelHaenszel,
	StatsError,
	strata2x2,
	TableStatistics,
	type Column
} from '../stats';
import { drain, type Steps } from './steps';
import { readMeasure } from './arrow-checks';
import { twoWayTable } from './two-way';
import type { CandidateCheck, ConfounderChecks, PairSummary, VariableMapping } from './types';

function pairSummary(a: Column, b: Column, stats: TableStatistics): PairSummary {
	try {
		const r = associate(a, b, stats);
		const table = a.kind !== 'continuous' && b.kind !== 'continuous' ? twoWayTable(a, b, stats) : null;
		return {
			columns: [a.name, b.name],
			test: r.main.test,
			statisticName: r.main.statisticName,
			statistic: r.main.statistic,
			df: r.main.df,
			pValue: r.main.pValue,
			n: r.main.n,
			measure: readMeasure(a, b, r.main, table, stats),
			table,
			message: null
		};
	} catch (e) {
		if (!(e instanceof StatsError)) throw e;
		return { columns: [a.name, b.name], test: '', statisticName: '', statistic: NaN, df: [], pValue: NaN, n: 0, measure: null, table: null, message: e.message };
	}
}

function guard<T>(f: () => T): T | { message: string } {
	try {
		return f();
	} catch (e) {
		if (!(e instanceof StatsError || e instanceof InputError)) throw e;
		return { message: e.message };
	}
}

export function checkConfounders(seen: Diagram, columnOf: (name: string) => Column, mapping: VariableMapping, statistics?: TableStatistics): ConfounderChecks | null {
	return drain(confounderSteps(seen, columnOf, mapping, statistics));
}

/** The confounder check one candidate per step (steps.ts), with the table's shared statistics. */
export function* confounderSteps(seen: Diagram, columnOf: (name: string) => Column, mapping: VariableMapping, statistics?: TableStatistics, onProgress?: (done: number, total: number) => void): Steps<ConfounderChecks | null> {
	const stats = statistics ?? new TableStatistics();
	if (seen.exposures.length !== 1 || seen.outcomes.length !== 1) return null;
	const [xId] = seen.exposures;
	const [yId] = seen.outcomes;
	if (own(mapping.columns, xId) === undefined || own(mapping.columns, yId) === undefined) return null;
	const x = columnOf(mappedColumn(mapping, xId));
	const y = columnOf(mappedColumn(mapping, yId));
	const roles = new Map(variableRoles(seen).map((r) => [r.id, r]));
	const candidates: CandidateCheck[] = [];
	for (const [index, v] of seen.variables.entries()) {
		stats.interrupt.poll();
		onProgress?.(index, seen.variables.length);
		if (v.id === xId || v.id === yId || own(mapping.columns, v.id) === undefined) continue;
		const c = columnOf(mappedColumn(mapping, v.id));
		const r = roles.get(v.id);
		const rs = r?.roles ?? [];
		const preExposure = !rs.includes('mediator') && !rs.includes('descendant-of-exposure') && !rs.includes('descendant-of-outcome');
		const base = {
			id: v.id,
			column: c.name,
			kind: c.kind,
			codeValues: categoryCodeValues(c),
			roles: rs,
			...(r?.adjustWith ? { adjustWith: r.adjustWith } : {}),
			preExposure
		};
		if (!preExposure) {
			candidates.push({ ...base, withExposure: null, withOutcome: null, change: null, stratified: null });
			continue;
		}
		const change = guard(() => {
			const e = estimateExposureEffect(y, x, [c], stats);
			const a = e.adjusted[0];
			const cr = e.crude.find((q) => q.term === a?.term);
			if (!a || !cr) throw new StatsError(`The exposure '${x.name}' was left out of the model adjusted for '${c.name}'.`);
			return { measure: e.measure, n: e.n, crude: { estimate: cr.estimate, ci: cr.ci }, adjusted: { estimate: a.estimate, ci: a.ci }, percent: e.change[0].percent };
		});
		const stratified =
			x.kind === 'binary' && y.kind === 'binary'
				? guard(() => {
						const s = strata2x2(x, y, c, stats);
						const mh = mantelHaenszel(s.tables);
						const bd = guard(() => breslowDay(s.tables, mh.oddsRatio));
						return {
							by: s.by,
							strata: s.labels,
							n: s.n,
							oddsRatio: mh.oddsRatio,
							ci: mh.ci,
							pValue: mh.pValue,
							homogeneity: 'message' in bd ? null : { statistic: bd.statisticTarone, df: bd.df, pValue: bd.pValueTarone, strataUsed: bd.strataUsed },
							homogeneityMessage: 'message' in bd ? bd.message : null
						};
					})
				: null;
		candidates.push({ ...base, withExposure: pairSummary(c, x, stats), withOutcome: pairSummary(c, y, stats), change, stratified });
		yield;
	}
	return { exposure: xId, outcome: yId, exposureKind: x.kind, outcomeKind: y.kind, candidates };
}
