/**
 * The canvas's first view (src/lib/ui/canvas/StaticView.svelte): the page answers before
 * Cytoscape is loaded, and input given to the first view acts once the real canvas is there.
 * Cytoscape's chunk is held back by the test until it has acted on the first view.
 */
import { expect, test, type Page } from '@playwright/test';
import { announcer, canvas, verdict } from './helpers';
import { palette } from '../../src/lib/palette';

/** Holds the response of the chunk that contains Cytoscape until `release()`. */
async function holdCytoscape(page: Page) {
	let release: () => void = () => {};
	const released = new Promise<void>((r) => (release = r));
	let asked = false;
	await page.route('**/_app/immutable/chunks/*.js', async (route) => {
		const response = await route.fetch();
		const body = await response.text();
		if (body.includes('cytoscape')) {
			asked = true;
			await released;
		}
		await route.fulfill({ response, body });
	});
	return { release, asked: () => asked };
}

const marks = (page: Page, id: string) => page.evaluate((v) => window.__causewayCanvas.nodeClasses(v), id);
const firstView = (page: Page) => page.getByTestId('static-view');

test('a click on a variable of the first view selects it once the canvas has loaded', async ({ page }) => {
	const held = await holdCytoscape(page);
	await page.goto('/');
	await expect(verdict(page)).toBeVisible({ timeout: 20_000 });
	const age = firstView(page).locator('g[data-vid="age"]');
	await expect(age).toBeVisible();
	const box = (await age.boundingBox())!;
	await page.mouse.click(box.x + box.width / 2, box.y + box.height / 2);
	// The click asked for Cytoscape, which is held: the first view is still what is shown.
	await expect.poll(held.asked).toBe(true);
	await expect(firstView(page)).toBeVisible();
	expect(await page.evaluate(() => document.querySelectorAll('.canvas canvas').length)).toBe(0);
	held.release();
	await expect.poll(() => marks(page, 'age')).toContain('selected');
	await expect(firstView(page)).toHaveCount(0);
	await expect(announcer(page)).toContainText('Age');
});

test('keys act on the diagram before the canvas has loaded; its view follows', async ({ page }) => {
	const held = await holdCytoscape(page);
	await page.goto('/');
	await expect(verdict(page)).toBeVisible({ timeout: 20_000 });
	await canvas(page).focus();
	await page.keyboard.press('ArrowRight');
	await expect(announcer(page)).not.toHaveText('');
	const said = (await announcer(page).textContent())!;
	const label = said.split(':')[0];
	// The selection is drawn on the first view, the planned set changes with Z, the verdict follows.
	await expect(firstView(page).locator(`rect[stroke="${palette.selection}" i]`)).toHaveCount(1);
	const before = await verdict(page).textContent();
	await page.keyboard.press('z');
	await expect(verdict(page)).not.toHaveText(before!);
	expect(held.asked()).toBe(true);
	await expect(firstView(page)).toBeVisible();
	held.release();
	const id = await page.evaluate((l) => Array.from(document.querySelectorAll('.static-view g[data-vid]')).find((g) => g.textContent?.startsWith(l))?.getAttribute('data-vid') ?? null, label);
	expect(id).not.toBeNull();
	await expect.poll(() => marks(page, id!)).toContain('selected');
});

test('a double-click on the empty first view starts a new variable once the canvas has loaded', async ({ page }) => {
	await page.addInitScript(() => {
		if (sessionStorage.getItem('e2e-started')) return;
		sessionStorage.setItem('e2e-started', '1');
		localStorage.clear();
		localStorage.setItem('causeway.visited', '1');
	});
	const held = await holdCytoscape(page);
	await page.goto('/');
	await expect(page.getByText('An empty diagram.')).toBeVisible({ timeout: 20_000 });
	const c = (await canvas(page).boundingBox())!;
	await page.mouse.dblclick(c.x + 300, c.y + 200);
	await expect.poll(held.asked).toBe(true);
	held.release();
	const input = page.getByRole('textbox', { name: 'Name of the new variable' });
	await expect(input).toBeFocused();
	await input.fill('Sleep');
	await input.press('Enter');
	await expect.poll(() => page.evaluate(() => window.__causewayCanvas.counts().variables)).toBe(1);
});
