/**
 * The Review section in real Chromium: a stated set judged with every reason (lit on the
 * canvas), fixes, the stress test (hover, click and keyboard light up the change), the
 * comparison with a second diagram side by side, and a 200-variable stress test in the worker
 * with progress while the page stays usable. Screenshots go to test-results/review-*.png.
 */
import { test, expect, type Page } from '@playwright/test';
import { readFileSync } from 'node:fs';
import { adjustmentSets } from '../../src/lib/causal/analysis';
import { message, openSection, variableMenu, verdict } from './helpers';
import type { Diagram } from '../../src/lib/graph/diagram';

const DEMO = JSON.parse(readFileSync('static/demo/cycling-hypertension.causeway.json', 'utf8'));

async function openDemo(page: Page) {
	await page.goto('/');
	await expect(verdict(page)).toBeVisible({ timeout: 15_000 });
	await openSection(page, 'review');
	await expect(page.getByTestId('review-verdict')).toBeVisible({ timeout: 15_000 });
	// Close the other analysis sections so the Review section is in view.
	for (const id of ['adjustment', 'paths', 'claims']) await page.locator(`#${id}-heading button`).click();
	await page.locator('#review-heading').evaluate((el) => el.scrollIntoView({ block: 'start' }));
}

const review = (page: Page) => page.locator('[data-section="review"]');

test('a stated set with a mediator and a collider: verdict, every reason lit on the canvas, the nearest fix', async ({ page }) => {
	await openDemo(page);
	await expect(page.getByTestId('review-verdict')).toContainText('is sufficient');
	const input = review(page).getByRole('combobox', { name: 'Add a variable to the stated set' });
	await input.fill('Body-mass index, Fitness-app panel enrolment, nonsense');
	await input.press('Enter');
	await expect(review(page).getByRole('alert')).toContainText('No variable is called "nonsense"');
	await expect(page.getByTestId('review-verdict')).toContainText('is not sufficient');
	const reasons = page.getByTestId('review-reasons');
	await expect(reasons).toContainText('Overadjustment: Body-mass index is a mediator');
	await expect(reasons).toContainText('Collider bias: Fitness-app panel enrolment is a collider');
	await expect(reasons).toContainText('Fitness-app panel enrolment is caused by the outcome');
	await expect(page.getByTestId('review-nearest')).toContainText('drop Fitness-app panel enrolment and Body-mass index');

	// Clicking a reason keeps it lit: the adjusted mediator's box.
	await reasons.getByRole('button', { name: /Overadjustment/ }).click();
	expect(await page.evaluate(() => window.__causewayCanvas.nodeClasses('bmi'))).toContain('hl-node');
	await page.screenshot({ path: 'test-results/review-verdict.png' });

	// The fix is one click away.
	await page.getByTestId('review-nearest').getByRole('button', { name: 'Review this set' }).click();
	await expect(page.getByTestId('review-verdict')).toContainText('is sufficient');
});

test('the stated set follows a change of id, and its undo', async ({ page }) => {
	await openDemo(page);
	const input = review(page).getByRole('combobox', { name: 'Add a variable to the stated set' });
	await input.fill('Body-mass index');
	await input.press('Enter');
	await expect(page.getByTestId('review-verdict')).toContainText('is not sufficient');
	const bmiChip = review(page).getByRole('button', { name: 'Remove Body-mass index from the stated set' });
	await expect(bmiChip).toBeVisible();
	await variableMenu(page, 'bmi', 'Change id…');
	const idDialog = page.getByRole('dialog', { name: 'Id of Body-mass index' });
	await idDialog.getByRole('textbox').fill('body_mass_index');
	await idDialog.getByRole('textbox').press('Enter');
	await expect(message(page)).toContainText('"body_mass_index"');
	// Still stated (not silently dropped), so the verdict still names the mediator.
	await expect(bmiChip).toBeVisible();
	await expect(page.getByTestId('review-reasons')).toContainText('Overadjustment: Body-mass index is a mediator');
	await page.keyboard.press('Control+z');
	await expect(message(page)).toContainText('Undone');
	await expect(bmiChip).toBeVisible();
	await expect(page.getByTestId('review-verdict')).toContainText('is not sufficient');
});

test('stress test: the changes that break the plan, lit by hover, click and keyboard', async ({ page }) => {
	await openDemo(page);
	const list = page.getByTestId('stress-list');
	await expect(list).toBeVisible();
	await expect(page.getByTestId('stress-summary')).toContainText('Tried 80 added arrows');
	const first = list.getByRole('button').first();
	await expect(first).toContainText('Depends on there being no arrow from Commutes by bicycle to Diet quality');
	await first.hover();
	expect(await page.evaluate(() => window.__causewayCanvas.nodeClasses('diet'))).toContain('hl-on-path');

	// Keyboard only: focus an entry (lit while focused) and press Enter to keep it lit.
	const open = list.getByRole('button', { name: /no arrow from Street bikeability to Hypertension/ });
	await open.focus();
	await page.keyboard.press('Enter');
	await expect(open).toHaveAttribute('aria-pressed', 'true');
	expect(await page.evaluate(() => window.__causewayCanvas.nodeClasses('bikeability'))).toContain('hl-on-path');
	await open.evaluate((el) => el.scrollIntoView({ block: 'center' }));
	await page.screenshot({ path: 'test-results/review-stress.png' });
	await expect(page.getByTestId('robust-sets')).toContainText('No sufficient set survives every single added arrow');
});

