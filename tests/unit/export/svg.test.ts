/**
 * The SVG figure parsed by an independent XML parser (@xmldom/xmldom, a W3C DOM Level 2
 * implementation): well-formed, labels drawn as the exact text given, no script, no event
 * handler, a generic font fallback, one shape per variable and one line per arrow.
 */
import { describe, expect, it } from 'vitest';
import { DOMParser, type Element as XmlElement, type Node as XmlNode } from '@xmldom/xmldom';
import { writeSvg } from '../../../src/lib/export/svg';
import { variableRoles } from '../../../src/lib/causal/analysis';
import { demo, hostileDemo, HOSTILE_LABELS } from './helpers';

function parseXml(text: string) {
	const errors: string[] = [];
	const doc = new DOMParser({ onError: (level, msg) => level !== 'warning' && errors.push(msg) }).parseFromString(text, 'image/svg+xml');
	expect(errors).toEqual([]);
	return doc;
}

function all(node: XmlNode, out: XmlElement[] = []): XmlElement[] {
	for (let c = node.firstChild; c; c = c.nextSibling) {
		if (c.nodeType === 1) {
			out.push(c as XmlElement);
			all(c, out);
		}
	}
	return out;
}

describe('SVG figure', () => {
	const d = hostileDemo();
	const svg = writeSvg(d, variableRoles(d));
	const doc = parseXml(svg);
	const elements = all(doc);

	it('is well-formed SVG with a generic font fallback and an accessible title', () => {
		const root = doc.documentElement!;
		expect(root.nodeName).toBe('svg');
		expect(root.getAttribute('xmlns')).toBe('http://www.w3.org/2000/svg');
		expect(root.getAttribute('font-family')).toMatch(/, sans-serif$/);
		expect(elements.find((e) => e.nodeName === 'title')?.textContent).toBe(d.title);
	});

	it('draws every label as the exact text, escaped, never as markup', () => {
		const groups = elements.filter((e) => e.getAttribute('class') === 'variable');
		expect(groups.map((g) => g.getAttribute('data-id'))).toEqual(d.variables.map((v) => v.id));
		for (const [i, label] of HOSTILE_LABELS.entries()) {
			const text = all(groups[i]).find((e) => e.nodeName === 'text')!;
			expect(text.textContent).toBe(label);
		}
		expect(elements.some((e) => e.nodeName === 'script' || e.nodeName === 'img' || e.nodeName === 'foreignObject')).toBe(false);
		for (const e of elements) for (let a = 0; a < e.attributes.length; a++) expect(e.attributes[a].name.toLowerCase().startsWith('on')).toBe(false);
	});

	it('has one line per arrow and role badges as text', () => {
		const lines = elements.filter((e) => e.nodeName === 'line' && e.getAttribute('data-from') !== null);
		expect(lines.map((l) => [l.getAttribute('data-from'), l.getAttribute('data-to')])).toEqual(d.arrows.map((a) => [a.from, a.to]));
		const texts = elements.filter((e) => e.nodeName === 'text').map((e) => e.textContent);
		for (const badge of ['exposure', 'outcome', 'mediator', 'instrument-like', 'precision']) expect(texts.some((t) => t?.split(' · ').includes(badge))).toBe(true);
		// The legend explains the badges used.
		expect(texts.some((t) => t?.startsWith('mediator: lies on a causal path'))).toBe(true);
	});

	it('the black-and-white style has no colour and no fill but white', () => {
		const mono = writeSvg(demo(), variableRoles(demo()), { mono: true });
		const colours = new Set([...mono.matchAll(/(?:fill|stroke)="(#[0-9a-fA-F]{6})"/g)].map((m) => m[1].toLowerCase()));
		expect([...colours].sort()).toEqual(['#000000', '#ffffff']);
		const colour = writeSvg(demo(), variableRoles(demo()));
		expect(colour).toContain('fill="#E69F00"');
		expect(colour).toContain('fill="#CC79A7"');
	});

	it('boxes the planned variables and dashes the unmeasured ones', () => {
		const plain = demo();
		const doc2 = parseXml(writeSvg(plain, variableRoles(plain)));
		const groups = all(doc2).filter((e) => e.getAttribute('class') === 'variable');
		for (const g of groups) {
			const id = g.getAttribute('data-id')!;
			const rects = all(g).filter((e) => e.nodeName === 'rect');
			expect(rects.length).toBe(plain.adjusted.includes(id) ? 2 : 1);
			const v = plain.variables.find((x) => x.id === id)!;
			expect(rects[0].getAttribute('stroke-dasharray') !== null).toBe(!v.measured);
		}
	});

	it('gives every variable a box wide enough for its text and keeps boxes inside the picture', () => {
		const width = Number(doc.documentElement!.getAttribute('width'));
		const height = Number(doc.documentElement!.getAttribute('height'));
		expect(width).toBeGreaterThan(100);
		expect(height).toBeGreaterThan(100);
		const plain = demo();
		const svg2 = writeSvg(plain, [], { legend: false });
		const rects = [...svg2.matchAll(/<rect x="(-?[\d.]+)" y="(-?[\d.]+)" width="([\d.]+)" height="([\d.]+)"/g)].map((m) => m.slice(1).map(Number));
		const translate = /translate\(([\d.-]+) ([\d.-]+)\)/.exec(svg2)!.slice(1).map(Number);
		const w = Number(/width="(\d+)"/.exec(svg2)![1]);
		for (const [x, , rw] of rects) {
			expect(x + translate[0]).toBeGreaterThanOrEqual(0);
			expect(x + translate[0] + rw).toBeLessThanOrEqual(w);
		}
	});

	it('is the same on every call (no dates, random ids or measurement from the machine)', () => {
		expect(writeSvg(d, variableRoles(d))).toBe(svg);
	});
});
