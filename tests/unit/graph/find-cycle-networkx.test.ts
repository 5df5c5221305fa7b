// findCycle against networkx: 300 random directed graphs whose acyclicity was decided by
// networkx's is_directed_acyclic_graph (Debian python3-networkx); the fixture and the script
// that wrote it are in tests/fixtures/graph/cycles/.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { findCycle } from '../../../src/lib/graph/validate';

interface Case {
	ids: string[];
	arrows: [string, string][];
	acyclic: boolean;
}
const fixture: { source: string; cases: Case[] } = JSON.parse(readFileSync('tests/fixtures/graph/cycles/networkx-cycles.json', 'utf8'));

describe(`findCycle agrees with ${fixture.source}`, () => {
	it('has both kinds of graph in the fixture', () => {
		expect(fixture.cases.filter((c) => c.acyclic).length).toBeGreaterThan(50);
		expect(fixture.cases.filter((c) => !c.acyclic).length).toBeGreaterThan(50);
	});

	it('finds a cycle exactly when networkx says the graph is not acyclic, and the cycle is real', () => {
		for (const [k, c] of fixture.cases.entries()) {
			const arrows = c.arrows.map(([from, to]) => ({ from, to }));
			const cycle = findCycle(c.ids, arrows);
			expect(cycle === null, `case ${k}`).toBe(c.acyclic);
			if (cycle) {
				const edges = new Set(c.arrows.map(([f, t]) => `${f} ${t}`));
				expect(cycle[0]).toBe(cycle[cycle.length - 1]);
				expect(new Set(cycle.slice(0, -1)).size, `case ${k}: a simple cycle`).toBe(cycle.length - 1);
				for (let i = 0; i + 1 < cycle.length; i++) expect(edges.has(`${cycle[i]} ${cycle[i + 1]}`), `case ${k}`).toBe(true);
			}
		}
	});
});
