/**
 * Section 4d: the Data section of the built app at a million rows, in Debian's Chromium. The
 * demo study's 12 columns (scripts/simulate-demo.ts, seeded, ≈39 MiB) are picked with the
 * section's file input, as a user would, then timed in the page from the input's change event:
 * - reading: the first progress shown, then "1,000,000 rows, 12 columns" on screen;
 * - the checks: arrow checks, claim checks and estimates all on screen, nothing in progress
 *   (target: the whole section ≤ 10 s, with progress);
 * - Cancel while reading, and Cancel while checking: the time from the click to the progress
 *   gone, and what the section then shows (the earlier state kept, parts "not run").
 * Times are performance.now() in the page, polled every animation frame; the machine's load
 * average beside each row (the machine is shared).
 *
 *   node --import tsx bench/data-browser.ts [rows]   (builds the committed app; port E2E_PORT or 4186)
 */
import type { Browser, Page } from '@playwright/test';
import { mkdtempSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { demoCsv, simulateDemo } from '../scripts/simulate-demo';
import { buildApp, launchChromium, removeApp, serveApp } from './app';
import { KEEP_NAMES_SHIM } from './editor';
import { fmtBytes, fmtInt, fmtMs, renderSection, type Row, type Section } from './table';
import { chromium } from './tools';

interface Timeline {
	/** ms after the change event; −1 when not seen. */
	firstProgress: number;
	loaded: number;
	firstCheckProgress: number;
	done: number;
	/** Distinct progress texts shown while reading and while checking. */
	loadSteps: number;
	checkSteps: number;
}

const load1 = () => loadavg()[0].toFixed(1);

/** The app with the demo diagram, the Data section open. */
async function openDataSection(browser: Browser, url: string): Promise<Page> {
	const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
	const page = await context.newPage();
	await page.addInitScript(KEEP_NAMES_SHIM);
	await page.goto(url);
	await page.getByTestId('verdict').waitFor({ timeout: 60_000 });
	const button = page.locator('#data-heading button');
	if ((await button.getAttribute('aria-expanded')) !== 'true') await button.click();
	await page.locator('section[data-section="data"] .loading').waitFor({ state: 'detached', timeout: 60_000 });
	return page;
}

/** Watches the section from the file input's change event on; resolves with the timeline. */
function watch(page: Page, rowsText: string): Promise<Timeline> {
	return page.evaluate(
		(rowsText) =>
			new Promise<Timeline>((resolve) => {
				const section = document.querySelector('section[data-section="data"]') as HTMLElement;
				const input = section.querySelector('input[type="file"]') as HTMLInputElement;
				const t: Timeline = { firstProgress: -1, loaded: -1, firstCheckProgress: -1, done: -1, loadSteps: 0, checkSteps: 0 };
				const seen = new Set<string>();
				input.addEventListener(
					'change',
					() => {
						const t0 = performance.now();
						const tick = () => {
							const now = performance.now() - t0;
							const reading = section.querySelector('[data-testid="data-progress"]');
							const checking = Array.from(section.querySelectorAll('.progress')).find((p) => p !== reading);
							for (const p of [reading, checking]) {
								const text = p?.textContent?.trim();
								if (!text || seen.has(text)) continue;
								seen.add(text);
								if (p === reading) t.loadSteps++;
								else t.checkSteps++;
							}
							if (reading && t.firstProgress < 0) t.firstProgress = now;
							if (checking && t.firstCheckProgress < 0) t.firstCheckProgress = now;
							if (t.loaded < 0 && section.querySelector('[data-testid="data-source"]')?.textContent?.includes(rowsText)) t.loaded = now;
							const finished = t.loaded >= 0 && !reading && !checking && section.querySelector('[data-testid="estimates-table"]') !== null;
							if (finished) {
								t.done = now;
								resolve(t);
							} else if (now > 600_000) resolve(t);
							else requestAnimationFrame(tick);
						};
						requestAnimationFrame(tick);
					},
					{ once: true }
				);
			}),
		rowsText
	);
}

/** Clicks the Cancel of the progress matching `which` once it shows; ms from the click to the progress gone, and the section's text then. */
async function cancelWhile(page: Page, csv: string, which: 'reading' | 'checking'): Promise<{ ms: number; after: string }> {
	const section = page.locator('section[data-section="data"]');
	await section.getByRole('group', { name: 'Load data' }).locator('input[type="file"]').setInputFiles(csv);
	const progress = which === 'reading' ? section.getByTestId('data-progress') : section.locator('.progress', { hasText: 'Checking' });
	// Wait until the reading has shown some rows (or the checks some progress), so the cancel lands mid-way.
	await progress.filter({ hasText: which === 'reading' ? /[1-9][\d,]* rows/ : /\d+ ?%/ }).waitFor({ timeout: 120_000 });
	const ms = await page.evaluate((which) => {
		const s = document.querySelector('section[data-section="data"]') as HTMLElement;
		const find = () =>
			which === 'reading'
				? s.querySelector('[data-testid="data-progress"]')
				: Array.from(s.querySelectorAll('.progress')).find((p) => p.textContent?.includes('Checking')) ?? null;
		const button = find()?.querySelector('button') as HTMLButtonElement;
		const t0 = performance.now();
		button.click();
		return new Promise<number>((resolve) => {
			const tick = () => (find() === null ? resolve(performance.now() - t0) : requestAnimationFrame(tick));
			requestAnimationFrame(tick);
		});
	}, which);
	await page.waitForTimeout(300);
	const after = ((await section.textContent()) ?? '').replace(/\s+/g, ' ');
	return { ms, after };
}

export async function benchDataBrowser(browser: Browser | null, url: string | null, rows: number): Promise<Section> {
	const title = `4d. The Data section at ${fmtInt(rows)} rows (Chromium)`;
	if (!browser || !url) return { title, rows: [], skipped: 'Chromium not found (apt-get install chromium, or set CHROMIUM_PATH)' };
	const dir = mkdtempSync(join(tmpdir(), 'causeway-bench-data-browser-'));
	try {
		const csv = join(dir, 'cycling-hypertension-1e6.csv');
		writeFileSync(csv, demoCsv(simulateDemo(rows, 20260101)));
		const bytes = statSync(csv).size;
		const rowsText = `${fmtInt(rows)} rows, 12 columns`;
		const out: Row[] = [];

		const page = await openDataSection(browser, url);
		const before = load1();
		const timeline = watch(page, rowsText);
		await page.locator('section[data-section="data"] input[type="file"]').setInputFiles(csv);
		const t = await timeline;
		out.push({
			what: 'load the file, all checks on screen',
			'first progress': fmtMs(t.firstProgress),
			'rows on screen (read)': fmtMs(t.loaded),
			'checks: first progress': fmtMs(t.firstCheckProgress),
			'section finished': t.done >= 0 ? fmtMs(t.done) : 'not within 10 min',
			'progress updates (reading; checking)': `${t.loadSteps}; ${t.checkSteps}`,
			target: '≤ 10 s, with progress',
			'load (1 min)': `${before} → ${load1()}`
		});
		await page.context().close();

		for (const which of ['reading', 'checking'] as const) {
			const p = await openDataSection(browser, url);
			const l0 = load1();
			const c = await cancelWhile(p, csv, which);
			const kept =
				which === 'reading'
					? c.after.includes('No data loaded') && !c.after.includes(rowsText)
						? 'no data, as before'
						: `section: ${c.after.slice(0, 80)}`
					: c.after.includes('Not run: the checks were cancelled')
						? 'data kept; unfinished parts "not run"'
						: `section: ${c.after.slice(0, 80)}`;
			out.push({
				what: `Cancel while ${which}`,
				'first progress': '',
				'rows on screen (read)': '',
				'checks: first progress': '',
				'section finished': `progress gone ${fmtMs(c.ms)} after the click`,
				'progress updates (reading; checking)': kept,
				target: 'working Cancel',
				'load (1 min)': `${l0} → ${load1()}`
			});
			await p.context().close();
		}
		return {
			title,
			rows: out,
			note:
				`The demo study's 12 columns, ${fmtInt(rows)} rows (${fmtBytes(bytes)}), picked with the Data section's file input of the built app (vite build of the committed tree, served by vite preview) in headless Chromium (--disable-gpu). ` +
				'Times from the input\'s change event, read in the page every animation frame: the file is read in the data worker (1 MiB slices) and the checks run there. ' +
				'"Section finished": the row count, arrow checks, claim checks and estimates on screen and no progress left. One run each; the load average (1 min) before → after each row.'
		};
	} finally {
		rmSync(dir, { recursive: true, force: true });
	}
}

/** Standalone: builds the committed app, serves it, and prints the section. */
async function main(): Promise<void> {
	const c = chromium();
	const rows = Number(process.argv[2] ?? 1_000_000);
	const app = buildApp();
	const server = await serveApp(app, Number(process.env.E2E_PORT ?? 4186));
	const browser = c ? await launchChromium(c.path) : null;
	try {
		console.log(renderSection(await benchDataBrowser(browser, server.url, rows)));
	} finally {
		await browser?.close();
		server.stop();
		removeApp(app);
	}
}

if (process.argv[1]?.endsWith('data-browser.ts')) {
	main().catch((e: unknown) => {
		console.error(e instanceof Error ? e.message : String(e));
		process.exit(1);
	});
}
