import { mappedColumn } from './mapping';
/**
 * Claim checks: each independence the diagram implies among variables with data
 * (src/lib/causal/claims.ts, on the diagram as the data see it) tested on the data
 * (src/lib/stats/conditional/independence.ts chooses the test by column kinds), with Holm
 * (1979) and Benjamini–Hochberg (1995) adjusted p-values over the family of tested claims.
 * A claim is "contradicted" when its Holm-adjusted p-value is below α (family-wise error
 * controlled); the BH value is shown beside it. For a contradicted claim, the arrows that
 * would remove it without closing a cycle are suggested. Cost: one test per claim plus
 * O(m log m) for the adjustments.
 */
import type { Diagram } from '../graph/diagram';
import { findCycle } from '../graph/validate';
import { impliedClaims } from '../causal';
import { own, benjaminiHochbergAdjust, holmAdjust, NEVER, StatsError, TableStatistics, testConditionalIndependence, type Column, type Interrupt } from '../stats';
import { drain, type Steps } from './steps';
import { DEFAULT_ALPHA } from './arrow-checks';
import type { ClaimCheck, ClaimChecks, VariableMapping } from './types';

export interface ClaimCheckOptions {
	alpha?: number;
	/** Test at most this many claims (the listing says it was cut). */
	max?: number;
	/** Called before each claim's test with (done, total). */
	onProgress?: (done: number, total: number) => void;
	/** The table's shared statistics (and the run's interrupt); made for this call when absent. */
	statistics?: TableStatistics;
}

/** Arrows between a and b that keep the diagram acyclic. O(n + m) each. */
export function suggestedArrows(d: Diagram, a: string, b: string): { from: string; to: string }[] {
	const ids = d.variables.map((v) => v.id);
	return [
		{ from: a, to: b },
		{ from: b, to: a }
	].filter((arrow) => findCycle(ids, [...d.arrows, arrow]) === null);
}

/** Runs a claim list through a test; shared by the table and the summary-matrix paths. */
export function claimFamily(
	claims: readonly { a: string; b: string; given: string[] | null }[],
	test: (a: string, b: string, given: string[]) => Pick<ClaimCheck, 'main' | 'others'>,
	diagram: Diagram,
	alpha: number,
	truncated: boolean,
	onProgress?: (done: number, total: number) => void
): ClaimChecks {
	return drain(claimFamilySteps(claims, test, diagram, alpha, truncated, onProgress));
}

/** claimFamily one claim per step (steps.ts); `interrupt` is polled before each claim. */
export function* claimFamilySteps(
	claims: readonly { a: string; b: string; given: string[] | null }[],
	test: (a: string, b: string, given: string[]) => Pick<ClaimCheck, 'main' | 'others'>,
	diagram: Diagram,
	alpha: number,
	truncated: boolean,
	onProgress?: (done: number, total: number) => void,
	interrupt: Interrupt = NEVER
): Steps<ClaimChecks> {
	const noTestableClaim: { a: string; b: string }[] = [];
	const checks: ClaimCheck[] = [];
	for (const [index, c] of claims.entries()) {
		interrupt.poll();
		onProgress?.(index, claims.length);
		if (c.given === null) {
			noTestableClaim.push({ a: c.a, b: c.b });
			continue;
		}
		const base = { a: c.a, b: c.b, given: c.given, pHolm: NaN, pBH: NaN, suggestedArrows: [] };
		try {
			const r = test(c.a, c.b, c.given);
			checks.push({ ...base, status: 'consistent', main: r.main, others: r.others, p: r.main?.pValue ?? NaN, message: null });
		} catch (e) {
			if (!(e instanceof StatsError)) throw e;
			checks.push({ ...base, status: 'untested', main: null, others: [], p: NaN, message: e.message });
		}
		yield;
	}
	const p = checks.map((c) => c.p);
	const holm = holmAdjust(p);
	const bh = benjaminiHochbergAdjust(p);
	checks.forEach((c, i) => {
		c.pHolm = holm[i];
		c.pBH = bh[i];
		if (c.status !== 'untested' && holm[i] < alpha) {
			c.status = 'contradicted';
			c.suggestedArrows = suggestedArrows(diagram, c.a, c.b);
		}
	});
	const rank = { contradicted: 0, consistent: 1, untested: 2 } as const;
	checks.sort((x, y) => rank[x.status] - rank[y.status] || (Number.isNaN(x.p) ? 1 : Number.isNaN(y.p) ? -1 : x.p - y.p));
	return {
		alpha,
		checks,
		noTestableClaim,
		tested: checks.filter((c) => c.status !== 'untested').length,
		contradicted: checks.filter((c) => c.status === 'contradicted').length,
		truncated
	};
}

/**
 * `seen` is the diagram as the data see it (dataDiagram): claims are listed among variables
 * with a column; suggestions are checked for cycles on it too.
 */
export function checkClaims(seen: Diagram, columnOf: (name: string) => Column, mapping: VariableMapping, options: ClaimCheckOptions = {}): ClaimChecks {
	return drain(claimCheckSteps(seen, columnOf, mapping, options));
}

/** The claim checks one claim per step (steps.ts), with the table's shared statistics. */
export function claimCheckSteps(seen: Diagram, columnOf: (name: string) => Column, mapping: VariableMapping, options: ClaimCheckOptions = {}): Steps<ClaimChecks> {
	const alpha = options.alpha ?? DEFAULT_ALPHA;
	const stats = options.statistics ?? new TableStatistics();
	const listed = impliedClaims(seen, { max: options.max === undefined ? undefined : options.max + 1 });
	const truncated = options.max !== undefined && listed.length > options.max;
	const claims = truncated ? listed.slice(0, options.max) : listed;
	const col = (id: string) => columnOf(mappedColumn(mapping, id));
	return claimFamilySteps(
		claims,
		(a, b, given) => {
			const r = testConditionalIndependence(col(a), col(b), given.map(col), stats);
			return { main: r.main, others: r.others };
		},
		seen,
		alpha,
		truncated,
		options.onProgress,
		stats.interrupt
	);
}
