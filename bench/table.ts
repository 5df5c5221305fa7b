/** Small helpers for printing benchmark tables as Markdown. */
export type Row = Record<string, string>;

export function table(rows: Row[]): string {
	if (rows.length === 0) return '(no rows)\n';
	const cols = Object.keys(rows[0]);
	const line = (cells: string[]) => `| ${cells.join(' | ')} |`;
	return [line(cols), line(cols.map(() => '---')), ...rows.map((r) => line(cols.map((c) => r[c] ?? '')))].join('\n') + '\n';
}

export function fmtMs(ms: number): string {
	if (ms < 0.01) return `${(ms * 1000).toFixed(2)} µs`;
	if (ms < 1) return `${(ms * 1000).toFixed(0)} µs`;
	if (ms < 1000) return `${ms.toFixed(1)} ms`;
	return `${(ms / 1000).toFixed(2)} s`;
}

/** Median wall time of `repeat` runs (after one warm-up run), in milliseconds. */
export function timeIt(fn: () => void, repeat = 5): number {
	fn();
	const times: number[] = [];
	for (let i = 0; i < repeat; i++) {
		const t0 = performance.now();
		fn();
		times.push(performance.now() - t0);
	}
	times.sort((a, b) => a - b);
	return times[Math.floor(times.length / 2)];
}
