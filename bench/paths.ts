/**
 * Section 8: exposure–outcome paths at scale (issue 13) — time to the first open non-causal
 * path, time to the exact count (stopping at 10,000), the delay per path, and the capped
 * listing, on seeded random DAGs of 300 and 1,000 variables (random-dag.ts, average degree 4)
 * and on the 200-variable two-ladder diagram where the Paths and Adjustment sections once
 * disagreed (tests/unit/reference/two-ladders.ts). Figures are CPU time of this process; the
 * machine's load average is printed with them, since the machines are shared.
 *
 * Run alone: npx tsx bench/paths.ts   (or npm run bench -- --only=8)
 */
import { loadavg } from 'node:os';
import { openNonCausalPathsIdx } from '../src/lib/causal/open-paths';
import { listPathsIdx } from '../src/lib/causal/paths';
import { compileDag, type CompiledDag } from '../src/lib/graph/compiled';
import { twoLadderArrows } from '../tests/unit/reference/two-ladders';
import { randomDag, randomQuery, xorshift } from './random-dag';
import { fmtInt, fmtMs, timeOnce, type Row, type Section } from './table';

interface Question {
	label: string;
	g: CompiledDag;
	X: number[];
	Y: number[];
	Z: number[];
}

const load = () => loadavg().map((x) => x.toFixed(2)).join(' / ');

function measure(q: Question): Row {
	const { g, X, Y, Z } = q;
	const first = timeOnce(() => openNonCausalPathsIdx(g, X, Y, Z, { keep: 1, countCap: 1 }));
	let count = { count: 0, bound: 'exact', branches: 0, deadBranches: 0 };
	const all = timeOnce(() => {
		count = openNonCausalPathsIdx(g, X, Y, Z, { keep: 0 });
	});
	let listed = 0;
	const listing = timeOnce(() => {
		listed = listPathsIdx(g, X, Y, Z, 1000).paths.length;
	});
	const shown = count.bound === 'more-than' ? `> ${fmtInt(count.count)}` : count.bound === 'at-least' ? `≥ ${fmtInt(count.count)}` : fmtInt(count.count);
	return {
		question: q.label,
		'first open path': fmtMs(first.cpu),
		'open non-causal paths': shown,
		'time to count': fmtMs(all.cpu),
		'per path': count.count > 0 ? fmtMs(all.cpu / count.count) : '—',
		'branches per path (dead)': count.count > 0 ? `${(count.branches / count.count).toFixed(1)} (${fmtInt(count.deadBranches)})` : '—',
		'listing (max 1,000)': `${fmtMs(listing.cpu)} (${fmtInt(listed)} paths)`,
		'load (1/5/15 min)': load()
	};
}

/**
 * Seeded questions with at least one open non-causal path: `want` of them with Z random (three
 * variables; these usually have more than 10,000), and one whose count is exact and at least
 * 50 — Z the parents of X or of Y but one, so that most back-door paths are blocked.
 */
function randomQuestions(n: number, want: number): Question[] {
	const { g } = randomDag(n, 4, 7 * n);
	const rand = xorshift(11 * n);
	const parentsOf = (v: number) => Array.from(g.parentList.subarray(g.parentStart[v], g.parentStart[v + 1]));
	const capped: Question[] = [];
	let exact: Question | null = null;
	for (let attempt = 0; attempt < 60 && (capped.length < want || !exact); attempt++) {
		const { X, Y, Z } = randomQuery(n, rand, 3);
		const ends = new Set([...X, ...Y]);
		for (const [i, z] of [Z, parentsOf(X[0]).slice(1), parentsOf(Y[0]).slice(1)].entries()) {
			const usable = z.filter((v) => !ends.has(v));
			const r = openNonCausalPathsIdx(g, X, Y, usable, { keep: 0 });
			if (i === 0 && r.count > 0 && capped.length < want) capped.push({ label: `${fmtInt(n)} variables, random Z (${capped.length + 1})`, g, X, Y, Z: usable });
			if (i > 0 && !exact && r.bound === 'exact' && r.count >= 50)
				exact = { label: `${fmtInt(n)} variables, Z = parents of ${i === 1 ? 'X' : 'Y'} but one`, g, X, Y, Z: usable };
		}
	}
	return exact ? [...capped, exact] : capped;
}

function twoLadders(): Question {
	const arrows = twoLadderArrows();
	const ids = [...new Set(arrows.flat())];
	const g = compileDag(ids, arrows.map(([from, to]) => ({ from, to })));
	return { label: '200-variable two-ladder diagram', g, X: [ids.indexOf('x')], Y: [ids.indexOf('y')], Z: [] };
}

export function benchPaths(sizes: number[], perSize: number): Section {
	const loadBefore = load();
	const rows = [measure(twoLadders()), ...sizes.flatMap((n) => randomQuestions(n, perSize).map(measure))];
	return {
		title: '8. Exposure–outcome paths (open non-causal first, counted exactly to 10,000)',
		rows,
		note:
			`CPU time of one run each. "time to count": the search that counts open non-causal paths, stopping past 10,000 ("> 10,000"); ` +
			`"per path" is that time over the count (polynomial delay: one Bayes-Ball completion test per branch, O(n + m)); ` +
			`"branches per path": partial paths extended per path found (at most the path length when no branch is dead), with the number of dead branches (a search that found no path). ` +
			`"listing": the Paths section's listing at its default cap (open non-causal paths, then causal, then blocked). ` +
			`Load average before the section: ${loadBefore}; after: ${load()}.`
	};
}

if (import.meta.url === `file://${process.argv[1]}`) {
	const s = benchPaths([300, 1_000], 3);
	console.log(s.title);
	for (const r of s.rows) console.log(JSON.stringify(r));
	console.log(s.note);
}
