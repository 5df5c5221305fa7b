import { test, expect } from '@playwright/test';

test('the app loads with no console error and no request beyond its own origin', async ({ page, baseURL }) => {
	const problems: string[] = [];
	const foreign: string[] = [];
	page.on('console', (msg) => {
		if (msg.type() === 'error') problems.push(msg.text());
	});
	page.on('pageerror', (err) => problems.push(err.message));
	page.on('request', (req) => {
		const url = new URL(req.url());
		if (!['data:', 'blob:'].includes(url.protocol) && url.origin !== new URL(baseURL!).origin) foreign.push(req.url());
	});
	await page.goto('/');
	await expect(page).toHaveTitle(/Causeway/);
	await page.waitForLoadState('networkidle');
	expect(problems).toEqual([]);
	expect(foreign).toEqual([]);
});
