// The data-check pipeline beyond the R reference values: mapping and unmapped variables,
// column kinds chosen by the user, checks that cannot run, pictures, the summary-matrix path
// (which must give lm's numbers from second moments alone) and bad input.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { mapVariables, parseSummaryMatrix, retypeColumn, runDataChecks, runSummaryChecks, suggestedArrows } from '../../../src/lib/datacheck';
import type { Diagram } from '../../../src/lib/graph/diagram';
import { InputError } from '../../../src/lib/graph/errors';
import { continuousColumn, StatsError } from '../../../src/lib/stats';
import { expectClose } from '../stats/fixtures';
import { fixtureDir, readDiagram, readTable, tableOf } from './helpers';

const ref = JSON.parse(readFileSync(`${fixtureDir}datacheck.json`, 'utf8'));
const mtcars = readDiagram(`${fixtureDir}mtcars.causeway.json`);
const mtcarsTable = readTable(`${fixtureDir}mtcars.csv`);

function chain(ids: string[], arrows: [string, string][], exposure: string, outcome: string, adjusted: string[] = []): Diagram {
	return {
		title: 't',
		variables: ids.map((id) => ({ id, label: id, measured: true })),
		arrows: arrows.map(([from, to]) => ({ from, to })),
		exposures: [exposure],
		outcomes: [outcome],
		adjusted
	};
}

describe('mapping', () => {
	it('matches ignoring case and punctuation, and a manual choice wins', () => {
		const d = chain(['body_mass', 'age'], [['age', 'body_mass']], 'age', 'body_mass');
		const auto = mapVariables(d, ['Body-Mass', 'AGE', 'other']);
		expect(auto.columns).toEqual({ body_mass: 'Body-Mass', age: 'AGE' });
		const manual = mapVariables(d, ['Body-Mass', 'AGE', 'other'], { age: 'other' });
		expect(manual.columns).toEqual({ body_mass: 'Body-Mass', age: 'other' });
		expect(manual.by.age).toBe('manual');
		expect(manual.unusedColumns).toEqual(['AGE']);
	});

	it('a variable without a column is treated as unmeasured, and the report says so', () => {
		const r = runDataChecks(mtcars, mtcarsTable, { mapping: { disp: null } });
		expect(r.mapping.unmapped).toEqual(['disp']);
		expect(r.notes.join(' ')).toMatch(/"disp": treated as unmeasured/);
		// Arrows touching disp are not checked; the claims are those of the diagram with disp unmeasured.
		expect(r.arrows.skipped.map((s) => `${s.from}>${s.to}`)).toEqual(['cyl>disp', 'disp>hp', 'disp>weight']);
		expect(r.claims.checks.every((c) => ![c.a, c.b, ...c.given].includes('disp'))).toBe(true);
		// {disp} was the planned set: it now has no column, so that row says why; {hp} remains sufficient.
		const planned = r.estimates!.rows.find((x) => x.roles.includes('planned'))!;
		expect(planned.message).toMatch(/no column for "disp"/);
		expect(r.estimates!.rows.find((x) => x.adjustedFor.join() === 'hp')!.sufficient).toBe(true);
	});

	it('refuses a mapping to a column that does not exist, naming both', () => {
		expect(() => runDataChecks(mtcars, mtcarsTable, { mapping: { hp: 'horsepower' } })).toThrow(/"hp" to column "horsepower"/);
		expect(() => runDataChecks(mtcars, mtcarsTable, { mapping: { hp: 'mpg', disp: 'mpg' } })).toThrow(InputError);
	});
});

