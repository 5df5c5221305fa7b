// The whole browser killed (SIGKILL, as a crash, the task manager or a power cut would) right
// after an edit: the edit is back when the browser is started again on the same profile.
// localStorage alone cannot promise it — Chromium writes it to disk in batches, up to a minute
// late (docs/reliability.md, "What the autosave promises") — so the app keeps a second copy in
// IndexedDB committed with strict durability (src/lib/editor/durable-copy.ts). The test kills
// the browser as soon as that copy holds the edit; no timing is asserted.
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, expect, test, type Browser, type Page } from '@playwright/test';
import { addVariableByMouse, counts } from './helpers';

const executablePath = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
// Apart from the ports Playwright and other checkouts use (E2E_PORT is the preview server's).
const debugPort = Number(process.env.E2E_PORT ?? 4173) + 1100;

async function startBrowser(profile: string, port: number): Promise<{ proc: ChildProcess; browser: Browser }> {
	const proc = spawn(executablePath, ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--no-first-run', `--user-data-dir=${profile}`, `--remote-debugging-port=${port}`, 'about:blank'], { detached: true, stdio: 'ignore' });
	for (let i = 0; i < 300; i++) {
		try {
			return { proc, browser: await chromium.connectOverCDP(`http://127.0.0.1:${port}`) };
		} catch {
			await new Promise((r) => setTimeout(r, 100));
		}
	}
	throw new Error('Chromium did not start');
}

function kill(proc: ChildProcess) {
	try {
		process.kill(-proc.pid!, 'SIGKILL'); // the whole process group: browser, renderers, GPU, storage
	} catch {
		// already gone
	}
}

async function firstPage(browser: Browser): Promise<Page> {
	const context = browser.contexts()[0];
	return context.pages()[0] ?? (await context.newPage());
}

/** The diagram text in the crash-safe copy (IndexedDB), or '' when there is none yet. */
function durableText(page: Page): Promise<string> {
	return page.evaluate(
		() =>
			new Promise<string>((resolve) => {
				const open = indexedDB.open('causeway', 1);
				open.onupgradeneeded = () => open.result.createObjectStore('autosave');
				open.onerror = () => resolve('');
				open.onsuccess = () => {
					const get = open.result.transaction('autosave').objectStore('autosave').get('latest');
					get.onsuccess = () => resolve((get.result?.text as string | undefined) ?? '');
					get.onerror = () => resolve('');
				};
			})
	);
}

test('an edit survives the whole browser being killed right after it is stored', async ({ baseURL }) => {
	const profile = mkdtempSync(join(tmpdir(), 'causeway-kill-'));
	let { proc, browser } = await startBrowser(profile, debugPort);
	try {
		let page = await firstPage(browser);
		// Not a first visit (no demo), before the app ever runs on this profile.
		await page.goto(`${baseURL}/favicon.svg`);
		await page.evaluate(() => localStorage.setItem('causeway.visited', '1'));
		await page.goto(baseURL!);
		await expect(page.getByText('An empty diagram.')).toBeVisible({ timeout: 20_000 });

		await addVariableByMouse(page, 'First edit', { x: 200, y: 200 });
		await expect.poll(() => durableText(page), { timeout: 20_000 }).toContain('First edit');
		await addVariableByMouse(page, 'Last edit', { x: 420, y: 260 });
		await expect.poll(() => durableText(page), { timeout: 20_000 }).toContain('Last edit');

		kill(proc);
		({ proc, browser } = await startBrowser(profile, debugPort + 1));
		page = await firstPage(browser);
		await page.goto(baseURL!);
		await expect.poll(async () => (await page.evaluate(() => !!window.__causewayCanvas)) && (await counts(page)).variables, { timeout: 20_000 }).toBe(2);
		await expect(page.getByText('Your diagram from the last session is back')).toBeVisible();
		await page.getByRole('button', { name: 'Text view' }).click();
		await expect(page.getByText('Last edit', { exact: true }).first()).toBeVisible();
	} finally {
		kill(proc);
		rmSync(profile, { recursive: true, force: true });
	}
});
