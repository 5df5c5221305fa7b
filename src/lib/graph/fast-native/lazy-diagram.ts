/**
 * The diagram the fast reader returns, and the compiled graph that goes with it.
 *
 * The title and the question (exposures, outcomes, planned set) are read; the variable and
 * arrow lists are not built, because building their 300,000 objects is what the fast reader
 * saves. They are made on first use (`lists`: from the scan, or by the full reader), equal to
 * what the full reader gives. Until then the compiled graph is registered for the diagram, and
 * compileChecked (causal/question.ts) takes it instead of compiling: touching either list
 * (which may then be edited) removes it, so the graph can never be stale.
 */
import type { CompiledDag } from '../compiled';
import type { Arrow, Diagram, Variable } from '../diagram';

const compiled = new WeakMap<Diagram, CompiledDag>();

/** The graph the fast reader compiled for `d`, while neither of its lists has been touched. */
export function precompiledGraph(d: Diagram): CompiledDag | undefined {
	return compiled.get(d);
}

export interface DiagramHead {
	title: string;
	exposures: string[];
	outcomes: string[];
	adjusted: string[];
}

/**
 * A Diagram whose `variables` and `arrows` are own enumerable properties made on first use (so
 * spreading, JSON.stringify and structuredClone see them), in the full reader's key order.
 */
export function lazyDiagram(head: DiagramHead, graph: CompiledDag, lists: { variables: () => Variable[]; arrows: () => Arrow[] }): Diagram {
	const d = { title: head.title } as Diagram;
	lazyList(d, 'variables', lists.variables);
	lazyList(d, 'arrows', lists.arrows);
	d.exposures = head.exposures;
	d.outcomes = head.outcomes;
	d.adjusted = head.adjusted;
	compiled.set(d, graph);
	return d;
}

/** d[key] made by `make` on first read; reading or replacing it unregisters the compiled graph. */
function lazyList<K extends 'variables' | 'arrows'>(d: Diagram, key: K, make: () => Diagram[K]): void {
	let value: Diagram[K] | undefined;
	Object.defineProperty(d, key, {
		enumerable: true,
		configurable: true,
		get: () => {
			compiled.delete(d);
			return (value ??= make());
		},
		set: (replaced: Diagram[K]) => {
			compiled.delete(d);
			value = replaced;
		}
	});
}
