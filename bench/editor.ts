/**
 * Section 5: the editor in headless Chromium. For diagrams of 50, 300 and 1,000 variables
 * (twice as many arrows) it times, inside the page, from the key press (the keydown event's
 * timestamp) to the first animation frame that shows the refreshed analysis:
 *   - a question edit (P: the selected variable in or out of the planned set) until the
 *     verdict shows the new set and nothing is pending;
 *   - a structural edit (U: measured / unmeasured) until the claims are listed again.
 * Then frames per second while dragging a variable of a 500-variable diagram with the mouse.
 * Diagrams are loaded as the autosaved diagram (the app restores it on opening).
 */
import type { Browser, Page } from '@playwright/test';
import { xorshift } from './random-dag';
import { fmtInt, fmtMs, type Row, type Section } from './table';

/** A seeded random diagram: arrows from lower to higher index (≤ 25 apart), grid positions. */
export function editorDiagram(n: number): object {
	const rand = xorshift(4242 + n);
	const m = 2 * n;
	const seen = new Set<string>();
	const arrows: { from: string; to: string }[] = [];
	while (arrows.length < m) {
		const a = Math.floor(rand() * n);
		const b = a + 1 + Math.floor(rand() * 25);
		if (b >= n || seen.has(`${a},${b}`)) continue;
		seen.add(`${a},${b}`);
		arrows.push({ from: `v${a}`, to: `v${b}` });
	}
	const cols = Math.ceil(Math.sqrt(n * 1.6));
	return {
		format: 'causeway.diagram',
		version: 1,
		title: `Benchmark diagram (${n} variables)`,
		variables: Array.from({ length: n }, (_, i) => ({ id: `v${i}`, label: `Variable ${i}`, measured: i % 13 !== 5, x: (i % cols) * 170, y: Math.floor(i / cols) * 110 })),
		arrows,
		exposures: [`v${Math.floor(n * 0.3)}`],
		outcomes: [`v${Math.floor(n * 0.6)}`],
		adjusted: []
	};
}

/**
 * tsx compiles this file with esbuild's keepNames, which wraps named functions inside the
 * callbacks sent to page.evaluate in a `__name(fn, "name")` helper the page does not have.
 */
export const KEEP_NAMES_SHIM = 'globalThis.__name = (fn) => fn;';

async function openDiagram(browser: Browser, url: string, diagram: object): Promise<Page> {
	const context = await browser.newContext({ viewport: { width: 1280, height: 800 } });
	const page = await context.newPage();
	await page.addInitScript(KEEP_NAMES_SHIM);
	await page.addInitScript((text) => {
		localStorage.setItem('causeway.visited', '1');
		localStorage.setItem('causeway.autosave.v1', text);
	}, JSON.stringify(diagram));
	await page.goto(url);
	await page.getByTestId('verdict').waitFor({ timeout: 240_000 });
	await waitForClaims(page);
	return page;
}

async function waitForClaims(page: Page): Promise<void> {
	await page.waitForFunction(() => /\d+\+? claims/.test(document.querySelector('[data-section="claims"] h2')?.textContent ?? ''), null, { timeout: 240_000, polling: 100 });
}

async function select(page: Page, id: string): Promise<void> {
	const box = await page.evaluate((v) => (window as unknown as { __causewayCanvas: { nodeBox(id: string): { x: number; y: number; width: number; height: number } | null } }).__causewayCanvas.nodeBox(v), id);
	if (!box) throw new Error(`no variable ${id} on the canvas`);
	await page.mouse.click(box.x + box.width / 2, box.y + box.height / 2);
}

/**
 * Presses `key` and returns the milliseconds from its keydown to the first frame where the
 * refreshed analysis is shown (see the section's note), measured in the page.
 */
