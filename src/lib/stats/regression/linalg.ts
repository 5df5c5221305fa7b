/**
 * Dense linear algebra on Float64Array, sized for regression (p up to a few dozen, n up
 * to millions).
 * - Householder QR (Golub & Van Loan, Matrix Computations, 4th ed., Alg. 5.2.1; the
 *   column layout of JAMA/LINPACK): O(n·p²) time, in place on a column-major n × p copy.
 * - Cholesky factorisation of a symmetric positive-definite p × p matrix (Golub & Van
 *   Loan Alg. 4.2.1): O(p³); solves and inverse O(p²) / O(p³).
 */

/** Result of an in-place Householder QR of a column-major n × p matrix. */
export interface HouseholderQR {
	/** Householder vectors below and on the diagonal, R above it (column-major). */
	qr: Float64Array;
	/** Diagonal of R. */
	rDiag: Float64Array;
	n: number;
	p: number;
}

/** Factor `a` (column-major, n × p, overwritten) as Q·R. */
export function householderQR(a: Float64Array, n: number, p: number): HouseholderQR {
	const rDiag = new Float64Array(p);
	for (let j = 0; j < p; j++) {
		const cj = j * n;
		// Plain sum of squares (data values are far from the overflow range, 1e154).
		let sumSquares = 0;
		for (let i = j; i < n; i++) sumSquares += a[cj + i] * a[cj + i];
		let norm = Math.sqrt(sumSquares);
		if (norm === 0) {
			rDiag[j] = 0;
			continue;
		}
		if (a[cj + j] < 0) norm = -norm;
		for (let i = j; i < n; i++) a[cj + i] /= norm;
		a[cj + j] += 1;
		for (let k = j + 1; k < p; k++) {
			const ck = k * n;
			let s = 0;
			for (let i = j; i < n; i++) s += a[cj + i] * a[ck + i];
			s = -s / a[cj + j];
			for (let i = j; i < n; i++) a[ck + i] += s * a[cj + i];
		}
		rDiag[j] = -norm;
	}
	return { qr: a, rDiag, n, p };
}

/** y ← Qᵀy, in place. O(n·p). */
export function applyQTranspose(f: HouseholderQR, y: Float64Array): void {
	const { qr, n, p } = f;
	for (let j = 0; j < p; j++) {
		const cj = j * n;
		if (f.rDiag[j] === 0) continue;
		let s = 0;
		for (let i = j; i < n; i++) s += qr[cj + i] * y[i];
		s = -s / qr[cj + j];
		for (let i = j; i < n; i++) y[i] += s * qr[cj + i];
	}
}

/** The p × p upper-triangular R, row-major. */
export function upperR(f: HouseholderQR): Float64Array {
	const { qr, n, p } = f;
	const r = new Float64Array(p * p);
	for (let i = 0; i < p; i++) {
		r[i * p + i] = f.rDiag[i];
		for (let k = i + 1; k < p; k++) r[i * p + k] = qr[k * n + i];
	}
	return r;
}

/** Solve R·x = b for upper-triangular R (row-major p × p). O(p²). */
export function solveUpper(r: Float64Array, b: Float64Array, p: number): Float64Array {
	const x = new Float64Array(p);
	for (let i = p - 1; i >= 0; i--) {
		let s = b[i];
		for (let k = i + 1; k < p; k++) s -= r[i * p + k] * x[k];
		x[i] = s / r[i * p + i];
	}
	return x;
}

/** (RᵀR)⁻¹ from upper-triangular R: R⁻¹·R⁻ᵀ. O(p³). */
export function inverseFromUpper(r: Float64Array, p: number): Float64Array {
	const rinv = new Float64Array(p * p);
	for (let j = 0; j < p; j++) {
		const e = new Float64Array(p);
		e[j] = 1;
		const col = solveUpper(r, e, p);
		for (let i = 0; i < p; i++) rinv[i * p + j] = col[i];
	}
	const out = new Float64Array(p * p);
	for (let i = 0; i < p; i++)
		for (let j = 0; j <= i; j++) {
			let s = 0;
			for (let k = Math.max(i, j); k < p; k++) s += rinv[i * p + k] * rinv[j * p + k];
			out[i * p + j] = s;
			out[j * p + i] = s;
		}
	return out;
}

/**
 * Lower-triangular L with A = L·Lᵀ (row-major p × p), or null when A is not numerically
 * positive definite (a pivot ≤ `tolerance` × the largest diagonal entry).
 */
export function cholesky(a: Float64Array, p: number, tolerance = 1e-13): Float64Array | null {
	const l = new Float64Array(p * p);
	let maxDiag = 0;
	for (let i = 0; i < p; i++) maxDiag = Math.max(maxDiag, Math.abs(a[i * p + i]));
	for (let j = 0; j < p; j++) {
		let d = a[j * p + j];
		for (let k = 0; k < j; k++) d -= l[j * p + k] * l[j * p + k];
		if (!(d > tolerance * maxDiag)) return null;
		const ljj = Math.sqrt(d);
		l[j * p + j] = ljj;
		for (let i = j + 1; i < p; i++) {
			let s = a[i * p + j];
			for (let k = 0; k < j; k++) s -= l[i * p + k] * l[j * p + k];
			l[i * p + j] = s / ljj;
		}
	}
	return l;
}

/** Solve (L·Lᵀ)·x = b. O(p²). */
export function choleskySolve(l: Float64Array, b: Float64Array, p: number): Float64Array {
	const y = new Float64Array(p);
	for (let i = 0; i < p; i++) {
		let s = b[i];
		for (let k = 0; k < i; k++) s -= l[i * p + k] * y[k];
		y[i] = s / l[i * p + i];
	}
	const x = new Float64Array(p);
	for (let i = p - 1; i >= 0; i--) {
		let s = y[i];
		for (let k = i + 1; k < p; k++) s -= l[k * p + i] * x[k];
		x[i] = s / l[i * p + i];
	}
	return x;
}

/** (L·Lᵀ)⁻¹, row-major. O(p³). */
export function choleskyInverse(l: Float64Array, p: number): Float64Array {
	const inv = new Float64Array(p * p);
	for (let j = 0; j < p; j++) {
		const e = new Float64Array(p);
		e[j] = 1;
		const col = choleskySolve(l, e, p);
		for (let i = 0; i < p; i++) inv[i * p + j] = col[i];
	}
	return inv;
}
