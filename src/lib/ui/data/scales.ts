/**
 * Position scales for the data pane's small SVG pictures and forest plot. The mapping itself
 * is one line (linear, or linear in log for ratios); "nice" tick values come from d3-array's
 * `ticks` (Wilkinson-style 1-2-5 steps). O(1) per value.
 */
import { ticks } from 'd3-array';

export interface Scale {
	(x: number): number;
	ticks(count: number): number[];
}

/** Linear map of [d0, d1] onto [r0, r1]; a zero-width domain is widened by 1 each side. */
export function linearScale(d0: number, d1: number, r0: number, r1: number): Scale {
	if (d0 === d1) {
		d0 -= 1;
		d1 += 1;
	}
	const f = ((x: number) => r0 + ((x - d0) / (d1 - d0)) * (r1 - r0)) as Scale;
	f.ticks = (count) => ticks(d0, d1, count);
	return f;
}

/** For ratios: positions linear in log(x); ticks at nice ratio values inside the domain. */
export function logScale(d0: number, d1: number, r0: number, r1: number): Scale {
	const l0 = Math.log(d0);
	const l1 = d0 === d1 ? Math.log(d1) + 1 : Math.log(d1);
	const f = ((x: number) => r0 + ((Math.log(x) - l0) / (l1 - l0)) * (r1 - r0)) as Scale;
	f.ticks = () => {
		const candidates = [0.01, 0.02, 0.05, 0.1, 0.2, 0.25, 0.5, 0.75, 1, 1.5, 2, 3, 4, 5, 10, 20, 50, 100];
		const inside = candidates.filter((c) => c >= d0 && c <= d1);
		return inside.length > 6 ? inside.filter((_, i) => i % 2 === 0 || inside[i] === 1) : inside;
	};
	return f;
}

/** Domain [lo, hi] of finite values, padded by `pad` of its width. */
export function extent(values: Iterable<number>, pad = 0.05): [number, number] {
	let lo = Infinity;
	let hi = -Infinity;
	for (const v of values)
		if (Number.isFinite(v)) {
			if (v < lo) lo = v;
			if (v > hi) hi = v;
		}
	if (lo > hi) return [0, 1];
	const w = (hi - lo) * pad;
	return [lo - w, hi + w];
}