async function timeEdit(page: Page, key: string, kind: 'question' | 'structure'): Promise<number> {
	await page.evaluate((k) => {
		const text = (sel: string) => document.querySelector(sel)?.textContent ?? '';
		const state = { t0: -1, done: -1, saw: false, verdict: text('[data-testid="verdict"]'), claims: text('[data-section="claims"] h2') };
		(window as unknown as { __bench: typeof state }).__bench = state;
		window.addEventListener('keydown', (e) => {
			if (state.t0 < 0) state.t0 = e.timeStamp;
		}, { capture: true, once: true });
		const tick = () => {
			if (state.t0 >= 0) {
				const working = document.querySelector('[data-testid="analysis-progress"]') !== null;
				if (working) state.saw = true;
				const verdict = text('[data-testid="verdict"]');
				const claims = text('[data-section="claims"] h2');
				const ready = !working && verdict !== '' && /\d+\+? claims/.test(claims);
				const changed = k === 'question' ? verdict !== state.verdict : state.saw || claims !== state.claims || verdict !== state.verdict;
				if (ready && changed) {
					state.done = performance.now();
					return;
				}
			}
			requestAnimationFrame(tick);
		};
		requestAnimationFrame(tick);
	}, kind);
	await page.keyboard.press(key);
	try {
		await page.waitForFunction(() => (window as unknown as { __bench: { done: number } }).__bench.done >= 0, null, { timeout: EDIT_TIMEOUT, polling: 50 });
	} catch {
		return NaN; // shown as "> timeout" in the table
	}
	return page.evaluate(() => {
		const s = (window as unknown as { __bench: { t0: number; done: number } }).__bench;
		return s.done - s.t0;
	});
}

/** Longest wait for one edit's refreshed analysis before it is reported as not done. */
const EDIT_TIMEOUT = 150_000;

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[xs.length >> 1];
const fmtRun = (t: number) => (Number.isNaN(t) ? `> ${EDIT_TIMEOUT / 1000} s` : t < 1000 ? t.toFixed(0) : `${(t / 1000).toFixed(1)}k`);
const fmtMedian = (xs: number[]) => (xs.some(Number.isNaN) ? `${xs.filter(Number.isNaN).length} of ${xs.length} runs > ${EDIT_TIMEOUT / 1000} s` : fmtMs(median(xs)));

export async function benchEditor(browser: Browser, url: string, sizes: number[], dragSize: number, repeats: number): Promise<Section> {
	const rows: Row[] = [];
	for (const n of sizes) {
		try {
			rows.push(await benchSize(browser, url, n, n >= 1000 ? 1 : repeats));
		} catch (e) {
			rows.push({ variables: fmtInt(n), arrows: fmtInt(2 * n), 'open + first full analysis': `failed: ${e instanceof Error ? e.message.split('\n')[0] : String(e)}` });
		}
	}
	let drag: Row;
	try {
		drag = await benchDrag(browser, url, dragSize);
	} catch (e) {
		drag = { variables: `${fmtInt(dragSize)} (drag)`, arrows: fmtInt(2 * dragSize), 'open + first full analysis': `failed: ${e instanceof Error ? e.message.split('\n')[0] : String(e)}` };
	}
	return {
		title: '5. The editor (headless Chromium, software rendering)',
		rows: [...rows, drag],
		note: NOTE(dragSize)
	};
}

async function benchSize(browser: Browser, url: string, n: number, repeats: number): Promise<Row> {
	const t0 = performance.now();
	const page = await openDiagram(browser, url, editorDiagram(n));
	const openMs = performance.now() - t0;
	const claimsText = (await page.locator('[data-section="claims"] h2').textContent()) ?? '';
	// A confounder-like variable between exposure and outcome for P; a low index for U,
	// so that it appears in the first pairs the (capped) claims listing reaches.
	await select(page, `v${Math.floor(n * 0.3) - 1}`);
	const question: number[] = [];
	for (let i = 0; i < repeats; i++) question.push(await timeEdit(page, 'p', 'question'));
	await select(page, 'v1');
	const structure: number[] = [];
	for (let i = 0; i < repeats; i++) structure.push(await timeEdit(page, 'u', 'structure'));
	await page.context().close();
	return {
		variables: fmtInt(n),
		arrows: fmtInt(2 * n),
		'open + first full analysis': fmtMs(openMs),
		claims: /\d+\+? claims/.exec(claimsText)?.[0] ?? claimsText,
		'question edit → verdict (median)': fmtMedian(question),
		'question edit: all runs': question.map(fmtRun).join(', ') + ' ms',
		'structural edit → claims listed (median)': fmtMedian(structure),
		'structural edit: all runs': structure.map(fmtRun).join(', ') + ' ms'
	};
}

