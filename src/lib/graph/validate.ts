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

	// Arrows.
	const seen = new Map<string, Map<string, number>>(); // from → to → first arrow index
	const acyclicCandidates: { from: string; to: string }[] = [];
	d.arrows.forEach((a, i) => {
		const name = `Arrow ${i + 1} (${showId(a.from)} → ${showId(a.to)})`;
		const fromKnown = known(a.from);
		const toKnown = known(a.to);
		if (!fromKnown || !toKnown) {
			const ends: string[] = [];
			if (!fromKnown) ends.push(`starts at ${quote(a.from)}`);
			if (!toKnown) ends.push(`points to ${quote(a.to)}`);
			const which = !fromKnown && !toKnown && a.from !== a.to ? 'neither of which is a variable' : 'which is not a variable';
			issues.push({
				code: 'unknown-arrow-end',
				message: `${name} ${ends.join(' and ')}, ${which}`,
				ids: [...new Set([...(fromKnown ? [] : [a.from]), ...(toKnown ? [] : [a.to])])]
			});
			return;
		}
		if (a.from === a.to) {
			issues.push({ code: 'self-loop', message: `${name} points from ${quote(a.from)} to itself; ${NEEDS_DAG}, so remove this arrow`, ids: [a.from] });
			return;
		}
		let targets = seen.get(a.from);
		if (!targets) seen.set(a.from, (targets = new Map()));
		const earlier = targets.get(a.to);
		if (earlier !== undefined) {
			issues.push({ code: 'duplicate-arrow', message: `${name} repeats arrow ${earlier + 1}`, ids: [a.from, a.to] });
			return;
		}
		targets.set(a.to, i);
		acyclicCandidates.push(a);
	});

	const cycle = findCycle(
		d.variables.map((v) => v.id),
		acyclicCandidates
	);
	if (cycle) {
		issues.push({
			code: 'cycle',
			message: `The diagram has a cycle: ${cycle.map(showId).join(' → ')}; ${NEEDS_DAG}, so remove or reverse one of these arrows`,
			ids: cycle.slice(0, -1)
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
	return issues;
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
	const n = ids.length;
	const indexOf = new Map<string, number>();
	ids.forEach((id, i) => {
		if (!indexOf.has(id)) indexOf.set(id, i);
	});

	// Children in compressed sparse rows, keeping arrow order.
	const start = new Int32Array(n + 1);
	const ends: [number, number][] = [];
	for (const a of arrows) {
		const f = indexOf.get(a.from);
		const t = indexOf.get(a.to);
		if (f === undefined || t === undefined) continue;
		ends.push([f, t]);
		start[f + 1]++;
	}
	for (let v = 0; v < n; v++) start[v + 1] += start[v];
	const child = new Int32Array(ends.length);
	const fill = start.slice(0, n);
	for (const [f, t] of ends) child[fill[f]++] = t;

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
					return closedCycle(Array.from(stack.subarray(depthOf[w], top + 1)), ids);
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
