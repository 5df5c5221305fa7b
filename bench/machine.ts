/** The machine and the reference tools a benchmark run used, for the report's header. */
import { readFileSync } from 'node:fs';
import { cpus, loadavg, totalmem, platform, release } from 'node:os';
import { chromium, networkx, rscript } from './tools';

function cpuModel(): string {
	try {
		const m = /^model name\s*:\s*(.+)$/m.exec(readFileSync('/proc/cpuinfo', 'utf8'));
		if (m) return m[1].trim();
	} catch {
		// not Linux
	}
	return cpus()[0]?.model ?? 'unknown CPU';
}

export function describeMachine(): string {
	const nx = networkx();
	const r = rscript();
	const c = chromium();
	const load = loadavg().map((x) => x.toFixed(1)).join(', ');
	return [
		`- CPU: ${cpuModel()}, ${cpus().length} logical cores`,
		`- RAM: ${(totalmem() / 2 ** 30).toFixed(1)} GiB; ${platform()} ${release()}`,
		`- Node ${process.version}; networkx ${nx ? `${nx.version} (${nx.python})` : 'not installed'}; ${r ? r.version : 'R not installed'}; ${c ? c.version : 'Chromium not installed'}`,
		`- Load average at the start (1, 5, 15 min): ${load} — the machine is shared, so wall times can include waiting for a core`
	].join('\n');
}
