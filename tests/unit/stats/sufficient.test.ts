// The statistics computed once per table (src/lib/stats/sufficient) against the direct
// computation each test did before (the same functions called without them), on the demo
// study's data (static/demo/cycling-hypertension.csv, 5,000 rows) and on a copy with missing
// values: every implied claim, every arrow's association and two-way table, the estimates and
// the confounder check's pieces, to 1e-9 (relative, or absolute where the statistic is near 0,
// since the direct linear test subtracts two residual sums of squares that agree to ~1e-10).
// Logistic fits are compared with the direct fit run to full convergence: the shared path
// reaches the maximum-likelihood estimate more closely than R's stopping rule does (warm
// starts are finished with the Newton step the last pass prepared), so the direct fit at the
// default tolerance can differ from both by up to ~1e-8 (it does, in one claim here).
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { impliedClaims } from '../../../src/lib/causal';
import { dataDiagram, mapVariables } from '../../../src/lib/datacheck';
import { twoWayTable } from '../../../src/lib/datacheck/two-way';
import {
	associate,
	buildDesign,
	continuousColumn,
	estimateExposureEffect,
	fitLogistic,
	levelOddsRatios,
	standardize,
	strata2x2,
	TableStatistics,
	testConditionalIndependence,
	type CodedColumn,
	type Column,
	type Table,
	type TestResult
} from '../../../src/lib/stats';
import { centeredGram } from '../../../src/lib/stats/regression/collinearity';
import { midRanks } from '../../../src/lib/stats/association/ranks';
import { ColumnOrder } from '../../../src/lib/stats/sufficient/column-order';
import { Moments } from '../../../src/lib/stats/sufficient/moments';
import { demoDir, readDiagram, readTable } from '../datacheck/helpers';

const TOL = 1e-9;

function close(a: number, b: number, what: string): void {
	if (Number.isNaN(a) && Number.isNaN(b)) return;
	const ok = Math.abs(a - b) <= TOL * Math.max(1, Math.abs(a), Math.abs(b));
	if (!ok) expect.fail(`${what}: ${a} vs ${b}`);
}

function sameTest(a: TestResult, b: TestResult, what: string): void {
	expect(b.test).toBe(a.test);
	expect(b.n).toBe(a.n);
	expect(b.df).toEqual(a.df);
	expect(b.notes).toEqual(a.notes);
	close(a.statistic, b.statistic, `${what} statistic`);
	close(a.pValue, b.pValue, `${what} p`);
	expect(b.effects.map((e) => e.name)).toEqual(a.effects.map((e) => e.name));
	a.effects.forEach((e, i) => {
		if (/^odds ratio for /.test(e.name)) return; // from a logistic fit: checked against the converged fit below
		close(e.value, b.effects[i].value, `${what} ${e.name}`);
		if (e.ci) e.ci.forEach((v, j) => close(v, (b.effects[i].ci as readonly number[])[j], `${what} ${e.name} CI`));
	});
}

const demo = readTable(`${demoDir}cycling-hypertension.csv`);
const diagram = readDiagram(`${demoDir}cycling-hypertension.causeway.json`);

/** The demo data with values removed: 4 % of age, 6 % of bmi, 3 % of family_history (seeded). */
function withMissing(t: Table): Table {
	let seed = 7;
	const next = () => ((seed = (Math.imul(seed, 1103515245) + 12345) >>> 0) / 2 ** 32);
	const columns = t.columns.map((c): Column => {
		const share = c.name === 'age' ? 0.04 : c.name === 'bmi' ? 0.06 : c.name === 'family_history' ? 0.03 : 0;
		if (share === 0) return c;
		if (c.kind === 'continuous') {
			const values = c.values.slice();
			for (let i = 0; i < values.length; i++) if (next() < share) values[i] = NaN;
			return continuousColumn(c.name, values);
		}
		const codes = c.codes.slice();
		let missing = 0;
		for (let i = 0; i < codes.length; i++)
			if (next() < share) {
				codes[i] = -1;
				missing++;
			}
		return { ...c, codes, missing };
	});
	return { ...t, columns };
}

