// The confounder check in real Chromium: with the demo data, every candidate at once (its kind,
// roles, associations with exposure and outcome, crude → adjusted, Mantel–Haenszel with
// Breslow–Day–Tarone), non-candidates with the reason, two-way tables opened on demand,
// standardized estimates with the confounding vs non-collapsibility sentence, the analysis
// code copied and downloaded; a CSV with a 0/1/2/3-coded column (built here) gets the notice
// naming the column and its kind beside every result; all of it from the keyboard; text
// contrast of the section at least 4.5:1. Screenshots go to test-results/.
import { expect, test, type Page } from '@playwright/test';
import { readFileSync } from 'node:fs';
import { counts, dataSection, openDemo, openSection } from './helpers';

/** The Data section starts closed and loads its code when opened; by keyboard here. */
async function openDataByKeyboard(page: Page) {
	await page.locator('#data-heading button').focus();
	await page.keyboard.press('Enter');
	await expect(page.locator('#data-heading button')).toHaveAttribute('aria-expanded', 'true');
	await expect(page.locator('#data-heading button')).toBeFocused();
}

const data = dataSection;
const candidate = (page: Page, id: string) => data(page).locator(`tbody[data-candidate="${id}"]`);

async function loadDemoData(page: Page) {
	await openSection(page, 'data');
	await data(page).getByRole('button', { name: 'Load demo data' }).click();
	await expect(data(page).getByTestId('confounder-table')).toBeVisible({ timeout: 30_000 });
}

/** The demo rows with income replaced by its band coded 0, 1, 2, 3 (a numeric column that is really categories). */
function codedIncomeCsv(): Buffer {
	const lines = readFileSync('static/demo/cycling-hypertension.csv', 'utf8').trim().split('\n');
	const at = lines[0].split(',').indexOf('income');
	const out = lines.map((line, i) => {
		if (i === 0) return line;
		const f = line.split(',');
		const income = Number(f[at]);
		f[at] = String(income < 30 ? 0 : income < 40 ? 1 : income < 50 ? 2 : 3);
		return f.join(',');
	});
	return Buffer.from(`${out.join('\n')}\n`);
}

test('every candidate at once, a two-way table, standardized estimates and the collapsibility sentence', async ({ page }) => {
	await page.setViewportSize({ width: 1280, height: 1000 });
	await openDemo(page);
	await loadDemoData(page);
	const section = data(page);
	// Every pre-exposure variable with data is a row; mediators and descendants say why they are not.
	for (const id of ['age', 'income', 'diet', 'distance', 'bikeability', 'family_history']) await expect(candidate(page, id)).toBeVisible();
	const age = candidate(page, 'age');
	await expect(age).toContainText('Age');
	await expect(age).toContainText('continuous');
	await expect(age).toContainText('confounder · common cause');
	await expect(age).toContainText('d = −0.268');
	await expect(age).toContainText('0.474 → 0.526');
	await expect(age).toContainText('+10.9 %');
	await expect(age).toContainText('MH OR 0.523 (0.453 to 0.605) over fifths; Breslow–Day–Tarone p = 0.32');
	await expect(candidate(page, 'diet')).toContainText('confounder · collider: adjust together with Age and Household income');
	const table = section.getByTestId('confounder-table');
	await expect(table.locator('tbody.others')).toContainText('Cardiorespiratory fitness');
	await expect(table.locator('tbody.others')).toContainText('not a candidate: a mediator');
	await expect(table.locator('tbody.others')).toContainText('not a candidate: caused by the outcome');
	// A discrete candidate opens to its two-way tables with row %, X² and per-level odds ratios.
	const family = candidate(page, 'family_history');
	await expect(family).toContainText('OR 1.77');
	await family.getByRole('button', { name: 'Details of Family history of hypertension' }).click();
	const twoWay = family.getByTestId('two-way-table').last();
	await expect(twoWay).toContainText('2,628 (76 %)');
	await expect(twoWay).toContainText('553 (36 %)');
	await expect(twoWay).toContainText('Pearson X² = 75.4, 1 df, p < 0.001');
	await expect(twoWay).toContainText('1 vs 0');
	await expect(family).toContainText('Breslow–Day–Tarone X² = 3.11, 1 df, p = 0.078');
	await section.getByTestId('confounder-part').evaluate((el) => el.scrollIntoView({ block: 'start' }));
	const column = (await page.locator('#analysis-column').boundingBox())!;
	await page.screenshot({ path: 'test-results/confounder-check.png', clip: column });
	// The arrow check of two discrete columns opens to the same kind of table.
	const arrow = section.locator('li[data-arrow="family_history>hypertension"]');
	await expect(arrow).toContainText('odds ratio 1.77 (95 % CI 1.56 to 2.02)');
	await arrow.getByText('Table of counts, X² and odds ratios').click();
	await expect(arrow.getByTestId('two-way-table')).toContainText('998 (64 %)');
	// Estimates: the crude on each row's own rows, kinds beside each set, standardized estimates, the sentence.
	await expect(section.getByTestId('crude-rows')).toContainText('Crude on all rows: 0.474 (0.411 to 0.546), n = 5,000');
	await expect(section.getByTestId('estimates-table')).toContainText('from 0.474');
	await expect(section.getByTestId('estimates-table')).toContainText('continuous: Age, Diet quality, Household income');
	const standardized = section.getByTestId('standardized-table');
	await expect(standardized).toContainText('−8.8');
	await expect(standardized).toContainText('0.709');
	await expect(standardized).toContainText('0.637 to 0.79');
	await expect(section.getByTestId('collapsibility')).toContainText('crude 0.474 → standardized marginal 0.63 → conditional (the model\'s) 0.609');
	await expect(section.getByTestId('collapsibility')).toContainText('is non-collapsibility');
	// Nothing in the Data section is wider than the analysis column.
	expect(await page.locator('#analysis-column').evaluate((el) => el.scrollWidth - el.clientWidth)).toBeLessThanOrEqual(0);
	await section.getByTestId('standardized-table').scrollIntoViewIfNeeded();
	await page.screenshot({ path: 'test-results/confounder-estimates.png', clip: column });
});

