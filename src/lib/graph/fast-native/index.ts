/**
 * The fast path for reading a native diagram file when only its compiled graph and question
 * are needed (the command line's `dsep`, `check`, `sets`, `paths` on large diagrams): from the
 * file's bytes straight to the CSR form of compiled.ts, with no JSON value tree and no
 * variable or arrow objects.
 *
 * Why a hand-written scanner instead of JSON.parse (measured, node --cpu-prof of
 * `causeway dsep` on 100,000 variables and 200,000 arrows, 11.5 MiB, bench/cli.ts): of about
 * 0.85 s of CPU, reading took nearly all — JSON.parse 0.23 s, collecting the 300,000 objects it
 * makes 0.14 s, the schema check 0.09 s, the diagram checks 0.13 s, compiling 0.20 s — and the
 * d-separation search 12 ms. The scanner reads the bytes once, keeps ids as byte spans, resolves
 * arrow ends with a hash table over the bytes (span-table.ts) and fills typed arrays. With it
 * the same process takes 0.52 s of CPU against 1.00 s through the full reader, at the same
 * load (bench/RESULTS.md, section cli), 10.4× less than networkx.
 *
 * It is only a fast path: it answers for a strict subset of the files the full reader
 * (native-json.ts, validate.ts) accepts, and for those gives the same compiled graph (checked by
 * property tests against the full reader). For anything else — other keys, escapes in ids,
 * version 1, `data` settings, repeated ids, unknown arrow ends, self-loops, cycles, limits —
 * it returns `{ ok: false }` and the caller reads the file with the full reader, which owns
 * every message. Duplicate arrows are kept, as compileChecked keeps them.
 *
 * The bytes must be valid UTF-8 (the caller checks; the command line uses Node's isUtf8, as
 * its text decoding does). Cost O(bytes + n + m), no recursion.
 */
import { compileIndexed, type CompiledDag } from '../compiled';
import type { Diagram } from '../diagram';
import type { ReadLimits } from '../size-limits';
import { isAcyclic } from './acyclic';
import { IdIndex } from './id-index';
import { OffFastPath, offFastPath } from './json-bytes';
import { lazyDiagram } from './lazy-diagram';
import { scannedArrows, scannedVariables } from './lists';
import { scanDiagram, type ScannedDiagram } from './scan-diagram';
import { SpanTable } from './span-table';
import { idTexts } from './texts';

export { precompiledGraph } from './lazy-diagram';

export type FastRead = { ok: true; diagram: Diagram; graph: CompiledDag } | { ok: false; reason: string };

/**
 * Reads a native diagram from UTF-8 bytes, or says why it leaves that to the full reader.
 * `full` reads the same file with the full reader; the returned diagram calls it only if its
 * variable or arrow list is used and cannot be made from the scan (lazy-diagram.ts, lists.ts).
 */
export function readNativeFast(input: Uint8Array, limits: ReadLimits, full: () => Diagram): FastRead {
	try {
		// A plain Uint8Array view: indexing a Node Buffer (a Uint8Array subclass) here made the
		// hash lookups 2–4× slower, and its subarray() builds a Buffer object each time.
		const bytes = new Uint8Array(input.buffer, input.byteOffset, input.length);
		const scanned = scanDiagram(bytes, limits);
		const { graph, from, to } = compileScanned(scanned);
		let whole: Diagram | undefined;
		const fullLists = () => (whole ??= full());
		const diagram = lazyDiagram(scanned, graph, {
			variables: () => (scanned.plainVariables ? scannedVariables(scanned, graph.ids) : fullLists().variables),
			arrows: () => (scanned.plainArrows ? scannedArrows(graph.ids, from, to) : fullLists().arrows)
		});
		return { ok: true, diagram, graph };
	} catch (e) {
		// Anything unexpected also goes to the full reader, which then reports it its own way.
		return { ok: false, reason: e instanceof OffFastPath ? e.reason : `unexpected: ${String(e)}` };
	}
}

/** Ids interned, arrow ends resolved, structure checked, CSR built; or OffFastPath. */
function compileScanned(s: ScannedDiagram): { graph: CompiledDag; from: Int32Array; to: Int32Array } {
	const { bytes, n, m, ends } = s;
	const table = new SpanTable(bytes, s.ids, n, 2 * m);
	if (table.duplicate !== -1) offFastPath('a repeated id');
	const from = new Int32Array(m);
	const to = new Int32Array(m);
	for (let e = 0; e < m; e++) {
		const f = table.findQuoted(bytes, ends[2 * e]);
		const t = table.findQuoted(bytes, ends[2 * e + 1]);
		if (f < 0 || t < 0) offFastPath('an arrow end that is not a variable');
		if (f === t) offFastPath('a self-loop');
		from[e] = f;
		to[e] = t;
	}
	table.settle();
	const ids = idTexts(table.pool, table.poolStart, n);
	const indexOf = new IdIndex(ids, table);
	const graph = compileIndexed(ids, indexOf, from, to);
	// The flags straight into the new graph's array, rather than through a list of 100,000
	// booleans that the garbage collector then copies (compileIndexed takes booleans).
	graph.measured.set(s.measured);
	if (!isAcyclic(graph)) offFastPath('a cycle');
	return { graph, from, to };
}