for (const [label, table] of [
	['the demo data', demo],
	['the demo data with missing values', withMissing(demo)]
] as const) {
	describe(`shared statistics = direct computation on ${label}`, () => {
		const byName = new Map(table.columns.map((c) => [c.name, c]));
		const col = (name: string) => byName.get(name) as Column;
		const mapping = mapVariables(diagram, table.columns.map((c) => c.name));
		const seen = dataDiagram(diagram, mapping);
		const stats = new TableStatistics();
		stats.expect(table.columns);

		it('every implied claim: test, statistic, p, effects', () => {
			const claims = impliedClaims(seen).filter((c) => c.given !== null);
			expect(claims.length).toBeGreaterThan(40);
			for (const c of claims) {
				const what = `${c.a} ⊥ ${c.b} | ${(c.given ?? []).join(',')}`;
				const direct = testConditionalIndependence(col(c.a), col(c.b), (c.given ?? []).map(col));
				const shared = testConditionalIndependence(col(c.a), col(c.b), (c.given ?? []).map(col), stats);
				sameTest(direct.main, shared.main, what);
				expect(shared.others.length).toBe(direct.others.length);
				direct.others.forEach((o, i) => sameTest(o, shared.others[i], `${what} (other)`));
				const or = shared.main.effects.find((e) => /^odds ratio for /.test(e.name));
				if (or) {
					// The tested variable's odds ratio against the direct fit run to convergence.
					const notes = shared.main.notes[0].match(/Response '(.+)', tested '(.+)', given/) as RegExpMatchArray;
					const given = (c.given ?? []).map(col);
					const fit = fitLogistic(buildDesign(col(notes[1]), [...given, col(notes[2])]), { tolerance: 1e-15, maxIterations: 60 });
					const name = or.name.replace(/^odds ratio for '(.+)'$/, '$1');
					close(or.value, fit.coefficients.find((co) => co.name === name)?.oddsRatio ?? NaN, `${what} odds ratio`);
				}
			}
		});

		it('every arrow: association tests and two-way tables with per-level odds ratios', () => {
			for (const a of diagram.arrows) {
				const x = byName.get(a.from);
				const y = byName.get(a.to);
				if (!x || !y) continue;
				const direct = associate(x, y);
				const shared = associate(x, y, stats);
				sameTest(direct.main, shared.main, `${a.from} → ${a.to}`);
				direct.others.forEach((o, i) => sameTest(o, shared.others[i], `${a.from} → ${a.to} (other)`));
				if (x.kind !== 'continuous' && y.kind !== 'continuous') {
					const t1 = twoWayTable(x, y);
					const t2 = twoWayTable(x, y, stats);
					expect(t2.counts).toEqual(t1.counts);
					t1.levelOddsRatios?.levels.forEach((l, i) => {
						const m = t2.levelOddsRatios?.levels[i];
						close(l.oddsRatio, m?.oddsRatio ?? NaN, `${a.from} → ${a.to} level OR`);
						l.ci.forEach((v, j) => close(v, m?.ci[j] ?? NaN, `${a.from} → ${a.to} level OR CI`));
					});
				}
			}
		});

		it('estimates for every minimal set and the confounder check pieces', () => {
			const [y, x] = [col('hypertension'), col('cycling')];
			for (const set of [[], ['age', 'income', 'diet'], ['age', 'income', 'diet', 'fitness'], ['app_panel'], ['age']]) {
				const adjust = set.map(col);
				const direct = estimateExposureEffect(y, x, adjust);
				const shared = estimateExposureEffect(y, x, adjust, stats);
				expect(shared.n).toBe(direct.n);
				for (const k of ['crude', 'adjusted'] as const)
					direct[k].forEach((e, i) => {
						close(e.estimate, shared[k][i].estimate, `${set} ${k}`);
						e.ci.forEach((v, j) => close(v, shared[k][i].ci[j], `${set} ${k} CI`));
						close(e.pValue, shared[k][i].pValue, `${set} ${k} p`);
					});
				expect(shared.warnings).toEqual(direct.warnings);
				const g1 = standardize(y, x, adjust);
				const g2 = standardize(y, x, adjust, 0.95, stats);
				for (const k of ['riskDifference', 'riskRatio', 'marginalOddsRatio', 'risk1', 'risk0'] as const) {
					close(g1[k].estimate, g2[k].estimate, `${set} ${k}`);
					g1[k].ci.forEach((v, j) => close(v, g2[k].ci[j], `${set} ${k} CI`));
				}
			}
			for (const by of ['age', 'income', 'family_history', 'bmi']) {
				const s1 = strata2x2(x, y, col(by));
				const s2 = strata2x2(x, y, col(by), stats);
				expect(s2).toEqual(s1);
			}
			const [yc, fh] = [y, col('family_history')] as CodedColumn[];
			const l1 = levelOddsRatios(yc, fh);
			const l2 = levelOddsRatios(yc, fh, stats);
			close(l1.levels[0].oddsRatio, l2.levels[0].oddsRatio, 'family history OR');
		});

		it('a linear outcome: estimates from the shared cross-products equal lm by QR', () => {
			for (const set of [[], ['age', 'income'], ['hypertension', 'cycling']]) {
				const direct = estimateExposureEffect(col('bmi'), col('diet'), set.map(col));
				const shared = estimateExposureEffect(col('bmi'), col('diet'), set.map(col), stats);
				for (const k of ['crude', 'adjusted'] as const)
					direct[k].forEach((e, i) => {
						close(e.estimate, shared[k][i].estimate, `${set} ${k}`);
						e.ci.forEach((v, j) => close(v, shared[k][i].ci[j], `${set} ${k} CI`));
						close(e.pValue, shared[k][i].pValue, `${set} ${k} p`);
					});
				const f1 = direct.fits.adjusted;
				const f2 = shared.fits.adjusted;
				if (f1.model === 'linear' && f2.model === 'linear') {
					close(f1.rss, f2.rss, 'rss');
					close(f1.rSquared, f2.rSquared, 'R²');
					f1.coefficients.forEach((c, j) => close(c.se, f2.coefficients[j].se, `se ${c.name}`));
				}
			}
		});
	});
}

