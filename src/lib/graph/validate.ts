/**
 * Diagram-level checks: what a well-formed file can still get wrong, each reported with a
 * message that names the variable or the arrow (arrows are numbered from 1, in file order).
 *
 * Everything is O(n + m) for n variables and m arrows (hash maps, one depth-first search), so
 * the checks can run on every edit of a large diagram.
 */
import type { Diagram } from './diagram';
import { InputError, quote, showId } from './errors';

export type DiagramIssueCode =
	| 'duplicate-id'
	| 'unknown-arrow-end'
	| 'self-loop'
	| 'duplicate-arrow'
	| 'cycle'
	| 'unknown-role-id'
	| 'exposure-is-outcome'
	| 'missing-exposure'
	| 'missing-outcome'
	| 'adjusted-is-exposure-or-outcome';

export interface DiagramIssue {
	code: DiagramIssueCode;
	/** One line, naming the variables or arrow concerned. */
	message: string;
	/** The variable ids concerned (for the editor to select them). */
	ids: string[];
}

export interface ValidateOptions {
	/** Also require at least one exposure and one outcome (needed before any analysis). */
	needQuestion?: boolean;
}

/** Said with every cycle and self-loop, so that a file with one explains why nothing is computed. */
const NEEDS_DAG = 'the analysis needs an acyclic diagram (a DAG)';

const ROLE_LISTS = [
	{ key: 'exposures', name: 'Exposure' },
	{ key: 'outcomes', name: 'Outcome' },
	{ key: 'adjusted', name: 'The planned adjustment set lists' }
] as const;

/**
 * Lists every problem of the diagram, in a fixed order: variables, then arrows (in file
 * order), then a cycle, then the roles. An empty list means the diagram is a valid DAG whose
 * roles name known variables. O(n + m).
 */
export function validateDiagram(d: Diagram, opts: ValidateOptions = {}): DiagramIssue[] {
	return inspectDiagram(d, opts).issues;
}

/** Each id's first variable index, and each arrow's ends as indices (-1: not a variable). */
export interface ResolvedArrows {
	indexOf: ReadonlyMap<string, number>;
	tail: Int32Array;
	head: Int32Array;
}

/**
 * validateDiagram, also returning the id → index map and arrow ends it built, so that
 * compiling a checked diagram (causal/question.ts) does not hash every id again: on 100,000
 * variables and 200,000 arrows the second pass was about 0.1 s (node --cpu-prof).
 */
