/**
 * Multiple-testing adjustments of a family of p-values, returned in the input order
 * (matching R's p.adjust; NaN entries are passed through and not counted). O(m log m).
 * - Holm (1979): step-down, controls the family-wise error rate.
 * - Benjamini & Hochberg (1995): step-up, controls the false discovery rate under
 *   independence or positive dependence.
 */

function finiteOrder(p: readonly number[]): number[] {
	return [...p.keys()].filter((i) => !Number.isNaN(p[i]));
}

export function holmAdjust(p: readonly number[]): number[] {
	const idx = finiteOrder(p).sort((a, b) => p[a] - p[b]);
	const m = idx.length;
	const out = p.map(() => NaN);
	let running = 0;
	idx.forEach((i, rank) => {
		running = Math.max(running, Math.min(1, (m - rank) * p[i]));
		out[i] = running;
	});
	return out;
}

export function benjaminiHochbergAdjust(p: readonly number[]): number[] {
	const idx = finiteOrder(p).sort((a, b) => p[b] - p[a]);
	const m = idx.length;
	const out = p.map(() => NaN);
	let running = 1;
	idx.forEach((i, k) => {
		const rank = m - k;
		running = Math.min(running, (m / rank) * p[i]);
		out[i] = Math.min(1, running);
	});
	return out;
}