describe('column kinds chosen by the user', () => {
	it('turns a numeric 0/1/2 column into categorical levels and back', () => {
		const c = continuousColumn('k', [0, 1, 2, NaN, 1]);
		const cat = retypeColumn(c, 'categorical');
		expect(cat.kind).toBe('categorical');
		if (cat.kind === 'continuous') throw new Error('kind');
		expect(cat.levels).toEqual(['0', '1', '2']);
		expect(Array.from(cat.codes)).toEqual([0, 1, 2, -1, 1]);
		const back = retypeColumn(cat, 'continuous');
		if (back.kind !== 'continuous') throw new Error('kind');
		expect(Array.from(back.values).slice(0, 3)).toEqual([0, 1, 2]);
	});

	it('refuses binary for a column with three values, naming the column', () => {
		expect(() => retypeColumn(continuousColumn('k', [0, 1, 2]), 'binary')).toThrow(/'k' cannot be binary: it has 3 distinct values/);
	});

	it('declaring cyl categorical changes its arrow check to a one-way ANOVA', () => {
		const r = runDataChecks(mtcars, mtcarsTable, { types: { cyl: 'categorical' } });
		const c = r.arrows.checks.find((x) => x.from === 'cyl')!;
		expect(c.main!.test).toMatch(/ANOVA/);
		expect(c.strengthName).toBe('√eta squared');
	});
});

describe('checks that cannot run, and pictures', () => {
	const d = chain(['a', 'b', 'c'], [['a', 'b'], ['b', 'c']], 'a', 'c');
	const table = tableOf('a,b,c\n1,0,2.5\n2,0,3.1\n3,0,1.0\n4,0,7.2\n5,0,0.3\n');

	it('a constant column gives an untested arrow naming the column, never a silent verdict', () => {
		const r = runDataChecks(d, table);
		const ab = r.arrows.checks.find((c) => c.from === 'a' && c.to === 'b')!;
		expect(ab.support).toBe('untested');
		expect(ab.message).toMatch(/'b' has the single value 0/);
	});

	it('pictures: box plot for binary × continuous, scatter for continuous pairs, stacked bars for two binary columns', () => {
		const r = runDataChecks(mtcars, mtcarsTable, { pictures: true, types: { cyl: 'categorical' } });
		const kinds = Object.fromEntries(r.arrows.checks.map((c) => [`${c.from}>${c.to}`, c.picture?.kind]));
		expect(kinds['cyl>disp']).toBe('box');
		expect(kinds['weight>mpg']).toBe('scatter');
		const box = r.arrows.checks.find((c) => c.from === 'cyl')!.picture!;
		if (box.kind !== 'box') throw new Error('kind');
		// Quartiles by R's type 7: quantile(mtcars$disp[mtcars$cyl == 4]) = 71.1, 78.85, 108, 120.65, 146.7 (R 4.2).
		expectClose(box.boxes[0].q1, 78.85, 1e-12);
		expectClose(box.boxes[0].median, 108, 1e-12);
		expectClose(box.boxes[0].q3, 120.65, 1e-12);
		expect(box.boxes.map((b) => b.n)).toEqual([11, 7, 14]);
		const bin = chain(['x', 'y'], [['x', 'y']], 'x', 'y');
		const bars = runDataChecks(bin, tableOf('x,y\n0,1\n0,0\n1,1\n1,1\n0,0\n1,0\n'), { pictures: true }).arrows.checks[0].picture!;
		if (bars.kind !== 'bars') throw new Error('kind');
		expect(bars.counts).toEqual([
			[2, 1],
			[1, 2]
		]);
	});

	it('suggests only arrows that keep the diagram acyclic', () => {
		expect(suggestedArrows(d, 'a', 'c')).toEqual([{ from: 'a', to: 'c' }]);
		expect(suggestedArrows(chain(['p', 'q'], [], 'p', 'q'), 'p', 'q')).toHaveLength(2);
	});

	it('a cyclic diagram is refused before any test runs', () => {
		const cyclic = chain(['a', 'b'], [['a', 'b'], ['b', 'a']], 'a', 'b');
		expect(() => runDataChecks(cyclic, table)).toThrow(InputError);
	});

	it('estimates need one exposure and one outcome; the pane gets the reason', () => {
		const r = runDataChecks({ ...d, outcomes: [] }, table, { parts: { arrows: false, claims: false } });
		expect(r.estimates).toBeNull();
		expect(r.estimatesMessage).toMatch(/one exposure and one outcome/);
	});
});

