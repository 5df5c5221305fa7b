/**
 * Keyboard-only operation. The mediator example (overadjustment; Schisterman, Cole & Platt,
 * Epidemiology 2009): age confounds cycling and hypertension, fitness mediates. {Age} is the
 * only minimal sufficient set for the total effect; adding the mediator makes the planned set
 * fail, for the reason that fitness is a mediator.
 */
import { test, expect, type Page } from '@playwright/test';
import { adjustment, announcer, canvas, counts, drawArrowByKeyboard, message, nodeCentre, openDemo, openEmpty, selectByKeyboard, undoAll, verdict } from './helpers';

async function tabToCanvas(page: Page) {
	for (let i = 0; i < 40; i++) {
		if (await canvas(page).evaluate((el) => el === document.activeElement)) return;
		await page.keyboard.press('Tab');
	}
	throw new Error('the canvas is not reachable with Tab');
}

async function addByKeyboard(page: Page, label: string) {
	await page.keyboard.press('v');
	const input = page.getByRole('textbox', { name: 'Name of the new variable' });
	await expect(input).toBeFocused();
	await page.keyboard.type(label);
	await page.keyboard.press('Enter');
	await expect(canvas(page)).toBeFocused();
}

test('mediator example built with the keyboard alone: question, sets, verdict, undo and redo', async ({ page }) => {
	await openEmpty(page);
	await tabToCanvas(page);
	// The focus ring is visible on the canvas.
	expect(await canvas(page).evaluate((el) => getComputedStyle(el).outlineStyle)).toBe('solid');

	for (const label of ['Age', 'Cycling', 'Fitness', 'Hypertension']) await addByKeyboard(page, label);
	expect((await counts(page)).variables).toBe(4);

	await drawArrowByKeyboard(page, 'Age', 'Cycling');
	await drawArrowByKeyboard(page, 'Age', 'Hypertension');
	await drawArrowByKeyboard(page, 'Cycling', 'Fitness');
	await drawArrowByKeyboard(page, 'Fitness', 'Hypertension');
	await drawArrowByKeyboard(page, 'Cycling', 'Hypertension');
	expect((await counts(page)).arrows).toBe(5);

	await selectByKeyboard(page, 'Cycling');
	await page.keyboard.press('x');
	await selectByKeyboard(page, 'Hypertension');
	await page.keyboard.press('y');
	await selectByKeyboard(page, 'Age');
	await page.keyboard.press('z');
	await expect(verdict(page)).toContainText('Adjusting for Age is sufficient');

	// The mediator in the planned set: refused as a valid set, with the reason.
	await selectByKeyboard(page, 'Fitness');
	await expect(announcer(page)).toContainText('mediator');
	await page.keyboard.press('z');
	await expect(verdict(page)).toContainText('Adjusting for Age and Fitness is not sufficient: one variable should not be adjusted for.');
	await expect(adjustment(page).getByRole('button', { name: /Fitness is a mediator/ })).toBeVisible();
	const sets = adjustment(page).getByRole('list', { name: /total effect/ });
	await expect(sets.getByRole('listitem')).toHaveCount(1);
	const plan = sets.getByRole('button', { name: 'Plan {Age}' });
	await plan.focus();
	await page.keyboard.press('Enter');
	await expect(verdict(page)).toContainText('Adjusting for Age is sufficient');

	// Direct-effect sets on the toggle (single-door criterion: {Age, Fitness}... fitness is the mediator; {Age} plus blocking the mediator).
	await page.getByRole('checkbox', { name: 'Show sets for the direct effect' }).check();
	await expect(adjustment(page).getByRole('list', { name: /direct effect/ })).toContainText('{Age, Fitness}');

	// Menu by keyboard: Shift+F10 on the selected variable, arrow keys, Enter.
	await canvas(page).focus();
	await selectByKeyboard(page, 'Age');
	await page.keyboard.press('Shift+F10');
	const menu = page.getByRole('menu', { name: 'Age' });
	await expect(menu).toBeVisible();
	await expect(menu.getByRole('menuitem', { name: 'Rename' })).toBeFocused();
	for (let i = 0; i < 4; i++) await page.keyboard.press('ArrowDown');
	await expect(menu.getByRole('menuitemcheckbox', { name: 'Unmeasured' })).toBeFocused();
	await page.keyboard.press('Enter');
	await expect(adjustment(page)).toContainText('No set of measured variables is sufficient for the total effect');
	await canvas(page).focus();
	await selectByKeyboard(page, 'Age');
	await page.keyboard.press('h');
	await expect(verdict(page)).toBeVisible();

	// Rename in place, step to an arrow with ], reverse it, delete it.
	await page.keyboard.press('F2');
	const rename = page.getByRole('textbox', { name: 'New name for Age' });
	await expect(rename).toBeFocused();
	await rename.fill('Age at enrolment');
	await page.keyboard.press('Enter');
	await expect(message(page)).toContainText('Rename Age to Age at enrolment');
	await page.keyboard.press(']');
	await expect(announcer(page)).toContainText('Arrow Age at enrolment → Cycling');
	await page.keyboard.press('r');
	await expect(message(page)).toContainText('Reverse arrow Age at enrolment → Cycling');
	await page.keyboard.press('Delete');
	await expect(message(page)).toContainText('Delete arrow Cycling → Age at enrolment');
	expect((await counts(page)).arrows).toBe(4);

	// Move a variable with Shift+arrows: held keys make one undo step.
	await selectByKeyboard(page, 'Fitness');
	for (let i = 0; i < 4; i++) await page.keyboard.press('Shift+ArrowDown');
	await page.keyboard.press('Control+z');
	await expect(message(page)).toContainText('Undone: Move Fitness');

	const end = await counts(page);
	await undoAll(page);
	expect(await counts(page)).toEqual({ variables: 0, arrows: 0 });
	for (let i = 0; i < 100 && (await page.getByRole('button', { name: 'Redo' }).isEnabled()); i++) await page.keyboard.press('Control+Shift+z');
	expect(await counts(page)).toEqual({ ...end, arrows: 4 });
});

