/**
 * The tidy layout (dagre, a Sugiyama-style layered layout): every variable gets a position,
 * boxes do not overlap, and every arrow points down the page — the defining property of a
 * layered drawing of a DAG (Sugiyama, Tagawa & Toda, IEEE SMC 1981).
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { dagrePositions, needsLayout, withPositions } from '../../../src/lib/layout';
import { layoutInput } from '../../../src/lib/ui/canvas/layout';
import { createMeasure } from '../../../src/lib/ui/canvas/elements';
import { parseDiagramJson } from '../../../src/lib/graph/native-json';
import { parseDot } from '../../../src/lib/graph/dot';

const demo = parseDiagramJson(readFileSync('static/demo/cycling-hypertension.causeway.json', 'utf8'));

describe('tidy layout', () => {
	it('places every variable of the demo study in layers along the arrows, without overlaps', () => {
		const input = layoutInput(demo, createMeasure());
		const placed = withPositions(demo, dagrePositions(input));
		expect(needsLayout(placed)).toBe(false);
		const at = new Map(placed.variables.map((v) => [v.id, v]));
		for (const a of demo.arrows) expect(at.get(a.from)!.y!).toBeLessThan(at.get(a.to)!.y!);
		const size = new Map(input.nodes.map((n) => [n.id, n]));
		const vs = placed.variables;
		for (let i = 0; i < vs.length; i++)
			for (let j = i + 1; j < vs.length; j++) {
				const [a, b] = [vs[i], vs[j]];
				const [sa, sb] = [size.get(a.id)!, size.get(b.id)!];
				const apartX = Math.abs(a.x! - b.x!) >= (sa.w + sb.w) / 2;
				const apartY = Math.abs(a.y! - b.y!) >= (sa.h + sb.h) / 2;
				expect(apartX || apartY).toBe(true);
			}
	});

	it('is needed for a DOT file, which carries no positions', () => {
		expect(needsLayout(parseDot('digraph { a -> b; }'))).toBe(true);
		expect(needsLayout(demo)).toBe(false);
	});
});
