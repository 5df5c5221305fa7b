/**
 * The Report section in real Chromium: every export downloaded from the app and checked
 * (byte-equal to the library's output for the same diagram, which the CLI also uses; the SVG
 * and HTML parsed by independent parsers; the PNG's size read from its header), the edited
 * draft paragraph in the report, the print view, and share links (a good one restores the
 * diagram exactly in a fresh browser; a damaged one changes nothing and says why).
 */
import { test, expect, type Page, type Download } from '@playwright/test';
import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { DOMParser } from '@xmldom/xmldom';
import { parse } from 'parse5';
import { message, verdict, watchPage } from './helpers';

const DEMO_PATH = 'static/demo/cycling-hypertension.causeway.json';
const DEMO = JSON.parse(readFileSync(DEMO_PATH, 'utf8')) as { title: string };
const EXTENSION: Record<string, string> = {
	svg: '.svg',
	tikz: '.tex',
	dot: '.dot',
	json: '.causeway.json',
	'variables-csv': '.variables.csv',
	'arrows-csv': '.arrows.csv',
	'sets-csv': '.sets.csv',
	'sets-md': '.sets.md',
	'report-md': '.report.md',
	'report-html': '.report.html'
};

/** What `causeway export` writes for the demo (the bundled command line, built before the tests). */
function cli(format: string, ...options: string[]): string {
	return execFileSync('node', ['bin/causeway.js', 'export', DEMO_PATH, '--format', format, ...options], { encoding: 'utf8' });
}
test.beforeAll(() => {
	execFileSync('node', ['scripts/build-cli.mjs']);
});
const STEM = 'cycling-to-work-and-hypertension-demo-study';
const report = (page: Page) => page.locator('[data-section="report"]');

async function openReport(page: Page) {
	await page.goto('/');
	await expect(verdict(page)).toBeVisible({ timeout: 20_000 });
	await page.getByRole('button', { name: /^▸?\s*Report/ }).click();
	await expect(report(page).getByRole('button', { name: 'SVG' })).toBeVisible();
}

async function download(page: Page, name: string | RegExp): Promise<{ file: Download; text: string }> {
	const [file] = await Promise.all([page.waitForEvent('download'), report(page).getByRole('button', { name, exact: typeof name === 'string' }).click()]);
	return { file, text: readFileSync((await file.path())!, 'utf8') };
}

test('every export downloads from the Report section and matches the command line', async ({ page, baseURL }) => {
	const problems = watchPage(page, baseURL!);
	await openReport(page);
	const buttons: [string, string][] = [
		['svg', 'SVG'],
		['variables-csv', 'Variables CSV'],
		['arrows-csv', 'Arrows CSV'],
		['sets-csv', 'Sets CSV'],
		['sets-md', 'Sets Markdown'],
		['json', 'Causeway JSON'],
		['dot', 'DOT']
	];
	for (const [format, label] of buttons) {
		const { file, text } = await download(page, label);
		expect(file.suggestedFilename()).toBe(`${STEM}${EXTENSION[format]}`);
		expect(text, format).toBe(cli(format));
	}
	const tikz = await download(page, 'TikZ (LaTeX)');
	expect(tikz.text).toBe(cli('tikz', '--standalone'));

	// The SVG is well-formed XML with the labels as text.
	const svg = (await download(page, 'SVG')).text;
	const errors: string[] = [];
	const doc = new DOMParser({ onError: (level, msg) => level !== 'warning' && errors.push(msg) }).parseFromString(svg, 'image/svg+xml');
	expect(errors).toEqual([]);
	expect(doc.documentElement!.textContent).toContain('Commutes by bicycle');

	// Black and white, without legend.
	await report(page).getByLabel('Black and white').check();
	await report(page).getByLabel('Legend').uncheck();
	expect((await download(page, 'SVG')).text).toBe(cli('svg', '--mono', '--no-legend'));

	// PNG at 3×: the header's size is three times the SVG's.
	await report(page).getByLabel('PNG scale').selectOption('3');
	const [png] = await Promise.all([page.waitForEvent('download'), report(page).getByRole('button', { name: 'PNG' }).click()]);
	const bytes = readFileSync((await png.path())!);
	expect(bytes.subarray(1, 4).toString()).toBe('PNG');
	const width = Number(/width="(\d+)"/.exec(cli('svg', '--mono', '--no-legend'))![1]);
	expect(bytes.readUInt32BE(16)).toBe(width * 3);

	// Reports: HTML parsed as a browser would; Markdown equal to the library's apart from the date.
	const html = (await download(page, 'HTML')).text;
	const now = new Date();
	const today = `${now.getFullYear()}-${String(now.getMonth() + 1).padStart(2, '0')}-${String(now.getDate()).padStart(2, '0')}`;
	expect(html).toContain(`Causeway 0.1.0 on ${today}`);
	expect(html).not.toMatch(/<script/i);
	const tags: string[] = [];
	const walk = (n: object) => {
		if ('tagName' in n) tags.push(String(n.tagName));
		for (const c of ('childNodes' in n ? (n.childNodes as object[]) : [])) walk(c);
	};
	walk(parse(html));
	expect(tags).toContain('svg');
	expect(tags).not.toContain('script');
	expect(html).toContain('Minimal sufficient adjustment sets');
	const md = (await download(page, 'Markdown')).text;
	expect(md).toBe(cli('report-md', '--mono', '--date', today));
	expect(problems).toEqual([]);
});

