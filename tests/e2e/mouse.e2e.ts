/**
 * Building diagrams with the mouse. M-bias (Greenland, Epidemiology 2003): exposure and
 * outcome each have a cause, and both causes affect a pre-exposure variable M. The empty set
 * is sufficient; adjusting for M alone opens the path X ← A → M ← B → Y. Told in the demo
 * scenario: A = health consciousness, B = family history, M = sports-club membership.
 */
import { test, expect } from '@playwright/test';
import { addVariableByMouse, adjustment, canvas, counts, drawArrowByMouse, message, openEmpty, undoAll, variableMenu, verdict, watchPage } from './helpers';

test('M-bias built by mouse: sets, verdict, reasons, then undo everything', async ({ page, baseURL }) => {
	const problems = watchPage(page, baseURL!);
	await openEmpty(page);

	await addVariableByMouse(page, 'Health consciousness', { x: 160, y: 140 });
	await addVariableByMouse(page, 'Family history', { x: 640, y: 140 });
	await addVariableByMouse(page, 'Sports-club membership', { x: 400, y: 290 });
	await addVariableByMouse(page, 'Cycling', { x: 160, y: 460 });
	await addVariableByMouse(page, 'Hypertension', { x: 640, y: 460 });
	expect((await counts(page)).variables).toBe(5);

	await drawArrowByMouse(page, 'health_consciousness', 'cycling');
	await drawArrowByMouse(page, 'health_consciousness', 'sports_club_membership');
	await drawArrowByMouse(page, 'family_history', 'sports_club_membership');
	await drawArrowByMouse(page, 'family_history', 'hypertension');
	await drawArrowByMouse(page, 'cycling', 'hypertension');
	expect((await counts(page)).arrows).toBe(5);

	await variableMenu(page, 'cycling', 'Exposure');
	await variableMenu(page, 'hypertension', 'Outcome');

	const adj = adjustment(page);
	// The empty set is the only minimal sufficient set (Greenland 2003).
	await expect(adj.getByRole('list', { name: /Minimal sufficient adjustment sets for the total effect/ }).getByRole('listitem')).toHaveCount(1);
	await expect(adj.getByRole('button', { name: 'Plan { }: adjust for nothing' })).toBeVisible();
	await expect(verdict(page)).toContainText('No adjustment is needed');
	await expect(page.locator('[data-section="paths"]')).toContainText('Cycling ← Health consciousness → Sports-club membership ← Family history → Hypertension');

	// Badges on the canvas, as text.
	const text = async (id: string) => page.evaluate((v) => window.__causewayCanvas.nodeClasses(v), id);
	expect(await text('cycling')).toContain('exposure');

	// Adjusting for the collider alone opens the non-causal path.
	await variableMenu(page, 'sports_club_membership', 'In the planned set');
	await expect(verdict(page)).toContainText('Adjusting for Sports-club membership is not sufficient: a non-causal path stays open.');
	// The Paths section gives the verdict's count, in the same words (one engine search feeds both).
	await expect(page.locator('[data-section="paths"]')).toContainText('1 open non-causal path under the planned set.');
	await expect(page.locator('[data-section="paths"]')).not.toContainText('biasing');
	const reason = adj.getByRole('button', { name: /A non-causal path stays open: Cycling ← Health consciousness → Sports-club membership ← Family history → Hypertension/ });
	await reason.click();
	await expect(reason).toHaveAttribute('aria-pressed', 'true');
	const lit = await page.evaluate(() => window.__causewayCanvas.arrowClasses('health_consciousness', 'sports_club_membership'));
	expect(lit).toContain('hl-open');
	expect(await page.evaluate(() => window.__causewayCanvas.arrowClasses('cycling', 'hypertension'))).toContain('faded');

	// Adding either parent of the collider closes it again.
	await variableMenu(page, 'health_consciousness', 'In the planned set');
	await expect(verdict(page)).toContainText('is sufficient');

	// Clicking a minimal set makes it the planned set.
	await adj.getByRole('button', { name: 'Plan { }: adjust for nothing' }).click();
	await expect(verdict(page)).toContainText('No adjustment is needed');

	// Paths: hovering one lights it on the canvas.
	const path = page.locator('[data-section="paths"] button.path', { hasText: 'Cycling → Hypertension' }).first();
	await path.hover();
	expect(await page.evaluate(() => window.__causewayCanvas.arrowClasses('cycling', 'hypertension'))).toContain('hl-causal');

	// Reverse and delete an arrow from its menu.
	const mid = (await page.evaluate(() => window.__causewayCanvas.arrowMidpoint('family_history', 'hypertension')))!;
	await page.mouse.click(mid.x, mid.y, { button: 'right' });
	await page.getByRole('menuitem', { name: 'Reverse arrow' }).click();
	expect(await page.evaluate(() => window.__causewayCanvas.arrowMidpoint('hypertension', 'family_history'))).not.toBeNull();
	const mid2 = (await page.evaluate(() => window.__causewayCanvas.arrowMidpoint('hypertension', 'family_history')))!;
	await page.mouse.click(mid2.x, mid2.y);
	await expect(canvas(page)).toBeFocused();
	await page.keyboard.press('Delete');
	await expect(message(page)).toContainText('Delete arrow Hypertension → Family history');
	expect((await counts(page)).arrows).toBe(4);

	// Drag a variable: one undoable move.
	const before = await page.evaluate(() => window.__causewayCanvas.nodeBox('cycling'));
	await page.mouse.move(before!.x + 10, before!.y + 10);
	await page.mouse.down();
	await page.mouse.move(before!.x + 60, before!.y + 80, { steps: 6 });
	await page.mouse.up();
	await expect(message(page)).toContainText('Move Cycling');

	await undoAll(page);
	expect(await counts(page)).toEqual({ variables: 0, arrows: 0 });
	// Redo everything back.
	const redo = page.getByRole('button', { name: 'Redo' });
	while (await redo.isEnabled()) await page.keyboard.press('Control+Shift+z');
	expect(await counts(page)).toEqual({ variables: 5, arrows: 4 });
	expect(problems).toEqual([]);
});

