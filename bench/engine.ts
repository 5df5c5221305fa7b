/**
 * Engine benchmarks (issue: benchmarks): d-separation and adjustment validity on random DAGs
 * of growing size, with networkx's d-separation on the same graphs when Debian's
 * python3-networkx is present; listing minimal sets (time to first set, delay per set);
 * implied claims.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { dSeparated } from '../src/lib/causal/dsep';
import { isAdjustmentSet } from '../src/lib/causal/adjustment';
import { contractedMoralGraph } from '../src/lib/causal/moral-graph';
import { properBackDoorGraph, properCausalStructure } from '../src/lib/causal/proper-causal';
import { closeSeparator, listMinimalSeparators } from '../src/lib/causal/separators';
import { impliedClaimsIdx } from '../src/lib/causal/claims';
import { randomDag, randomQuery, xorshift } from './random-dag';
import { fmtMs, table, timeIt, type Row } from './table';

interface DsepCase {
	n: number;
	arrows: [number, number][];
	queries: { X: number[]; Y: number[]; Z: number[] }[];
	ours: boolean[];
	perQuery: number;
	perQueryValidity: number;
	size: number;
}

/** Debian's python3 (with python3-networkx) first, then whatever python3 is on the PATH. */
function pythonWithNetworkx(): string | null {
	for (const python of ['/usr/bin/python3', 'python3']) {
		try {
			execFileSync(python, ['-c', 'import networkx'], { stdio: 'ignore' });
			return python;
		} catch {
			// try the next one
		}
	}
	return null;
}

export function benchDsep(sizes: number[]): Row[] {
	const cases: DsepCase[] = [];
	for (const n of sizes) {
		const { g, arrows } = randomDag(n, 4, n);
		const rand = xorshift(n + 7);
		const queries = Array.from({ length: n >= 100_000 ? 20 : 50 }, () => randomQuery(n, rand, 5));
		const ours: boolean[] = [];
		const perQuery = timeIt(() => {
			ours.length = 0;
			for (const q of queries) ours.push(dSeparated(g, q.X, q.Y, q.Z).separated);
		}) / queries.length;
		const perQueryValidity = timeIt(() => {
			for (const q of queries) isAdjustmentSet(g, q.X, q.Y, q.Z);
		}) / queries.length;
		cases.push({ n, arrows, queries, ours, perQuery, perQueryValidity, size: n + arrows.length });
	}
	let nx: { networkx: string; results: { n: number; seconds_per_query: number; answers: boolean[] }[] } | null = null;
	const python = pythonWithNetworkx();
	if (python) {
		const dir = mkdtempSync(join(tmpdir(), 'causeway-bench-'));
		const file = join(dir, 'cases.json');
		writeFileSync(file, JSON.stringify(cases.map((c) => ({ n: c.n, arrows: c.arrows, queries: c.queries }))));
		nx = JSON.parse(execFileSync(python, ['bench/nx_dsep.py', file], { encoding: 'utf8', maxBuffer: 1 << 28 }));
	} else {
		console.log('networkx not found (apt-get install python3-networkx): the comparison column is skipped');
	}
	return cases.map((c, i) => {
		const ref = nx?.results[i];
		const agree = ref ? ref.answers.every((a, k) => a === c.ours[k]) : null;
		return {
			variables: c.n.toLocaleString('en'),
			arrows: c.arrows.length.toLocaleString('en'),
			'd-sep / query': fmtMs(c.perQuery),
			'ns per (n+m)': ((c.perQuery * 1e6) / c.size).toFixed(1),
			'validity / query': fmtMs(c.perQueryValidity),
			'networkx / query': ref ? fmtMs(ref.seconds_per_query * 1000) : 'n/a',
			'speed-up vs networkx': ref ? `${(ref.seconds_per_query * 1000 / c.perQuery).toFixed(1)}×` : 'n/a',
			'same answers': agree === null ? 'n/a' : agree ? 'yes' : 'NO'
		};
	});
}

/** Time to the first minimal set and mean delay per set for the total effect of v_a on v_b. */
export function benchListing(sizes: number[], perGraph: number): Row[] {
	return sizes.map((n) => {
		const { g } = randomDag(n, 4, 3 * n);
		// Pick a far-apart pair with an ancestor relation so there is something to adjust for.
		const X = [Math.floor(n / 3)];
		const Y = [n - 1 - Math.floor(n / 5)];
		const allowed = new Uint8Array(n).fill(1);
		const s = properCausalStructure(g, X, Y);
		for (let v = 0; v < n; v++) if (s.inX[v] || s.inY[v] || s.forbidden[v]) allowed[v] = 0;
		let first = 0;
		let all = 0;
		let count = 0;
		const t0 = performance.now();
		const h = contractedMoralGraph(properBackDoorGraph(g, s), X, Y, allowed);
		closeSeparator(h, [h.source]);
		first = performance.now() - t0;
		const t1 = performance.now();
		const listing = listMinimalSeparators(h, perGraph);
		all = performance.now() - t1;
		count = listing.sets.length;
		return {
			variables: n.toLocaleString('en'),
			'first set': fmtMs(first),
			'sets listed': String(count),
			'delay / set': count ? fmtMs(all / count) : 'n/a',
			'delay / set / (n+m)': count ? `${((all / count) * 1e6 / (n + g.childList.length)).toFixed(1)} ns` : 'n/a'
		};
	});
}

export function benchClaims(sizes: number[]): Row[] {
	return sizes.map((n) => {
		const { g } = randomDag(n, 4, 11 * n);
		let count = 0;
		const ms = timeIt(() => {
			count = impliedClaimsIdx(g).claims.length;
		}, 1);
		return { variables: String(n), claims: count.toLocaleString('en'), time: fmtMs(ms), 'per claim': fmtMs(ms / Math.max(count, 1)) };
	});
}

export function runEngineBenchmarks(): string {
	const parts: string[] = [];
	parts.push('### 1. d-separation and adjustment validity (random DAGs, average degree 4)\n');
	parts.push(table(benchDsep([100, 1_000, 10_000, 100_000])));
	parts.push('\n### 2. Listing minimal adjustment sets (up to 200 sets per graph)\n');
	parts.push(table(benchListing([1_000, 10_000], 200)));
	parts.push('\n### 3. Implied claims\n');
	parts.push(table(benchClaims([50, 200, 1_000])));
	return parts.join('\n');
}