test('the edited draft paragraph goes into the report and is saved with the diagram; print view opens the report', async ({ page }) => {
	await openReport(page);
	const draft = report(page).getByLabel(/Draft paragraph for the analysis plan/);
	await expect(draft).toHaveValue(/We will estimate the total effect of Commutes by bicycle on Hypertension/);
	await draft.fill('Our team will adjust for age, income and diet <b>as planned</b>.');
	await draft.blur();
	const md = (await download(page, 'Markdown')).text;
	expect(md).toContain('> Our team will adjust for age, income and diet \\<b\\>as planned\\</b\\>.');
	const json = JSON.parse((await download(page, 'Causeway JSON')).text);
	expect(json.reportDraft).toBe('Our team will adjust for age, income and diet <b>as planned</b>.');
	// Undo brings back the generated text.
	await page.keyboard.press('Control+z');
	await expect(draft).toHaveValue(/We will estimate the total effect/);

	const [popup] = await Promise.all([page.waitForEvent('popup'), report(page).getByRole('button', { name: 'Print view (PDF)' }).click()]);
	await popup.waitForLoadState();
	await expect(popup.locator('h1')).toHaveText(DEMO.title);
	await expect(popup.locator('figure svg')).toBeVisible();
	await expect(popup.locator('.verdict')).toContainText('Sufficient');
	await popup.screenshot({ path: 'test-results/export-report-print-view.png', fullPage: true });
	await popup.close();

	const [figure] = await Promise.all([page.waitForEvent('popup'), report(page).getByRole('button', { name: 'Print view', exact: true }).click()]);
	await figure.waitForLoadState();
	await expect(figure.locator('svg title')).toHaveText(DEMO.title);
	await figure.close();
});

test('a share link restores the diagram exactly in another browser; a damaged one changes nothing', async ({ page, browser, baseURL }) => {
	await openReport(page);
	await page.getByRole('button', { name: 'Copy share link' }).click();
	const link = await report(page).getByRole('textbox', { name: 'Share link' }).inputValue();
	expect(link.startsWith(`${baseURL}/#diagram=1.`)).toBe(true);

	const other = await browser.newContext();
	const fresh = await other.newPage();
	const problems = watchPage(fresh, baseURL!);
	await fresh.addInitScript(() => localStorage.setItem('causeway.visited', '1'));
	await fresh.goto(link);
	// An empty diagram before (not a first visit), the shared one after, as an undoable step.
	await expect(fresh.getByRole('textbox', { name: 'Diagram title' })).toHaveValue(DEMO.title, { timeout: 20_000 });
	await expect(fresh.getByRole('button', { name: 'Undo' })).toHaveAttribute('title', 'Undo: Open a shared diagram (Ctrl+Z)');
	await expect(fresh).toHaveURL(`${baseURL}/`); // the fragment is removed after opening
	await fresh.getByRole('button', { name: /^▸?\s*Report/ }).click();
	const [saved] = await Promise.all([fresh.waitForEvent('download'), fresh.locator('[data-section="report"]').getByRole('button', { name: 'Causeway JSON' }).click()]);
	expect(readFileSync((await saved.path())!, 'utf8')).toBe(cli('json'));

	// A damaged link: a clear message, and the diagram already there stays.
	await fresh.goto(`${baseURL}/#diagram=1.${link.split('.').pop()!.slice(0, 200)}`);
	await expect(message(fresh)).toContainText('The shared diagram was not opened — The share link is damaged');
	await expect(message(fresh)).toContainText('Your current diagram is unchanged');
	await expect(verdict(fresh)).toContainText('Adjusting for Age, Diet quality and Household income is sufficient');
	expect(problems).toEqual([]);
	await other.close();
});