test('comparison with a reviewer’s diagram: diff list, sets and verdict, side by side', async ({ page }) => {
	await openDemo(page);
	const other = structuredClone(DEMO);
	// The reviewer renames income's id (same label), adds distance → hypertension and reverses fitness → bmi.
	other.variables = other.variables.map((v: { id: string }) => (v.id === 'income' ? { ...v, id: 'household_income' } : v));
	other.arrows = other.arrows
		.map((a: { from: string; to: string }) => ({ from: a.from === 'income' ? 'household_income' : a.from, to: a.to === 'income' ? 'household_income' : a.to }))
		.map((a: { from: string; to: string }) => (a.from === 'fitness' && a.to === 'bmi' ? { from: 'bmi', to: 'fitness' } : a))
		.concat([{ from: 'distance', to: 'hypertension' }]);
	other.adjusted = [];
	await page.getByTestId('compare-file').setInputFiles({ name: 'reviewer.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(other)) });
	const diff = page.getByTestId('diff-list');
	await expect(diff).toContainText('Renamed: Household income → Household income (id income → household_income, matched by label)');
	await expect(diff).toContainText('Arrow added: Distance to work → Hypertension');
	await expect(diff).toContainText('Arrow reversed: Cardiorespiratory fitness → Body-mass index is now Body-mass index → Cardiorespiratory fitness');
	await expect(page.getByTestId('diff-sets')).toContainText('not sufficient');
	await page.getByTestId('side-by-side').click();
	const dialog = page.getByRole('dialog', { name: 'Side by side' });
	await expect(dialog.locator('svg[role=img]')).toHaveCount(2);
	await page.screenshot({ path: 'test-results/review-compare.png' });
	await page.keyboard.press('Escape');
	await expect(dialog).toBeHidden();
});

/** A seeded 200-variable diagram: arrows from lower to higher index, exposure v20 causes outcome v180. */
function bigDiagram(n = 200) {
	let s = 12345;
	const rand = () => ((s = (s * 1103515245 + 12345) % 2 ** 31) / 2 ** 31);
	const arrows: { from: string; to: string }[] = [];
	const seen = new Set<string>();
	for (let i = 0; i < n; i++) {
		for (let k = 0; k < 2; k++) {
			const j = i + 1 + Math.floor(rand() * 30);
			if (j >= n || seen.has(`${i}-${j}`)) continue;
			seen.add(`${i}-${j}`);
			arrows.push({ from: `v${i}`, to: `v${j}` });
		}
	}
	for (let i = 0; i < 20; i++) arrows.push({ from: `v${i}`, to: `v${180 + (i % 20)}` });
	arrows.push({ from: 'v20', to: 'v180' });
	const d = {
		format: 'causeway.diagram',
		version: 1,
		title: 'Large',
		variables: Array.from({ length: n }, (_, i) => ({ id: `v${i}`, label: `v${i}`, measured: true, x: (i % 20) * 90, y: Math.floor(i / 20) * 70 })),
		arrows: arrows.filter((a, i, all) => all.findIndex((b) => b.from === a.from && b.to === a.to) === i),
		exposures: ['v20'],
		outcomes: ['v180'],
		adjusted: [] as string[]
	};
	// Plan the efficiency-optimal set (else a smallest one), so there is a sufficient set to stress-test.
	const sets = adjustmentSets(d as unknown as Diagram, { max: 1 });
	d.adjusted = sets.optimal ?? sets.minimum ?? [];
	return d;
}

test('a 200-variable stress test runs in the worker with progress; the page stays usable meanwhile', async ({ page }) => {
	await openDemo(page);
	await page.locator('header input[type=file]').setInputFiles({ name: 'large.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(bigDiagram())) });
	await expect(page.getByTestId('message')).toContainText('Opened large.json');
	const started = Date.now();
	await expect(page.getByTestId('stress-progress')).toBeVisible({ timeout: 10_000 });
	await expect(page.getByTestId('stress-summary')).toBeVisible({ timeout: 60_000 });
	const firstRun = Date.now() - started;
	await expect.poll(() => page.evaluate(() => window.__causewayCanvas.counts().variables)).toBe(200);
	// Run it again with the canvas settled, watching the gaps between painted frames meanwhile.
	await page.evaluate(() => {
		const w = window as unknown as { __gaps: number[]; __watch: boolean };
		w.__gaps = [];
		w.__watch = true;
		let last = performance.now();
		const tick = (t: number) => {
			w.__gaps.push(t - last);
			last = t;
			if (w.__watch) requestAnimationFrame(tick);
		};
		requestAnimationFrame(tick);
	});
	await review(page).getByRole('button', { name: 'Clear' }).click();
	await review(page).getByRole('button', { name: 'Use the planned set' }).click();
	const again = Date.now();
	await expect(page.getByTestId('stress-progress')).toBeVisible({ timeout: 10_000 });
	const input = review(page).getByRole('combobox', { name: 'Add a variable to the stated set' });
	await input.pressSequentially('v5');
	await expect(input).toHaveValue('v5');
	await input.fill('');
	await expect(page.getByTestId('stress-summary')).toBeVisible({ timeout: 60_000 });
	const secondRun = Date.now() - again;
	const gaps = await page.evaluate(() => {
		const w = window as unknown as { __gaps: number[]; __watch: boolean };
		w.__watch = false;
		return w.__gaps;
	});
	const longest = Math.max(...gaps);
	// Logged, not asserted (speed belongs in benchmarks): on a loaded machine the idle page with a
	// 200-variable canvas shows frame gaps of the same order.
	console.log(`200-variable stress test: first run ${firstRun} ms (with the canvas being built), second run ${secondRun} ms; longest frame gap during it ${Math.round(longest)} ms over ${gaps.length} frames`);
	expect(gaps.length).toBeGreaterThan(1);
	await page.screenshot({ path: 'test-results/review-large.png' });
});
