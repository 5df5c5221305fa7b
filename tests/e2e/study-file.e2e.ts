// One study, one file, in real Chromium: renaming keeps the data link and the estimates;
// New and Open with data loaded ask before keeping the data and show what changed; the data
// settings survive a reload and a save/open round trip; notes are written with the keyboard
// only; an over-long name is refused when it is typed; an unreadable autosave is kept aside
// and offered for download. Screenshots go to test-results/study-*.png.
import { readFileSync } from 'node:fs';
import { expect, test, type Page } from '@playwright/test';
import { announcer, canvas, counts, dataSection, loadDemoData, message, nodeCentre, openDemo, openEmpty, openSection, verdict, watchPage } from './helpers';

const data = dataSection;

async function openColumns(page: Page) {
	const part = data(page).locator('details.part').first();
	if ((await part.getAttribute('open')) === null) await part.locator('> summary').click();
	return part;
}

const diagramInput = (page: Page) => page.locator('header.toolbar input[type=file]');

/** With the canvas focused, walks the keyboard selection until `label` is selected (any direction). */
async function reachByKeyboard(page: Page, label: string) {
	for (const key of ['ArrowLeft', 'ArrowDown', 'ArrowUp', 'ArrowRight', 'ArrowDown', 'ArrowLeft']) {
		for (let i = 0; i < 8; i++) {
			if ((await announcer(page).textContent())?.startsWith(`${label}:`)) return;
			await page.keyboard.press(key);
		}
	}
	if (!(await announcer(page).textContent())?.startsWith(`${label}:`)) throw new Error(`could not reach ${label} with the keyboard`);
}

test('renaming a variable keeps its id, its data column and the estimates; no two sections disagree', async ({ page, baseURL }) => {
	const problems = watchPage(page, baseURL as string);
	await openDemo(page);
	await loadDemoData(page);
	const table = data(page).getByTestId('estimates-table');
	await expect(table).toContainText('0.609');
	// Rename Age in place on the canvas.
	const age = await nodeCentre(page, 'age');
	await page.mouse.dblclick(age.x, age.y);
	const input = page.getByRole('textbox', { name: 'New name for Age' });
	await input.fill('Age in years');
	await input.press('Enter');
	await expect(message(page)).toContainText('Rename Age to Age in years');
	// The id stayed: the canvas still has "age", the column link holds, the estimates stand.
	expect(await page.evaluate(() => window.__causewayCanvas.nodeBox('age'))).not.toBeNull();
	expect(await page.evaluate(() => window.__causewayCanvas.nodeBox('age_in_years'))).toBeNull();
	const columns = await openColumns(page);
	await expect(columns).toContainText('12 of 12 variables linked');
	await expect(table).toContainText('Age in years', { timeout: 20_000 });
	await expect(table).toContainText('0.609');
	await expect(data(page).getByTestId('data-unmapped')).toHaveCount(0);
	await expect(verdict(page)).toContainText('is sufficient');
	await expect(page.getByTestId('data-verdict')).toHaveCount(0);
	await expect(table).not.toContainText('not sufficient');

	// Leaving diet without data: the Adjustment section shows both verdicts side by side, with the reason.
	await data(page).getByRole('combobox', { name: 'Column for Diet quality' }).selectOption({ label: '— no data (unmeasured) —' });
	const seen = page.getByTestId('data-verdict');
	await expect(seen).toContainText('has no column for Diet quality', { timeout: 20_000 });
	await expect(seen).toContainText('not sufficient');
	await expect(seen).toContainText('The verdict differs');
	await expect(verdict(page)).toContainText('For the diagram');
	await expect(verdict(page)).toContainText('is sufficient');
	await expect(table).toContainText('not sufficient for the diagram as the data see it');
	await page.locator('[data-section="adjustment"]').screenshot({ path: 'test-results/study-verdicts.png' });
	expect(problems).toEqual([]);
});

