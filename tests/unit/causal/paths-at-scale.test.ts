/**
 * The path listing at scale: the 200-variable two-ladder diagram (tests/unit/reference/
 * two-ladders.ts), where the Paths section once said "0 open" while the Adjustment section
 * said 50 non-causal paths stay open, and `causeway paths --max 20` returned fewer than 20
 * (on this diagram the earlier depth-first listing, commit ee192ae, stopped at its step budget
 * after 17 blocked paths for --max 20 and --max 1000 alike, none of them open).
 * Expected figures by construction: 50 confounders give exactly 50 open back-door paths
 * x ← c_i → y; the 50 paths through the ladder end in the unadjusted collider k (blocked).
 */
import { describe, expect, it } from 'vitest';
import { checkAdjustment, checkAndPaths, exposureOutcomePaths } from '../../../src/lib/causal';
import type { Diagram } from '../../../src/lib/graph/diagram';
import { readDiagramText } from '../../../src/lib/graph/read-file';
import { labelLookup, verdictSentence } from '../../../src/lib/wording';
import { diagramJson, runCli } from '../cli/harness';
import { twoLadderArrows } from '../reference/two-ladders';

const file = diagramJson(twoLadderArrows(), { exposures: ['x'], outcomes: ['y'] });

const load = (text: string): Diagram => readDiagramText('ladder.json', text);

describe('the 200-variable two-ladder diagram', () => {
	it('has 200 variables', () => {
		expect(new Set(twoLadderArrows().flat()).size).toBe(200);
	});

	it('the Paths listing and the Adjustment verdict give the same count: 50 open non-causal paths', () => {
		const d = load(file);
		const paths = exposureOutcomePaths(d);
		const check = checkAdjustment(d);
		expect(paths.openNonCausal).toEqual({ count: 50, bound: 'exact' });
		expect(check.openPaths).toEqual(paths.openNonCausal);
		expect(verdictSentence(check, labelLookup(d))).toBe('Adjusting for nothing is not sufficient: 50 non-causal paths stay open.');
		// Default listing (cap 1,000): all 100 paths, 50 open and 50 blocked, none causal.
		expect(paths.paths).toHaveLength(100);
		expect(paths.paths.filter((p) => p.open && !p.causal)).toHaveLength(50);
		expect(paths.paths.filter((p) => !p.open && !p.causal)).toHaveLength(50);
		expect(Math.max(...paths.paths.map((p) => p.nodes.length))).toBe(103);
		expect(paths.truncated).toBe(false);
	});

	it('the app computes both from one search (checkAndPaths) and gets what the two calls give', () => {
		const d = load(file);
		const both = checkAndPaths(d, { maxPaths: 30 });
		expect(both.check).toEqual(checkAdjustment(d));
		expect(both.paths).toEqual(exposureOutcomePaths(d, { max: 30 }));
		expect(both.paths.paths).toHaveLength(30);
	});

	it('adjusting for every confounder leaves no open non-causal path, in both sections', () => {
		const d = load(file);
		const adjusted = Array.from({ length: 50 }, (_, i) => `c${i + 1}`);
		expect(exposureOutcomePaths(d, { adjusted, max: 20 }).openNonCausal).toEqual({ count: 0, bound: 'exact' });
		expect(checkAdjustment(d, { adjusted })).toMatchObject({ valid: true, openPaths: { count: 0, bound: 'exact' } });
	});

	it('`causeway plan paths --max 20` lists 20 paths and says more exist', async () => {
		const r = await runCli(['plan', 'paths', 'ladder.json', '--max', '20', '--json'], { 'ladder.json': file });
		expect(r.code).toBe(0);
		const j = JSON.parse(r.out) as { paths: { open: boolean; causal: boolean }[]; truncated: boolean; openNonCausal: unknown };
		expect(j.paths).toHaveLength(20);
		expect(j.paths.every((p) => p.open && !p.causal)).toBe(true);
		expect(j.truncated).toBe(true);
		expect(j.openNonCausal).toEqual({ count: 50, bound: 'exact' });
		const text = await runCli(['plan', 'paths', 'ladder.json', '--max', '20'], { 'ladder.json': file });
		expect(text.out).toContain('50 open non-causal paths under the planned set.');
	});
});
