// Privacy in real Chromium: while the app loads, is edited, opens a diagram file, loads data
// (the demo data and a CSV file of the user's) and exports, it makes no request beyond its own
// origin (page and worker requests alike); it sets no cookie, opens no IndexedDB, cache or
// service worker; localStorage holds only the diagram's autosave (never the data); and the
// shipped code has no analytics or beacon calls (the request log above is the proof that
// nothing is fetched; license comments in bundled libraries do hold addresses).
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { expect, test, type Page } from '@playwright/test';
import { addVariableByMouse, counts, openSection } from './helpers';

const MARKER = 'privacy-marker-4711';

function files(dir: string): string[] {
	return readdirSync(dir).flatMap((f) => (statSync(join(dir, f)).isDirectory() ? files(join(dir, f)) : [join(dir, f)]));
}

async function storageReport(page: Page) {
	return page.evaluate(async () => {
		const local: Record<string, string> = {};
		for (let i = 0; i < localStorage.length; i++) {
			const k = localStorage.key(i) as string;
			local[k] = localStorage.getItem(k) ?? '';
		}
		const session = Object.keys(sessionStorage);
		const databases = 'databases' in indexedDB ? (await indexedDB.databases()).map((d) => d.name) : [];
		// The autosave's crash-safe copy (src/lib/editor/durable-copy.ts): everything it holds.
		const durable = databases.includes('causeway')
			? await new Promise<string>((resolve) => {
					const open = indexedDB.open('causeway', 1);
					open.onerror = () => resolve('');
					open.onsuccess = () => {
						const all = open.result.transaction('autosave').objectStore('autosave').getAll();
						all.onsuccess = () => resolve(JSON.stringify(all.result));
						all.onerror = () => resolve('');
					};
				})
			: '';
		const cacheNames = 'caches' in window ? await caches.keys() : [];
		const workers = navigator.serviceWorker ? (await navigator.serviceWorker.getRegistrations()).length : 0;
		return { local, session, databases, durable, cacheNames, workers, cookie: document.cookie };
	});
}

test('no request leaves the origin while loading, editing, opening, loading data and exporting; data are not stored', async ({ page, context, baseURL }) => {
	test.setTimeout(180_000);
	const origin = new URL(baseURL as string).origin;
	const requests: string[] = [];
	context.on('request', (r) => requests.push(r.url()));
	const foreign = () => requests.filter((u) => !u.startsWith('data:') && !u.startsWith('blob:') && new URL(u).origin !== origin);

	// Load: a first visit opens the demo study.
	await page.goto('/');
	await expect.poll(() => page.evaluate(() => window.__causewayCanvas?.counts().variables ?? 0), { timeout: 20_000 }).toBe(13);

	// Edit.
	await addVariableByMouse(page, 'Privacy check', { x: 120, y: 520 });
	expect((await counts(page)).variables).toBe(14);

	// Open a diagram file.
	await page.locator('header.toolbar input[type=file]').setInputFiles({ name: 'small.dot', mimeType: 'text/vnd.graphviz', buffer: Buffer.from('digraph { age -> cycling; age -> hypertension; cycling -> hypertension; cycling [role=exposure]; hypertension [role=outcome] }') });
	await expect(page.getByTestId('message')).toContainText('Opened small.dot');
	await page.getByRole('button', { name: 'Undo' }).click();

	// Load data: the demo data, then a CSV file of the user's with a marker value.
	const data = page.locator('section[data-section="data"]');
	if ((await data.count()) > 0) {
		await openSection(page, 'data');
		await data.getByRole('button', { name: 'Load demo data' }).click();
		await expect(data.getByTestId('data-source')).toContainText('5,000 rows', { timeout: 30_000 });
		const csv = readFileSync('static/demo/cycling-hypertension.csv', 'utf8').split('\n').slice(0, 400);
		const marked = csv.map((line, i) => (line === '' ? line : `${line},${i === 0 ? 'site' : i % 2 ? MARKER : 'other-site'}`)).join('\n');
		const csvInput = data.locator('input[type=file]');
		await csvInput.first().setInputFiles({ name: 'mine.csv', mimeType: 'text/csv', buffer: Buffer.from(marked) });
		await expect(data.getByTestId('data-source')).toContainText('mine.csv', { timeout: 30_000 });
	} else test.info().annotations.push({ type: 'note', description: 'no Data section in this build: data loading not exercised' });

	// Export.
	const reportToggle = page.getByRole('button', { name: /^▸?\s*Report/ });
	if ((await reportToggle.count()) > 0) {
		await reportToggle.click();
		const report = page.locator('section[data-section="report"]');
		for (const name of ['SVG', 'PNG', 'HTML', 'Markdown']) {
			const [d] = await Promise.all([page.waitForEvent('download'), report.getByRole('button', { name, exact: true }).click()]);
			expect(await d.failure()).toBeNull();
		}
	}
	const [dot] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Save DOT' }).click()]);
	expect(await dot.failure()).toBeNull();

	await page.waitForTimeout(500); // let any late request show
	expect(requests.length).toBeGreaterThan(0);
	expect(foreign()).toEqual([]);

	// Nothing but the diagram's autosave is kept, and never the data.
	const stored = await storageReport(page);
	expect(Object.keys(stored.local).every((k) => k.startsWith('causeway.'))).toBe(true);
	const everything = Object.values(stored.local).join('\n');
	expect(everything).not.toContain(MARKER);
	expect(everything).not.toMatch(/age,income,diet/);
	// One database, the autosave's crash-safe copy of the diagram, and never the data.
	expect(stored.databases.filter((name) => name !== 'causeway')).toEqual([]);
	expect(stored.durable).not.toContain(MARKER);
	expect(stored.durable).not.toMatch(/age,income,diet/);
	if (stored.databases.includes('causeway')) expect(stored.durable).toContain('causeway.diagram');
	expect(stored.cacheNames).toEqual([]);
	expect(stored.workers).toBe(0);
	expect(stored.cookie).toBe('');
	expect(await context.cookies()).toEqual([]);

	// A reload brings back the diagram, not the data.
	await page.reload();
	await expect.poll(() => page.evaluate(() => window.__causewayCanvas?.counts().variables ?? 0), { timeout: 20_000 }).toBe(14);
	if ((await data.count()) > 0) await expect(data.getByTestId('data-source')).toHaveCount(0);
	expect(foreign()).toEqual([]);
});

test('the shipped code has no analytics or beacon calls', () => {
	const shipped = files('build').filter((f) => /\.(js|html)$/.test(f));
	expect(shipped.length).toBeGreaterThan(0);
	for (const f of shipped) {
		const text = readFileSync(f, 'utf8');
		expect(text, f).not.toMatch(/sendBeacon|google-analytics|googletagmanager|gtag\(|plausible\.io|matomo|mixpanel|segment\.(io|com)|sentry\.io|hotjar/i);
	}
});
