/** Small helpers for benchmark sections: Markdown tables, number formats, timing. */
export type Row = Record<string, string>;

/** One numbered part of the report: a table, a note on what limits it, or why it was skipped. */
export interface Section {
	title: string;
	rows: Row[];
	/** What the figures mean, ratios, and what limits them. */
	note?: string;
	/** Set when the section could not run (a tool is missing): the reason, printed instead. */
	skipped?: string;
}

export function table(rows: Row[]): string {
	if (rows.length === 0) return '(no rows)\n';
	const cols = Object.keys(rows[0]);
	const line = (cells: string[]) => `| ${cells.join(' | ')} |`;
	return [line(cols), line(cols.map(() => '---')), ...rows.map((r) => line(cols.map((c) => r[c] ?? '')))].join('\n') + '\n';
}

export function renderSection(s: Section): string {
	const parts = [`### ${s.title}\n`];
	if (s.skipped) parts.push(`Skipped: ${s.skipped}\n`);
	if (s.rows.length > 0) parts.push(table(s.rows));
	if (s.note) parts.push(`\n${s.note}\n`);
	return parts.join('\n');
}

export function fmtMs(ms: number): string {
	if (!Number.isFinite(ms)) return 'n/a';
	if (ms < 0.01) return `${(ms * 1000).toFixed(2)} µs`;
	if (ms < 1) return `${(ms * 1000).toFixed(0)} µs`;
	if (ms < 1000) return `${ms.toFixed(1)} ms`;
	return `${(ms / 1000).toFixed(2)} s`;
}

export function fmtBytes(bytes: number): string {
	if (bytes < 1024) return `${bytes} B`;
	if (bytes < 1024 ** 2) return `${(bytes / 1024).toFixed(1)} KiB`;
	if (bytes < 1024 ** 3) return `${(bytes / 1024 ** 2).toFixed(1)} MiB`;
	return `${(bytes / 1024 ** 3).toFixed(2)} GiB`;
}

export const fmtInt = (x: number): string => x.toLocaleString('en');

/** Median CPU time (user + system of this process) and median wall time of `repeat` runs after one warm-up run, in ms. */
export function timeBoth(fn: () => void, repeat = 5): { cpu: number; wall: number } {
	fn();
	const cpu: number[] = [];
	const wall: number[] = [];
	for (let i = 0; i < repeat; i++) {
		const c0 = process.cpuUsage();
		const t0 = performance.now();
		fn();
		wall.push(performance.now() - t0);
		const c = process.cpuUsage(c0);
		cpu.push((c.user + c.system) / 1000);
	}
	const median = (xs: number[]) => xs.sort((a, b) => a - b)[Math.floor(xs.length / 2)];
	return { cpu: median(cpu), wall: median(wall) };
}

/**
 * Median CPU time of `repeat` runs after a warm-up, in ms. CPU time rather than wall time
 * because the benchmark machines are shared: waiting for a core is not the algorithm's cost.
 */
export function timeIt(fn: () => void, repeat = 5): number {
	return timeBoth(fn, repeat).cpu;
}

/** Wall time and CPU time (user + system, this process) of one run, in milliseconds. */
export function timeOnce(fn: () => void): { wall: number; cpu: number } {
	const c0 = process.cpuUsage();
	const t0 = performance.now();
	fn();
	const wall = performance.now() - t0;
	const c = process.cpuUsage(c0);
	return { wall, cpu: (c.user + c.system) / 1000 };
}
