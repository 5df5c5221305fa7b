// Property-based checks (fast-check): random diagrams survive write → parse unchanged, in the
// native JSON format and in DOT; random and mangled text never makes a reader throw anything
// but an InputError with a one-line message.
import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { canonicalLabels, DATA_KINDS, type Arrow, type Diagram, type Extra, type Variable, type VariableData } from '../../../src/lib/graph/diagram';
import { parseDot, writeDot } from '../../../src/lib/graph/dot';
import { InputError } from '../../../src/lib/graph/errors';
import { parseDiagramJson, writeDiagramJson } from '../../../src/lib/graph/native-json';
import { readDiagramText } from '../../../src/lib/graph/read-file';
import { findCycle } from '../../../src/lib/graph/validate';

const UNSAFE = new Set(['__proto__', 'constructor', 'prototype']);

/** Any text, including control characters, quotes, backslashes, line breaks and astral characters. */
const anyText = fc.oneof(fc.string({ unit: 'binary' }), fc.string({ unit: 'grapheme' }), fc.constantFrom('', '\\', '"', '\\"', '\n', '\r\n', '&amp;', '\\N', '\\l', '<b>', '\u2028'));
/** Text that DOT can hold as a raw quoted string: no backslash before a quote, a line break or the end. */
const dotRawText = anyText.filter((s) => !/\\(?=["\r\n]|$)/.test(s));
const coordinate = fc.double({ noNaN: true, noDefaultInfinity: true }).map((x) => (x === 0 ? 0 : x));

/** JSON values without keys the reader drops and without -0 (JSON writes it as 0). */
function sanitize(value: unknown): unknown {
	if (typeof value === 'number') return value === 0 ? 0 : value;
	if (Array.isArray(value)) return value.map(sanitize);
	if (typeof value === 'object' && value !== null) {
		const out: Record<string, unknown> = {};
		for (const [k, v] of Object.entries(value)) if (!UNSAFE.has(k)) out[k] = sanitize(v);
		return out;
	}
	return value;
}

function extraArb(reserved: ReadonlySet<string>, key: fc.Arbitrary<string>, value: fc.Arbitrary<unknown>): fc.Arbitrary<Extra | undefined> {
	return fc.option(
		fc
			.uniqueArray(fc.tuple(key.filter((k) => !reserved.has(k) && !UNSAFE.has(k)), value), { minLength: 1, maxLength: 4, selector: ([k]) => k })
			.map((pairs) => Object.fromEntries(pairs)),
		{ nil: undefined }
	);
}

interface Flavour {
	id: fc.Arbitrary<string>;
	extraKey: fc.Arbitrary<string>;
	extraValue: fc.Arbitrary<unknown>;
	/** DOT lists roles in variable order, once each; JSON keeps any list. */
	rolesInVariableOrder: boolean;
}

const jsonFlavour: Flavour = {
	id: anyText.filter((s) => s.length > 0),
	extraKey: anyText,
	extraValue: fc.jsonValue({ maxDepth: 3 }).map(sanitize),
	rolesInVariableOrder: false
};

const balancedHtml = fc.array(fc.constantFrom('a', ' ', '<b>', '</b>', '&amp;', 'x'), { maxLength: 6 }).map((parts) => parts.join(''));
const dotFlavour: Flavour = {
	id: dotRawText.filter((s) => s.length > 0),
	extraKey: dotRawText.filter((s) => s.length > 0),
	extraValue: fc.oneof(dotRawText, balancedHtml.map((html) => ({ html }))),
	rolesInVariableOrder: true
};

const NODE_OWN = new Set(['id', 'label', 'measured', 'x', 'y', 'note', 'data', 'role', 'pos', 'data_column', 'data_kind', 'data_reference', 'data_labels']);

/** A variable's data settings (version 2); unknown keys inside them only where the format keeps them. */
function dataArb(f: Flavour): fc.Arbitrary<VariableData | undefined> {
	const text = f.rolesInVariableOrder ? dotRawText : anyText;
	return fc.option(
		fc
			.record(
				{
					column: fc.option(text.filter((s) => s.length > 0), { nil: null }),
					kind: fc.constantFrom(...DATA_KINDS),
					reference: text,
					labels: fc.array(fc.record({ value: fc.oneof(text, fc.nat({ max: 30 }).map(String)).filter((v) => !UNSAFE.has(v)), label: text }), { minLength: 1, maxLength: 4 }).map(canonicalLabels),
					extra: f.rolesInVariableOrder ? fc.constant(undefined) : extraArb(new Set(['column', 'kind', 'reference', 'labels']), f.extraKey, f.extraValue)
				},
				{ requiredKeys: [] }
			)
			.filter((d) => Object.values(d).some((x) => x !== undefined))
			.map((d) => Object.fromEntries(Object.entries(d).filter(([, x]) => x !== undefined)) as VariableData),
		{ nil: undefined }
	);
}

function diagramArb(f: Flavour): fc.Arbitrary<Diagram> {
	const variable = (id: string): fc.Arbitrary<Variable> =>
		fc
			.record({
				label: fc.option(anyText, { nil: undefined }),
				measured: fc.boolean(),
				pos: fc.option(fc.tuple(coordinate, coordinate), { nil: undefined }),
				note: fc.option(anyText, { nil: undefined }),
				data: dataArb(f),
				extra: extraArb(NODE_OWN, f.extraKey, f.extraValue)
			})
			.map(({ label, measured, pos, note, data, extra }) => {
				const v: Variable = { id, label: label ?? id, measured };
				if (pos) [v.x, v.y] = pos;
				if (note !== undefined) v.note = note;
				if (data) v.data = data;
				if (extra) v.extra = extra;
				return v;
			});
	return fc.uniqueArray(f.id, { maxLength: 8 }).chain((ids) => {
		const idArb = ids.length > 0 ? fc.constantFrom(...ids) : f.id;
		const roleList = f.rolesInVariableOrder
			? fc.subarray(ids)
			: fc.array(fc.oneof(idArb, f.id), { maxLength: 3 });
		const arrow: fc.Arbitrary<Arrow> = fc
			// DOT reads `dir` as the arrow's direction and `key` as the edge's name (repeats merge).
			.record({ from: idArb, to: idArb, note: fc.option(anyText, { nil: undefined }), extra: extraArb(new Set(['from', 'to', 'note', 'dir', 'key']), f.extraKey, f.extraValue) })
			.map(({ from, to, note, extra }) => ({ from, to, ...(note !== undefined ? { note } : {}), ...(extra ? { extra } : {}) }));
		return fc
			.record({
				title: anyText,
				variables: fc.tuple(...ids.map(variable)),
				arrows: ids.length > 0 ? fc.array(arrow, { maxLength: 10 }) : fc.constant<Arrow[]>([]),
				exposures: roleList,
				outcomes: roleList,
				adjusted: roleList,
				extra: extraArb(new Set(['format', 'version', 'title', 'variables', 'arrows', 'exposures', 'outcomes', 'adjusted', 'label']), f.extraKey, f.extraValue)
			})
			.map(({ extra, ...rest }): Diagram => (extra ? { ...rest, extra } : rest));
	});
}

function expectInputErrorOnly(read: () => unknown): void {
	try {
		read();
	} catch (e) {
		if (!(e instanceof InputError)) throw e;
		expect(e.message).not.toMatch(/[\r\n]/);
		expect(e.message.length).toBeGreaterThan(0);
	}
}

/** Text with a few random characters inserted, deleted or replaced. */
function mangled(text: string): fc.Arbitrary<string> {
	const edit = fc.tuple(fc.nat({ max: text.length }), fc.nat({ max: 3 }), fc.string({ unit: 'binary', maxLength: 3 }));
	return fc.array(edit, { minLength: 1, maxLength: 4 }).map((edits) => {
		let s = text;
		for (const [at, remove, insert] of edits) {
			const i = Math.min(at, s.length);
			s = s.slice(0, i) + insert + s.slice(i + remove);
		}
		return s;
	});
}

const demoJson = readFileSync('static/demo/cycling-hypertension.causeway.json', 'utf8');
const demoDot = writeDot(parseDiagramJson(demoJson));

describe('round trips of random diagrams', () => {
	it('native JSON: parse(write(d)) = d', () => {
		fc.assert(
			fc.property(diagramArb(jsonFlavour), (d) => {
				expect(parseDiagramJson(writeDiagramJson(d))).toEqual(d);
			}),
			{ numRuns: 300 }
		);
	});

	it('DOT: parse(write(d)) = d', () => {
		fc.assert(
			fc.property(diagramArb(dotFlavour), (d) => {
				expect(parseDot(writeDot(d))).toEqual(d);
			}),
			{ numRuns: 300 }
		);
	});
});

describe('garbage never throws anything but InputError', () => {
	it('random strings, as JSON and as DOT', () => {
		fc.assert(
			fc.property(anyText, (text) => {
				expectInputErrorOnly(() => parseDiagramJson(text));
				expectInputErrorOnly(() => parseDot(text));
				expectInputErrorOnly(() => readDiagramText('pasted', text));
			}),
			{ numRuns: 400 }
		);
	});

	it('mangled copies of valid files', () => {
		fc.assert(
			fc.property(mangled(demoJson), mangled(demoDot), (json, dot) => {
				expectInputErrorOnly(() => parseDiagramJson(json));
				expectInputErrorOnly(() => parseDot(dot));
			}),
			{ numRuns: 300 }
		);
	});

	it('random JSON values in a diagram envelope', () => {
		fc.assert(
			fc.property(fc.jsonValue({ maxDepth: 4 }), fc.jsonValue({ maxDepth: 4 }), (variables, arrows) => {
				expectInputErrorOnly(() => parseDiagramJson(JSON.stringify({ format: 'causeway.diagram', version: 1, variables, arrows })));
			}),
			{ numRuns: 300 }
		);
	});
});

describe('findCycle', () => {
	it('finds a cycle exactly when no topological order exists (Kahn 1962), and the cycle is made of arrows', () => {
		const graph = fc.integer({ min: 1, max: 12 }).chain((n) =>
			fc.record({ n: fc.constant(n), arrows: fc.array(fc.tuple(fc.nat({ max: n - 1 }), fc.nat({ max: n - 1 })), { maxLength: 25 }) })
		);
		fc.assert(
			fc.property(graph, ({ n, arrows }) => {
				const ids = Array.from({ length: n }, (_, i) => `v${i}`);
				// Kahn's algorithm: repeatedly remove vertices without incoming arrows.
				const indeg = new Array<number>(n).fill(0);
				for (const [, t] of arrows) indeg[t]++;
				const queue = ids.map((_, i) => i).filter((i) => indeg[i] === 0);
				let removed = 0;
				while (queue.length > 0) {
					const v = queue.pop() as number;
					removed++;
					for (const [f, t] of arrows) if (f === v && --indeg[t] === 0) queue.push(t);
				}
				const cycle = findCycle(ids, arrows.map(([f, t]) => ({ from: ids[f], to: ids[t] })));
				expect(cycle === null).toBe(removed === n);
				if (cycle) {
					const edges = new Set(arrows.map(([f, t]) => `v${f} v${t}`));
					for (let i = 0; i + 1 < cycle.length; i++) expect(edges.has(`${cycle[i]} ${cycle[i + 1]}`)).toBe(true);
				}
			}),
			{ numRuns: 300 }
		);
	});
});
