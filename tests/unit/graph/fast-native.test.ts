/**
 * The fast reader of native diagram files (src/lib/graph/fast-native) on chosen inputs: what it
 * answers, what it leaves to the full reader (and that the full reader then says the same as
 * without it), the hostile corpus of tests/fixtures/bad, and the lazy diagram it returns.
 * The reference is the full reader (fast-native-oracle.ts): JSON.parse, the schema, the limits
 * and validate.ts. Property tests over generated files: fast-native-properties.test.ts.
 */
import { isUtf8 } from 'node:buffer';
import { describe, expect, it } from 'vitest';
import { checkFirst, dSeparation } from '../../../src/lib/causal/analysis';
import { compileChecked } from '../../../src/lib/causal/question';
import { arrowLookup } from '../../../src/lib/graph/fast-native/arrow-lookup';
import { writeDiagramJson } from '../../../src/lib/graph/native-json';
import { APP_READ_LIMITS, CLI_READ_LIMITS, type ReadLimits } from '../../../src/lib/graph/size-limits';
import { randomDiagramJson } from '../../../bench/cli-diagram';
import { committedCorpus, wholeCorpus } from '../reliability/corpus';
import { expectSameAsFullReader, fastRead, fullRead } from './fast-native-oracle';
import { diagramOf, M_BIAS_LOWER_CASE } from '../reference/published-diagrams';

const enc = new TextEncoder();
const bytes = (text: string) => enc.encode(text);
const file = (body: Record<string, unknown>) => JSON.stringify({ format: 'causeway.diagram', version: 2, ...body });

const V = (id: string, more: Record<string, unknown> = {}) => ({ id, label: id.toUpperCase(), measured: true, ...more });
const A = (from: string, to: string, more: Record<string, unknown> = {}) => ({ from, to, ...more });
// M-bias (reference/published-diagrams.ts), e ← u1 → m ← u2 → d, e → d, labels in capitals.
const MBIAS = (() => {
	const d = diagramOf(M_BIAS_LOWER_CASE, { title: 'M-bias', unmeasured: ['u1', 'u2'], adjusted: ['m'] });
	return { ...d, variables: d.variables.map((v) => V(v.id, { measured: v.measured })) };
})();

function outcome<T>(run: () => T): { value: T } | { error: string } {
	try {
		return { value: run() };
	} catch (e) {
		return { error: (e as Error).message };
	}
}

function reason(text: string, limits?: ReadLimits): string {
	const { read } = fastRead(bytes(text), limits);
	return read.ok ? 'answered' : read.reason;
}

describe('fast reader: what it answers', () => {
	it('reads the M-bias diagram to the same graph and question as the full reader', () => {
		expect(expectSameAsFullReader(bytes(file(MBIAS)))).toBe(true);
	});

	it('reads what Causeway writes (pretty-printed, positions, notes on variables and arrows)', () => {
		const d = { ...MBIAS, variables: MBIAS.variables.map((v, i) => ({ ...v, x: i * 10.5, y: -i, note: `note ${i}` })), arrows: MBIAS.arrows.map((a) => ({ ...a, note: 'why' })) };
		const text = writeDiagramJson({ ...d, title: d.title });
		expect(expectSameAsFullReader(bytes(text))).toBe(true);
	});

	it('reads the benchmark file shape (bench/cli-diagram.ts) with its ids, arrows and measured flags, and makes its lists without the full reader', () => {
		const b = bytes(randomDiagramJson(3_000));
		expect(expectSameAsFullReader(b)).toBe(true);
		const { read, fullCalls } = fastRead(b);
		if (!read.ok) throw new Error(read.reason);
		expect(read.diagram.arrows.length + read.diagram.variables.length).toBe(9_000);
		expect(fullCalls()).toBe(0);
	});

	it('handles escapes, non-ASCII and a byte-order mark where it reads text, and keeps duplicate arrows', () => {
		const text = file({
			title: 'caf\\u00e9 \\"quoted\\" \\/ \\n',
			variables: [V('é'), V('😀'), V('日本')],
			arrows: [A('é', '😀'), A('é', '😀'), A('😀', '日本')],
			exposures: ['é'],
			outcomes: ['日本'],
			adjusted: []
		}).replace('"title":"caf\\\\u00e9', '"title":"caf\\u00e9');
		expect(expectSameAsFullReader(bytes(`\uFEFF ${text}\n`))).toBe(true);
		expect(expectSameAsFullReader(bytes(file({ ...MBIAS, exposures: ['\\u0065'] }).replace('"\\\\u0065"', '"\\u0065"')))).toBe(true);
	});

	it('answers dsep through the engine exactly as from the full reader', () => {
		const text = randomDiagramJson(2_000);
		const { read } = fastRead(bytes(text));
		const full = fullRead(bytes(text));
		expect(read.ok && full.ok).toBe(true);
		if (!read.ok || !full.ok) return;
		for (const [from, to, given] of [
			['v1', 'v2', ['v3', 'v4']],
			['v10', 'v1999', []],
			['v5', 'v6', ['v7']]
		] as const) {
			expect(dSeparation(read.diagram, [from], [to], [...given])).toEqual(dSeparation(full.diagram, [from], [to], [...given]));
		}
	});
});

