// Scale: a quarter of a million rows, fitted and streamed correctly and compactly. Speed at
// a million rows is measured by `npm run bench` (sections 4 and 4b, with R's glm beside it),
// never asserted here.
import { describe, expect, it } from 'vitest';
import { createRandom, designFromArrays, fitLogistic, parseTableStream } from '../../../src/lib/stats';

const N = 250_000;

describe('a quarter of a million rows', () => {
	it('logistic regression with 10 covariates recovers the simulated coefficients', () => {
		const r = createRandom(11);
		const truth = [-1, 0.5, -0.3, 0.2, 0.1, -0.1, 0.25, -0.2, 0.15, 0.05, 0.3];
		const xs = Array.from({ length: 10 }, (_, j) => ({ name: `x${j + 1}`, values: new Float64Array(N) }));
		const y = new Float64Array(N);
		for (let i = 0; i < N; i++) {
			let eta = truth[0];
			for (let j = 0; j < 10; j++) {
				const v = r.normal();
				xs[j].values[i] = v;
				eta += truth[j + 1] * v;
			}
			y[i] = r.bernoulli(1 / (1 + Math.exp(-eta)));
		}
		const fit = fitLogistic(designFromArrays(y, xs));
		expect(fit.converged).toBe(true);
		// Each estimate within 5 standard errors of the value simulated.
		fit.coefficients.forEach((c, j) => expect(Math.abs(c.estimate - truth[j])).toBeLessThan(5 * c.se));
	});

	it('streams 250,000 rows × 12 columns into typed arrays (about 8 bytes a cell), reporting progress', async () => {
		const r = createRandom(12);
		const XYZ = ['x', 'y', 'z'];
		function* chunks(): Generator<string> {
			yield 'a,b,c,d,e,f,g,h,i,j,k,l\n';
			let lines: string[] = [];
			for (let i = 0; i < N; i++) {
				const u = Math.floor(r.uniform() * 1e6);
				lines.push(`${u % 90},${u & 1},${(u % 10000) / 100},${u % 7},${XYZ[u % 3]},${(u >> 1) & 1},${u},${u % 1000},${(u % 700) / 7},${u % 13},${u % 31},${u % 97}`);
				if (lines.length === 20_000) {
					yield lines.join('\n') + '\n';
					lines = [];
				}
			}
			if (lines.length) yield lines.join('\n') + '\n';
		}
		let calls = 0;
		const result = await parseTableStream(chunks(), { onProgress: () => calls++ });
		if (!result.ok) throw new Error(result.error.message);
		const t = result.table;
		expect(t.rowCount).toBe(N);
		expect(t.columns.map((c) => c.kind)).toEqual(['continuous', 'binary', 'continuous', 'continuous', 'categorical', 'binary', ...Array(6).fill('continuous')]);
		const bytes = t.columns.reduce((s, c) => s + (c.kind === 'continuous' ? c.values.buffer.byteLength : c.codes.buffer.byteLength), 0);
		expect(bytes).toBeLessThan(12 * N * 8 * 1.1);
		expect(calls).toBeGreaterThan(5);
	});
});
