/**
 * Property tests (fast-check, fixed seed) of the fast reader (src/lib/graph/fast-native) against
 * the full reader (fast-native-oracle.ts: JSON.parse, the schema, the limits, validate.ts):
 * generated native files with awkward text (quotes, backslashes, control characters, lone
 * surrogates, astral characters, `__proto__`), every whitespace JSON allows and some it does
 * not, escapes written several ways, repeated ids and keys, unknown ids, self-loops, cycles,
 * wrong types, numbers at the edge of the grammar, version 1, tight limits, and small random
 * corruptions of the text. Whenever the fast path answers, its graph and question equal the
 * full reader's; whenever the full reader refuses, the fast path does not answer.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { scanDiagram } from '../../../src/lib/graph/fast-native/scan-diagram';
import { CLI_READ_LIMITS, type ReadLimits } from '../../../src/lib/graph/size-limits';
import '../fast-check-seed';
import { expectSameAsFullReader, fastRead } from './fast-native-oracle';

/** A JSON document with its key order, repeated keys and number spellings kept. */
type J = { o: [string, J][] } | { a: J[] } | { s: string } | { n: string } | { l: 'true' | 'false' | 'null' };

interface Style {
	/** Whitespace pieces used in turn between tokens (some not JSON whitespace). */
	ws: string[];
	/** How strings are written: JSON.stringify's escapes, every non-ASCII character and `/` escaped, or uppercase hex escapes. */
	escapes: 'minimal' | 'ascii' | 'upper';
}

function writeString(s: string, style: Style): string {
	const minimal = JSON.stringify(s);
	if (style.escapes === 'minimal') return minimal;
	const hex = (c: number) => `\\u${c.toString(16).padStart(4, '0')}`;
	let out = '';
	for (const ch of minimal.slice(1, -1).split('')) {
		const c = ch.charCodeAt(0);
		if (style.escapes === 'ascii') out += c > 0x7e ? hex(c) : ch === '/' ? '\\/' : ch;
		else out += c > 0x7e || ch === 'a' ? hex(c).toUpperCase().replace('\\U', '\\u') : ch;
	}
	return `"${out}"`;
}

function write(j: J, style: Style): string {
	let turn = 0;
	const ws = () => style.ws[turn++ % style.ws.length];
	// An explicit stack: no recursion, although these documents are shallow.
	const out: string[] = [];
	const stack: (J | string)[] = [j];
	while (stack.length > 0) {
		const top = stack.pop() as J | string;
		if (typeof top === 'string') {
			out.push(top);
			continue;
		}
		if ('s' in top) out.push(writeString(top.s, style));
		else if ('n' in top) out.push(top.n);
		else if ('l' in top) out.push(top.l);
		else if ('a' in top) {
			const parts: (J | string)[] = ['['];
			top.a.forEach((item, i) => parts.push(...(i > 0 ? [',', ws()] : [ws()]), item));
			parts.push(ws(), ']');
			stack.push(...parts.reverse());
		} else {
			const parts: (J | string)[] = ['{'];
			top.o.forEach(([key, value], i) => parts.push(...(i > 0 ? [',', ws()] : [ws()]), writeString(key, style), ws(), ':', ws(), value));
			parts.push(ws(), '}');
			stack.push(...parts.reverse());
		}
	}
	return out.join('');
}

const awkward = fc.oneof(
	{ weight: 6, arbitrary: fc.string({ maxLength: 6 }) },
	{ weight: 2, arbitrary: fc.string({ unit: 'binary', maxLength: 6 }) },
	{ weight: 1, arbitrary: fc.string({ unit: 'grapheme', maxLength: 4 }) },
	{ weight: 3, arbitrary: fc.constantFrom('', ' ', '\\', '"', '/', '\u2028', '\uFEFF', '\u0000', '\u001f', '\u007f', 'é', '😀', '\uD800', '\uDC00x', '__proto__', 'constructor', 'v1', 'a b', 'x'.repeat(1_001)) }
);
const numberText = fc.oneof(
	{ weight: 12, arbitrary: fc.integer({ min: -1e6, max: 1e6 }).map(String) },
	{ weight: 6, arbitrary: fc.double({ noNaN: true, noDefaultInfinity: true }).map((x) => JSON.stringify(x)) },
	{ weight: 2, arbitrary: fc.constantFrom('-0', '1e999', '-1e400', '1E5', '0.5e-3', '2.0', '1e+2', '00', '01', '1.', '.5', '+1', '-', '1e', '0x10', 'NaN') }
);
const str = (s: string): J => ({ s });
const num = (n: string): J => ({ n });
/** A value of the wrong kind for any key. */
const wrong: fc.Arbitrary<J> = fc.constantFrom<J>({ l: 'null' }, { l: 'true' }, { n: '1' }, { s: 'x' }, { a: [] }, { o: [] }, { a: [{ s: 'a' }] });

