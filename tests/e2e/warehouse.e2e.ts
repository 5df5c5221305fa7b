// The Data section's "Summary from a database" panel in real Chromium: the SQL for the demo
// diagram in each dialect, copied; grouped counts (CSV), a Parquet file of rows and one line
// of moments loaded through it give the checks of the rows; the panel says no row-level data
// leave the database.
import { expect, test } from '@playwright/test';
import { readFileSync } from 'node:fs';
import { dataSection, loadDemoData, openDemo, openSection } from './helpers';

test('SQL for the current diagram, dialects, copy; grouped counts and Parquet load as rows', async ({ page, context }) => {
	await context.grantPermissions(['clipboard-read', 'clipboard-write']);
	await openDemo(page);
	await openSection(page, 'data');
	const section = dataSection(page);
	const panel = section.getByTestId('warehouse-sql');
	await panel.locator('summary').click();
	await expect(panel).toContainText('never one row per person: the rows stay in the database');
	const query = panel.getByTestId('warehouse-query');
	await expect(query).toContainText('COUNT(*) AS "n"');
	await expect(query).toContainText('"cycling"');
	await panel.getByTestId('warehouse-table').fill('clinic.visits');
	await panel.getByTestId('warehouse-dialect').selectOption('spark');
	await expect(query).toContainText('FROM `clinic`.`visits`');
	await panel.getByRole('button', { name: 'Copy SQL' }).click();
	await expect(panel).toContainText('SQL copied.');
	expect(await page.evaluate(() => navigator.clipboard.readText())).toContain('GROUP BY 1, 2, 3');
	await panel.getByTestId('warehouse-dialect').selectOption('duckdb');
	await page.screenshot({ path: 'test-results/warehouse-panel.png' });

	// Grouped counts of the demo study (a line per combination, written by DuckDB): read as rows.
	const csv = readFileSync('static/demo/cycling-hypertension.csv', 'utf8').trim().split('\n');
	const counts = new Map<string, number>();
	for (const line of csv.slice(1)) counts.set(line, (counts.get(line) ?? 0) + 1);
	const grouped = [`${csv[0]},n`, ...[...counts].map(([l, n]) => `${l},${n}`)].join('\n');
	await panel.getByTestId('warehouse-file').setInputFiles({ name: 'visits-grouped.csv', mimeType: 'text/csv', buffer: Buffer.from(grouped) });
	await expect(section.getByTestId('data-source')).toContainText('5,000 rows, 12 columns', { timeout: 30_000 });
	await expect(section.getByTestId('estimates-table')).toBeVisible({ timeout: 30_000 });
	const fromGroups = await section.getByTestId('estimates-table').innerText();
	await expect(section).toContainText(/46 tested/, { timeout: 30_000 });
	await expect(section.getByTestId('warehouse-grouped')).toContainText(/Grouped table: [\d,]+ lines stand for 5,000 rows \(counts in column 'n'\)\. A summary holds counts/);
	await section.getByTestId('data-source').scrollIntoViewIfNeeded();
	await page.screenshot({ path: 'test-results/warehouse-grouped.png' });
	// The report names the source: grouped counts, no row-level data.
	await page.getByRole('button', { name: /^▸?\s*Report/ }).click();
	const reportSection = page.locator('[data-section="report"]');
	await expect(reportSection.getByText('The report includes the data checks and estimates.')).toBeVisible();
	const [file] = await Promise.all([page.waitForEvent('download'), reportSection.getByRole('button', { name: 'HTML', exact: true }).click()]);
	const html = readFileSync((await file.path())!, 'utf8');
	expect(html).toMatch(/Source: grouped counts, [\d,]+ lines each read as as many rows as its count \(column &#39;n&#39;\); no row-level data were read\./);

	// A bad count: one message with the row and column; the earlier data stay.
	await panel.getByTestId('warehouse-file').setInputFiles({ name: 'bad.csv', mimeType: 'text/csv', buffer: Buffer.from('age,n\n40,3\n41,-1\n') });
	await expect(section.getByTestId('data-error')).toContainText("Row 3, column 'n': the count -1 is negative");
	await expect(section.getByTestId('data-source')).toContainText('visits-grouped.csv');

	// The same rows as Parquet (count column blank): the same estimates.
	await panel.getByTestId('warehouse-count').fill('');
	await panel.getByTestId('warehouse-file').setInputFiles('tests/fixtures/parquet/demo.parquet');
	await expect(section.getByTestId('data-source')).toContainText('demo.parquet', { timeout: 30_000 });
	await expect(section.getByTestId('estimates-table')).toBeVisible({ timeout: 30_000 });
	await expect.poll(() => section.getByTestId('estimates-table').innerText(), { timeout: 30_000 }).toBe(fromGroups);

	// And as the demo's own CSV.
	await loadDemoData(page);
	await expect.poll(() => section.getByTestId('estimates-table').innerText(), { timeout: 30_000 }).toBe(fromGroups);
	await page.screenshot({ path: 'test-results/warehouse-loaded.png', fullPage: false });
});
