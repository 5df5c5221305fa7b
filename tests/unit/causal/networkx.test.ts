/**
 * d-separation against a reference library: the answers of networkx (Debian's
 * python3-networkx; version recorded in the fixture) on 40 seeded random DAGs of 10–200
 * variables with about 20 queries each. Fixture and the script that made it:
 * tests/fixtures/networkx/{dsep-fixtures.json, make_dsep_fixtures.py}. The script also
 * asserts networkx's answers against the moralised-ancestral-graph criterion
 * (Lauritzen et al. 1990) before writing them.
 *
 * No minimal-separator checks: networkx has find_minimal_d_separator only from 3.3 on, and
 * Debian 12 ships 2.8.8. Minimal separators are held to the brute-force oracle instead
 * (properties.test.ts, claims).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { compileDag, type CompiledDag } from '../../../src/lib/graph/compiled';
import type { Diagram } from '../../../src/lib/graph/diagram';
import { dSeparated } from '../../../src/lib/causal/dsep';
import { dSeparation } from '../../../src/lib/causal/analysis';
import { isOpenPath, isSimplePathInSkeleton } from '../reference/brute-force';

interface Query {
	kind: string;
	x: string[];
	y: string[];
	z: string[];
	separated: boolean;
}
interface FixtureGraph {
	nodes: string[];
	edges: [string, string][];
	queries: Query[];
}
interface Fixture {
	networkx: string;
	function: string;
	counts: { separated: number; connected: number };
	graphs: FixtureGraph[];
}

const fixture = JSON.parse(
	readFileSync(new URL('../../fixtures/networkx/dsep-fixtures.json', import.meta.url), 'utf8')
) as Fixture;

function compiled(fg: FixtureGraph): CompiledDag {
	return compileDag(
		fg.nodes,
		fg.edges.map(([from, to]) => ({ from, to }))
	);
}

function diagram(fg: FixtureGraph): Diagram {
	return {
		title: 'networkx fixture',
		variables: fg.nodes.map((id) => ({ id, label: id, measured: true })),
		arrows: fg.edges.map(([from, to]) => ({ from, to })),
		exposures: [],
		outcomes: [],
		adjusted: []
	};
}

describe(`d-separation agrees with networkx ${fixture.networkx} (nx.${fixture.function})`, () => {
	it('the fixture holds both answers in quantity', () => {
		expect(fixture.graphs.length).toBe(40);
		expect(fixture.counts.separated).toBeGreaterThan(100);
		expect(fixture.counts.connected).toBeGreaterThan(100);
	});

	it('index-based dSeparated: every query, with an open simple path as witness when connected', () => {
		let checked = 0;
		for (const [gi, fg] of fixture.graphs.entries()) {
			const g = compiled(fg);
			const ix = (ids: string[]) => ids.map((id) => g.indexOf.get(id) as number);
			for (const q of fg.queries) {
				const [X, Y, Z] = [ix(q.x), ix(q.y), ix(q.z)];
				const r = dSeparated(g, X, Y, Z);
				const where = `graph ${gi} (${fg.nodes.length} nodes): x=${q.x} y=${q.y} z=${q.z}`;
				expect(r.separated, where).toBe(q.separated);
				if (!r.separated) {
					const path = r.path as number[];
					expect(X, where).toContain(path[0]);
					expect(Y, where).toContain(path[path.length - 1]);
					expect(isSimplePathInSkeleton(g, path), where).toBe(true);
					expect(isOpenPath(g, path, new Set(Z)), where).toBe(true);
				} else expect(r.path).toBeNull();
				checked++;
			}
		}
		expect(checked).toBe(fixture.counts.separated + fixture.counts.connected);
	});

	it('façade dSeparation (string ids): every query on the graphs of up to 100 nodes', () => {
		for (const fg of fixture.graphs.filter((g) => g.nodes.length <= 100)) {
			const d = diagram(fg);
			for (const q of fg.queries) expect(dSeparation(d, q.x, q.y, q.z).separated).toBe(q.separated);
		}
	});

});