/** Object entries in the canonical order, or reversed, or with one key written twice. */
function entries(list: ([string, J] | null)[], order: number): J {
	const present = list.filter((e): e is [string, J] => e !== null);
	if (order === 1) present.reverse();
	if (order === 2 && present.length > 0) present.push(present[0]);
	return { o: present };
}

/** Ids: mostly ones the fast path reads as they are (any character that needs no escape), some awkward. */
const poolId = fc.oneof(
	{ weight: 12, arbitrary: fc.string({ unit: fc.constantFrom('a', 'b', 'Z', '1', ' ', '/', "'", 'é', '😀', '日', '\u2028', '\uFEFF', '\u007f'), minLength: 1, maxLength: 5 }) },
	{ weight: 1, arbitrary: awkward }
);

/** The pair of pool ids a < b (distinct where the pool has two ids). */
function forward(pool: readonly string[], a: number, b: number): readonly [string, string] {
	const [lo, hi] = a < b ? [a, b] : a > b ? [b, a] : a + 1 < pool.length ? [a, a + 1] : [Math.max(0, a - 1), a];
	return [pool[lo], pool[hi]];
}

const documentArb = fc.uniqueArray(poolId, { minLength: 1, maxLength: 6 }).chain((pool) => {
	const poolId = fc.constantFrom(...pool);
	const anyId = fc.oneof({ weight: 9, arbitrary: poolId }, { weight: 1, arbitrary: awkward });
	const order = fc.oneof({ weight: 80, arbitrary: fc.constant(0) }, { weight: 1, arbitrary: fc.constantFrom(1, 2) });
	/** Present most of the time (absent one time in `absent`). */
	const maybe = <T>(a: fc.Arbitrary<T>, absent = 2) => fc.option(a, { freq: absent });
	/** Present five times in six: labels and flags, so that many variables have the plain shape. */
	const maybe6 = <T>(a: fc.Arbitrary<T>) => fc.option(a, { freq: 6 });
	/** Present one time in `one`: a defect. */
	const rare = <T>(a: fc.Arbitrary<T>, one: number) => fc.oneof({ weight: one - 1, arbitrary: fc.constant(null) }, { weight: 1, arbitrary: a });
	const variable = (id: string) => fc
		.record({
			id: fc.oneof({ weight: 60, arbitrary: fc.constant(str(id)) }, { weight: 2, arbitrary: anyId.map(str) }, { weight: 1, arbitrary: wrong }),
			label: maybe6(fc.oneof({ weight: 40, arbitrary: awkward.map(str) }, { weight: 1, arbitrary: wrong })),
			measured: maybe6(fc.oneof({ weight: 40, arbitrary: fc.boolean().map((b): J => ({ l: b ? 'true' : 'false' })) }, { weight: 1, arbitrary: wrong })),
			x: rare(numberText.map(num), 6),
			y: rare(numberText.map(num), 6),
			note: rare(awkward.map(str), 6),
			data: rare(fc.constantFrom<J>({ o: [['column', { s: 'c' }]] }, { o: [] }, { o: [['kind', { s: 'odd' }]] }), 60),
			unknown: rare(fc.constant<[string, J]>(['shape', { s: 'box' }]), 60),
			drop: rare(fc.constantFrom('id', 'label', 'measured'), 60),
			order
		})
		.map((v): J => {
			const e: ([string, J] | null)[] = [
				v.drop === 'id' ? null : ['id', v.id],
				v.label && v.drop !== 'label' ? ['label', v.label] : null,
				v.measured && v.drop !== 'measured' ? ['measured', v.measured] : null,
				v.x ? ['x', v.x] : null,
				v.y ? ['y', v.y] : null,
				v.note ? ['note', v.note] : null,
				v.data ? ['data', v.data] : null,
				v.unknown
			];
			return entries(e, v.order);
		});
	/** Mostly forward in the pool's order (acyclic), now and then any two ids. */
	const ends = fc.oneof(
		{ weight: 12, arbitrary: fc.tuple(fc.nat(pool.length - 1), fc.nat(pool.length - 1)).map(([a, b]) => forward(pool, a, b)) },
		{ weight: 1, arbitrary: fc.tuple(anyId, anyId) }
	);
	const arrow = fc
		.record({ ends, note: rare(awkward.map(str), 4), wrongEnd: rare(wrong, 40), unknown: rare(fc.constant<[string, J]>(['weight', { n: '1' }]), 40), order })
		.map((a): J => entries([['from', a.wrongEnd ?? str(a.ends[0])], ['to', str(a.ends[1])], a.note ? ['note', a.note] : null, a.unknown], a.order));
	const idList = fc.oneof({ weight: 40, arbitrary: fc.array(anyId.map(str), { maxLength: 3 }).map((a): J => ({ a })) }, { weight: 1, arbitrary: wrong });
	return fc
		.record({
			format: fc.oneof({ weight: 40, arbitrary: fc.constant(str('causeway.diagram')) }, { weight: 1, arbitrary: fc.constantFrom<J>(str('causeway.Diagram'), num('1')) }),
			version: fc.oneof({ weight: 30, arbitrary: fc.constant(num('2')) }, { weight: 1, arbitrary: fc.constantFrom<J>(num('1'), num('2.0'), num('3'), str('2'), num('2e0')) }),
			title: maybe(fc.oneof({ weight: 40, arbitrary: awkward.map(str) }, { weight: 1, arbitrary: wrong })),
			// Each id of the pool once, now and then one more variable with any id.
			variables: fc.oneof(
				{ weight: 40, arbitrary: fc.tuple(fc.tuple(...pool.map(variable)), rare(anyId.chain(variable), 8)).map(([vs, more]): J => ({ a: more ? [...vs, more] : vs })) },
				{ weight: 1, arbitrary: wrong }
			),
			arrows: fc.oneof({ weight: 40, arbitrary: fc.array(arrow, { maxLength: 9 }).map((a): J => ({ a })) }, { weight: 1, arbitrary: wrong }),
			exposures: maybe(idList),
			outcomes: maybe(idList),
			adjusted: maybe(idList),
			unknown: rare(fc.constantFrom<[string, J]>(['layout', { s: 'tidy' }], ['__proto__', { o: [['polluted', { l: 'true' }]] }]), 40),
			drop: rare(fc.constantFrom('format', 'version', 'variables', 'arrows'), 40),
			order
		})
		.map((d): J =>
			entries(
				[
					d.drop === 'format' ? null : ['format', d.format],
					d.drop === 'version' ? null : ['version', d.version],
					d.title ? ['title', d.title] : null,
					d.drop === 'variables' ? null : ['variables', d.variables],
					d.drop === 'arrows' ? null : ['arrows', d.arrows],
					d.exposures ? ['exposures', d.exposures] : null,
					d.outcomes ? ['outcomes', d.outcomes] : null,
					d.adjusted ? ['adjusted', d.adjusted] : null,
					d.unknown
				],
				d.order
			)
		);
});

