/**
 * The built app for sections 5 and 6: the committed tree (git archive HEAD, or the commit named
 * by BENCH_APP_REV, to measure an earlier version on the same machine load) is built with
 * `vite build` in a temporary directory — so the benchmark measures what is committed and
 * never touches build/ while other work serves it — then served by `vite preview`, and driven
 * by Debian's Chromium through Playwright.
 */
import { execFileSync, spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync, symlinkSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { chromium, type Browser } from '@playwright/test';

export interface BuiltApp {
	/** The temporary checkout; the static site is in `${dir}/build`. */
	dir: string;
	buildMs: number;
}

export function buildApp(): BuiltApp {
	const root = resolve('.');
	const dir = mkdtempSync(join(tmpdir(), 'causeway-bench-app-'));
	const rev = process.env.BENCH_APP_REV ?? 'HEAD';
	execFileSync('bash', ['-c', `git -C "${root}" archive "$1" | tar -x -C "${dir}"`, 'archive', rev]);
	symlinkSync(join(root, 'node_modules'), join(dir, 'node_modules'));
	const t0 = performance.now();
	execFileSync(process.execPath, [join(root, 'node_modules/vite/bin/vite.js'), 'build', '--logLevel', 'error'], { cwd: dir, stdio: ['ignore', 'ignore', 'pipe'] });
	return { dir, buildMs: performance.now() - t0 };
}

export function removeApp(app: BuiltApp): void {
	rmSync(app.dir, { recursive: true, force: true });
}

export interface Server {
	url: string;
	stop(): void;
}

/** `vite preview` of the built app on a free-ish port (BENCH_PORT overrides it); resolves once it answers. */
export async function serveApp(app: BuiltApp, port = Number(process.env.BENCH_PORT ?? 4319)): Promise<Server> {
	const child: ChildProcess = spawn(
		process.execPath,
		[join(app.dir, 'node_modules/vite/bin/vite.js'), 'preview', '--host', '127.0.0.1', '--port', String(port), '--strictPort'],
		{ cwd: app.dir, stdio: 'ignore' }
	);
	const url = `http://127.0.0.1:${port}/`;
	const stop = () => {
		if (child.exitCode === null) child.kill('SIGTERM');
	};
	for (let i = 0; i < 300; i++) {
		if (child.exitCode !== null) throw new Error(`vite preview exited (port ${port} in use?)`);
		try {
			if ((await fetch(url)).ok) return { url, stop };
		} catch {
			// not up yet
		}
		await new Promise((r) => setTimeout(r, 100));
	}
	stop();
	throw new Error('vite preview did not answer within 30 s');
}

export function launchChromium(executablePath: string): Promise<Browser> {
	return chromium.launch({
		executablePath,
		args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run']
	});
}
