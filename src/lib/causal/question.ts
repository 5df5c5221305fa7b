/**
 * A question in terms of the engine's indices: the diagram checked and compiled once, the
 * exposure and outcome ids turned into indices, and the one id and set order used by every
 * output. Shared by the façade modules (analysis.ts, reviewer.ts). O(n + m).
 */
import type { Diagram } from '../graph/diagram';
import { compileIndexed, type CompiledDag } from '../graph/compiled';
import { InputError } from '../graph/errors';
import { inspectDiagram, type DiagramIssue } from '../graph/validate';
import { precompiledGraph } from '../graph/fast-native/lazy-diagram';

export interface QuestionOptions {
	exposures?: string[];
	outcomes?: string[];
}

export interface Prepared {
	g: CompiledDag;
	X: number[];
	Y: number[];
	exposures: string[];
	outcomes: string[];
}

/** Compares ids the same way everywhere (code-unit order, stable across machines). */
export function compareIds(a: string, b: string): number {
	return a < b ? -1 : a > b ? 1 : 0;
}

export function sortIds(ids: Iterable<string>): string[] {
	return [...ids].sort(compareIds);
}

/** Orders sets by size, then lexicographically by their sorted ids. */
export function compareSets(a: readonly string[], b: readonly string[]): number {
	if (a.length !== b.length) return a.length - b.length;
	for (let i = 0; i < a.length; i++) {
		const c = compareIds(a[i], b[i]);
		if (c !== 0) return c;
	}
	return 0;
}

/** Throws InputError for the first structural error (duplicate ids, unknown ends, cycles). */
export function compileChecked(d: Diagram): CompiledDag {
	// A diagram from the fast reader comes with its graph, checked the same way (graph/fast-native).
	const ready = precompiledGraph(d);
	if (ready) return ready;
	const { issues, resolved } = inspectDiagram(d);
	const blocking = issues.filter((issue) => STRUCTURAL.has(issue.code));
	if (blocking.length > 0) throw new InputError(blocking[0].message);
	// Without structural problems ids are unique and every arrow end is a variable, so the
	// indices validation resolved are the compiled form's (O(n + m), no second pass over ids).
	return compileIndexed(
		d.variables.map((v) => v.id),
		resolved.indexOf,
		resolved.tail,
		resolved.head,
		d.variables.map((v) => v.measured)
	);
}

export const STRUCTURAL: ReadonlySet<DiagramIssue['code']> = new Set<DiagramIssue['code']>(['duplicate-id', 'unknown-arrow-end', 'self-loop', 'cycle']);

export function indicesFor(g: CompiledDag, ids: readonly string[], role: string): number[] {
	const seen = new Set<string>();
	const out: number[] = [];
	for (const id of ids) {
		const i = g.indexOf.get(id);
		if (i === undefined) throw new InputError(`The ${role} "${id}" is not a variable of the diagram`);
		if (seen.has(id)) continue;
		seen.add(id);
		out.push(i);
	}
	return out;
}

export function prepare(d: Diagram, opts: QuestionOptions = {}): Prepared {
	const g = compileChecked(d);
	const exposures = opts.exposures ?? d.exposures;
	const outcomes = opts.outcomes ?? d.outcomes;
	if (exposures.length === 0) throw new InputError('No exposure is chosen: name one (for example --exposure cycling)');
	if (outcomes.length === 0) throw new InputError('No outcome is chosen: name one (for example --outcome hypertension)');
	const X = indicesFor(g, exposures, 'exposure');
	const Y = indicesFor(g, outcomes, 'outcome');
	const both = exposures.find((id) => outcomes.includes(id));
	if (both !== undefined) throw new InputError(`"${both}" is both an exposure and an outcome`);
	return { g, X, Y, exposures: sortIds(new Set(exposures)), outcomes: sortIds(new Set(outcomes)) };
}

