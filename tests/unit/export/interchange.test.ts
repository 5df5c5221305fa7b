/**
 * Interchange exports held to the outside world: the DOT export read by Graphviz itself
 * (`dot -Tjson` reports every node's attributes as Graphviz parsed them, so the roles must be
 * there as written, and `dot -Tsvg` must draw it without a warning), and the round trip of
 * native JSON and DOT through export and import (ids, labels, roles, positions, unknown keys).
 * The Graphviz checks are skipped, with a message, where Graphviz is not installed.
 */
import { spawnSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { exportText } from '../../../src/lib/export/formats';
import { readDiagramText } from '../../../src/lib/graph/read-file';
import type { Diagram } from '../../../src/lib/graph/diagram';
import { demo, hostileDemo, hasProgram } from './helpers';

const graphviz = hasProgram('dot', '-V');
if (!graphviz) console.warn('Graphviz `dot` not found: skipping the DOT export checks against Graphviz (apt-get install graphviz)');

/** The demo with unknown keys everywhere and a note, to check nothing is lost. */
function richDemo(): Diagram {
	const d = hostileDemo();
	d.extra = { protocolId: 'CW-2026-01', reviewers: ['A', 'B'] };
	d.variables[0].extra = { unit: 'years', scale: 2 };
	d.arrows[0].extra = { evidence: 'cohort studies', strength: 0.4 };
	d.variables[1].note = 'line one\nline two';
	return d;
}

describe.skipIf(!graphviz)('DOT export read by Graphviz', () => {
	const d = hostileDemo();
	const dot = exportText('dot', d);

	it('renders with dot -Tsvg without warnings', () => {
		const run = spawnSync('dot', ['-Tsvg'], { input: dot, encoding: 'utf8' });
		expect(run.stderr).toBe('');
		expect(run.status).toBe(0);
		expect(run.stdout).toContain('<svg');
	});

	it('carries roles and measured flags as node attributes Graphviz reads (positions: see the round trip below, since Graphviz lays out anew)', () => {
		const run = spawnSync('dot', ['-Tjson0'], { input: dot, encoding: 'utf8' });
		expect(run.status).toBe(0);
		const graph = JSON.parse(run.stdout) as { objects: { name: string; role?: string; measured?: string; pos?: string }[]; edges: { tail: number; head: number }[] };
		const byName = new Map(graph.objects.map((o) => [o.name, o]));
		for (const v of d.variables) {
			const node = byName.get(v.id)!;
			const roles = (node.role ?? '').split(',').filter(Boolean);
			expect(roles.includes('exposure')).toBe(d.exposures.includes(v.id));
			expect(roles.includes('outcome')).toBe(d.outcomes.includes(v.id));
			expect(roles.includes('adjusted')).toBe(d.adjusted.includes(v.id));
			expect(node.measured === 'false').toBe(!v.measured);
		}
		const names = graph.objects.map((o) => o.name);
		expect(graph.edges.map((e) => [names[e.tail], names[e.head]]).sort()).toEqual(d.arrows.map((a) => [a.from, a.to]).sort());
	});
});

describe('round trip through export and import', () => {
	it('native JSON keeps everything, unknown keys included', () => {
		const d = richDemo();
		const back = readDiagramText('x.json', exportText('json', d));
		expect(back).toEqual(d);
	});

	it('DOT keeps ids, labels, roles, positions, notes and unknown keys', () => {
		const d = richDemo();
		const back = readDiagramText('x.dot', exportText('dot', d));
		expect(back.variables.map((v) => [v.id, v.label, v.measured, v.x, v.y, v.note ?? ''])).toEqual(d.variables.map((v) => [v.id, v.label, v.measured, v.x, v.y, v.note ?? '']));
		expect(back.arrows.map((a) => [a.from, a.to])).toEqual(d.arrows.map((a) => [a.from, a.to]));
		expect([back.exposures, back.outcomes, [...back.adjusted].sort()]).toEqual([d.exposures, d.outcomes, [...d.adjusted].sort()]);
		expect(back.title).toBe(d.title);
		// DOT has only text values: unknown keys come back as their text (docs/graph-io.md).
		expect(back.variables[0].extra).toEqual({ unit: 'years', scale: '2' });
		expect(back.arrows[0].extra).toEqual({ evidence: 'cohort studies', strength: '0.4' });
		expect(back.extra).toMatchObject({ protocolId: 'CW-2026-01' });
		// And a second round trip is exact.
		expect(readDiagramText('y.dot', exportText('dot', back))).toEqual(back);
	});

	it('JSON → DOT → JSON of the demo study loses nothing the demo uses', () => {
		const d = demo();
		const back = readDiagramText('x.dot', exportText('dot', d));
		expect(exportText('json', { ...back, adjusted: d.adjusted })).toBe(exportText('json', d));
	});
});