test('New and Open with data loaded ask, naming the file; kept data are matched again and the differences shown', async ({ page }) => {
	await openDemo(page);
	await loadDemoData(page);
	// New → empty diagram: the app asks; "Start without data" drops the data.
	await page.getByRole('button', { name: 'New…' }).click();
	await page.getByRole('button', { name: 'Start an empty diagram' }).click();
	const ask = page.getByRole('dialog', { name: 'Keep the loaded data?' });
	await expect(ask).toContainText('cycling-hypertension.csv (demo) is loaded for the current diagram');
	await page.screenshot({ path: 'test-results/study-keep-data.png' });
	await ask.getByRole('button', { name: 'Start without data' }).click();
	await expect(page.getByText('An empty diagram.')).toBeVisible();
	await expect(data(page)).toContainText('No data loaded.');

	// Back to the demo with its data; then Open another study and keep the data.
	await page.keyboard.press('Control+z');
	await expect.poll(async () => (await counts(page)).variables).toBe(13);
	await loadDemoData(page);
	const other = {
		format: 'causeway.diagram',
		version: 2,
		title: 'Age and blood pressure',
		variables: [
			{ id: 'age', label: 'Age', x: 0, y: 0 },
			{ id: 'bp', label: 'Blood pressure', x: 200, y: 0 },
			{ id: 'salt', label: 'Salt intake', x: 100, y: 120 }
		],
		arrows: [
			{ from: 'age', to: 'bp' },
			{ from: 'salt', to: 'bp' }
		],
		exposures: ['salt'],
		outcomes: ['bp'],
		adjusted: []
	};
	const file = { name: 'age-bp.causeway.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(other)) };
	// Cancel leaves everything as it was.
	await diagramInput(page).setInputFiles(file);
	await ask.getByRole('button', { name: 'Cancel' }).click();
	await expect(message(page)).toContainText('age-bp.causeway.json was not opened.');
	expect((await counts(page)).variables).toBe(13);
	// Keep the data this time.
	await diagramInput(page).setInputFiles(file);
	await ask.getByRole('button', { name: 'Keep cycling-hypertension.csv (demo)' }).click();
	await expect(message(page)).toContainText('Opened age-bp.causeway.json');
	const rematch = data(page).getByTestId('data-rematch');
	await expect(rematch).toContainText('was matched again to this diagram: Age ← "age"', { timeout: 20_000 });
	await expect(rematch).toContainText('No column for Blood pressure, Salt intake');
	await expect(rematch).toContainText('No longer used: "income" (was Household income)');
	// One note for the two unmatched variables, not a wall of them.
	await expect(data(page).getByTestId('data-unmapped')).toHaveCount(1);
	await data(page).screenshot({ path: 'test-results/study-rematch.png' });
});

test('column links, kinds, reference levels and value labels survive a reload and a save/open round trip', async ({ page }) => {
	await openDemo(page);
	await loadDemoData(page);
	await openColumns(page);
	const section = data(page);
	await section.getByRole('combobox', { name: 'Column for Diet quality' }).selectOption({ label: '— no data (unmeasured) —' });
	await expect(message(page)).toContainText('Diet quality: no data (unmeasured for the checks)');
	// A kind that does not fit is refused before it is stored.
	await section.getByRole('combobox', { name: 'Kind of column income' }).selectOption('binary');
	await expect(message(page)).toContainText("Column 'income' has more than 20 distinct values, too many to use as binary levels. The kind of Household income is unchanged.");
	await expect(section.getByRole('combobox', { name: 'Kind of column income' })).toHaveValue('');
	await section.getByRole('combobox', { name: 'Kind of column cycling' }).selectOption('categorical');
	await section.getByTestId('levels-cycling').locator('summary').click();
	await section.getByRole('textbox', { name: 'Name of value 0 of Commutes by bicycle' }).fill('other commute');
	await section.getByRole('textbox', { name: 'Name of value 0 of Commutes by bicycle' }).press('Tab');
	await section.getByRole('textbox', { name: 'Name of value 1 of Commutes by bicycle' }).fill('bicycle');
	await section.getByRole('textbox', { name: 'Name of value 1 of Commutes by bicycle' }).press('Tab');
	await section.getByRole('radio', { name: '1 is the reference level of Commutes by bicycle' }).check();
	await expect(section.getByTestId('levels-cycling')).toContainText('The checks used "bicycle" as the reference level.', { timeout: 20_000 });
	await section.screenshot({ path: 'test-results/study-settings.png' });
	// Undo takes back the last setting, redo restores it.
	await page.getByRole('button', { name: 'Undo' }).click();
	await expect(section.getByRole('radio', { name: '0 is the reference level of Commutes by bicycle' })).toBeChecked();
	await page.getByRole('button', { name: 'Redo' }).click();
	await expect(section.getByRole('radio', { name: '1 is the reference level of Commutes by bicycle' })).toBeChecked();

	const checkSettings = async () => {
		await loadDemoData(page);
		await openColumns(page);
		await expect(section.getByRole('combobox', { name: 'Column for Diet quality' })).toHaveValue('\u0000none');
		await expect(section.getByRole('combobox', { name: 'Kind of column cycling' })).toHaveValue('categorical');
		const levels = section.getByTestId('levels-cycling');
		await levels.locator('summary').click();
		await expect(section.getByRole('textbox', { name: 'Name of value 1 of Commutes by bicycle' })).toHaveValue('bicycle');
		await expect(section.getByRole('radio', { name: '1 is the reference level of Commutes by bicycle' })).toBeChecked();
		await expect(levels).toContainText('The checks used "bicycle" as the reference level.', { timeout: 20_000 });
	};
	// Reload: the data are not stored (they never leave the page), the settings are.
	await page.reload();
	await expect.poll(async () => (await page.evaluate(() => window.__causewayCanvas?.counts().variables)) ?? 0, { timeout: 20_000 }).toBe(13);
	await openSection(page, 'data');
	await expect(section).toContainText('No data loaded.');
	await checkSettings();

	// Save, start afresh without data, open the saved file: the same settings.
	const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Save', exact: true }).click()]);
	const saved = readFileSync((await download.path())!, 'utf8');
	const file = JSON.parse(saved);
	expect(file.version).toBe(2);
	expect(file.variables.find((v: { id: string }) => v.id === 'cycling').data).toEqual({ kind: 'categorical', reference: '1', labels: { 0: 'other commute', 1: 'bicycle' } });
	expect(file.variables.find((v: { id: string }) => v.id === 'diet').data).toEqual({ column: null });
	await page.getByRole('button', { name: 'New…' }).click();
	await page.getByRole('button', { name: 'Start an empty diagram' }).click();
	await page.getByRole('dialog', { name: 'Keep the loaded data?' }).getByRole('button', { name: 'Start without data' }).click();
	await expect(page.getByText('An empty diagram.')).toBeVisible();
	await diagramInput(page).setInputFiles({ name: download.suggestedFilename(), mimeType: 'application/json', buffer: Buffer.from(saved) });
	await expect(message(page)).toContainText(`Opened ${download.suggestedFilename()}`);
	await checkSettings();
});

test('notes on variables and arrows, and an id change, by keyboard only', async ({ page, baseURL }) => {
	const problems = watchPage(page, baseURL as string);
	await openDemo(page);
	await canvas(page).focus();
	await reachByKeyboard(page, 'Age');
	// T opens the note of the selected variable; Ctrl+Enter saves.
	await page.keyboard.press('t');
	const dialog = page.getByRole('dialog', { name: 'Note on Age' });
	const field = dialog.getByRole('textbox');
	await expect(field).toBeFocused();
	await expect(field).toHaveValue('Years at enrolment');
	await page.keyboard.press('Control+a');
	await page.keyboard.type('Age at enrolment, whole years (questionnaire item 2).');
	await page.keyboard.press('Control+Enter');
	await expect(dialog).toBeHidden();
	await expect(message(page)).toContainText('Edit the note on Age');
	// Shown beside the selected variable and announced.
	await expect(page.getByTestId('note-tip')).toContainText('Age at enrolment, whole years');
	await canvas(page).focus();
	await page.keyboard.press('ArrowRight');
	await page.keyboard.press('ArrowLeft');
	await expect(announcer(page)).toContainText('Note: Age at enrolment, whole years');

	// ] selects an arrow of Age; T writes its note.
	await page.keyboard.press(']');
	await expect(announcer(page)).toContainText('Arrow Age → ');
	const arrowName = ((await announcer(page).textContent()) ?? '').replace(/^Arrow (.*?)\..*$/, '$1');
	await page.keyboard.press('t');
	const arrowDialog = page.getByRole('dialog', { name: `Note on the arrow ${arrowName}` });
	await expect(arrowDialog.getByRole('textbox')).toBeFocused();
	await page.keyboard.type('Assumed from the pilot survey (our own data, 2025).');
	await page.keyboard.press('Control+Enter');
	await expect(arrowDialog).toBeHidden();
	await expect(page.getByTestId('note-tip')).toContainText('Assumed from the pilot survey');
	await page.screenshot({ path: 'test-results/study-arrow-note.png' });

	// The menu of the selected variable (Shift+F10) changes its id; every reference follows.
	await canvas(page).focus();
	await reachByKeyboard(page, 'Age');
	await page.keyboard.press('Shift+F10');
	const menu = page.getByRole('menu');
	await expect(menu).toBeVisible();
	for (let i = 0; i < 10 && !(await menu.getByRole('menuitem', { name: 'Change id…' }).evaluate((el) => el === document.activeElement)); i++) await page.keyboard.press('ArrowDown');
	await page.keyboard.press('Enter');
	const idDialog = page.getByRole('dialog', { name: 'Id of Age' });
	await expect(idDialog.getByRole('textbox')).toBeFocused();
	await page.keyboard.type('age_years');
	await page.keyboard.press('Enter');
	await expect(message(page)).toContainText('Change the id of Age from "age" to "age_years"');
	expect(await page.evaluate(() => window.__causewayCanvas.nodeBox('age_years'))).not.toBeNull();
	await expect(verdict(page)).toContainText('is sufficient');

	// The text view lists the notes and the new id.
	await page.getByRole('button', { name: 'Text view' }).click();
	const text = page.getByRole('region', { name: 'Text view of the diagram' });
	await expect(text).toContainText('id age_years');
	await expect(text).toContainText('Note: Age at enrolment, whole years (questionnaire item 2).');
	await expect(text).toContainText('Note: Assumed from the pilot survey (our own data, 2025).');
	await text.screenshot({ path: 'test-results/study-text-view.png' });
	expect(problems).toEqual([]);
});

test('an over-long name is refused when it is typed, and what the app saves always opens again', async ({ page }) => {
	await openEmpty(page);
	await canvas(page).focus();
	await page.keyboard.press('v');
	const input = page.getByRole('textbox', { name: 'Name of the new variable' });
	await input.fill('x'.repeat(1001));
	await input.press('Enter');
	await expect(message(page)).toContainText('The name is too long: 1,001 characters, at most 1,000 are allowed; no variable was added.');
	// The box stays open with the text, to shorten it.
	await expect(input).toBeVisible();
	await expect(input).toHaveValue('x'.repeat(1001));
	await page.screenshot({ path: 'test-results/study-too-long.png' });
	await input.fill('x'.repeat(1000));
	await input.press('Enter');
	await expect.poll(async () => (await counts(page)).variables).toBe(1);
	// Renaming past the limit is refused too; the title as well.
	await page.keyboard.press('F2');
	const rename = page.getByRole('textbox', { name: /^New name for x+$/ });
	await rename.fill('y'.repeat(1200));
	await rename.press('Enter');
	await expect(message(page)).toContainText('The name is too long: 1,200 characters, at most 1,000 are allowed; the old name is kept.');
	await rename.press('Escape');
	await page.getByRole('textbox', { name: 'Diagram title' }).fill('t'.repeat(1001));
	await page.getByRole('textbox', { name: 'Diagram title' }).press('Enter');
	await expect(message(page)).toContainText('The title is too long');
	// Save writes a file the app opens; a reload brings the diagram back (not an empty one).
	const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Save', exact: true }).click()]);
	const saved = readFileSync((await download.path())!, 'utf8');
	await diagramInput(page).setInputFiles({ name: 'saved.causeway.json', mimeType: 'application/json', buffer: Buffer.from(saved) });
	await expect(message(page)).toContainText('Opened saved.causeway.json: 1 variable, 0 arrows');
	await page.reload();
	await expect.poll(async () => (await page.evaluate(() => window.__causewayCanvas?.counts().variables)) ?? 0, { timeout: 20_000 }).toBe(1);
	await expect(page.getByTestId('stored-copy')).toHaveCount(0);
});

test('an unreadable autosave is kept aside, offered for download with the reason, and never replaced by an empty diagram', async ({ page }) => {
	// What an editor without length checks stored: a name past the reader's limit.
	const stored = JSON.stringify({ format: 'causeway.diagram', version: 2, title: 'Old study', variables: [{ id: 'a', label: 'z'.repeat(1001) }, { id: 'b' }], arrows: [{ from: 'a', to: 'b' }] });
	await page.addInitScript((text) => {
		if (sessionStorage.getItem('e2e-started')) return;
		sessionStorage.setItem('e2e-started', '1');
		localStorage.clear();
		localStorage.setItem('causeway.visited', '1');
		localStorage.setItem('causeway.autosave.v1', text);
	}, stored);
	await page.goto('/');
	const notice = page.getByTestId('stored-copy');
	await expect(notice).toContainText('could not be read, so it was kept aside');
	await expect(notice).toContainText('The label of Variable 1 ("a") is too long: 1,001 characters');
	await expect(message(page)).toContainText('It was kept aside');
	await page.screenshot({ path: 'test-results/study-kept-aside.png' });
	const [download] = await Promise.all([page.waitForEvent('download'), notice.getByRole('button', { name: 'Download it' }).click()]);
	expect(readFileSync((await download.path())!, 'utf8')).toBe(stored);
	// Edits in the empty diagram are saved, and the copy aside stays until discarded, across reloads.
	await canvas(page).focus();
	await page.keyboard.press('v');
	await page.getByRole('textbox', { name: 'Name of the new variable' }).fill('Fresh');
	await page.keyboard.press('Enter');
	await expect.poll(async () => (await counts(page)).variables).toBe(1);
	await page.reload();
	await expect(notice).toBeVisible();
	await expect.poll(async () => (await page.evaluate(() => window.__causewayCanvas?.counts().variables)) ?? 0, { timeout: 20_000 }).toBe(1);
	expect(await page.evaluate(() => JSON.parse(localStorage.getItem('causeway.autosave.unreadable.v1') ?? '[]')[0].text)).toBe(stored);
	await notice.getByRole('button', { name: 'Discard it' }).click();
	await expect(notice).toHaveCount(0);
	await page.reload();
	await expect.poll(async () => (await page.evaluate(() => window.__causewayCanvas?.counts().variables)) ?? 0, { timeout: 20_000 }).toBe(1);
	await expect(notice).toHaveCount(0);
});
