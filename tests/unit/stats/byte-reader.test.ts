// The byte-level reader (src/lib/stats/table/read-table.ts on csv-scanner.ts) against the reader
// it replaced (PapaParse on decoded text, kept in tests/unit/stats/reference/papa-table-reader.ts):
// the same table — kinds, levels, every value bit for bit, missing counts, notes, format — or the
// same refusal, on generated files with quotes, embedded line breaks, CRLF, empty fields, blank
// lines, white space, decimal commas and missing tokens, read whole and in random byte chunks.
// Also the byte-level number path against Number() (Clinger's fast path must agree exactly).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseTable, parseTableStream, type ParseOptions } from '../../../src/lib/stats/table/read-table';
import type { ParseResult } from '../../../src/lib/stats/table/types';
import * as reference from './reference/papa-table-reader';
import { plainDecimal } from '../../../src/lib/stats/table/byte-number';
import { parseNumber } from '../../../src/lib/stats/table/cells';

function summary(r: ParseResult) {
	if (!r.ok) return { ok: false, message: r.error.message, row: r.error.row, column: r.error.column };
	const t = r.table;
	return {
		ok: true,
		rows: t.rowCount,
		format: t.format,
		notes: t.notes,
		skipped: t.skipped,
		columns: t.columns.map((c) => ({ name: c.name, kind: c.kind, missing: c.missing, values: c.kind === 'continuous' ? Array.from(c.values) : Array.from(c.codes), levels: c.kind === 'continuous' ? [] : c.levels }))
	};
}

const numberCell = fc.oneof(
	fc.integer({ min: -1000, max: 100000 }).map(String),
	fc.double({ min: -1e6, max: 1e6, noNaN: true }).map((x) => String(Math.round(x * 1000) / 1000)),
	fc.constantFrom('0', '-0', '+5', '.5', '-.25', '5.', '007', '1e3', '2.5E-2', '12345678901234567890', '0.1234567890123456789', '3,5', '-3,25', ',5', '-,5', '0x10', 'Infinity', '1_000')
);
const textCell = fc.constantFrom('yes', 'no', 'a,b', 'say "hi"', 'two\nlines', 'cr\r\nlf', 'ä', 'naïve', ' padded ', 'x;y', 'tab\there', '"', '');
const missingCell = fc.constantFrom('', 'NA', 'na', '.', 'NaN', 'NULL', ' NA ', '  ');

/** A column generator: mostly numbers, or mostly one kind of text, with missing cells. */
const columnOf = fc.oneof(
	fc.array(fc.oneof({ weight: 8, arbitrary: numberCell }, { weight: 1, arbitrary: missingCell }), { minLength: 1, maxLength: 1 }).map(() => 'number' as const),
	fc.constant('binary' as const),
	fc.constant('text' as const)
);

interface Layout {
	delimiter: ',' | ';' | '\t';
	newline: '\n' | '\r\n';
	bom: boolean;
	trailingNewline: boolean;
	quoteAll: boolean;
}

function quote(cell: string, layout: Layout, force: boolean): string {
	const needs = cell.includes(layout.delimiter) || cell.includes('"') || cell.includes('\n') || cell.includes('\r');
	return needs || force ? `"${cell.replaceAll('"', '""')}"` : cell;
}

const csv = fc
	.record({
		layout: fc.record({ delimiter: fc.constantFrom(',' as const, ';' as const, '\t' as const), newline: fc.constantFrom('\n' as const, '\r\n' as const), bom: fc.boolean(), trailingNewline: fc.boolean(), quoteAll: fc.boolean() }),
		kinds: fc.array(columnOf, { minLength: 2, maxLength: 5 }),
		rows: fc.integer({ min: 1, max: 40 }),
		seed: fc.array(fc.nat(), { minLength: 400, maxLength: 400 }),
		blankAt: fc.array(fc.nat({ max: 40 }), { maxLength: 3 })
	})
	.chain(({ layout, kinds, rows, seed, blankAt }) =>
		fc
			.tuple(
				...kinds.map((k) =>
					fc.array(k === 'number' ? fc.oneof({ weight: 8, arbitrary: numberCell }, { weight: 1, arbitrary: missingCell }) : k === 'binary' ? fc.oneof({ weight: 6, arbitrary: fc.constantFrom('0', '1') }, { weight: 1, arbitrary: missingCell }) : fc.oneof({ weight: 4, arbitrary: textCell }, { weight: 1, arbitrary: missingCell }), { minLength: rows, maxLength: rows })
				)
			)
			.map((columns) => {
				const lines = [kinds.map((_, j) => quote(`col ${j}${j === 1 ? ', "b"' : ''}`, layout, layout.quoteAll)).join(layout.delimiter)];
				for (let i = 0; i < rows; i++) {
					lines.push(columns.map((c, j) => quote(c[i], layout, layout.quoteAll && seed[(i * 7 + j) % seed.length] % 2 === 0)).join(layout.delimiter));
					if (blankAt.includes(i)) lines.push(seed[i] % 2 ? '' : '   ');
				}
				return (layout.bom ? '\ufeff' : '') + lines.join(layout.newline) + (layout.trailingNewline ? layout.newline : '');
			})
	);