describe('fast reader: what it leaves to the full reader', () => {
	const cases: [string, string, string][] = [
		['version 1', file({ variables: [], arrows: [] }).replace('"version":2', '"version":1'), 'not version 2'],
		['version written 2.0', file({ variables: [], arrows: [] }).replace('"version":2', '"version":2.0'), 'not version 2'],
		['an unknown top-level key', file({ variables: [], arrows: [], layout: 'tidy' }), 'a key the fast path does not read'],
		['a variable with data settings', file({ variables: [V('a', { data: { column: 'A' } })], arrows: [] }), 'a key the fast path does not read'],
		['an unknown key on an arrow', file({ variables: [V('a'), V('b')], arrows: [A('a', 'b', { weight: 1 })] }), 'a key the fast path does not read'],
		['a __proto__ key', file({ variables: [], arrows: [] }).replace('{', '{"__proto__":{},'), 'a key the fast path does not read'],
		['a key written twice', file({ variables: [], arrows: [] }).replace('"version":2', '"version":2,"version":2'), 'written twice'],
		['an escape in an id', file({ variables: [V('a\\nb')], arrows: [] }).replace('a\\\\nb', 'a\\nb'), 'an escape in an id'],
		['an escape in an arrow end', file({ variables: [V('a'), V('b')], arrows: [A('a', 'b')] }).replace('"from":"a"', '"from":"\\u0061"'), 'an escape in an arrow end'],
		['a repeated id', file({ variables: [V('a'), V('a')], arrows: [] }), 'a repeated id'],
		['an arrow to an unknown id', file({ variables: [V('a')], arrows: [A('a', 'b')] }), 'not a variable'],
		['a self-loop', file({ variables: [V('a')], arrows: [A('a', 'a')] }), 'a self-loop'],
		['a cycle', file({ variables: [V('a'), V('b'), V('c')], arrows: [A('a', 'b'), A('b', 'c'), A('c', 'a')] }), 'a cycle'],
		['"to" before "from"', file({ variables: [V('a'), V('b')], arrows: [{ to: 'b', from: 'a' }] }), 'comes before'],
		['measured as text', file({ variables: [V('a', { measured: 'yes' })], arrows: [] }), 'expected true or false'],
		['an empty id', file({ variables: [V('')], arrows: [] }), 'an empty an id'],
		['a coordinate of 1e999', file({ variables: [V('a', { x: 1 })], arrows: [] }).replace('"x":1', '"x":1e999'), 'too large to be finite'],
		['a trailing comma', file({ variables: [V('a')], arrows: [] }).replace('}]', '},]'), 'expected an object'],
		['text after the diagram', `${file({ variables: [], arrows: [] })} {}`, 'text after the diagram'],
		['a missing key', JSON.stringify({ format: 'causeway.diagram', version: 2, variables: [] }), 'a required key is missing'],
		['a DOT digraph', 'digraph { a -> b }', 'expected an object'],
		['a raw control character', file({ title: 'a\u0001b', variables: [], arrows: [] }).replace('\\u0001', '\u0001'), 'a control character']
	];
	it.each(cases)('%s', (_name, text, why) => {
		expect(reason(text)).toContain(why);
		expectSameAsFullReader(bytes(text));
	});

	it('leaves a diagram past the limits to the full reader, which names the limit', () => {
		const tight: ReadLimits = { ...CLI_READ_LIMITS, variables: 3, arrows: 2 };
		const four = file({ variables: ['a', 'b', 'c', 'd'].map((id) => V(id)), arrows: [] });
		expect(reason(four, tight)).toBe('more variables than the limit');
		const full = fullRead(bytes(four), tight);
		expect(full.ok ? '' : full.message).toContain('The diagram has 4 variables; the causeway command handles at most 3');
		const three = file({ variables: ['a', 'b', 'c'].map((id) => V(id)), arrows: [A('a', 'b'), A('b', 'c'), A('a', 'c')] });
		expect(reason(three, tight)).toBe('more arrows than the limit');
		expect(reason(file({ title: 't'.repeat(1_001), variables: [], arrows: [] }))).toBe('a title over the limit');
		expect(reason(file({ variables: [V('a', { label: 'l'.repeat(1_001) })], arrows: [] }))).toContain('a label longer than');
		// 600 two-byte characters are 1,200 bytes but within the 1,000-character limit: the fast
		// path cannot tell from the bytes alone, so it leaves the file to the full reader, which accepts it.
		const wide = file({ variables: [V('a', { label: 'é'.repeat(600) })], arrows: [] });
		expect(reason(wide)).toContain('a label longer than');
		expect(fullRead(bytes(wide)).ok).toBe(true);
		expect(reason(file({ variables: [], arrows: [] }), { ...CLI_READ_LIMITS, chars: 10 })).toBe('more bytes than the limit');
	});

	it('gives up on ids made to collide rather than probe quadratically, and the full reader reads them', () => {
		// 500 ids chosen so that the table's hash (FNV-1a with murmur3's final mix, as in
		// span-table.ts) puts them all in one slot of its 1,024: linear probing would take about
		// 125,000 probes, over the budget of 16 per id.
		const slotOf = (id: string) => {
			let h = 0x811c9dc5;
			for (const c of enc.encode(id)) h = Math.imul(h ^ c, 0x01000193);
			h ^= h >>> 16;
			h = Math.imul(h, 0x85ebca6b);
			h ^= h >>> 13;
			return h & 1023;
		};
		const ids: string[] = [];
		for (let i = 0; ids.length < 500; i++) if (slotOf(`c${i}`) === 0) ids.push(`c${i}`);
		const text = file({ variables: ids.map((id) => V(id)), arrows: [] });
		expect(reason(text)).toBe('too many hash collisions among the ids');
		expect(fullRead(bytes(text)).ok).toBe(true);
	});
});

