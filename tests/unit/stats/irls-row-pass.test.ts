/**
 * One IRLS pass over rows (src/lib/stats/regression/irls-row-pass.ts) against the textbook
 * per-row sums it stands for (McCullagh & Nelder 1989, §2.5: W = μ(1 − μ), z = η + (y − μ)/w,
 * deviance −2 Σ log q): with the design read from a matrix, from column vectors over every row
 * (the copied-slice path) and over a subset of rows (the gathered path), on enough rows that the
 * deviance's running product is folded into its logarithm many times.
 */
import { describe, expect, it } from 'vitest';
import { rowPass, rowPassScratch } from '../../../src/lib/stats/regression/irls-row-pass';
import type { DesignVector } from '../../../src/lib/stats/regression/design';
import type { IrlsData } from '../../../src/lib/stats/regression/irls';
import { createRandom } from '../../../src/lib/stats/random';

const N = 5_000;
const P = 4;

function reference(rows: Int32Array, vectors: DesignVector[], y: (r: number) => number, beta: Float64Array) {
	const xtwx = new Float64Array(P * P);
	const xtwz = new Float64Array(P);
	let deviance = 0;
	for (const r of rows) {
		const x = vectors.map((v) => (v.kind === 'one' ? 1 : v.kind === 'values' ? v.values[r] : v.codes[r] === v.level ? 1 : 0));
		const eta = x.reduce((s, xj, j) => s + xj * beta[j], 0);
		const mu = 1 / (1 + Math.exp(-eta));
		const w = mu * (1 - mu);
		const yr = y(r);
		deviance -= 2 * Math.log(yr === 1 ? mu : 1 - mu);
		for (let j = 0; j < P; j++) {
			xtwz[j] += x[j] * (w * eta + (yr - mu));
			for (let m = 0; m <= j; m++) xtwx[j * P + m] += w * x[j] * x[m];
		}
	}
	return { xtwx, xtwz, deviance };
}

describe('one IRLS pass over rows', () => {
	const rng = createRandom(20261206);
	const random = () => rng.uniform();
	const a = Float64Array.from({ length: N }, () => random() * 4 - 2);
	const b = Float64Array.from({ length: N }, () => random() * 2);
	const codes = Int32Array.from({ length: N }, () => Math.floor(random() * 3));
	const vectors: DesignVector[] = [{ kind: 'one' }, { kind: 'values', values: a }, { kind: 'values', values: b }, { kind: 'level', codes, level: 2 }];
	const outcome = Float64Array.from({ length: N }, (_, r) => (random() < 1 / (1 + Math.exp(-(0.3 * a[r] - 0.5))) ? 1 : 0));
	const beta = Float64Array.from([-0.4, 0.3, -0.2, 0.5]);
	const cols = Int32Array.from([0, 1, 2, 3]);

	function passOver(rows: Int32Array, fromMatrix: boolean) {
		const y = Float64Array.from(rows, (r) => outcome[r]);
		const x = new Float64Array(fromMatrix ? rows.length * P : 0);
		if (fromMatrix)
			rows.forEach((r, k) => {
				x[k * P] = 1;
				x[k * P + 1] = a[r];
				x[k * P + 2] = b[r];
				x[k * P + 3] = codes[r] === 2 ? 1 : 0;
			});
		const data: IrlsData = { x, stride: P, cols, units: rows.length, y, trials: null, source: fromMatrix ? undefined : { vectors, rows } };
		const xtwx = new Float64Array(P * P);
		const xtwz = new Float64Array(P);
		const { deviance } = rowPass(data, beta, xtwx, xtwz, rowPassScratch(P), true);
		return { xtwx, xtwz, deviance };
	}

	const every = Int32Array.from({ length: N }, (_, i) => i);
	const some = every.filter((r) => r % 7 !== 3);
	for (const [name, rows, fromMatrix] of [
		['every row, from column vectors (slices)', every, false],
		['a subset of rows, from column vectors (gathered)', some, false],
		['every row, from a row-major matrix', every, true]
	] as const) {
		it(name, () => {
			const got = passOver(rows, fromMatrix);
			const want = reference(rows, vectors, (r) => outcome[r], beta);
			expect(got.deviance).toBeGreaterThan(1000);
			expect(Math.abs(got.deviance - want.deviance) / want.deviance).toBeLessThan(1e-12);
			for (let j = 0; j < P; j++) {
				expect(got.xtwz[j]).toBeCloseTo(want.xtwz[j], 8);
				for (let m = 0; m <= j; m++) expect(got.xtwx[j * P + m]).toBeCloseTo(want.xtwx[j * P + m], 8);
			}
		});
	}
});
