/** Files and persistence: demo on first visit, autosave and restore, open/save JSON and DOT, drag-and-drop, new diagram. */
import { test, expect } from '@playwright/test';
import { readFileSync } from 'node:fs';
import { counts, message, openEmpty, verdict, watchPage } from './helpers';

const DOT_WITHOUT_POSITIONS = `digraph study {
  age [label="Age"];
  cycling [label="Cycles to work", role=exposure];
  bp [label="Hypertension", role=outcome];
  fitness [label="Fitness"];
  age -> cycling; age -> bp; cycling -> fitness; fitness -> bp; cycling -> bp;
}
`;

test('first visit shows the demo study; later visits restore the autosaved diagram', async ({ page, baseURL }) => {
	const problems = watchPage(page, baseURL!);
	await page.goto('/');
	await expect(page.getByRole('textbox', { name: 'Diagram title' })).toHaveValue('Cycling to work and hypertension (demo study)');
	// The demo's planned set {age, income, diet} is sufficient (its own documented design).
	await expect(verdict(page)).toContainText('Adjusting for Age, Diet quality and Household income is sufficient');
	expect((await counts(page)).variables).toBe(13);

	// Edit, reload at once: the edit is still there (saved when the page is hidden).
	await page.getByRole('button', { name: 'Text view' }).click();
	await page.getByLabel('New variable').fill('Air pollution');
	await page.keyboard.press('Enter');
	await expect(page.getByRole('heading', { name: 'Variables (14)' })).toBeVisible();
	await page.reload();
	await expect(message(page)).toContainText('Your diagram from the last session is back');
	expect((await counts(page)).variables).toBe(14);

	// Not a first visit any more: a new empty diagram stays empty after a reload.
	await page.getByRole('button', { name: 'New…' }).click();
	const dialog = page.getByRole('dialog', { name: 'Start a new diagram?' });
	await expect(dialog).toBeVisible();
	await dialog.getByRole('button', { name: 'Cancel' }).click();
	expect((await counts(page)).variables).toBe(14);
	await page.getByRole('button', { name: 'New…' }).click();
	await dialog.getByRole('button', { name: 'Start an empty diagram' }).click();
	expect((await counts(page)).variables).toBe(0);
	await page.waitForTimeout(500);
	await page.reload();
	await expect(page.getByText('An empty diagram.')).toBeVisible();
	// Undo brings the replaced diagram back (within a session).
	await page.getByRole('button', { name: 'New…' }).click();
	await page.getByRole('dialog').getByRole('button', { name: 'Open the demo study' }).click();
	expect((await counts(page)).variables).toBe(13);
	await page.keyboard.press('Control+z');
	expect((await counts(page)).variables).toBe(0);
	expect(problems).toEqual([]);
});

test('open a DOT file without positions: tidy layout, question read from the file', async ({ page }) => {
	await openEmpty(page);
	await page.locator('header.toolbar input[type=file]').setInputFiles({ name: 'study.dot', mimeType: 'text/vnd.graphviz', buffer: Buffer.from(DOT_WITHOUT_POSITIONS) });
	await expect(message(page)).toContainText('Opened study.dot: 4 variables, 5 arrows');
	// Minimal set {Age} (the mediator example, Schisterman et al. 2009).
	await expect(page.getByRole('button', { name: 'Plan {Age}' })).toBeVisible();
	// Every variable got a place of its own, arranged top to bottom along the arrows.
	const boxes = await page.evaluate(() => ['age', 'cycling', 'fitness', 'bp'].map((id) => window.__causewayCanvas.nodeBox(id)!));
	for (let i = 0; i < boxes.length; i++)
		for (let j = i + 1; j < boxes.length; j++) {
			const [a, b] = [boxes[i], boxes[j]];
			const apart = a.x + a.width <= b.x || b.x + b.width <= a.x || a.y + a.height <= b.y || b.y + b.height <= a.y;
			expect(apart).toBe(true);
		}
	expect(boxes[0].y).toBeLessThan(boxes[1].y);
	expect(boxes[1].y).toBeLessThan(boxes[2].y);
	expect(boxes[2].y).toBeLessThan(boxes[3].y);
});

test('save as JSON and DOT, open the saved file again, drag-and-drop, and a bad file changes nothing', async ({ page }) => {
	await page.goto('/');
	await expect(verdict(page)).toBeVisible();

	const [json] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Save', exact: true }).click()]);
	expect(json.suggestedFilename()).toBe('cycling-to-work-and-hypertension-demo-study.causeway.json');
	const saved = JSON.parse(readFileSync((await json.path())!, 'utf8'));
	const demo = JSON.parse(readFileSync('static/demo/cycling-hypertension.causeway.json', 'utf8'));
	expect(saved).toEqual(demo);

	const [dot] = await Promise.all([page.waitForEvent('download'), page.keyboard.press('Control+Shift+s')]);
	expect(dot.suggestedFilename()).toBe('cycling-to-work-and-hypertension-demo-study.dot');
	const dotText = readFileSync((await dot.path())!, 'utf8');
	expect(dotText).toContain('digraph');
	expect(dotText).toContain('age -> cycling;');

	// Start afresh, then drop the saved DOT file on the window.
	await page.getByRole('button', { name: 'New…' }).click();
	await page.getByRole('dialog').getByRole('button', { name: 'Start an empty diagram' }).click();
	const transfer = await page.evaluateHandle((text) => {
		const dt = new DataTransfer();
		dt.items.add(new File([text], 'saved.dot', { type: 'text/plain' }));
		return dt;
	}, dotText);
	await page.dispatchEvent('.canvas-area', 'dragover', { dataTransfer: transfer });
	await expect(page.getByText('Drop a Causeway JSON or DOT file to open it')).toBeVisible();
	await page.dispatchEvent('.canvas-area', 'drop', { dataTransfer: transfer });
	await expect(message(page)).toContainText('Opened saved.dot: 13 variables, 21 arrows');
	await expect(verdict(page)).toContainText('Adjusting for Age, Diet quality and Household income is sufficient');

	// A broken file: one line naming the place, and the diagram as it was.
	await page.locator('header.toolbar input[type=file]').setInputFiles({ name: 'broken.json', mimeType: 'application/json', buffer: Buffer.from('{\n  "format": "causeway.diagram",\n  "version": 1,\n  "variables": [ { "id": "a" }, ]\n}\n') });
	await expect(message(page)).toContainText('Not opened — broken.json: Invalid JSON at line 4');
	expect((await counts(page)).variables).toBe(13);

	// The native file saved earlier opens back to the same diagram.
	await page.locator('header.toolbar input[type=file]').setInputFiles((await json.path())!);
	await expect(message(page)).toContainText('13 variables, 21 arrows');
});
