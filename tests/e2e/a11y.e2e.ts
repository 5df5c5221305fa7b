/**
 * Accessibility checks in the browser: text contrast of the page against WCAG 2.1 SC 1.4.3
 * (4.5:1, with the relative-luminance formula of the WCAG 2.1 glossary), a visible focus
 * indicator on everything reachable with Tab, and names for the main regions.
 */
import { test, expect } from '@playwright/test';
import { openSection, verdict } from './helpers';

test('every visible text meets 4.5:1 contrast, with the analysis, legend and dialogs open', async ({ page }) => {
	await page.goto('/');
	await expect(verdict(page)).toBeVisible();
	// A failing verdict, open reasons and the direct-effect list, so their colours are checked too.
	await page.getByRole('checkbox', { name: 'Body-mass index: in the planned set' }).check();
	await page.getByRole('checkbox', { name: 'Show sets for the direct effect' }).check();
	await page.getByRole('button', { name: 'Legend' }).click();
	// The sections whose code loads when opened are checked open, too.
	for (const id of ['review', 'data', 'report'] as const) await openSection(page, id);

	const check = () =>
		page.evaluate(() => {
			const parse = (c: string) => {
				const m = c.match(/rgba?\(([^)]+)\)/);
				if (!m) return null;
				const [r, g, b, a = 1] = m[1].split(/[ ,/]+/).filter(Boolean).map(Number);
				return { r, g, b, a };
			};
			const lum = ({ r, g, b }: { r: number; g: number; b: number }) => {
				const f = (v: number) => ((v /= 255) <= 0.03928 ? v / 12.92 : ((v + 0.055) / 1.055) ** 2.4);
				return 0.2126 * f(r) + 0.7152 * f(g) + 0.0722 * f(b);
			};
			const background = (el: Element | null): { r: number; g: number; b: number } => {
				for (; el; el = el.parentElement) {
					const c = parse(getComputedStyle(el).backgroundColor);
					if (c && c.a >= 0.9) return c;
				}
				return { r: 255, g: 255, b: 255 };
			};
			const failures: string[] = [];
			const walker = document.createTreeWalker(document.body, NodeFilter.SHOW_TEXT);
			for (let n = walker.nextNode(); n; n = walker.nextNode()) {
				const text = n.textContent?.trim();
				const el = n.parentElement;
				if (!text || !el) continue;
				const r = el.getBoundingClientRect();
				const style = getComputedStyle(el);
				if (r.width === 0 || r.height === 0 || style.visibility === 'hidden' || el.closest('[hidden], .visually-hidden, [disabled]')) continue;
				if (!el.checkVisibility()) continue;
				const fg = parse(style.color)!;
				const bg = background(el);
				const [hi, lo] = [lum(fg), lum(bg)].sort((a, b) => b - a);
				const ratio = (hi + 0.05) / (lo + 0.05);
				if (ratio < 4.5) failures.push(`${ratio.toFixed(2)} "${text.slice(0, 40)}" ${style.color} on rgb(${bg.r}, ${bg.g}, ${bg.b})`);
			}
			return failures;
		});
	expect(await check()).toEqual([]);
	await page.getByRole('navigation', { name: 'Diagram actions' }).getByRole('button', { name: 'About & cautions' }).click();
	await expect(page.getByRole('dialog', { name: 'About Causeway and cautions' })).toContainText('Data never leave your machine');
	expect(await check()).toEqual([]);
});

test('every control reached with Tab shows a visible focus indicator', async ({ page }) => {
	await page.goto('/');
	await expect(verdict(page)).toBeVisible();
	const seen = new Set<string>();
	for (let i = 0; i < 40; i++) {
		await page.keyboard.press('Tab');
		const info = await page.evaluate(() => {
			const el = document.activeElement as HTMLElement | null;
			if (!el || el === document.body) return null;
			const s = getComputedStyle(el);
			return { name: `${el.tagName} ${el.getAttribute('aria-label') ?? el.textContent?.trim().slice(0, 30)}`, outline: s.outlineStyle !== 'none' && parseFloat(s.outlineWidth) >= 2 };
		});
		if (!info) continue;
		seen.add(info.name);
		expect(info.outline, `focus ring on ${info.name}`).toBe(true);
	}
	expect(seen.size).toBeGreaterThan(15);
	await expect(page.getByRole('application', { name: 'Diagram canvas' })).toHaveCount(1);
	await expect(page.getByRole('complementary', { name: 'Analysis' })).toHaveCount(1);
});
