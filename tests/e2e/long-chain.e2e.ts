/**
 * A 1,000-variable chain without positions (as a DOT file or hand-written JSON gives it) opens
 * laid out and drawn: before the layered layout (src/lib/layout/tidy.ts) dagre overflowed the
 * layout worker's stack on it. No timing is asserted; the waits are "did not freeze" guards of
 * 90 s, over ten times the few seconds the app takes on a loaded two-core machine.
 */
import { test, expect } from '@playwright/test';
import { counts, message, nodeCentre, openEmpty } from './helpers';

const N = 1_000;
const chain = {
	format: 'causeway.diagram',
	version: 2,
	title: `A chain of ${N} variables`,
	variables: Array.from({ length: N }, (_, i) => ({ id: `v${i}`, label: `Variable ${i}`, measured: true })),
	arrows: Array.from({ length: N - 1 }, (_, i) => ({ from: `v${i}`, to: `v${i + 1}` })),
	exposures: [],
	outcomes: [],
	adjusted: []
};

test('a 1,000-variable chain without positions is laid out and drawn, and Tidy layout works on it', async ({ page }) => {
	test.setTimeout(300_000);
	const errors: string[] = [];
	page.on('pageerror', (e) => errors.push(e.message));
	await openEmpty(page);
	await page.locator('header.toolbar input[type=file]').setInputFiles({ name: 'chain.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(chain)) });
	await expect(message(page)).toContainText('1,000 variables, 999 arrows', { timeout: 90_000 });
	await expect.poll(() => counts(page), { timeout: 90_000 }).toEqual({ variables: N, arrows: N - 1 });
	// Laid out along the arrows: the chain runs down the page.
	const [first, middle, last] = [await nodeCentre(page, 'v0'), await nodeCentre(page, 'v500'), await nodeCentre(page, `v${N - 1}`)];
	expect(first.y).toBeLessThan(middle.y);
	expect(middle.y).toBeLessThan(last.y);

	await page.getByRole('button', { name: 'Tidy layout' }).click();
	await expect(page.getByRole('button', { name: 'Tidy layout' })).toBeEnabled({ timeout: 90_000 });
	await expect(message(page)).not.toContainText(/could not|failed|error/i);
	expect(await counts(page)).toEqual({ variables: N, arrows: N - 1 });
	expect(errors).toEqual([]);
});

test('a diagram too large to fit at the smallest zoom opens on its top-left corner', async ({ page }) => {
	test.setTimeout(300_000);
	// 1,000 variables on a grid of 40 columns, 170 px apart: 6,800 px wide, more than the canvas
	// holds at the smallest zoom. The clamped fit used to leave its top-left corner mid-screen.
	const cols = 40;
	const grid = {
		...chain,
		title: 'A grid of 1,000 variables',
		variables: chain.variables.map((v, i) => ({ ...v, x: (i % cols) * 170, y: Math.floor(i / cols) * 110 }))
	};
	await openEmpty(page);
	await page.locator('header.toolbar input[type=file]').setInputFiles({ name: 'grid.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(grid)) });
	await expect.poll(() => counts(page), { timeout: 90_000 }).toEqual({ variables: N, arrows: N - 1 });
	await page.getByRole('button', { name: 'Fit' }).click();
	const canvasBox = (await page.getByRole('application', { name: 'Diagram canvas' }).boundingBox())!;
	const first = await nodeCentre(page, 'v0');
	expect(first.x).toBeGreaterThan(canvasBox.x);
	expect(first.x).toBeLessThan(canvasBox.x + canvasBox.width / 4);
	expect(first.y).toBeGreaterThan(canvasBox.y);
	expect(first.y).toBeLessThan(canvasBox.y + canvasBox.height / 4);
});