test('analysis code: pick a set and a language, copy and download it', async ({ page, context }) => {
	await context.grantPermissions(['clipboard-read', 'clipboard-write']);
	await openDemo(page);
	await loadDemoData(page);
	const part = data(page).getByTestId('code-part');
	await part.locator('summary').click();
	const code = part.getByTestId('analysis-code');
	await expect(code).toHaveValue(/fit_adjusted <- glm\(hypertension ~ cycling \+ age \+ diet \+ income, family = binomial, data = d\)/);
	await part.getByTestId('code-set').selectOption({ label: 'Optimal {Age, Diet quality, Family history of hypertension, Household income}' });
	await part.getByRole('radio', { name: 'Python (statsmodels)' }).check();
	await expect(code).toHaveValue(/smf\.glm\("hypertension ~ cycling \+ age \+ diet \+ family_history \+ income"/);
	await part.getByRole('button', { name: 'Copy code' }).click();
	await expect(part.getByRole('status')).toHaveText('Copied the Python (statsmodels) code.');
	expect(await page.evaluate(() => navigator.clipboard.readText())).toBe(await code.inputValue());
	const [file] = await Promise.all([page.waitForEvent('download'), part.getByRole('button', { name: 'Download .py file' }).click()]);
	expect(file.suggestedFilename()).toBe('cycling-to-work-and-hypertension-demo-study-analysis.py');
	const text = readFileSync((await file.path())!, 'utf8');
	expect(text).toBe(await code.inputValue());
	expect(text).toContain('d = pd.read_csv("cycling-hypertension.csv"');
	await part.screenshot({ path: 'test-results/analysis-code.png' });
});

test('a 0/1/2/3-coded column: the notice names it, its kind is stated beside each result, one click makes it categories', async ({ page }) => {
	await openDemo(page);
	await openSection(page, 'data');
	const chooser = page.waitForEvent('filechooser');
	await data(page).getByRole('button', { name: 'Load data file…' }).click();
	await (await chooser).setFiles({ name: 'coded-income.csv', mimeType: 'text/csv', buffer: codedIncomeCsv() });
	await expect(data(page).getByTestId('confounder-table')).toBeVisible({ timeout: 30_000 });
	const notice = data(page).getByTestId('category-codes');
	await expect(notice).toContainText("Column 'income' holds only the whole numbers 0, 1, 2 and 3: it looks like category codes.");
	await expect(notice).toContainText('residual confounding');
	await expect(candidate(page, 'income')).toContainText('continuous — values look like category codes 0, 1, 2 and 3');
	await expect(data(page).getByTestId('estimates-table')).toContainText('Household income (look like category codes)');
	await expect(data(page).locator('li[data-arrow="income>cycling"]')).toContainText('Household income: continuous — values look like category codes 0, 1, 2 and 3');
	await page.screenshot({ path: 'test-results/category-codes.png' });
	await notice.getByRole('button', { name: "Treat 'income' as categories" }).click();
	await expect(data(page).getByTestId('category-codes')).toHaveCount(0, { timeout: 30_000 });
	await expect(candidate(page, 'income')).toContainText('categorical, 4 levels (reference 0)', { timeout: 30_000 });
	// Now the income arrows read odds ratios per level against band 0, with the table.
	await expect(candidate(page, 'income')).toContainText('OR ');
	await candidate(page, 'income').getByRole('button', { name: 'Details of Household income' }).click();
	await expect(candidate(page, 'income').getByTestId('two-way-table').first()).toContainText('3 vs 0');
});

test('keyboard only: open a candidate’s details and copy the analysis code', async ({ page, context }) => {
	await context.grantPermissions(['clipboard-read', 'clipboard-write']);
	await openDemo(page);
	const section = data(page);
	await openDataByKeyboard(page);
	await section.getByRole('button', { name: 'Load demo data' }).focus();
	await page.keyboard.press('Enter');
	await expect(section.getByTestId('confounder-table')).toBeVisible({ timeout: 30_000 });
	// From the Confounder check heading, Tab reaches the first candidate's Details button.
	await section.getByTestId('confounder-part').locator('> summary').focus();
	const focusedName = () => page.evaluate(() => document.activeElement?.getAttribute('aria-label') ?? document.activeElement?.textContent?.trim() ?? '');
	for (let i = 0; i < 10 && !(await focusedName()).startsWith('Details'); i++) await page.keyboard.press('Tab');
	expect(await focusedName()).toBe('Details of Age');
	await page.keyboard.press('Enter');
	await expect(candidate(page, 'age').getByRole('button', { name: 'Hide details of Age' })).toHaveAttribute('aria-expanded', 'true');
	await expect(candidate(page, 'age')).toContainText('Within fifths of Age some confounding by it remains');
	// The analysis code: open with Enter, choose SAS with the arrow keys, copy with Enter.
	const part = section.getByTestId('code-part');
	await part.locator('summary').focus();
	await page.keyboard.press('Enter');
	await part.getByRole('radio', { name: 'R (glm)' }).focus();
	await page.keyboard.press('ArrowRight');
	await page.keyboard.press('ArrowRight');
	await expect(part.getByRole('radio', { name: 'SAS' })).toBeChecked();
	await expect(part.getByTestId('analysis-code')).toHaveValue(/proc logistic data=work\.cc;/);
	await part.getByRole('button', { name: 'Copy code' }).focus();
	await page.keyboard.press('Enter');
	await expect(part.getByRole('status')).toHaveText('Copied the SAS code.');
});

test('the Data section with the confounder check meets 4.5:1 text contrast', async ({ page }) => {
	await openDemo(page);
	await loadDemoData(page);
	await candidate(page, 'family_history').getByRole('button', { name: 'Details of Family history of hypertension' }).click();
	await data(page).getByTestId('code-part').locator('summary').click();
	const failures = await page.evaluate(() => {
		const parse = (c: string) => {
			const m = c.match(/rgba?\(([^)]+)\)/);
			if (!m) return null;
			const [r, g, b, a = 1] = m[1].split(/[ ,/]+/).filter(Boolean).map(Number);
			return { r, g, b, a };
		};
		// WCAG 2.1 relative luminance and contrast ratio.
		const lum = ({ r, g, b }: { r: number; g: number; b: number }) => {
			const f = (v: number) => ((v /= 255) <= 0.03928 ? v / 12.92 : ((v + 0.055) / 1.055) ** 2.4);
			return 0.2126 * f(r) + 0.7152 * f(g) + 0.0722 * f(b);
		};
		const background = (el: Element | null) => {
			for (; el; el = el.parentElement) {
				const c = parse(getComputedStyle(el).backgroundColor);
				if (c && c.a >= 0.9) return c;
			}
			return { r: 255, g: 255, b: 255 };
		};
		const out: string[] = [];
		const root = document.querySelector('section[data-section="data"]')!;
		const walker = document.createTreeWalker(root, NodeFilter.SHOW_TEXT);
		for (let n = walker.nextNode(); n; n = walker.nextNode()) {
			const text = n.textContent?.trim();
			const el = n.parentElement;
			if (!text || !el || !el.checkVisibility() || el.closest('.visually-hidden')) continue;
			const fg = parse(getComputedStyle(el).color)!;
			const [hi, lo] = [lum(fg), lum(background(el))].sort((a, b) => b - a);
			const ratio = (hi + 0.05) / (lo + 0.05);
			if (ratio < 4.5) out.push(`${ratio.toFixed(2)} "${text.slice(0, 40)}"`);
		}
		return out;
	});
	expect(failures).toEqual([]);
});