export function inspectDiagram(d: Diagram, opts: ValidateOptions = {}): { issues: DiagramIssue[]; resolved: ResolvedArrows } {
	const issues: DiagramIssue[] = [];

	// Variables: the first occurrence of an id is the variable; later ones are duplicates.
	const firstIndex = new Map<string, number>();
	d.variables.forEach((v, i) => {
		const first = firstIndex.get(v.id);
		if (first === undefined) firstIndex.set(v.id, i);
		else
			issues.push({
				code: 'duplicate-id',
				message: `Variable ${i + 1} has the id ${quote(v.id)}, already used by variable ${first + 1}`,
				ids: [v.id]
			});
	});
	const known = (id: string) => firstIndex.has(id);

	// Arrows, as variable indices (first occurrence of an id). Each arrow's message is built
	// only when it has a problem, and repeats are found with one stamp array per tail rather
	// than a map per variable: at 200,000 arrows this pass took 0.7 s with the maps and eager
	// names, and takes a few tens of milliseconds now (measured in bench/cli.ts).
	const m = d.arrows.length;
	const tail = new Int32Array(m);
	const head = new Int32Array(m);
	const name = (i: number) => `Arrow ${i + 1} (${showId(d.arrows[i].from)} → ${showId(d.arrows[i].to)})`;
	const usable = new Uint8Array(m); // neither an unknown end nor a self-loop
	for (let i = 0; i < m; i++) {
		const a = d.arrows[i];
		const f = firstIndex.get(a.from);
		const t = firstIndex.get(a.to);
		tail[i] = f ?? -1;
		head[i] = t ?? -1;
		if (f !== undefined && t !== undefined && a.from !== a.to) usable[i] = 1;
	}
	const repeats = earlierSameArrow(d.variables.length, tail, head, usable);
	const acyclic: number[] = [];
	for (let i = 0; i < m; i++) {
		const a = d.arrows[i];
		const fromKnown = tail[i] !== -1;
		const toKnown = head[i] !== -1;
		if (!fromKnown || !toKnown) {
			const ends: string[] = [];
			if (!fromKnown) ends.push(`starts at ${quote(a.from)}`);
			if (!toKnown) ends.push(`points to ${quote(a.to)}`);
			const which = !fromKnown && !toKnown && a.from !== a.to ? 'neither of which is a variable' : 'which is not a variable';
			issues.push({
				code: 'unknown-arrow-end',
				message: `${name(i)} ${ends.join(' and ')}, ${which}`,
				ids: [...new Set([...(fromKnown ? [] : [a.from]), ...(toKnown ? [] : [a.to])])]
			});
			continue;
		}
		if (a.from === a.to) {
			issues.push({ code: 'self-loop', message: `${name(i)} points from ${quote(a.from)} to itself; ${NEEDS_DAG}, so remove this arrow`, ids: [a.from] });
			continue;
		}
		if (repeats[i] !== -1) {
			issues.push({ code: 'duplicate-arrow', message: `${name(i)} repeats arrow ${repeats[i] + 1}`, ids: [a.from, a.to] });
			continue;
		}
		acyclic.push(i);
	}

	const cycle = findCycleIdx(
		d.variables.length,
		acyclic.map((i) => tail[i]),
		acyclic.map((i) => head[i])
	);
	if (cycle) {
		const ids = d.variables.map((v) => v.id);
		const closed = closedCycle(cycle, ids);
		issues.push({
			code: 'cycle',
			message: `The diagram has a cycle: ${closed.map(showId).join(' → ')}; ${NEEDS_DAG}, so remove or reverse one of these arrows`,
			ids: closed.slice(0, -1)
		});
	}

	// Roles.
	for (const { key, name } of ROLE_LISTS) {
		for (const id of d[key]) {
			if (!known(id)) {
				issues.push({
					code: 'unknown-role-id',
					message: key === 'adjusted' ? `${name} ${quote(id)}, which is not a variable` : `${name} ${quote(id)} is not a variable`,
					ids: [id]
				});
			}
		}
	}
	const exposures = new Set(d.exposures);
	const outcomes = new Set(d.outcomes);
	for (const id of new Set(d.outcomes)) {
		if (exposures.has(id)) {
			issues.push({ code: 'exposure-is-outcome', message: `${quote(id)} is both an exposure and an outcome`, ids: [id] });
		}
	}
	for (const id of new Set(d.adjusted)) {
		const role = exposures.has(id) ? 'an exposure' : outcomes.has(id) ? 'an outcome' : null;
		if (role) {
			issues.push({
				code: 'adjusted-is-exposure-or-outcome',
				message: `${quote(id)} is in the planned adjustment set but is ${role}`,
				ids: [id]
			});
		}
	}
	if (opts.needQuestion) {
		if (d.exposures.length === 0) issues.push({ code: 'missing-exposure', message: 'No exposure is chosen: mark at least one variable as the exposure', ids: [] });
		if (d.outcomes.length === 0) issues.push({ code: 'missing-outcome', message: 'No outcome is chosen: mark at least one variable as the outcome', ids: [] });
	}
	return { issues, resolved: { indexOf: firstIndex, tail, head } };
}

/**
 * The first problem an editor cannot display, or undefined: a repeated id or an arrow to a
 * variable that is not listed (the canvas and the lists draw each variable and arrow by its
 * id). The app refuses to open such a file, naming the problem; the other issues are shown in
 * the opened diagram. O(n + m).
 */
export function firstUnopenableIssue(d: Diagram): DiagramIssue | undefined {
	return validateDiagram(d).find((i) => i.code === 'duplicate-id' || i.code === 'unknown-arrow-end');
}

/** Throws an InputError with the first problem validateDiagram finds (where = its ids). */
export function assertValidDiagram(d: Diagram, opts: ValidateOptions = {}): void {
	const [first] = validateDiagram(d, opts);
	if (first) throw new InputError(first.message, first.ids.join(', ') || undefined);
}

/**
 * Finds one directed cycle, or null when the arrows form a DAG.
 *
 * Not @dagrejs/graphlib's alg.findCycles: it recurses once per variable and overflowed the
 * stack on a 10,000-variable chain (graphlib 4.0.6, Node 20), and took 201 ms on a 2,000 chain.
 *
 * Depth-first search with three colours (Cormen, Leiserson, Rivest & Stein, Introduction to
 * Algorithms, §22.3: a graph is acyclic iff DFS finds no back edge), written with an explicit
 * stack so a path of 100,000 variables cannot overflow the call stack. O(n + m) time and space.
 * Arrows naming unknown ids are ignored; a duplicated id counts as its first occurrence.
 *
 * @returns the cycle as a closed walk, first id repeated at the end (`[a, b, c, a]`; a
 *   self-loop is `[a, a]`), rotated to start at the variable listed first in `ids`. Which
 *   cycle is found is fixed by the order of `ids` and `arrows`.
 */
