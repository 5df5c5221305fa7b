// The Data section in real Chromium: the demo study's simulated data in one click, arrow
// checks (and their verdicts on the canvas arrows), claim checks, estimates with a forest
// plot and E-value; a bad CSV gives one clear message and leaves the earlier results; the
// whole section works from the keyboard.
import { expect, test, type Page } from '@playwright/test';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { demoCsv, simulateDemo } from '../../scripts/simulate-demo';
import { counts, dataSection, loadDemoData, openDemo, openSection } from './helpers';

const data = dataSection;

test('demo data: arrow checks with pictures and canvas marks, claims (a contradicted one after an edit), estimates', async ({ page }) => {
	await openDemo(page);
	await loadDemoData(page);
	const section = data(page);
	// Arrow checks: the exposure's arrow to fitness is supported, with its n and a picture.
	const fitness = section.locator('li[data-arrow="cycling>fitness"]');
	await expect(fitness).toContainText('supported');
	await expect(fitness).toContainText('n = 5,000');
	await expect(fitness.getByRole('img')).toHaveAttribute('aria-label', /Box plots of VO2max|Box plots of Fitness|Box plots of/);
	// The weak income → hypertension association is reported, not hidden.
	await expect(section.locator('li[data-arrow="income>hypertension"]')).toContainText('not found');
	// The canvas arrows carry the verdicts.
	expect(await page.evaluate(() => window.__causewayCanvas.arrowClasses('cycling', 'fitness'))).toContain('data-supported');
	expect(await page.evaluate(() => window.__causewayCanvas.arrowClasses('income', 'hypertension'))).toContain('data-absent');
	// Selecting an arrow on the canvas marks its check.
	// Once, on a loaded CI machine, this click did not select the arrow (not reproduced here in
	// 12 runs); a user would click again, so the test does. Clicks are tested in mouse.e2e.ts.
	await expect(async () => {
		const fm = (await page.evaluate(() => window.__causewayCanvas.arrowMidpoint('cycling', 'fitness')))!;
		await page.mouse.click(fm.x, fm.y);
		await expect(fitness).toHaveClass(/selected/, { timeout: 3_000 });
	}).toPass({ timeout: 30_000 });
	// Unmeasured health consciousness: its arrows are not checked, and the section says so.
	await expect(section).toContainText('Not checked, as an end has no data: Health consciousness → Commutes by bicycle');
	// Claims: tested with Holm and BH.
	await expect(section).toContainText(/46 tested; 0 contradicted/);
	await expect(section).toContainText('No claim is contradicted by the data.');
	await section.getByText('46 consistent with the data').click();
	await expect(section.getByText(/Holm .*BH/).first()).toBeVisible();
	// Estimates: crude and planned odds ratios, forest plot, E-value.
	const table = section.getByTestId('estimates-table');
	await expect(table).toContainText('0.474');
	await expect(table).toContainText('0.609');
	await expect(section.getByTestId('forest-plot')).toBeVisible();
	await expect(section.getByTestId('evalue')).toContainText('E-value of the planned estimate: 1.88');
	await expect(section).toContainText('common practice');
	await page.screenshot({ path: 'test-results/data-demo.png', fullPage: false });

	// Remove the true arrow age → hypertension from its context menu.
	const mid = (await page.evaluate(() => window.__causewayCanvas.arrowMidpoint('age', 'hypertension')))!;
	await page.mouse.click(mid.x, mid.y, { button: 'right' });
	await page.getByRole('menuitem', { name: 'Delete arrow' }).click();
	await expect.poll(() => page.evaluate(() => window.__causewayCanvas.arrowMidpoint('age', 'hypertension'))).toBeNull();
	const contradicted = section.locator('li.contradicted').first();
	await expect(contradicted).toContainText('Age ⟂ Hypertension', { timeout: 20_000 });
	await expect(contradicted).toContainText('Missing arrow? Age → Hypertension');
	await contradicted.getByRole('button').click();
	await expect(contradicted.getByRole('button')).toHaveAttribute('aria-pressed', 'true');
	await page.screenshot({ path: 'test-results/data-contradicted.png' });
});

