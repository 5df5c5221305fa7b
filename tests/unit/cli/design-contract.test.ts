// The command-line contract of the design document (shared DESIGN.md, "Command line
// contract"), spelled exactly as written there: the 0.1 verbs keep working (as hidden aliases
// of the jobs), with the JSON keys the contract names and its exit statuses.
import { describe, expect, it } from 'vitest';
import { runCli } from './harness';

const DEMO = 'static/demo/cycling-hypertension.causeway.json';
const CSV = 'static/demo/cycling-hypertension.csv';

describe('the design contract, verbatim', () => {
	it('sets, check and dsep give the JSON the contract shows', async () => {
		const sets = await runCli(['sets', DEMO, '--json']);
		expect(sets.code).toBe(0);
		expect(Object.keys(JSON.parse(sets.out))).toEqual(expect.arrayContaining(['exposures', 'outcomes', 'effect', 'identifiable', 'sets', 'truncated', 'optimal']));
		const check = await runCli(['check', DEMO, '--adjust', 'age', '--json']);
		expect(check.code).toBe(1); // a negative verdict
		expect(Object.keys(JSON.parse(check.out))).toEqual(['adjusted', 'valid', 'problems']);
		const dsep = await runCli(['dsep', DEMO, '--from', 'age', '--to', 'hypertension', '--json']);
		expect(dsep.code).toBe(0);
		expect(Object.keys(JSON.parse(dsep.out))).toEqual(['separated', 'path']);
	});

	it('paths, claims, roles, test and estimate answer with exit 0', async () => {
		for (const args of [['paths', DEMO], ['claims', DEMO], ['roles', DEMO], ['test', DEMO, CSV], ['estimate', DEMO, CSV, '--adjust', 'age,diet,income']]) {
			const r = await runCli(args);
			expect(r.code, args.join(' ')).toBe(0);
			expect(r.out.length).toBeGreaterThan(0);
		}
	});

	it('export --to takes every short format the contract lists, and convert writes JSON', async () => {
		const expected: Record<string, RegExp> = { dot: /^digraph /m, svg: /<svg/, tikz: /tikzpicture/, md: /^# /, html: /<html/i, json: /"format": "causeway.diagram"/, csv: /^kind,number,size,ids,labels,sufficient/ };
		for (const [to, shape] of Object.entries(expected)) {
			const r = await runCli(['export', DEMO, '--to', to]);
			expect(r.code, to).toBe(0);
			expect(r.out, to).toMatch(shape);
		}
		const same = await runCli(['export', DEMO, '--format', 'sets-csv']);
		expect((await runCli(['export', DEMO, '--to', 'csv'])).out).toBe(same.out);
		const convert = await runCli(['convert', DEMO, '-o', '-']);
		expect(convert.code).toBe(0);
		expect(JSON.parse(convert.out).format).toBe('causeway.diagram');
	});
});
