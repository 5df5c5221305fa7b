/**
 * The check every fast-reader test makes: the fast path (src/lib/graph/fast-native) against the
 * full reader, as the command line runs them on the same bytes — the bytes decoded as UTF-8
 * (one byte-order mark dropped, as the command's decoding does), read by parseDiagramJson
 * (JSON.parse, the generated schema validator, the size limits) and compiled by compileChecked
 * (validate.ts's duplicate ids, unknown arrow ends, self-loops, cycles).
 *
 * Whenever the fast path answers, the full reader must accept the same bytes and give the same
 * compiled graph and question; whenever the full reader refuses, the fast path must not answer.
 */
import { isUtf8 } from 'node:buffer';
import { expect } from 'vitest';
import { compileChecked } from '../../../src/lib/causal/question';
import type { CompiledDag } from '../../../src/lib/graph/compiled';
import type { Diagram } from '../../../src/lib/graph/diagram';
import { InputError } from '../../../src/lib/graph/errors';
import { readNativeFast, type FastRead } from '../../../src/lib/graph/fast-native';
import { parseDiagramJson } from '../../../src/lib/graph/native-json';
import { CLI_READ_LIMITS, type ReadLimits } from '../../../src/lib/graph/size-limits';

export type FullRead = { ok: true; diagram: Diagram; graph: CompiledDag } | { ok: false; message: string };

const utf8 = new TextDecoder(); // drops one byte-order mark, like the command's decoding

export function fullRead(bytes: Uint8Array, limits: ReadLimits = CLI_READ_LIMITS): FullRead {
	try {
		const diagram = parseDiagramJson(utf8.decode(bytes), limits);
		return { ok: true, diagram, graph: compileChecked(diagram) };
	} catch (e) {
		if (e instanceof InputError) return { ok: false, message: e.message };
		throw e;
	}
}

/** The fast path on valid UTF-8 bytes, its `full` reader counting its calls. */
export function fastRead(bytes: Uint8Array, limits: ReadLimits = CLI_READ_LIMITS): { read: FastRead; fullCalls: () => number } {
	let calls = 0;
	const read = readNativeFast(bytes, limits, () => {
		calls++;
		return parseDiagramJson(utf8.decode(bytes), limits);
	});
	return { read, fullCalls: () => calls };
}

/** The compiled graph as plain data, indexOf included (every id and a few that are not). */
export function graphData(g: CompiledDag, probes: readonly string[] = []): unknown {
	return {
		n: g.n,
		ids: [...g.ids],
		indexOf: [...g.ids, ...probes].map((id) => [id, g.indexOf.get(id) ?? null, g.indexOf.has(id)]),
		size: g.indexOf.size,
		parentStart: [...g.parentStart],
		parentList: [...g.parentList],
		childStart: [...g.childStart],
		childList: [...g.childList],
		measured: [...g.measured]
	};
}

/**
 * Runs both readers on the bytes and checks the contract; returns whether the fast path
 * answered (so a property can also require it to answer clean inputs).
 */
export function expectSameAsFullReader(bytes: Uint8Array, limits: ReadLimits = CLI_READ_LIMITS): boolean {
	expect(isUtf8(bytes)).toBe(true);
	const full = fullRead(bytes, limits);
	const { read, fullCalls } = fastRead(bytes, limits);
	if (!full.ok) {
		expect(read.ok, `the full reader refuses (${full.message}) but the fast path answered`).toBe(false);
		return false;
	}
	if (!read.ok) return false;
	const probes = ['', 'v0 ', '\uD800', '\uFFFD', ...full.diagram.exposures];
	expect(graphData(read.graph, probes)).toEqual(graphData(full.graph, probes));
	const d = read.diagram;
	expect({ title: d.title, exposures: d.exposures, outcomes: d.outcomes, adjusted: d.adjusted }).toEqual({
		title: full.diagram.title,
		exposures: full.diagram.exposures,
		outcomes: full.diagram.outcomes,
		adjusted: full.diagram.adjusted
	});
	expect(compileChecked(d)).toBe(read.graph); // taken as compiled, nothing read again
	expect(fullCalls()).toBe(0);
	// The lists, on first use, equal the full reader's (made from the scan, or by the full
	// reader at most once), key order included: the whole diagram serialises the same.
	expect(d.variables).toStrictEqual(full.diagram.variables);
	expect(d.arrows).toStrictEqual(full.diagram.arrows);
	expect(JSON.stringify(d)).toBe(JSON.stringify(full.diagram));
	expect(fullCalls()).toBeLessThanOrEqual(1);
	return true;
}
