/** Window sizes, and staying responsive on a large diagram (analysis in a worker, with progress and cancel). */
import { test, expect } from '@playwright/test';
import { canvas, counts, message, openEmpty, verdict } from './helpers';

function overlap(a: { x: number; y: number; width: number; height: number }, b: typeof a): boolean {
	return a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height && b.y < a.y + a.height;
}

test('at 1920×1080 the canvas fills the window beside the analysis column', async ({ page }) => {
	await page.setViewportSize({ width: 1920, height: 1080 });
	await page.goto('/');
	await expect(verdict(page)).toBeVisible();
	const c = (await page.locator('.canvas-area').boundingBox())!;
	const col = (await page.getByRole('complementary', { name: 'Analysis' }).boundingBox())!;
	expect(c.width).toBeGreaterThan(1400);
	expect(c.height).toBeGreaterThan(950);
	expect(overlap(c, col)).toBe(false);
	expect(col.x + col.width).toBeLessThanOrEqual(1920);
});

test('on a narrow window the analysis column collapses instead of covering the canvas', async ({ page }) => {
	await page.setViewportSize({ width: 760, height: 800 });
	await page.goto('/');
	const column = page.getByRole('complementary', { name: 'Analysis' });
	const toggle = column.getByRole('button', { name: /Analysis/ });
	await expect(toggle).toHaveAttribute('aria-expanded', 'false');
	await expect(page.locator('#analysis-body')).toBeHidden();
	let c = (await page.locator('.canvas-area').boundingBox())!;
	let col = (await column.boundingBox())!;
	expect(col.width).toBeLessThan(60);
	expect(overlap(c, col)).toBe(false);
	expect(c.width).toBeGreaterThan(650);

	await toggle.click();
	await expect(verdict(page)).toBeVisible();
	c = (await page.locator('.canvas-area').boundingBox())!;
	col = (await column.boundingBox())!;
	expect(overlap(c, col)).toBe(false);
	expect(col.x + col.width).toBeLessThanOrEqual(760);
	expect(c.width).toBeGreaterThan(300);
	await page.screenshot({ path: '/tmp/causeway-narrow.png' });
});

/** A seeded random DAG (arrows from lower to higher index), positions on a grid. */
function largeDiagram(n: number, m: number) {
	let seed = 20240611;
	const next = () => (seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648;
	const seen = new Set<string>();
	const arrows: { from: string; to: string }[] = [];
	while (arrows.length < m) {
		const a = Math.floor(next() * n);
		const b = a + 1 + Math.floor(next() * 25);
		if (b >= n || seen.has(`${a},${b}`)) continue;
		seen.add(`${a},${b}`);
		arrows.push({ from: `v${a}`, to: `v${b}` });
	}
	return {
		format: 'causeway.diagram',
		version: 1,
		title: `Large test diagram (${n} variables)`,
		variables: Array.from({ length: n }, (_, i) => ({ id: `v${i}`, label: `Variable ${i}`, measured: i % 13 !== 0, x: (i % 20) * 190, y: Math.floor(i / 20) * 110 })),
		arrows,
		exposures: ['v100'],
		outcomes: ['v160'],
		adjusted: []
	};
}

test('300 variables: progress and cancel, then edits stay smooth while the worker lists the claims', async ({ page }) => {
	test.setTimeout(120_000);
	await openEmpty(page);
	const open = async (d: ReturnType<typeof largeDiagram>) =>
		page.locator('header.toolbar input[type=file]').setInputFiles({ name: 'large.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(d)) });

	// The worker's progress shows with a Cancel from the start of the run (the question's
	// results first, then the claims); cancelling stops it and Run again restarts it. Claims
	// take about a second here since their speed-up, so Cancel is pressed at once.
	await open(largeDiagram(300, 600));
	await expect(message(page)).toContainText('300 variables, 600 arrows', { timeout: 30_000 });
	const progress = page.getByTestId('analysis-progress');
	await progress.getByRole('button', { name: 'Cancel' }).click({ timeout: 10_000 });
	await expect(page.getByText('Analysis stopped')).toBeVisible();
	await page.getByRole('button', { name: 'Run again' }).click();
	await expect(verdict(page)).toBeVisible({ timeout: 30_000 });

	// Record the longest gap between animation frames while editing.
	await page.evaluate(() => {
		const w = window as unknown as { maxGap: number; last: number };
		w.maxGap = 0;
		w.last = performance.now();
		const tick = (t: number) => {
			w.maxGap = Math.max(w.maxGap, t - w.last);
			w.last = t;
			requestAnimationFrame(tick);
		};
		requestAnimationFrame(tick);
	});
	const target = (await page.evaluate(() => window.__causewayCanvas.nodeBox('v100')))!;
	await page.mouse.click(target.x + target.width / 2, target.y + target.height / 2);
	await expect(canvas(page)).toBeFocused();
	const timings: number[] = [];
	for (const key of ['h', 'h', 'Shift+ArrowRight', 'z', 'z', 'ArrowRight', 'h', 'h', 'x', 'x', 'ArrowLeft', 'Shift+ArrowDown', 'y', 'y', 'h', 'h']) {
		const started = Date.now();
		const before = await page.evaluate(() => window.__causewayCanvas.counts());
		await page.keyboard.press(key);
		await page.evaluate(() => new Promise((r) => requestAnimationFrame(() => requestAnimationFrame(r))));
		timings.push(Date.now() - started);
		expect(await page.evaluate(() => window.__causewayCanvas.counts())).toEqual(before);
	}
	const maxGap = await page.evaluate(() => (window as unknown as { maxGap: number }).maxGap);
	console.log(`300 variables / 600 arrows: key-to-frame ${timings.join(', ')} ms; longest frame gap ${maxGap.toFixed(0)} ms`);
	// No speed target here (that is `npm run bench`, section 5, on a quiet machine): only a
	// guard against a freeze, twenty times the slowest edit target of the benchmark (250 ms;
	// medians logged on a loaded CI machine were 150–200 ms), so a busy machine cannot break it.
	const median = [...timings].sort((a, b) => a - b)[timings.length >> 1];
	expect(median).toBeLessThan(5_000);

	// Eventually everything is listed.
	const listing = Date.now();
	await expect(page.locator('[data-section="claims"] h2')).toContainText(/\d+\+? claims/, { timeout: 60_000 });
	console.log(`claims listed ${Date.now() - listing} ms after the last edit`);

	// Tidy layout on demand, timed.
	const started = Date.now();
	await page.getByRole('button', { name: 'Tidy layout' }).click();
	await expect(message(page)).toContainText('Tidy layout');
	console.log(`tidy layout of 300 variables: ${Date.now() - started} ms`);
	expect((await counts(page)).variables).toBe(300);
});
