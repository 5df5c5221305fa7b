/**
 * Section 6: production bundle size and time to interactive of the built page.
 * Sizes: the files of the static build (build/ of bench/app.ts's temporary checkout), raw and
 * gzip (zlib, level 9), split into what the page loads up front (index.html, its module
 * preloads and style sheets) and what it loads on demand (web workers, other chunks).
 * Time to interactive (fresh browser context, first visit, so the demo study opens; median of
 * at least 3 such cold loads): first contentful paint, the moment the analysis column first
 * shows a verdict, and TTI = the end of the last long task (> 50 ms, PerformanceObserver
 * 'longtask') before the first quiet second after the verdict is shown — the page then answers
 * input at once. The canvas shows a first view (SVG) until Cytoscape is loaded, on the first
 * interaction or once the page is quiet (src/lib/ui/Canvas.svelte); the moment the real canvas
 * has drawn and the longest task of that upgrade are given beside TTI. Targets (issue
 * "Interactive at 1,000 variables"): TTI ≤ 0.8 s, up-front JavaScript ≤ 250 KiB gzip.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, relative } from 'node:path';
import { loadavg } from 'node:os';
import { gzipSync } from 'node:zlib';
import type { Browser } from '@playwright/test';
import type { BuiltApp } from './app';
import { KEEP_NAMES_SHIM } from './editor';
import { fmtBytes, fmtMs, type Row, type Section } from './table';

function filesUnder(dir: string): string[] {
	return readdirSync(dir).flatMap((f) => {
		const p = join(dir, f);
		return statSync(p).isDirectory() ? filesUnder(p) : [p];
	});
}

function sizes(files: string[]): { raw: number; gzip: number } {
	let raw = 0;
	let gzip = 0;
	for (const f of files) {
		const bytes = readFileSync(f);
		raw += bytes.length;
		gzip += gzipSync(bytes, { level: 9 }).length;
	}
	return { raw, gzip };
}

export const TTI_TARGET_MS = 800;
export const UP_FRONT_TARGET_KIB = 250;

const load1 = () => loadavg()[0].toFixed(1);

export function bundleRows(app: BuiltApp): Row[] {
	const root = join(app.dir, 'build');
	const code = filesUnder(root).filter((f) => /\.(js|css|html)$/.test(f));
	const html = readFileSync(join(root, 'index.html'), 'utf8');
	const referenced = new Set([...html.matchAll(/(?:href|import\()\s*=?\s*"\.\/([^"]+)"/g)].map((m) => join(root, m[1])));
	referenced.add(join(root, 'index.html'));
	// What the preloaded modules import statically is loaded up front too, preloaded or not
	// (a small helper shared with a big library once pulled dagre into the first download
	// without appearing in index.html's list).
	const pending = [...referenced].filter((f) => f.endsWith('.js'));
	while (pending.length > 0) {
		const file = pending.pop()!;
		for (const m of readFileSync(file, 'utf8').matchAll(/\bimport\s*(?:\{[^}]*\}|\*\s*as\s*[\w$]+|[\w$]+)?\s*(?:from)?\s*"(\.{1,2}\/[^"]+\.js)"/g)) {
			const target = join(dirname(file), m[1]);
			if (!referenced.has(target)) {
				referenced.add(target);
				pending.push(target);
			}
		}
	}
	const upFront = code.filter((f) => referenced.has(f));
	const workers = code.filter((f) => f.includes('/workers/'));
	const other = code.filter((f) => !referenced.has(f) && !f.includes('/workers/'));
	const row = (what: string, files: string[]): Row => {
		const s = sizes(files);
		return { part: what, files: String(files.length), raw: fmtBytes(s.raw), gzip: fmtBytes(s.gzip) };
	};
	const upJs = sizes(upFront.filter((f) => f.endsWith('.js')));
	const kib = upJs.gzip / 1024;
	return [
		row('loaded up front (index.html, preloaded modules, CSS)', upFront),
		{
			part: `JavaScript loaded up front vs the ${UP_FRONT_TARGET_KIB} KiB gzip target`,
			files: String(upFront.filter((f) => f.endsWith('.js')).length),
			raw: fmtBytes(upJs.raw),
			gzip: `${kib.toFixed(1)} KiB = ${(kib / UP_FRONT_TARGET_KIB).toFixed(2)}× the target (${kib <= UP_FRONT_TARGET_KIB ? 'met' : 'not met'})`
		},
		...workers.map((w) => row(`worker ${relative(root, w).replace(/^_app\/immutable\/workers\//, '').replace(/-[\w-]+\.js$/, '')} (on demand)`, [w])),
		row('other chunks (on demand)', other),
		row('all code', code)
	];
}

interface Timing {
	fcp: number;
	verdict: number;
	tti: number;
	longTasks: number;
	/** The real canvas (Cytoscape) has drawn and the first view is gone. */
	canvas: number;
	/** The longest task after TTI up to `canvas` (the upgrade's). */
	upgradeTask: number;
}

