/**
 * The compact, indexed form of a diagram that the engine's algorithms work on.
 *
 * Variables become integers 0..n-1 (in the diagram's order); parents and children are stored
 * in compressed sparse rows (CSR): the parents of v are parentList[parentStart[v] ..
 * parentStart[v+1]). Building it is O(n + m); every algorithm in src/lib/causal reads only this.
 */
import type { Diagram } from './diagram';

export interface CompiledDag {
	readonly n: number;
	readonly ids: readonly string[];
	readonly indexOf: ReadonlyMap<string, number>;
	readonly parentStart: Int32Array;
	readonly parentList: Int32Array;
	readonly childStart: Int32Array;
	readonly childList: Int32Array;
	/** 1 where the variable is measured. */
	readonly measured: Uint8Array;
}

export class UnknownVariableError extends Error {
	constructor(readonly id: string, readonly where: string) {
		super(`${where} names "${id}", which is not a variable of the diagram`);
		this.name = 'UnknownVariableError';
	}
}

/** Builds the CSR form from plain lists. Arrows must name existing ids (O(n + m)). */
export function compileDag(ids: readonly string[], arrows: readonly { from: string; to: string }[], measured?: readonly boolean[]): CompiledDag {
	const indexOf = new Map<string, number>();
	ids.forEach((id, i) => indexOf.set(id, i));
	const m = arrows.length;
	const from = new Int32Array(m);
	const to = new Int32Array(m);
	for (let e = 0; e < m; e++) {
		const f = indexOf.get(arrows[e].from);
		const t = indexOf.get(arrows[e].to);
		if (f === undefined) throw new UnknownVariableError(arrows[e].from, `Arrow ${e + 1}`);
		if (t === undefined) throw new UnknownVariableError(arrows[e].to, `Arrow ${e + 1}`);
		from[e] = f;
		to[e] = t;
	}
	return compileIndexed(ids, indexOf, from, to, measured);
}

/**
 * The CSR form from arrows already given as indices (ids unique, every end a variable: what a
 * diagram without structural problems gives, validate.ts inspectDiagram). O(n + m).
 */
export function compileIndexed(
	ids: readonly string[],
	indexOf: ReadonlyMap<string, number>,
	from: Int32Array,
	to: Int32Array,
	measured?: readonly boolean[]
): CompiledDag {
	const n = ids.length;
	const m = from.length;
	const indeg = new Int32Array(n);
	const outdeg = new Int32Array(n);
	for (let e = 0; e < m; e++) {
		outdeg[from[e]]++;
		indeg[to[e]]++;
	}
	const parentStart = new Int32Array(n + 1);
	const childStart = new Int32Array(n + 1);
	for (let v = 0; v < n; v++) {
		parentStart[v + 1] = parentStart[v] + indeg[v];
		childStart[v + 1] = childStart[v] + outdeg[v];
	}
	const parentList = new Int32Array(m);
	const childList = new Int32Array(m);
	const pFill = parentStart.slice(0, n);
	const cFill = childStart.slice(0, n);
	for (let e = 0; e < m; e++) {
		parentList[pFill[to[e]]++] = from[e];
		childList[cFill[from[e]]++] = to[e];
	}
	const meas = new Uint8Array(n);
	for (let v = 0; v < n; v++) meas[v] = measured === undefined || measured[v] ? 1 : 0;
	return { n, ids, indexOf, parentStart, parentList, childStart, childList, measured: meas };
}

/** Compiles a diagram model (arrows must name known variables; see validate.ts for checks). */
export function compileDiagram(d: Diagram): CompiledDag {
	return compileDag(
		d.variables.map((v) => v.id),
		d.arrows,
		d.variables.map((v) => v.measured)
	);
}

/** Maps ids to indices, throwing UnknownVariableError naming `where` for an unknown id. */
export function indicesOf(g: CompiledDag, ids: readonly string[], where: string): number[] {
	return ids.map((id) => {
		const i = g.indexOf.get(id);
		if (i === undefined) throw new UnknownVariableError(id, where);
		return i;
	});
}