describe('fast reader on the hostile corpus (tests/fixtures/bad, JSON part)', () => {
	const json = wholeCorpus().filter((e) => e.name.startsWith('json/'));
	it('covers the committed JSON files', () => {
		expect(committedCorpus().filter((e) => e.name.startsWith('json/')).length).toBeGreaterThanOrEqual(50);
	});
	/** The same file as version 2 (most of the corpus is version 1, which the fast path leaves at once). */
	const asVersion2 = (b: Uint8Array) => bytes(new TextDecoder().decode(b).replace(/("version"\s*:\s*)1\b/, '$12'));
	const answered: string[] = [];
	it.each(json.map((e) => [e.name, e] as const))('%s', (name, e) => {
		// The command takes the fast path only for plain UTF-8 (read-input.ts); others go to the full reader directly.
		if (!isUtf8(e.bytes) || e.bytes[0] === 0xff || e.bytes[0] === 0xfe) return;
		for (const limits of [CLI_READ_LIMITS, APP_READ_LIMITS]) {
			for (const b of [e.bytes, asVersion2(e.bytes)]) {
				const ok = expectSameAsFullReader(b, limits);
				// The app's limits are the ones the corpus was made for.
				if (e.expect === 'error' && limits === APP_READ_LIMITS) expect(ok).toBe(false);
				if (!ok) continue;
				answered.push(name);
				// A file with a problem of the question (not of the graph) is refused by the engine alike.
				const fast = fastRead(b, limits).read;
				const full = fullRead(b, limits);
				if (fast.ok && full.ok) expect(outcome(() => checkFirst(fast.diagram))).toEqual(outcome(() => checkFirst(full.diagram)));
			}
		}
	});
	it('answers the legal files of the corpus once they are version 2', () => {
		for (const name of ['json/prototype-names-as-ids.json', 'json/markup-labels.json', 'json/utf8-bom.json', 'json/at-the-limits.json']) expect(answered).toContain(name);
	});
});