test('a bad CSV gives one clear message and leaves the earlier data and results', async ({ page }) => {
	await openDemo(page);
	await loadDemoData(page);
	const chooser = page.waitForEvent('filechooser');
	await data(page).getByRole('button', { name: 'Load data file…' }).click();
	await (await chooser).setFiles({ name: 'ragged.csv', mimeType: 'text/csv', buffer: Buffer.from('age,cycling\n40,1\n50,0,7\n') });
	await expect(data(page).getByTestId('data-error')).toHaveText('ragged.csv was not loaded — Row 3 has 3 fields but the header has 2.');
	await expect(data(page).getByTestId('data-source')).toContainText('cycling-hypertension.csv (demo)');
	await expect(data(page).getByTestId('estimates-table')).toContainText('0.609');
	// Text in a numeric column names the row and the column.
	const chooser2 = page.waitForEvent('filechooser');
	await data(page).getByRole('button', { name: 'Load data file…' }).click();
	await (await chooser2).setFiles({ name: 'text.csv', mimeType: 'text/csv', buffer: Buffer.from('age,cycling\n40,1\n50,0\nold,1\n41,0\n') });
	await expect(data(page).getByTestId('data-error')).toContainText("Row 4, column 'age': 'old' is not a number");
	for (const [name, bytes, message] of [
		['dup.csv', Buffer.from('age,age\n40,41\n'), "Duplicate column name 'age' (columns 1 and 2)."],
		['empty.csv', Buffer.from('age,cycling\n'), 'The file has a header row but no data rows.'],
		['book.csv', Buffer.from([0x50, 0x4b, 0x03, 0x04, 0, 0, 0, 8, 0, 0, 0x21, 0, 0xff, 0xfe, 0, 0]), 'binary data']
	] as const) {
		const next = page.waitForEvent('filechooser');
		await data(page).getByRole('button', { name: 'Load data file…' }).click();
		await (await next).setFiles({ name, mimeType: 'text/csv', buffer: bytes });
		await expect(data(page).getByTestId('data-error')).toContainText(`${name} was not loaded — `);
		await expect(data(page).getByTestId('data-error')).toContainText(message);
	}
	// Through all of it the earlier data, results and canvas marks stayed.
	await expect(data(page).getByTestId('estimates-table')).toContainText('0.609');
	expect(await page.evaluate(() => window.__causewayCanvas.arrowClasses('cycling', 'fitness'))).toContain('data-supported');
	// A constant column, dropped on the load area, is read, named, and its arrows are reported as not tested.
	const dropped = await page.evaluateHandle(() => {
		const dt = new DataTransfer();
		dt.items.add(new File(['age,cycling\n40,1\n50,1\n60,1\n'], 'constant.csv', { type: 'text/csv' }));
		return dt;
	});
	const loader = data(page).getByRole('group', { name: 'Load data' });
	await loader.dispatchEvent('dragover', { dataTransfer: dropped });
	await loader.dispatchEvent('drop', { dataTransfer: dropped });
	await expect(data(page).getByTestId('data-source')).toContainText('constant.csv');
	await expect(data(page).getByText("Column 'cycling' has a single value in every row")).toBeVisible();
	await expect(data(page).locator('li[data-arrow="age>cycling"]')).toContainText('not tested');
	expect(await page.evaluate(() => window.__causewayCanvas.arrowClasses('age', 'cycling'))).toContain('data-untested');
	// The diagram was not touched by the dropped file.
	expect((await counts(page)).variables).toBe(13);

	// A summary matrix (correlations of five demo columns, computed by R from the demo CSV).
	await data(page).getByRole('button', { name: 'Summary matrix…' }).click();
	await data(page)
		.getByRole('textbox')
		.fill(
			[
				',age,income,diet,cycling,hypertension',
				'age,1,0.383,0.076,-0.127,0.23',
				'income,0.383,1,0.224,0.025,0.008',
				'diet,0.076,0.224,1,0.219,-0.128',
				'cycling,-0.127,0.025,0.219,1,-0.148',
				'hypertension,0.23,0.008,-0.128,-0.148,1',
				'n,5000'
			].join('\n')
		);
	await data(page).getByRole('button', { name: 'Use this matrix' }).click();
	await expect(data(page).getByTestId('data-source')).toContainText('correlation matrix of 5 variables, n = 5000');
	await expect(data(page).getByTestId('estimates-table')).toContainText('Difference');
	await expect(data(page).getByTestId('data-unmapped').first()).toContainText('treated as unmeasured');
});

