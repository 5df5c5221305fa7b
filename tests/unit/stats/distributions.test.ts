// Distribution functions against R 4.2 (pnorm, qnorm, pt, qt, pchisq, qchisq, pf, qf,
// dhyper, phyper), values in tests/fixtures/stats/distributions.json from make-fixtures.R.
import { describe, it } from 'vitest';
import {
	chiSquareCdf,
	chiSquareQuantile,
	chiSquareSf,
	fCdf,
	fQuantile,
	fSf,
	hypergeometricCdf,
	hypergeometricPmf,
	normalCdf,
	normalQuantile,
	normalSf,
	tCdf,
	tQuantile,
	tSf
} from '../../../src/lib/stats';
import { expectClose, fixture, type Json } from './fixtures';

const d = fixture('distributions.json');
// Tolerance: 1e-12 relative (R and stdlib both implement the same Boost/Cephes-grade
// algorithms; the fixture holds 15 significant digits). Upper tails are checked relative
// to their own (tiny) size, so 1 − CDF cancellation would fail them.
const REL = 1e-12;

describe('distributions agree with R', () => {
	it('normal CDF, upper tail and quantile (R pnorm/qnorm)', () => {
		for (const c of d.pnorm as Json[]) {
			expectClose(normalCdf(c.x), c.lower, REL);
			expectClose(normalSf(c.x), c.upper, REL);
		}
		for (const c of d.qnorm as Json[]) expectClose(normalQuantile(c.p), c.q, REL, 1e-15);
	});
	it("Student's t CDF, upper tail and quantile (R pt/qt)", () => {
		for (const c of d.pt as Json[]) {
			expectClose(tCdf(c.t, c.df), c.lower, REL);
			expectClose(tSf(c.t, c.df), c.upper, REL);
		}
		for (const c of d.qt as Json[]) expectClose(tQuantile(c.p, c.df), c.q, REL);
	});
	it('chi-square CDF, upper tail and quantile (R pchisq/qchisq), incl. pchisq(250, 3) upper ≈ 1e-53', () => {
		for (const c of d.pchisq as Json[]) {
			expectClose(chiSquareCdf(c.x, c.df), c.lower, REL);
			expectClose(chiSquareSf(c.x, c.df), c.upper, REL);
		}
		for (const c of d.qchisq as Json[]) expectClose(chiSquareQuantile(c.p, c.df), c.q, REL);
	});
	it('F CDF, upper tail and quantile (R pf/qf)', () => {
		for (const c of d.pf as Json[]) {
			expectClose(fCdf(c.x, c.df1, c.df2), c.lower, REL);
			expectClose(fSf(c.x, c.df1, c.df2), c.upper, 1e-10);
		}
		for (const c of d.qf as Json[]) expectClose(fQuantile(c.p, c.df1, c.df2), c.q, 1e-10);
	});
	it('hypergeometric pmf and CDF (R dhyper/phyper; population = m + n)', () => {
		for (const c of d.hyper as Json[]) {
			expectClose(hypergeometricPmf(c.x, c.m + c.n, c.m, c.k), c.pmf, 1e-10);
			expectClose(hypergeometricCdf(c.x, c.m + c.n, c.m, c.k), c.cdf, 1e-10);
		}
	});
});