describe('the pieces', () => {
	const mixed = fc.array(fc.oneof(fc.integer({ min: -5, max: 5 }), fc.constant(Number.NaN), fc.double({ min: -3, max: 3, noNaN: true })), { minLength: 1, maxLength: 200 });

	it("a column's order gives the mid-ranks and sorted values of any set of its rows (property test)", () => {
		fc.assert(
			fc.property(mixed, fc.array(fc.boolean(), { minLength: 200, maxLength: 200 }), (list, keep) => {
				const values = Float64Array.from(list);
				const order = new ColumnOrder(values);
				const rows = Int32Array.from([...values.keys()].filter((i) => keep[i] && !Number.isNaN(values[i])));
				const gathered = Float64Array.from(rows, (r) => values[r]);
				const expected = midRanks(gathered);
				const got = order.midRanks(rows);
				expect(Array.from(got.ranks)).toEqual(Array.from(expected.ranks));
				expect(got.tieSum).toBe(expected.tieSum);
				expect(Array.from(order.sortedValues(rows))).toEqual(Array.from(gathered).sort((p, q) => p - q));
			}),
			{ numRuns: 300 }
		);
	});

	it('centred cross-products equal the collinearity check’s, bit for bit', () => {
		const design = buildDesign(demo.columns.find((c) => c.name === 'hypertension') as Column, ['age', 'income', 'family_history', 'bmi'].map((n) => demo.columns.find((c) => c.name === n) as Column));
		const gram = centeredGram(design);
		const rows = Int32Array.from({ length: design.n }, (_, i) => i);
		const m = new Moments(rows);
		const vectors = design.terms.slice(1).map((t) => {
			const c = demo.columns.find((x) => x.name === t.column) as Column;
			return c.kind === 'continuous' ? { kind: 'values' as const, values: c.values } : { kind: 'level' as const, codes: c.codes, level: 1 };
		});
		const q = vectors.length;
		const got = m.matrix(vectors);
		for (let j = 0; j < q; j++) for (let k = 0; k <= j; k++) expect(got[j * q + k]).toBe(gram[j * q + k]);
	});

	it('a logistic fit on covariate patterns equals the fit on the rows (a binary and a whole-number covariate)', () => {
		const stats = new TableStatistics();
		const y = demo.columns.find((c) => c.name === 'hypertension') as Column;
		const covariates = ['cycling', 'age'].map((n) => demo.columns.find((c) => c.name === n) as Column);
		const plan = stats.plan(y, covariates);
		const grouped = stats.logistic(plan, [0, 1, 2]);
		const direct = fitLogistic(buildDesign(y, covariates));
		expect(grouped.iterations).toBe(direct.iterations);
		close(grouped.deviance, direct.deviance, 'deviance');
		close(grouped.nullDeviance, direct.nullDeviance, 'null deviance');
		grouped.coefficients.forEach((c, j) => {
			close(c.estimate, direct.coefficients[j].estimate, c.name);
			close(c.se, direct.coefficients[j].se, `se ${c.name}`);
		});
	});
});