test('keyboard only: load the demo data, change a column link, pin an arrow check', async ({ page }) => {
	await openDemo(page);
	const section = data(page);
	// The Data section starts closed and loads its code when opened: by keyboard here.
	await page.locator('#data-heading button').focus();
	await page.keyboard.press('Enter');
	await expect(page.locator('#data-heading button')).toHaveAttribute('aria-expanded', 'true');
	await expect(page.locator('#data-heading button')).toBeFocused();
	await section.getByRole('button', { name: 'Load demo data' }).focus();
	await page.keyboard.press('Enter');
	await expect(section.getByTestId('estimates-table')).toBeVisible({ timeout: 20_000 });
	// Open the Columns part and unlink Diet quality with the keyboard.
	const columns = section.locator('details.part').first().locator('> summary');
	await columns.focus();
	await page.keyboard.press('Enter');
	const select = section.getByRole('combobox', { name: 'Column for Diet quality' });
	await select.focus();
	await select.selectOption({ label: '— no data (unmeasured) —' });
	await expect(section.getByTestId('data-unmapped').first()).toContainText('"diet": treated as unmeasured', { timeout: 20_000 });
	// Without diet, no measured set blocks the path through health consciousness.
	await expect(section).toContainText('no adjustment set is sufficient');
	// Tab to an arrow check and pin it with Space.
	const check = section.locator('li[data-arrow="cycling>fitness"] button');
	await check.focus();
	await page.keyboard.press(' ');
	await expect(check).toHaveAttribute('aria-pressed', 'true');
	await page.keyboard.press('Escape');
});

test('the protocol report carries the data checks and estimates once they are complete', async ({ page }) => {
	await openDemo(page);
	await loadDemoData(page);
	await expect(data(page)).toContainText(/46 tested/, { timeout: 30_000 });
	await page.getByRole('button', { name: /^▸?\s*Report/ }).click();
	const reportSection = page.locator('[data-section="report"]');
	await expect(reportSection.getByText('The report includes the data checks and estimates.')).toBeVisible();
	const [file] = await Promise.all([page.waitForEvent('download'), reportSection.getByRole('button', { name: 'HTML', exact: true }).click()]);
	const html = readFileSync((await file.path())!, 'utf8');
	expect(html).toContain('Data checks and estimates');
	expect(html).toContain('cycling-hypertension.csv');
	expect(html).toMatch(/E-value/);
});

test('a Cancel during the checks: the section heading says what was not checked, never "checking…"', async ({ page }) => {
	// 300,000 simulated rows of the demo study (scripts/simulate-demo.ts), so that the checks
	// are still running when Cancel is pressed on any machine.
	const dir = mkdtempSync(join(tmpdir(), 'causeway-cancel-'));
	const csv = join(dir, 'cycling-hypertension-300k.csv');
	writeFileSync(csv, demoCsv(simulateDemo(300_000, 20261206)));
	try {
		await openDemo(page);
		await openSection(page, 'data');
		const section = data(page);
		await section.getByRole('group', { name: 'Load data' }).locator('input[type="file"]').setInputFiles(csv);
		const checking = section.locator('.progress', { hasText: 'Checking' });
		await checking.getByRole('button', { name: 'Cancel' }).click({ timeout: 120_000 });
		await expect(section).toContainText('The data checks were cancelled', { timeout: 30_000 });
		const heading = page.locator('#data-heading .summary');
		await expect(heading).not.toContainText('checking…');
		await expect(heading).toContainText(/not checked|claims not run/);
		await expect(section).toContainText('300,000 rows');
	} finally {
		rmSync(dir, { recursive: true, force: true });
	}
});