const styleArb: fc.Arbitrary<Style> = fc
	.record({
		ws: fc.array(fc.constantFrom('', ' ', '\n', '\t', '\r\n', '  \n\t'), { minLength: 1, maxLength: 6 }),
		notJsonSpace: fc.oneof({ weight: 30, arbitrary: fc.constant(null) }, { weight: 1, arbitrary: fc.constantFrom('\u00a0', '\f', '\v', '\u2028', '/**/') }),
		escapes: fc.oneof({ weight: 10, arbitrary: fc.constant<Style['escapes']>('minimal') }, { weight: 1, arbitrary: fc.constant<Style['escapes']>('ascii') }, { weight: 1, arbitrary: fc.constant<Style['escapes']>('upper') })
	})
	.map(({ ws, notJsonSpace, escapes }) => ({ ws: notJsonSpace ? [...ws, notJsonSpace] : ws, escapes }));
/** Small corruptions of the text: a character deleted, inserted or replaced. */
const corruption = fc.array(fc.tuple(fc.nat(), fc.constantFrom('delete', 'insert', 'replace'), fc.constantFrom('{', '}', '[', ']', '"', '\\', ',', ':', ' ', '\n', '\u0000', '1', 'e', '-', 'é')), { maxLength: 2 });
const limitsArb: fc.Arbitrary<ReadLimits> = fc.oneof(
	{ weight: 8, arbitrary: fc.constant(CLI_READ_LIMITS) },
	{ weight: 1, arbitrary: fc.constantFrom({ ...CLI_READ_LIMITS, variables: 3, arrows: 4 }, { ...CLI_READ_LIMITS, chars: 300 }) }
);

