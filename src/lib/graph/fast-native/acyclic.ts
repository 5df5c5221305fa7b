/**
 * Whether a compiled graph has no directed cycle, by Kahn's algorithm (Kahn 1962: repeatedly
 * remove a variable with no remaining parent; all are removed iff the graph is acyclic).
 * Iterative over the CSR arrays, O(n + m). The fast reader only needs yes or no: on a cycle it
 * hands the file to the full reader, whose check (validate.ts) names the cycle.
 */
import type { CompiledDag } from '../compiled';

export function isAcyclic(g: CompiledDag): boolean {
	const { n, parentStart, childStart, childList } = g;
	const waiting = new Int32Array(n); // parents not yet removed
	const queue = new Int32Array(n);
	let tail = 0;
	for (let v = 0; v < n; v++) {
		waiting[v] = parentStart[v + 1] - parentStart[v];
		if (waiting[v] === 0) queue[tail++] = v;
	}
	for (let head = 0; head < tail; head++) {
		const v = queue[head];
		for (let k = childStart[v]; k < childStart[v + 1]; k++) if (--waiting[childList[k]] === 0) queue[tail++] = childList[k];
	}
	return tail === n;
}