test('an arrow that would close a cycle is refused on the spot, naming the cycle', async ({ page }) => {
	await openEmpty(page);
	await addVariableByMouse(page, 'Diet', { x: 150, y: 200 });
	await addVariableByMouse(page, 'Weight', { x: 450, y: 200 });
	await addVariableByMouse(page, 'Blood pressure', { x: 300, y: 420 });
	await drawArrowByMouse(page, 'diet', 'weight');
	await drawArrowByMouse(page, 'weight', 'blood_pressure');
	await drawArrowByMouse(page, 'blood_pressure', 'diet');
	await expect(message(page)).toContainText('Arrow Blood pressure → Diet refused: it would close the cycle Blood pressure → Diet → Weight → Blood pressure.');
	expect((await counts(page)).arrows).toBe(2);
	expect(await page.evaluate(() => window.__causewayCanvas.arrowClasses('diet', 'weight'))).toContain('hl-cycle');
	// The refusal is not an edit: undo removes the last real arrow.
	await page.keyboard.press('Control+z');
	expect((await counts(page)).arrows).toBe(1);
});

test('selection by mouse: click, Shift+click, Shift+drag a box; dragging one of several selected variables moves them all', async ({ page }) => {
	await page.goto('/');
	await expect(verdict(page)).toBeVisible();
	const marks = (id: string) => page.evaluate((v) => window.__causewayCanvas.nodeClasses(v), id);
	const centre = async (id: string) => {
		const b = (await page.evaluate((v) => window.__causewayCanvas.nodeBox(v), id))!;
		return { x: b.x + b.width / 2, y: b.y + b.height / 2 };
	};
	const click = async (id: string, modifiers: ('Shift' | 'Control')[] = []) => {
		const c = await centre(id);
		for (const m of modifiers) await page.keyboard.down(m);
		await page.mouse.click(c.x, c.y);
		for (const m of modifiers) await page.keyboard.up(m);
		await page.waitForTimeout(400); // two clicks in a row would be a double click (rename)
	};

	await click('age');
	expect(await marks('age')).toContain('selected');
	await click('income', ['Shift']);
	expect(await marks('age')).toContain('selected');
	expect(await marks('income')).toContain('selected');
	await click('income', ['Control']);
	expect(await marks('income')).not.toContain('selected');
	await click('income', ['Shift']);

	// Dragging Age moves Household income by the same amount, in one undoable step.
	const [a0, i0] = [await centre('age'), await centre('income')];
	await page.mouse.move(a0.x, a0.y);
	await page.mouse.down();
	await page.mouse.move(a0.x + 30, a0.y + 40, { steps: 6 });
	await page.mouse.up();
	await expect(message(page)).toContainText('Move 2 variables');
	const [a1, i1] = [await centre('age'), await centre('income')];
	expect(Math.round(a1.x - a0.x)).toBe(Math.round(i1.x - i0.x));
	expect(Math.round(a1.y - a0.y)).toBe(Math.round(i1.y - i0.y));
	expect(Math.abs(a1.y - a0.y)).toBeGreaterThan(20);

	// A click on the background clears the selection; Shift+drag draws a selection box.
	const area = (await canvas(page).boundingBox())!;
	await page.mouse.click(area.x + 8, area.y + area.height - 60);
	await page.waitForTimeout(400);
	expect(await marks('age')).not.toContain('selected');
	const lo = { x: Math.min(a1.x, i1.x) - 70, y: Math.min(a1.y, i1.y) - 30 };
	const hi = { x: Math.max(a1.x, i1.x) + 70, y: Math.max(a1.y, i1.y) + 30 };
	await page.keyboard.down('Shift');
	await page.mouse.move(lo.x, lo.y);
	await page.mouse.down();
	await page.mouse.move(hi.x, hi.y, { steps: 8 });
	await page.mouse.up();
	await page.keyboard.up('Shift');
	await expect.poll(() => marks('income')).toContain('selected');
	expect(await marks('age')).toContain('selected');
	expect(await marks('cycling')).not.toContain('selected');
});
