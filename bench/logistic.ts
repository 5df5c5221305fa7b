/**
 * Section 4b: logistic regression with 10 covariates (plus intercept) on 10⁶ rows, Causeway's
 * IRLS (src/lib/stats/regression/logistic.ts) side by side with R's glm on the same numbers
 * (bench/glm.R, run through Rscript when it is installed). Both are timed from columns in
 * memory to a fitted model (ours: design matrix + fit; R: glm's model frame + fit), median of
 * `repeats` runs; the coefficients are compared too.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createRandom, designFromArrays, fitLogistic, type LogisticFit } from '../src/lib/stats';
import { fmtInt, fmtMs, timeBoth, type Section } from './table';
import { rscript } from './tools';

/** True coefficients: intercept, then x1..x10 (continuous, binary and skewed covariates). */
const BETA = [-1, 0.5, -0.3, 0.2, 0.8, -0.6, 0.1, 0.05, -0.2, 0.4, 0.3];

/** y and x1..x10, seeded: normals (some correlated), two binaries, a log-normal, a uniform. */
export function simulateLogistic(n: number, seed: number): Float64Array[] {
	const r = createRandom(seed);
	const cols = Array.from({ length: 11 }, () => new Float64Array(n));
	for (let i = 0; i < n; i++) {
		const z = r.normal();
		const x = [
			z,
			0.6 * z + 0.8 * r.normal(),
			r.normal(2, 3),
			r.bernoulli(0.3),
			r.bernoulli(0.6),
			Math.exp(0.5 * r.normal()),
			r.uniform() * 10,
			r.normal(50, 10),
			r.normal(),
			r.normal()
		];
		let eta = BETA[0];
		for (let j = 0; j < 10; j++) {
			cols[j + 1][i] = x[j];
			eta += BETA[j + 1] * x[j];
		}
		cols[0][i] = r.bernoulli(1 / (1 + Math.exp(-eta)));
	}
	return cols;
}

interface RResult {
	r: string;
	seconds: number;
	elapsed: number;
	iterations: number;
	deviance: number;
	coefficients: number[];
}

export function benchLogistic(n: number, repeats: number): Section {
	const cols = simulateLogistic(n, 20260102);
	const predictors = cols.slice(1).map((values, j) => ({ name: `x${j + 1}`, values }));
	let fit: LogisticFit | null = null;
	const { cpu: ours, wall: oursWall } = timeBoth(() => {
		fit = fitLogistic(designFromArrays(cols[0], predictors));
	}, repeats);
	const f = fit as unknown as LogisticFit;
	const R = rscript();
	let ref: RResult | null = null;
	let skipped: string | undefined;
	if (R) {
		const dir = mkdtempSync(join(tmpdir(), 'causeway-bench-glm-'));
		try {
			const file = join(dir, 'columns.f64');
			const all = new Float64Array(11 * n);
			cols.forEach((c, j) => all.set(c, j * n));
			writeFileSync(file, new Uint8Array(all.buffer));
			const out = execFileSync(R.path, ['bench/glm.R', file, String(n), String(repeats)], { encoding: 'utf8', maxBuffer: 1 << 24 });
			ref = JSON.parse(out.trim().split('\n').pop() as string) as RResult;
		} finally {
			rmSync(dir, { recursive: true, force: true });
		}
	} else {
		skipped = "R not found (apt-get install r-base-core): R's glm column is empty";
	}
	const maxDiff = ref ? Math.max(...f.coefficients.map((c, j) => Math.abs(c.estimate - (ref as RResult).coefficients[j]))) : NaN;
	return {
		title: '4b. Logistic regression, 10 covariates, side by side with R',
		rows: [
			{
				rows: fmtInt(n),
				coefficients: String(f.coefficients.length),
				'Causeway (IRLS), CPU': fmtMs(ours),
				'Causeway, wall': fmtMs(oursWall),
				'Causeway iterations': String(f.iterations),
				"R's glm, CPU": ref ? fmtMs(ref.seconds * 1000) : 'n/a',
				"R's glm, wall": ref ? fmtMs(ref.elapsed * 1000) : 'n/a',
				'R iterations': ref ? String(ref.iterations) : 'n/a',
				'R CPU ÷ ours': ref ? `${((ref.seconds * 1000) / ours).toFixed(1)}×` : 'n/a',
				'max |Δ coefficient|': ref ? maxDiff.toExponential(1) : 'n/a',
				'|Δ deviance|': ref ? Math.abs(f.deviance - ref.deviance).toExponential(1) : 'n/a'
			}
		],
		skipped,
		note:
			`CPU time, median of ${repeats} fits (and median wall time; the machine is shared). Ours: design matrix from the columns (designFromArrays) + fitLogistic; R: glm(y ~ ., binomial) on a data.frame already in memory (${ref?.r ?? 'R'}), ` +
			'which includes building its model frame and matrix. Same convergence rule (relative deviance change < 1e-8), so the coefficients agree to rounding. Target: no slower than R.'
	};
}