describe('the diagram the fast reader returns', () => {
	const text = file(MBIAS);
	it('makes its lists on first use, from the scan when they have the plain shape, else from the full reader', () => {
		const { read, fullCalls } = fastRead(bytes(text));
		expect(read.ok).toBe(true);
		if (!read.ok) return;
		const d = read.diagram;
		expect(Object.keys(d)).toEqual(['title', 'variables', 'arrows', 'exposures', 'outcomes', 'adjusted']);
		expect(compileChecked(d)).toBe(read.graph);
		expect(d.arrows.length).toBe(5);
		expect(d.variables.map((v) => v.id)).toEqual(MBIAS.variables.map((v) => v.id)); // the file's order
		expect(fullCalls()).toBe(0);
		// A note on one arrow: the arrows come from the full reader, the plain variables still from the scan.
		const noted = fastRead(bytes(file({ ...MBIAS, arrows: [A('u1', 'e', { note: 'why' }), ...MBIAS.arrows.slice(1)] })));
		if (!noted.read.ok) throw new Error(noted.read.reason);
		expect(noted.read.diagram.variables.length).toBe(5);
		expect(noted.fullCalls()).toBe(0);
		expect(noted.read.diagram.arrows[0]).toEqual({ from: 'u1', to: 'e', note: 'why' });
		expect(noted.fullCalls()).toBe(1);
		// The lists may now be edited, so the graph is compiled from them again.
		d.arrows.push({ from: 'm', to: 'e' });
		const again = compileChecked(d);
		expect(again).not.toBe(read.graph);
		expect(again.parentList.length).toBe(6);
	});

	it('can have its lists replaced, and spreads and clones like a plain diagram', () => {
		const { read } = fastRead(bytes(text));
		if (!read.ok) throw new Error(read.reason);
		const d = read.diagram;
		d.arrows = [];
		expect(compileChecked(d).parentList.length).toBe(0);
		const copy = structuredClone({ ...d });
		expect(copy.variables.length).toBe(5);
		expect(copy.arrows).toEqual([]);
	});
});

describe('arrowLookup (the direction of a printed path’s arrows)', () => {
	it('answers from the compiled graph of a fast-read diagram, without making the arrow list, as from the list', () => {
		const text = file(MBIAS);
		const { read, fullCalls } = fastRead(bytes(text));
		const full = fullRead(bytes(text));
		if (!read.ok || !full.ok) throw new Error('not read');
		const fast = arrowLookup(read.diagram);
		const slow = arrowLookup(full.diagram);
		const ids = ['u1', 'u2', 'e', 'm', 'd', 'x'];
		for (const a of ids) for (const b of ids) expect(fast(a, b)).toBe(slow(a, b));
		expect(fast('u1', 'e')).toBe(true);
		expect(fast('e', 'u1')).toBe(false);
		expect(compileChecked(read.diagram)).toBe(read.graph); // the lists were not touched
		expect(fullCalls()).toBe(0);
	});
});
