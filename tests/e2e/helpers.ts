/**
 * Helpers for driving the app as a user would: mouse on the canvas, keyboard, menus.
 * Canvas geometry is read from the app's read-only `window.__causewayCanvas` view, since
 * the diagram is drawn on a <canvas> element.
 */
import { expect, type Page } from '@playwright/test';

interface Box {
	x: number;
	y: number;
	width: number;
	height: number;
}

declare global {
	interface Window {
		__causewayCanvas: {
			nodeBox(id: string): Box | null;
			arrowMidpoint(from: string, to: string): { x: number; y: number } | null;
			nodeClasses(id: string): string[];
			arrowClasses(from: string, to: string): string[];
			counts(): { variables: number; arrows: number };
			zoom(): number;
		};
	}
}

/** First visit (nothing stored): the app opens the demo study diagram, 13 variables. */
export async function openDemo(page: Page): Promise<void> {
	await page.addInitScript(() => {
		if (sessionStorage.getItem('e2e-started')) return;
		sessionStorage.setItem('e2e-started', '1');
		localStorage.clear();
	});
	await page.goto('/');
	await expect.poll(async () => (await page.evaluate(() => !!window.__causewayCanvas)) && (await counts(page)).variables, { timeout: 20_000 }).toBe(13);
}

/** The Data section. */
export const dataSection = (page: Page) => page.locator('section[data-section="data"]');

/** Opens the Data section and loads the demo data; waits for the estimates. */
export async function loadDemoData(page: Page): Promise<void> {
	await openSection(page, 'data');
	await dataSection(page).getByRole('button', { name: 'Load demo data' }).click();
	await expect(dataSection(page).getByTestId('data-source')).toContainText('5,000 rows, 12 columns', { timeout: 20_000 });
	await expect(dataSection(page).getByTestId('estimates-table')).toBeVisible({ timeout: 20_000 });
}

/** Opens the app with an empty diagram (not a first visit, nothing autosaved). */
export async function openEmpty(page: Page): Promise<void> {
	// Before the app's own scripts, once per tab: later reloads keep what the app autosaved.
	await page.addInitScript(() => {
		if (sessionStorage.getItem('e2e-started')) return;
		sessionStorage.setItem('e2e-started', '1');
		localStorage.clear();
		localStorage.setItem('causeway.visited', '1');
	});
	await page.goto('/');
	await expect(page.getByText('An empty diagram.')).toBeVisible();
}

export const canvas = (page: Page) => page.getByRole('application', { name: 'Diagram canvas' });

export async function counts(page: Page) {
	return page.evaluate(() => window.__causewayCanvas.counts());
}

export async function nodeCentre(page: Page, id: string) {
	const box = await page.evaluate((v) => window.__causewayCanvas.nodeBox(v), id);
	if (!box) throw new Error(`no variable ${id} on the canvas`);
	return { x: box.x + box.width / 2, y: box.y + box.height / 2 };
}

/** Double-clicks the canvas at a point relative to its top-left corner and names the variable. */
export async function addVariableByMouse(page: Page, label: string, at: { x: number; y: number }) {
	const box = (await canvas(page).boundingBox())!;
	await page.mouse.dblclick(box.x + at.x, box.y + at.y);
	const input = page.getByRole('textbox', { name: 'Name of the new variable' });
	await expect(input).toBeFocused();
	await input.fill(label);
	await input.press('Enter');
	await expect(input).toHaveCount(0);
}

/** Drags from the arrow handle of one variable to another. */
export async function drawArrowByMouse(page: Page, from: string, to: string) {
	const a = await nodeCentre(page, from);
	await page.mouse.move(a.x, a.y);
	const handle = page.locator('.arrow-handle');
	await expect(handle).toBeVisible();
	const h = (await handle.boundingBox())!;
	await page.mouse.move(h.x + h.width / 2, h.y + h.height / 2);
	await page.mouse.down();
	const b = await nodeCentre(page, to);
	await page.mouse.move((h.x + b.x) / 2, (h.y + b.y) / 2, { steps: 5 });
	await page.mouse.move(b.x, b.y, { steps: 5 });
	await page.mouse.up();
}