async function timeToInteractive(browser: Browser, url: string): Promise<Timing> {
	const context = await browser.newContext({ viewport: { width: 1280, height: 800 } });
	const page = await context.newPage();
	await page.addInitScript(KEEP_NAMES_SHIM);
	await page.addInitScript(() => {
		const w = window as unknown as { __tti: { tasks: [number, number][]; verdict: number } };
		w.__tti = { tasks: [], verdict: -1 };
		new PerformanceObserver((list) => {
			for (const e of list.getEntries()) w.__tti.tasks.push([e.startTime, e.startTime + e.duration]);
		}).observe({ type: 'longtask', buffered: true });
		const ww = w as unknown as { __canvas: number };
		ww.__canvas = -1;
		const tick = () => {
			if (w.__tti.verdict < 0 && document.querySelector('[data-testid="verdict"]')) w.__tti.verdict = performance.now();
			if (document.querySelector('.canvas canvas') && !document.querySelector('[data-testid="static-view"]')) ww.__canvas = performance.now();
			if (w.__tti.verdict < 0 || ww.__canvas < 0) requestAnimationFrame(tick);
		};
		requestAnimationFrame(tick);
	});
	await page.goto(url);
	await page.waitForFunction(() => (window as unknown as { __tti: { verdict: number } }).__tti.verdict >= 0, null, { timeout: 60_000 });
	// Wait for one quiet second (no long task) after the verdict.
	const r = await page.evaluate(
		() =>
			new Promise<Timing>((resolve) => {
				const w = window as unknown as { __tti: { tasks: [number, number][]; verdict: number } };
				const check = () => {
					const now = performance.now();
					const lastEnd = Math.max(w.__tti.verdict, ...w.__tti.tasks.map((t) => t[1]));
					if (now - lastEnd >= 1000) {
						const paint = performance.getEntriesByName('first-contentful-paint')[0];
						resolve({ fcp: paint ? paint.startTime : NaN, verdict: w.__tti.verdict, tti: lastEnd, longTasks: w.__tti.tasks.length, canvas: NaN, upgradeTask: 0 });
					} else setTimeout(check, 100);
				};
				check();
			})
	);
	// Then the real canvas, which loads in the idle time that follows (no input is given).
	await page.waitForFunction(() => (window as unknown as { __canvas: number }).__canvas >= 0, null, { timeout: 60_000 });
	const after = await page.evaluate((tti) => {
		const w = window as unknown as { __tti: { tasks: [number, number][] }; __canvas: number };
		const upgrade = w.__tti.tasks.filter((t) => t[0] >= tti && t[0] <= w.__canvas + 100);
		return { canvas: w.__canvas, upgradeTask: Math.max(0, ...upgrade.map((t) => t[1] - t[0])) };
	}, r.tti);
	await context.close();
	return { ...r, ...after };
}

export async function benchBundle(app: BuiltApp, browser: Browser | null, url: string | null, repeats: number, why?: string): Promise<Section> {
	const rows = bundleRows(app);
	let note =
		'gzip level 9 of each file (what a server sending gzip transfers). The analysis worker starts when a diagram has more than 20 variables, the layout worker on a tidy layout of more than 60, the data worker when data are opened. ' +
		`Build time of the app (vite build): ${fmtMs(app.buildMs)}.`;
	if (browser && url) {
		const runs: Timing[] = [];
		const cold = Math.max(3, repeats);
		const loadBefore = load1();
		for (let i = 0; i < cold; i++) runs.push(await timeToInteractive(browser, url));
		const loadAfter = load1();
		runs.sort((a, b) => a.tti - b.tti);
		const m = runs[runs.length >> 1];
		const median = (f: (t: Timing) => number) => runs.map(f).sort((a, b) => a - b)[runs.length >> 1];
		rows.push({
			part: `time to interactive, first visit with the demo study (median of ${cold} cold loads, local server; load average ${loadBefore} → ${loadAfter})`,
			files: '',
			raw: `first paint ${fmtMs(m.fcp)}; verdict shown ${fmtMs(m.verdict)}`,
			gzip: `TTI ${fmtMs(m.tti)} (${m.longTasks} long tasks) = ${(m.tti / TTI_TARGET_MS).toFixed(2)}× the ${fmtMs(TTI_TARGET_MS)} target (${m.tti <= TTI_TARGET_MS ? 'met' : 'not met'})`
		});
		rows.push({
			part: 'the real canvas (Cytoscape) drawn, loaded in the idle time after TTI with no input',
			files: '',
			raw: `at ${fmtMs(median((t) => t.canvas))} (median)`,
			gzip: `longest task of that upgrade ${fmtMs(median((t) => t.upgradeTask))} (median)`
		});
		note +=
			' TTI = end of the last long task before a quiet second after the first verdict is on screen (all runs: ' +
			runs.map((t) => fmtMs(t.tti)).join(', ') +
			'). Until the real canvas is there the canvas shows the diagram as SVG; keys act on the diagram at once, and a click, drag or wheel on it starts the load and is replayed to Cytoscape (tests/e2e/first-view.e2e.ts).';
	}
	return { title: '6. Production bundle and time to interactive', rows, note, skipped: browser ? undefined : why };
}