const NOTE = (dragSize: number): string =>
	'Times are taken in the page: from the keydown event to the first animation frame whose DOM shows the new analysis. ' +
	'Question edit: P toggles a variable in the planned set; done when the verdict names the new set and no analysis is pending (claims are reused, only the question is re-analysed, in the worker). ' +
	'Structural edit: U toggles a variable unmeasured; done when the claims are listed again (capped at 20,000 pairs by the app), so this includes the whole listing. ' +
	`Drag: the mouse drags a variable of a ${dragSize}-variable diagram in 60 steps; frames counted with requestAnimationFrame while dragging; the drag needs no new analysis (positions are not part of it). ` +
	'Chromium runs with --disable-gpu (Cytoscape draws on a 2D canvas in software), on the machine below. ' +
	'Edits on the 1,000-variable diagram are timed once (each can take tens of seconds on a busy 2-core machine).';

async function benchDrag(browser: Browser, url: string, n: number): Promise<Row> {
	const page = await openDiagram(browser, url, editorDiagram(n));
	const id = `v${Math.floor(n / 2)}`;
	const box = await page.evaluate((v) => (window as unknown as { __causewayCanvas: { nodeBox(id: string): { x: number; y: number; width: number; height: number } | null } }).__causewayCanvas.nodeBox(v), id);
	if (!box) throw new Error(`no variable ${id}`);
	const x0 = box.x + box.width / 2;
	const y0 = box.y + box.height / 2;
	await page.mouse.move(x0, y0);
	await page.mouse.down();
	await page.mouse.move(x0 + 3, y0 + 3);
	await page.evaluate(() => {
		const s = { frames: 0, start: performance.now(), last: performance.now(), maxGap: 0, stop: false };
		(window as unknown as { __drag: typeof s }).__drag = s;
		const tick = (t: number) => {
			if (s.stop) return;
			s.frames++;
			s.maxGap = Math.max(s.maxGap, t - s.last);
			s.last = t;
			requestAnimationFrame(tick);
		};
		requestAnimationFrame(tick);
	});
	for (let i = 1; i <= 60; i++) await page.mouse.move(x0 + 3 + i * 4, y0 + 3 + Math.round(40 * Math.sin(i / 10)));
	const r = await page.evaluate(() => {
		const s = (window as unknown as { __drag: { frames: number; start: number; last: number; maxGap: number; stop: boolean } }).__drag;
		s.stop = true;
		return { frames: s.frames, ms: performance.now() - s.start, maxGap: s.maxGap };
	});
	await page.mouse.up();
	const after = await page.evaluate((v) => (window as unknown as { __causewayCanvas: { nodeBox(id: string): { x: number; y: number } | null } }).__causewayCanvas.nodeBox(v), id);
	const moved = after ? Math.hypot(after.x - box.x, after.y - box.y) : 0;
	await page.context().close();
	return {
		variables: `${fmtInt(n)} (drag)`,
		arrows: fmtInt(2 * n),
		'open + first full analysis': '',
		claims: '',
		'question edit → verdict (median)': `${((r.frames * 1000) / r.ms).toFixed(0)} frames/s while dragging`,
		'question edit: all runs': `${r.frames} frames in ${fmtMs(r.ms)}; longest frame ${fmtMs(r.maxGap)}`,
		'structural edit → claims listed (median)': `variable moved ${moved.toFixed(0)} px`,
		'structural edit: all runs': ''
	};
}
