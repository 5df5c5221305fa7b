/**
 * Path counts against a reference library: networkx's nx.all_simple_paths on the skeleton
 * (Debian's python3-networkx; version in the fixture), each path judged by the d-separation
 * rule (Pearl 1988), on 60 seeded random DAGs of 8–26 variables, two questions each. The
 * script also checks that rule against networkx's own d-separation test before writing.
 * Fixture and script: tests/fixtures/networkx/{open-paths.json, make_path_fixtures.py}.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { compileDag } from '../../../src/lib/graph/compiled';
import { openNonCausalPathsIdx } from '../../../src/lib/causal/open-paths';
import { listPathsIdx } from '../../../src/lib/causal/paths';

interface Question {
	x: string;
	y: string;
	z: string[];
	counts: { paths: number; causal: number; openCausal: number; openNonCausal: number };
	separated: boolean;
	openNonCausalPaths: string[] | null;
}
interface Fixture {
	networkx: string;
	graphs: { nodes: string[]; edges: [string, string][]; questions: Question[] }[];
}

const fixture = JSON.parse(readFileSync(new URL('../../fixtures/networkx/open-paths.json', import.meta.url), 'utf8')) as Fixture;

describe(`path counts against networkx ${fixture.networkx} (all_simple_paths + the d-separation rule)`, () => {
	it('the same number of open non-causal paths, the same paths, on 120 questions', () => {
		let questions = 0;
		for (const fg of fixture.graphs) {
			const g = compileDag(fg.nodes, fg.edges.map(([from, to]) => ({ from, to })));
			const at = (id: string) => fg.nodes.indexOf(id);
			for (const q of fg.questions) {
				questions++;
				const Z = q.z.map(at);
				const open = openNonCausalPathsIdx(g, [at(q.x)], [at(q.y)], Z, { keep: 1_000_000 });
				expect(open).toMatchObject({ count: q.counts.openNonCausal, bound: 'exact' });
				if (q.openNonCausalPaths) expect(open.paths.map((p) => p.map((v) => fg.nodes[v]).join('-')).sort()).toEqual(q.openNonCausalPaths);
			}
		}
		expect(questions).toBe(120);
	});

	it('the full listing has every path; some path is open exactly when networkx says d-connected', () => {
		for (const fg of fixture.graphs) {
			const g = compileDag(fg.nodes, fg.edges.map(([from, to]) => ({ from, to })));
			const at = (id: string) => fg.nodes.indexOf(id);
			for (const q of fg.questions) {
				if (q.counts.paths > 10_000) continue; // the listing's own cap
				const listing = listPathsIdx(g, [at(q.x)], [at(q.y)], q.z.map(at), 10_000);
				expect(listing.truncated).toBe(false);
				expect(listing.paths).toHaveLength(q.counts.paths);
				expect(listing.paths.filter((p) => p.causal)).toHaveLength(q.counts.causal);
				expect(listing.paths.filter((p) => p.causal && p.open)).toHaveLength(q.counts.openCausal);
				expect(listing.paths.some((p) => p.open)).toBe(!q.separated);
			}
		}
	});
});