/** Right-clicks a variable and chooses a menu item. */
export async function variableMenu(page: Page, id: string, item: string | RegExp) {
	const c = await nodeCentre(page, id);
	await page.mouse.click(c.x, c.y, { button: 'right' });
	await page.getByRole('menu').getByRole(typeof item === 'string' ? 'menuitemcheckbox' : 'menuitem', { name: item }).or(page.getByRole('menu').getByRole('menuitem', { name: item })).first().click();
	await expect(page.getByRole('menu')).toHaveCount(0);
}

/** The text the canvas announces for screen readers (the selection, targets). */
export const announcer = (page: Page) => page.getByTestId('canvas-announcer');

/** With the canvas focused, moves the keyboard selection along a row until `label` is selected. */
export async function selectByKeyboard(page: Page, label: string) {
	for (let i = 0; i < 12; i++) await page.keyboard.press('ArrowLeft');
	for (let i = 0; i < 12; i++) {
		if ((await announcer(page).textContent())?.startsWith(`${label}:`)) return;
		await page.keyboard.press('ArrowRight');
	}
	throw new Error(`could not select ${label} with the keyboard`);
}

/** Keyboard arrow drawing: > on the selected variable, arrow keys to the target, Enter. */
export async function drawArrowByKeyboard(page: Page, from: string, to: string) {
	await selectByKeyboard(page, from);
	await page.keyboard.press('>');
	const banner = page.locator('.connect-banner');
	await expect(banner).toBeVisible();
	for (const key of ['ArrowLeft', 'ArrowRight']) {
		for (let i = 0; i < 12; i++) {
			if ((await banner.textContent())?.includes(`to ${to}`)) {
				await page.keyboard.press('Enter');
				await expect(banner).toHaveCount(0);
				return;
			}
			await page.keyboard.press(key);
		}
	}
	throw new Error(`could not reach ${to} with the keyboard`);
}

export const adjustment = (page: Page) => page.locator('[data-section="adjustment"]');
export const verdict = (page: Page) => page.getByTestId('verdict');
export const message = (page: Page) => page.getByTestId('message');

/** Undo with Ctrl+Z until nothing is left to undo. */
export async function undoAll(page: Page) {
	const undo = page.getByRole('button', { name: 'Undo' });
	for (let i = 0; i < 200 && (await undo.isEnabled()); i++) await page.keyboard.press('Control+z');
	await expect(undo).toBeDisabled();
}

/** Fails the test on page errors, console errors and requests to other origins. */
export function watchPage(page: Page, baseURL: string) {
	const problems: string[] = [];
	page.on('console', (m) => {
		if (m.type() === 'error') problems.push(m.text());
	});
	page.on('pageerror', (e) => problems.push(e.message));
	page.on('request', (req) => {
		const url = new URL(req.url());
		if (!['data:', 'blob:'].includes(url.protocol) && url.origin !== new URL(baseURL).origin) problems.push(`request to ${req.url()}`);
	});
	return problems;
}

/**
 * Opens a section of the analysis column. Data, Review and Report start closed and load
 * their code when first opened; this waits until the loaded section is shown open.
 */
export async function openSection(page: Page, id: 'question' | 'adjustment' | 'paths' | 'claims' | 'review' | 'data' | 'report') {
	const button = page.locator(`#${id}-heading button`);
	if ((await button.getAttribute('aria-expanded')) !== 'true') await button.click();
	await expect(page.locator(`section[data-section="${id}"] .loading`)).toHaveCount(0, { timeout: 60_000 });
	await expect(page.locator(`#${id}-heading button`)).toHaveAttribute('aria-expanded', 'true');
}
