/**
 * A small seeded pseudo-random generator for reproducible simulations.
 *
 * xoshiro128** (Blackman & Vigna, "Scrambled linear pseudorandom number generators",
 * ACM TOMS 2021): 128-bit state, period 2¹²⁸ − 1, passes BigCrush; the state is seeded
 * from a 32-bit seed with SplitMix32 as its authors recommend. Uniforms use the top 32 bits
 * (resolution 2⁻³²); normals use the Marsaglia polar method (Marsaglia & Bray 1964).
 * Every draw is O(1) and allocation-free. Hand-written because it is 30 lines and npm's
 * seeded generators either lack normals or pull in far larger libraries.
 */

export interface Random {
	/** Uniform on [0, 1). */
	uniform(): number;
	/** Normal with the given mean and standard deviation. */
	normal(mean?: number, sd?: number): number;
	/** 1 with probability p, else 0. */
	bernoulli(p: number): number;
}

function splitmix32(seed: number): () => number {
	let s = seed >>> 0;
	return () => {
		s = (s + 0x9e3779b9) >>> 0;
		let z = s;
		z = Math.imul(z ^ (z >>> 16), 0x85ebca6b) >>> 0;
		z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35) >>> 0;
		return (z ^ (z >>> 16)) >>> 0;
	};
}

/** A generator seeded from a 32-bit integer (state filled by SplitMix32). */
export function createRandom(seed: number): Random {
	const init = splitmix32(seed);
	return createRandomFromState([init(), init(), init(), init()]);
}

/** A generator from an explicit 128-bit state (four 32-bit words, not all zero). */
export function createRandomFromState(state: readonly [number, number, number, number]): Random & { nextUint32(): number } {
	let [a, b, c, d] = state.map((w) => w >>> 0);
	if ((a | b | c | d) === 0) a = 1;
	const next = (): number => {
		const result = Math.imul(rotl(Math.imul(b, 5) >>> 0, 7), 9) >>> 0;
		const t = (b << 9) >>> 0;
		c ^= a;
		d ^= b;
		b ^= c;
		a ^= d;
		c ^= t;
		d = rotl(d >>> 0, 11);
		a >>>= 0;
		b >>>= 0;
		c >>>= 0;
		return result;
	};
	let spare: number | null = null;
	const uniform = () => next() / 4294967296;
	return {
		nextUint32: next,
		uniform,
		normal(mean = 0, sd = 1) {
			if (spare !== null) {
				const v = spare;
				spare = null;
				return mean + sd * v;
			}
			let u: number;
			let v: number;
			let s: number;
			do {
				u = 2 * uniform() - 1;
				v = 2 * uniform() - 1;
				s = u * u + v * v;
			} while (s >= 1 || s === 0);
			const f = Math.sqrt((-2 * Math.log(s)) / s);
			spare = v * f;
			return mean + sd * u * f;
		},
		bernoulli(p: number) {
			return uniform() < p ? 1 : 0;
		}
	};
}

function rotl(x: number, k: number): number {
	return ((x << k) | (x >>> (32 - k))) >>> 0;
}