describe('summary-matrix path (mtcars covariance matrix written by R)', () => {
	const summary = parseSummaryMatrix(readFileSync(`${fixtureDir}mtcars-covariance.csv`, 'utf8'));
	const report = runSummaryChecks(mtcars, summary);

	it('reads a covariance matrix with n and means', () => {
		expect(summary.type).toBe('covariance');
		expect(summary.n).toBe(32);
		expect(summary.names).toEqual(['cyl', 'disp', 'hp', 'wt', 'mpg']);
	});

	it('linear estimates from second moments equal lm on the raw data', () => {
		for (const [set, key] of [
			['', 'crude'],
			['disp', 'disp'],
			['hp', 'hp']
		] as const) {
			const r = report.estimates!.rows.find((x) => x.adjustedFor.join() === set)!;
			expectClose(r.estimate, ref.mtcars.linear[key].estimate, 1e-9);
			expectClose(r.ci[0], ref.mtcars.linear[key].ci[0], 1e-9);
			expectClose(r.ci[1], ref.mtcars.linear[key].ci[1], 1e-9);
		}
	});

	it('claim checks equal the partial correlations and Holm values computed from the raw data by R', () => {
		for (const r of ref.mtcars.claims) {
			const c = report.claims.checks.find((x) => x.a === (r.a === 'wt' ? 'weight' : r.a) && x.b === (r.b === 'wt' ? 'weight' : r.b))!;
			expectClose(c.main!.effects[0].value, r.r, 1e-9);
			expectClose(c.pHolm, r.holm, 1e-9);
		}
	});

	it('bad matrices are refused with the row named', () => {
		expect(() => parseSummaryMatrix(',a,b\na,1,0.2\nb,0.2,1\n')).toThrow(/sample size is missing/);
		expect(() => parseSummaryMatrix(',a,b\na,1,x\nb,0.2,1\nn,10\n')).toThrow(/Row 2, column 3: 'x' is not a number/);
		expect(() => parseSummaryMatrix(',a,b\nb,1,0.2\na,0.2,1\nn,10\n')).toThrow(StatsError);
	});
});

describe('warnings on the estimates, never silent nonsense', () => {
	const d = chain(['c', 'x', 'y'], [['c', 'x'], ['c', 'y'], ['x', 'y']], 'x', 'y', ['c']);

	it('separation: an exposure that predicts the outcome perfectly is flagged', () => {
		const rows = ['c,x,y'];
		for (let i = 0; i < 60; i++) rows.push(`${i % 7},${i % 2},${i % 2}`);
		const r = runDataChecks(d, tableOf(rows.join('\n')), { parts: { arrows: false, claims: false } });
		const planned = r.estimates!.rows.find((x) => x.roles.includes('planned'))!;
		expect(planned.warnings.join(' ')).toMatch(/separation|did not converge|fitted probabilities/i);
	});

	it('fewer than about 10 events per parameter is flagged as a rule of thumb (Peduzzi et al. 1996)', () => {
		const rows = ['c,x,y'];
		for (let i = 0; i < 80; i++) rows.push(`${(i * 37) % 11},${i % 3 === 0 ? 1 : 0},${i % 13 === 0 ? 1 : 0}`);
		const r = runDataChecks(d, tableOf(rows.join('\n')), { parts: { arrows: false, claims: false } });
		const planned = r.estimates!.rows.find((x) => x.roles.includes('planned'))!;
		expect(planned.warnings.join(' ')).toMatch(/rule of thumb \(Peduzzi et al\., J Clin Epidemiol 1996\)/);
	});

	it('collinearity: an adjustment column equal to the exposure is left out and named', () => {
		const rows = ['c,x,y'];
		for (let i = 0; i < 50; i++) rows.push(`${(i * 7) % 10},${(i * 7) % 10},${((i * 13) % 17) / 3}`);
		const r = runDataChecks(d, tableOf(rows.join('\n')), { parts: { arrows: false, claims: false } });
		const planned = r.estimates!.rows.find((x) => x.roles.includes('planned'))!;
		expect(planned.message ?? planned.warnings.join(' ')).toMatch(/collinear|left out/i);
	});
});