export function findCycle(ids: readonly string[], arrows: readonly { from: string; to: string }[]): string[] | null {
	const indexOf = new Map<string, number>();
	ids.forEach((id, i) => {
		if (!indexOf.has(id)) indexOf.set(id, i);
	});
	const tails: number[] = [];
	const heads: number[] = [];
	for (const a of arrows) {
		const f = indexOf.get(a.from);
		const t = indexOf.get(a.to);
		if (f === undefined || t === undefined) continue;
		tails.push(f);
		heads.push(t);
	}
	const cycle = findCycleIdx(ids.length, tails, heads);
	return cycle && closedCycle(cycle, ids);
}

/**
 * For each usable arrow, the index of an earlier usable arrow with the same tail and head, or
 * -1. Arrows are bucketed by tail in file order (counting sort), then each tail's heads are
 * stamped in a typed array: O(n + m), no per-variable map.
 */
function earlierSameArrow(n: number, tail: Int32Array, head: Int32Array, usable: Uint8Array): Int32Array {
	const m = tail.length;
	const out = new Int32Array(m).fill(-1);
	const start = new Int32Array(n + 1);
	for (let i = 0; i < m; i++) if (usable[i]) start[tail[i] + 1]++;
	for (let v = 0; v < n; v++) start[v + 1] += start[v];
	const order = new Int32Array(start[n]);
	const fill = start.slice(0, n);
	for (let i = 0; i < m; i++) if (usable[i]) order[fill[tail[i]]++] = i;
	const stampedBy = new Int32Array(n).fill(-1); // the tail whose arrow last reached this head
	const firstArrow = new Int32Array(n);
	for (let v = 0; v < n; v++) {
		for (let k = start[v]; k < start[v + 1]; k++) {
			const i = order[k];
			const t = head[i];
			if (stampedBy[t] === v) out[i] = firstArrow[t];
			else {
				stampedBy[t] = v;
				firstArrow[t] = i;
			}
		}
	}
	return out;
}

/**
 * findCycle on indices: n variables, arrow k from tails[k] to heads[k]; the cycle as indices
 * in walk order (not closed, not rotated), or null.
 */
function findCycleIdx(n: number, tails: ArrayLike<number>, heads: ArrayLike<number>): number[] | null {
	// Children in compressed sparse rows, keeping arrow order.
	const m = tails.length;
	const start = new Int32Array(n + 1);
	for (let k = 0; k < m; k++) start[tails[k] + 1]++;
	for (let v = 0; v < n; v++) start[v + 1] += start[v];
	const child = new Int32Array(m);
	const fill = start.slice(0, n);
	for (let k = 0; k < m; k++) child[fill[tails[k]]++] = heads[k];

	const WHITE = 0;
	const GREY = 1; // on the current DFS path
	const BLACK = 2;
	const colour = new Uint8Array(n);
	const next = new Int32Array(n); // next child position to explore, per vertex
	const stack = new Int32Array(n);
	const depthOf = new Int32Array(n); // position of a grey vertex on the stack

	for (let root = 0; root < n; root++) {
		if (colour[root] !== WHITE) continue;
		let top = 0;
		stack[0] = root;
		colour[root] = GREY;
		depthOf[root] = 0;
		next[root] = start[root];
		while (top >= 0) {
			const v = stack[top];
			if (next[v] < start[v + 1]) {
				const w = child[next[v]++];
				if (colour[w] === WHITE) {
					colour[w] = GREY;
					next[w] = start[w];
					stack[++top] = w;
					depthOf[w] = top;
				} else if (colour[w] === GREY) {
					return Array.from(stack.subarray(depthOf[w], top + 1));
				}
			} else {
				colour[v] = BLACK;
				top--;
			}
		}
	}
	return null;
}

/** Rotates a cycle of indices to start at its smallest index and closes it with ids. */
function closedCycle(cycle: number[], ids: readonly string[]): string[] {
	let best = 0;
	for (let i = 1; i < cycle.length; i++) if (cycle[i] < cycle[best]) best = i;
	const rotated = [...cycle.slice(best), ...cycle.slice(0, best)];
	return [...rotated, rotated[0]].map((i) => ids[i]);
}