test('the text view lists the diagram and edits it', async ({ page }) => {
	await openEmpty(page);
	await page.getByRole('button', { name: 'Text view' }).click();
	const view = page.getByRole('region', { name: 'Text view of the diagram' });
	await view.getByLabel('New variable').fill('Distance to work');
	await page.keyboard.press('Enter');
	await view.getByLabel('New variable').fill('Cycling');
	await page.keyboard.press('Enter');
	await view.getByLabel('From', { exact: true }).selectOption({ label: 'Distance to work' });
	await view.getByLabel('to', { exact: true }).selectOption({ label: 'Cycling' });
	await view.getByRole('button', { name: 'Add arrow' }).click();
	await expect(view.getByRole('heading', { name: 'Arrows (1)' })).toBeVisible();
	await expect(view).toContainText('Distance to work → Cycling');
	await view.getByRole('button', { name: 'Reverse Distance to work → Cycling' }).click();
	await expect(view).toContainText('Cycling → Distance to work');
	await view.getByRole('button', { name: 'Delete Cycling', exact: true }).click();
	await expect(view.getByRole('heading', { name: 'Variables (1)' })).toBeVisible();
	await expect(view.getByRole('heading', { name: 'Arrows (0)' })).toBeVisible();
	// The canvas behind is out of the tab order while the text view is shown.
	expect(await page.locator('.canvas-host').getAttribute('inert')).not.toBeNull();
});

test('the keys dialog and the context menus show the keys of the actions table', async ({ page }) => {
	await openDemo(page);
	await canvas(page).focus();
	await page.keyboard.press('?');
	const dialog = page.getByRole('dialog', { name: 'Keyboard' });
	await expect(dialog).toBeVisible();
	const row = (words: string) => dialog.locator('tr', { hasText: words });
	await expect(row('exposure on or off').locator('kbd')).toHaveText('X');
	await expect(row('outcome on or off').locator('kbd')).toHaveText('Y');
	await expect(row('in or out of the planned set').locator('kbd')).toHaveText('Z');
	await expect(row('unmeasured (hidden) on or off').locator('kbd')).toHaveText('H');
	await expect(row('add a variable').locator('kbd')).toHaveText('V or Insert');
	await expect(row('draw an arrow from the selected variable').locator('kbd')).toHaveText('>');
	await dialog.evaluate((el) => (el.scrollTop = 0));
	await dialog.screenshot({ path: 'test-results/keys-dialog.png' });
	await page.keyboard.press('Escape');
	await expect(dialog).toBeHidden();

	const c = await nodeCentre(page, 'cycling');
	await page.mouse.click(c.x, c.y, { button: 'right' });
	const menu = page.getByRole('menu', { name: 'Commutes by bicycle' });
	await expect(menu.getByRole('menuitemcheckbox', { name: 'Exposure' }).locator('kbd')).toHaveText('X');
	await expect(menu.getByRole('menuitemcheckbox', { name: 'In the planned set' }).locator('kbd')).toHaveText('Z');
	await menu.screenshot({ path: 'test-results/variable-menu.png' });
	await page.keyboard.press('Escape');
	// The background's menu, from the keyboard with nothing selected.
	await canvas(page).focus();
	await page.keyboard.press('Escape');
	await page.keyboard.press('Shift+F10');
	const background = page.getByRole('menu', { name: 'Diagram' });
	await expect(background.getByRole('menuitem', { name: 'Add a variable here' }).locator('kbd')).toHaveText('V');
	await expect(background.getByRole('menuitem', { name: 'Tidy layout' }).locator('kbd')).toHaveText('L');
	await background.screenshot({ path: 'test-results/background-menu.png' });
	await page.keyboard.press('Escape');
	await page.mouse.click(c.x, c.y);
	// The same key as the menu item: H on the selected variable marks it unmeasured.
	await canvas(page).focus();
	await page.keyboard.press('h');
	await expect(announcer(page)).toContainText('Commutes by bicycle:');
	await expect(message(page)).toContainText('unmeasured');
});
