/**
 * Arrow checks: for every arrow whose two ends have a column, the marginal association the
 * arrow implies (src/lib/stats/association/associate.ts chooses the test by column kinds),
 * with its effect size and the n used, and a plain verdict (types.ts, ArrowSupport).
 * A weak or absent association is reported, never hidden. Cost: one association test per
 * arrow, O(n) or O(n log n) each.
 */
import type { Diagram } from '../graph/diagram';
import { associate, StatsError, type Column, type TestResult } from '../stats';
import { pictureData } from './pictures';
import type { ArrowCheck, ArrowChecks, ArrowSupport, VariableMapping } from './types';

/** Cohen (1988): r = 0.1 is a "small" correlation (common practice). */
export const SMALL_STRENGTH = 0.1;
export const DEFAULT_ALPHA = 0.05;

export interface ArrowCheckOptions {
	alpha?: number;
	/** Add the numbers for the small pictures (the app wants them, the CLI does not). */
	pictures?: boolean;
	/** Called after each arrow with (done, total). */
	onProgress?: (done: number, total: number) => void;
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

export function supportOf(p: number, strength: number | null, alpha: number): ArrowSupport {
	if (!Number.isFinite(p)) return 'untested';
	if (p >= alpha) return 'absent';
	return strength !== null && strength < SMALL_STRENGTH ? 'weak' : 'supported';
}

export function checkArrows(diagram: Diagram, columnOf: (name: string) => Column, mapping: VariableMapping, options: ArrowCheckOptions = {}): ArrowChecks {
	const alpha = options.alpha ?? DEFAULT_ALPHA;
	const checks: ArrowCheck[] = [];
	const skipped: ArrowChecks['skipped'] = [];
	diagram.arrows.forEach((a, index) => {
		options.onProgress?.(index, diagram.arrows.length);
		const cf = mapping.columns[a.from];
		const ct = mapping.columns[a.to];
		if (cf === undefined || ct === undefined) {
			const missing = [a.from, a.to].filter((id) => mapping.columns[id] === undefined);
			skipped.push({ from: a.from, to: a.to, why: `no data for ${missing.map((id) => `"${id}"`).join(' and ')}` });
			return;
		}
		const tail = columnOf(cf);
		const head = columnOf(ct);
		const base = { from: a.from, to: a.to, columns: [cf, ct] as [string, string] };
		try {
			const r = associate(tail, head);
			const strength = associationStrength([r.main, ...r.others]);
			checks.push({
				...base,
				support: supportOf(r.main.pValue, strength?.value ?? null, alpha),
				main: r.main,
				others: r.others,
				strength: strength?.value ?? null,
				strengthName: strength?.name ?? null,
				message: null,
				...(options.pictures ? { picture: pictureData(tail, head) } : {})
			});
		} catch (e) {
			if (!(e instanceof StatsError)) throw e;
			checks.push({ ...base, support: 'untested', main: null, others: [], strength: null, strengthName: null, message: e.message });
		}
	});
	return { alpha, checks, skipped };
}