function corrupt(text: string, edits: [number, string, string][]): string {
	let t = text;
	for (const [at, kind, ch] of edits) {
		const p = at % (t.length + 1);
		t = kind === 'delete' ? t.slice(0, p) + t.slice(p + 1) : kind === 'insert' ? t.slice(0, p) + ch + t.slice(p) : t.slice(0, p) + ch + t.slice(p + 1);
	}
	return t;
}

const encoder = new TextEncoder(); // lone surrogates become U+FFFD: the bytes are always valid UTF-8

describe('fast reader vs the full reader on generated files', () => {
	it('answers only what the full reader accepts, with the same graph and question', () => {
		let answered = 0;
		let runs = 0;
		const reasons = new Map<string, number>();
		fc.assert(
			fc.property(documentArb, styleArb, fc.oneof({ weight: 5, arbitrary: fc.constant(null) }, { weight: 1, arbitrary: corruption }), fc.boolean(), limitsArb, (doc, style, edits, bom, limits) => {
				const text = corrupt(write(doc, style), edits ?? []);
				runs++;
				const bytes = encoder.encode(bom ? `\uFEFF${text}` : text);
				if (expectSameAsFullReader(bytes, limits)) answered++;
				if (process.env.FAST_NATIVE_REASONS) {
					// FAST_NATIVE_REASONS=1 prints how often each reason to leave the fast path came up.
					const r = fastRead(bytes, limits).read;
					const why = r.ok ? 'answered' : r.reason.replace(/ at byte \d+/, '');
					reasons.set(why, (reasons.get(why) ?? 0) + 1);
					if (r.ok) {
						const scan = scanDiagram(bytes, limits);
						const lists = `answered, lists from the scan: variables ${scan.plainVariables && scan.n > 0}, arrows ${scan.plainArrows && scan.m > 0}`;
						reasons.set(lists, (reasons.get(lists) ?? 0) + 1);
					}
				}
			}),
			{ numRuns: 1_500 }
		);
		if (process.env.FAST_NATIVE_REASONS) console.log([...reasons].sort((a, b) => b[1] - a[1]));
		// Not vacuous: a good share of the generated files take the fast path.
		expect(answered / runs).toBeGreaterThan(0.1);
	});

	it('answers every clean file: unique plain ids, any labels, arrows forward in their order, any layout', () => {
		const plain = fc.string({ minLength: 1, maxLength: 8 }).filter((s) => JSON.stringify(s) === `"${s}"` && !/[\uD800-\uDFFF]/.test(s));
		const clean = fc.uniqueArray(plain, { minLength: 1, maxLength: 12 }).chain((ids) =>
			fc.record({
				ids: fc.constant(ids),
				arrows: fc.array(fc.tuple(fc.nat(ids.length - 1), fc.nat(ids.length - 1)), { maxLength: 20 }),
				measured: fc.array(fc.boolean(), { minLength: ids.length, maxLength: ids.length }),
				// Labels with escapes, control characters, lone surrogates, U+FEFF, astral characters.
				labels: fc.array(fc.oneof(fc.string({ unit: 'binary', maxLength: 8 }), fc.constantFrom('', '"', '\\', '\u0000', '\uFEFFa', '\uD800', 'é\n😀')), { minLength: ids.length, maxLength: ids.length }),
				title: fc.string({ maxLength: 20 }),
				question: fc.array(fc.nat(ids.length - 1), { maxLength: 3 })
			})
		);
		fc.assert(
			fc.property(clean, styleArb, fc.boolean(), (d, style, bom) => {
				const arrows = d.arrows.filter(([a, b]) => a !== b).map(([a, b]): J => ({ o: [['from', str(d.ids[Math.min(a, b)])], ['to', str(d.ids[Math.max(a, b)])]] }));
				const doc: J = {
					o: [
						['format', str('causeway.diagram')],
						['version', num('2')],
						['title', str(d.title)],
						['variables', { a: d.ids.map((id, i): J => ({ o: [['id', str(id)], ['label', str(d.labels[i])], ['measured', { l: d.measured[i] ? 'true' : 'false' }]] })) }],
						['arrows', { a: arrows }],
						['exposures', { a: d.question.map((i) => str(d.ids[i])) }]
					]
				};
				// Only JSON whitespace, and ids written without escapes (an escaped id leaves the fast path).
				const jsonStyle: Style = { ws: style.ws.filter((w) => /^[ \t\r\n]*$/.test(w)).concat(''), escapes: 'minimal' };
				const text = write(doc, jsonStyle);
				expect(expectSameAsFullReader(encoder.encode(bom ? `\uFEFF${text}` : text))).toBe(true);
			}),
			{ numRuns: 300 }
		);
	});
});
