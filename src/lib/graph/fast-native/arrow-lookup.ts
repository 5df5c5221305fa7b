/**
 * "Is there an arrow a → b?" for printing a path with its arrows' directions (the command line's
 * `dsep`, `check` and `paths` texts). For a diagram from the fast reader the compiled graph
 * answers, O(out-degree of a) per question, without making the arrow list; otherwise a set of
 * the arrows is built once, O(m). On 100,000 variables and 200,000 arrows the set (one string
 * per arrow) cost about half a second of a `dsep` that otherwise takes about as much
 * (bench/cli.ts), to look up the few arrows of one path.
 */
import type { Diagram } from '../diagram';
import { precompiledGraph } from './lazy-diagram';

export function arrowLookup(d: Diagram): (a: string, b: string) => boolean {
	const g = precompiledGraph(d);
	if (g) {
		return (a, b) => {
			const from = g.indexOf.get(a);
			const to = g.indexOf.get(b);
			if (from === undefined || to === undefined) return false;
			for (let k = g.childStart[from]; k < g.childStart[from + 1]; k++) if (g.childList[k] === to) return true;
			return false;
		};
	}
	const arrows = new Set(d.arrows.map((a) => `${a.from}\u0000${a.to}`));
	return (a, b) => arrows.has(`${a}\u0000${b}`);
}
