/**
 * Share links: opening one restores the diagram exactly (ids, labels, roles, positions, notes,
 * unknown keys), for the demo and for random diagrams with arbitrary Unicode; a damaged link
 * gives a one-line message and no diagram. (Unknown keys named __proto__, constructor or
 * prototype are dropped by the native reader on purpose, docs/graph-io.md, so the random
 * diagrams do not use them.)
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { deflateSync, strToU8 } from 'fflate';
import { readShareFragment, shareFragment, shareLink, isShareFragment, MAX_SHARED_JSON_BYTES } from '../../../src/lib/export/share-link';
import { bytesToBase64Url } from '../../../src/lib/export/base64';
import { InputError } from '../../../src/lib/graph/errors';
import { writeDiagramJson } from '../../../src/lib/graph/native-json';
import type { Diagram } from '../../../src/lib/graph/diagram';
import { demo, hostileDemo } from './helpers';

const text = fc.string({ unit: 'grapheme', maxLength: 12 });
const diagramArb: fc.Arbitrary<Diagram> = fc
	.uniqueArray(fc.string({ unit: 'grapheme', minLength: 1, maxLength: 8 }), { minLength: 1, maxLength: 8 })
	.chain((ids) =>
		fc.record({
			title: text,
			variables: fc.tuple(
				...ids.map((id) =>
					fc.record({
						id: fc.constant(id),
						label: text,
						measured: fc.boolean(),
						x: fc.integer({ min: -5000, max: 5000 }),
						y: fc.double({ min: -5000, max: 5000, noNaN: true }),
						note: text,
						extra: fc.option(fc.dictionary(fc.constantFrom('colour', 'unit', 'source'), fc.oneof(text, fc.integer(), fc.boolean(), fc.constant(null), fc.array(text, { maxLength: 3 }), fc.record({ deep: text })) as fc.Arbitrary<unknown>), { nil: undefined })
					})
				)
			),
			arrows: fc.constant(ids.slice(1).map((to, i) => ({ from: ids[i], to }))),
			exposures: fc.subarray(ids, { maxLength: 1 }),
			outcomes: fc.constant([] as string[]),
			adjusted: fc.subarray(ids),
			extra: fc.option(fc.record({ study: text }), { nil: undefined })
		})
	)
	.map((d) => {
		const out = { ...d } as Diagram;
		if (out.extra === undefined) delete out.extra;
		out.variables = d.variables.map((v) => {
			const c = { ...v };
			if (c.extra === undefined) delete c.extra;
			return c;
		});
		return out;
	});

describe('share links', () => {
	it('restore the demo exactly and stay short', () => {
		const d = hostileDemo();
		d.extra = { unknownTopLevel: { nested: [1, 'two'] } };
		const fragment = shareFragment(d);
		expect(readShareFragment(`#${fragment}`)).toEqual(d);
		// 1,341 characters measured with the demo's three arrow notes (1,149 without them).
		expect(shareFragment(demo()).length).toBeLessThan(1400);
		// The fragment is URL-safe: nothing to percent-encode.
		expect(encodeURIComponent(fragment.slice('diagram='.length))).toBe(fragment.slice('diagram='.length));
	});

	it('restore random diagrams with any Unicode text byte for byte', () => {
		fc.assert(
			fc.property(diagramArb, (d) => {
				const back = readShareFragment(shareFragment(d))!;
				expect(writeDiagramJson(back)).toBe(writeDiagramJson(d));
			}),
			{ numRuns: 150 }
		);
	});

	it('replace only the fragment of the page address', () => {
		const link = shareLink('https://example.org/causeway/?a=1#diagram=1.old', demo());
		expect(link.startsWith('https://example.org/causeway/?a=1#diagram=1.')).toBe(true);
		expect(readShareFragment(new URL(link).hash)).toEqual(demo());
	});

	it('ignore fragments that are not share links', () => {
		expect(readShareFragment('')).toBeNull();
		expect(readShareFragment('#section-2')).toBeNull();
		expect(isShareFragment('#diagram=9.x')).toBe(true);
	});

	const damaged = (fragment: string) => {
		try {
			readShareFragment(fragment);
		} catch (e) {
			expect(e).toBeInstanceOf(InputError);
			const message = (e as Error).message;
			expect(message).not.toContain('\n');
			return message;
		}
		throw new Error('no error');
	};

	it('explain what is wrong with a damaged link, in one line', () => {
		const good = shareFragment(demo());
		expect(damaged(good.slice(0, good.length - 40))).toMatch(/damaged.*cut off/);
		expect(damaged(good.replace(/.$/, '*'))).toMatch(/character \d+ \("\*"\) is not part of the link/);
		expect(damaged('diagram=2.abc')).toMatch(/newer version of Causeway \(link format 2\)/);
		expect(damaged('diagram=abc')).toMatch(/does not start with a format number/);
		expect(damaged('diagram=1.%E0%A4%A')).toMatch(/broken %-escape/);
		expect(damaged(`diagram=1.${bytesToBase64Url(deflateSync(strToU8('{"format": "causeway.diagram"')))}`)).toMatch(/cannot be read: .*JSON/);
		expect(damaged(`diagram=1.${bytesToBase64Url(deflateSync(strToU8('{"format":"causeway.diagram","version":1,"variables":[{"id":5}],"arrows":[]}')))}`)).toMatch(
			/variables\[0\]\.id must be text/
		);
		expect(damaged(`diagram=1.${bytesToBase64Url(deflateSync(new Uint8Array([0xff, 0xfe, 0x41])))}`)).toMatch(/not valid UTF-8/);
		// Repeated ids cannot be drawn (the canvas keys variables by id): refused as for opened files.
		const twice = '{"format":"causeway.diagram","version":1,"variables":[{"id":"a"},{"id":"a"}],"arrows":[]}';
		expect(damaged(`diagram=1.${bytesToBase64Url(deflateSync(strToU8(twice)))}`)).toMatch(/cannot be opened: .*"a"/);
		const dangling = '{"format":"causeway.diagram","version":1,"variables":[{"id":"a"}],"arrows":[{"from":"a","to":"b"}]}';
		expect(damaged(`diagram=1.${bytesToBase64Url(deflateSync(strToU8(dangling)))}`)).toMatch(/cannot be opened: .*"b"/);
	});

	it('refuse a link that unpacks to more than the file size limit (a "zip bomb")', () => {
		const bomb = deflateSync(new Uint8Array(MAX_SHARED_JSON_BYTES + 1024).fill(32), { level: 9 });
		expect(bomb.length).toBeLessThan(20_000);
		expect(damaged(`diagram=1.${bytesToBase64Url(bomb)}`)).toMatch(/larger than 5 MB unpacked/);
	});
});