/** Byte chunks of a text cut at the given places (inside multi-byte characters too). */
function* cutBytes(bytes: Uint8Array, cuts: number[]): Generator<Uint8Array> {
	let last = 0;
	for (const c of [...new Set(cuts.map((x) => x % (bytes.length + 1)))].sort((a, b) => a - b)) {
		yield bytes.subarray(last, c);
		last = c;
	}
	yield bytes.subarray(last);
}

describe('byte-level reader = previous PapaParse reader (property tests, fast-check)', () => {
	const options: fc.Arbitrary<ParseOptions> = fc.record({ decimalComma: fc.boolean(), missingTokens: fc.constantFrom([], ['-1'], ['x']) }, { requiredKeys: [] });

	it('same table or same message, read whole', () => {
		fc.assert(
			fc.property(csv, options, (text, opts) => {
				expect(summary(parseTable(text, opts))).toEqual(summary(reference.parseTable(text, opts)));
			}),
			{ numRuns: 400 }
		);
	});

	it('same table read in random byte chunks as read whole by the previous reader', async () => {
		await fc.assert(
			fc.asyncProperty(csv, fc.array(fc.nat(), { maxLength: 8 }), async (text, cuts) => {
				const bytes = new TextEncoder().encode(text);
				expect(summary(await parseTableStream(cutBytes(bytes, cuts)))).toEqual(summary(reference.parseTable(text)));
			}),
			{ numRuns: 200 }
		);
	});

	it('same acceptance on damaged files (stray quotes, delimiters and line breaks)', () => {
		const damaged = fc.tuple(csv, fc.array(fc.tuple(fc.nat(), fc.constantFrom('"', ',', '\n', '\r', ';', ' "', '" ', 'x"')), { minLength: 1, maxLength: 3 })).map(([text, edits]) => {
			let t = text;
			for (const [at, s] of edits) {
				const i = at % (t.length + 1);
				t = t.slice(0, i) + s + t.slice(i);
			}
			return t;
		});
		fc.assert(
			fc.property(damaged, (text) => {
				const now = summary(parseTable(text));
				const before = summary(reference.parseTable(text));
				expect(now.ok).toBe(before.ok);
				if (now.ok) expect(now).toEqual(before);
			}),
			{ numRuns: 400 }
		);
	});

	it('a long file in 64 KiB chunks (records cut at chunk ends, the bridge path)', async () => {
		const rows = Array.from({ length: 30000 }, (_, i) => `${i},"${i % 3 === 0 ? 'a\nb' : 'c'}",${(i * 0.37).toFixed(2)},${i % 2}`);
		const text = `id,note,x,flag\r\n${rows.join('\r\n')}\r\n`;
		const bytes = new TextEncoder().encode(text);
		const chunks = Array.from({ length: Math.ceil(bytes.length / 65536) }, (_, k) => (k + 1) * 65536 - 7 * k);
		expect(summary(await parseTableStream(cutBytes(bytes, chunks)))).toEqual(summary(reference.parseTable(text)));
	});
});

describe('plain decimals from bytes equal Number() (Clinger fast path)', () => {
	it('on random decimal texts', () => {
		const decimal = fc.tuple(fc.constantFrom('', '-', '+'), fc.stringMatching(/^\d{0,17}$/), fc.constantFrom('', '.', ','), fc.stringMatching(/^\d{0,24}$/)).map(([s, a, p, b]) => `${s}${a}${p}${b}`);
		fc.assert(
			fc.property(decimal, fc.boolean(), (s, comma) => {
				const bytes = new TextEncoder().encode(s);
				const fast = plainDecimal(bytes, 0, bytes.length, comma);
				if (!Number.isNaN(fast)) expect(Object.is(fast, parseNumber(s, comma))).toBe(true);
			}),
			{ numRuns: 3000 }
		);
	});
});
