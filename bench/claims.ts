/**
 * Section 3: implied claims (one minimal measured separator per non-adjacent pair) on random
 * DAGs of 50, 200 and 1,000 variables, average degree 4 (src/lib/causal/claims.ts), against
 * the previous method on a sample of the same pairs: a d-separation test of An({a, b}) ∩ R,
 * then the close separator of the explicitly built moral graph (moral-graph.ts,
 * separators.ts). Both give the same separators (tests/unit/causal/claims.test.ts).
 */
import type { CompiledDag } from '../src/lib/graph/compiled';
import { impliedClaimsIdx } from '../src/lib/causal/claims';
import { adjacent } from '../src/lib/causal/reach';
import { measuredSeparatorViaMoralGraph } from '../tests/unit/reference/moral-separator';
import { randomDag, xorshift } from './random-dag';
import { fmtInt, fmtMs, timeOnce, type Section } from './table';

/** CPU ms per pair of the previous method over `samples` random non-adjacent pairs. */
function previousPerPair(g: CompiledDag, samples: number): number {
	const rand = xorshift(g.n + 99);
	const pairs: [number, number][] = [];
	while (pairs.length < samples) {
		const a = Math.floor(rand() * g.n);
		const b = Math.floor(rand() * g.n);
		if (a < b && !adjacent(g, a, b)) pairs.push([a, b]);
	}
	measuredSeparatorViaMoralGraph(g, pairs[0][0], pairs[0][1]);
	return timeOnce(() => {
		for (const [a, b] of pairs) measuredSeparatorViaMoralGraph(g, a, b);
	}).cpu / samples;
}

export function benchClaims(sizes: number[]): Section {
	const rows = sizes.map((n) => {
		const { g } = randomDag(n, 4, 11 * n);
		let count = 0;
		let testable = 0;
		impliedClaimsIdx(g, 2000); // warm-up
		const t = timeOnce(() => {
			const { claims } = impliedClaimsIdx(g);
			count = claims.length;
			testable = claims.filter((c) => c.given !== null).length;
		});
		const perClaim = t.cpu / Math.max(count, 1);
		const before = previousPerPair(g, Math.min(count, 2000));
		return {
			variables: String(n),
			arrows: fmtInt(g.childList.length),
			claims: fmtInt(count),
			testable: fmtInt(testable),
			'all claims, CPU': fmtMs(t.cpu),
			'(wall)': fmtMs(t.wall),
			'per claim': fmtMs(perClaim),
			'previous method per claim (2,000 sampled)': fmtMs(before),
			'speed-up': `${(before / perClaim).toFixed(1)}×`
		};
	});
	return {
		title: '3. Implied claims',
		rows,
		note:
			'One claim per non-adjacent pair (about n²/2 pairs), each with the minimal measured separator closest to the first variable; CPU time of one listing. ' +
			'What limits it: every pair searches inside An({a, b}) (about 420 of the 1,000 variables here) for the separator, so the whole listing is O(n² · |An|); ' +
			'see src/lib/causal/claims.ts for what was tried. The app lists claims in a worker with progress and a cap of 20,000 pairs, so edits never wait for it.'
	};
}
