/**
 * The outside programs the benchmarks compare against or drive, found once: Debian's python3
 * with networkx, R's Rscript, Chromium. Each is null when missing, and the section using it
 * says so and skips.
 */
import { execFileSync } from 'node:child_process';
import { existsSync } from 'node:fs';

function run(cmd: string, args: string[]): string | null {
	try {
		return execFileSync(cmd, args, { encoding: 'utf8', stdio: ['ignore', 'pipe', 'ignore'], timeout: 30_000 }).trim();
	} catch {
		return null;
	}
}

/** Debian's /usr/bin/python3 first (python3-networkx lives there), then python3 on the PATH. */
export function networkx(): { python: string; version: string } | null {
	for (const python of ['/usr/bin/python3', 'python3']) {
		const version = run(python, ['-c', 'import networkx; print(networkx.__version__)']);
		if (version) return { python, version };
	}
	return null;
}

export function rscript(): { path: string; version: string } | null {
	const version = run('Rscript', ['-e', 'cat(R.version.string)']);
	return version ? { path: 'Rscript', version } : null;
}

export function chromium(): { path: string; version: string } | null {
	const path = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
	if (!existsSync(path)) return null;
	return { path, version: run(path, ['--version']) ?? 'unknown version' };
}
