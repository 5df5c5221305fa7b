/**
 * `npm run bench`: every figure and ratio of the performance issue, measured in one run,
 * printed as Markdown and (full runs) written to bench/RESULTS.md with the machine's
 * description. Timings are figures, never pass/fail.
 *
 *   npm run bench                 full run (about 10–15 minutes on a 2-core machine)
 *   npm run bench -- --quick      smaller sizes of every section (about 2–3 minutes); not written
 *   npm run bench -- --only=1,3   some sections only (1 d-sep, 2 listing, 3 claims, 4 data (4c: only the
 *                                 million-row reading, commands and R; 4d: the Data section at 10⁶ rows in Chromium),
 *                                 5 editor, 6 bundle, 7 reviewer tools, 8 paths, cli command line); not written
 *   npm run bench -- --only=layout   layout and SVG export of large diagrams (bench/layout.ts)
 *   npm run bench -- --only=warehouse   grouped counts from DuckDB vs the rows (bench/warehouse.ts)
 *   --no-write / --write          override whether bench/RESULTS.md is written
 *
 * A section whose tool is missing (networkx, R, Chromium) prints why and what it skipped.
 */
import { existsSync, writeFileSync } from 'node:fs';
import { benchDsep } from './dsep';
import { benchListing } from './listing';
import { benchClaims } from './claims';
import { benchData } from './data';
import { benchLogistic } from './logistic';
import { benchDataScale } from './data-scale';
import { benchDataBrowser } from './data-browser';
import { benchEditor } from './editor';
import { benchBundle } from './bundle';
import { benchPaths } from './paths';
import { benchLayout } from './layout';
import { benchCli } from './cli';
import { benchWarehouse } from './warehouse';
import { buildApp, launchChromium, removeApp, serveApp, type BuiltApp } from './app';
import { describeMachine } from './machine';
import { chromium } from './tools';
import { fmtMs, renderSection, type Section } from './table';

const args = process.argv.slice(2);
const quick = args.includes('--quick');
const onlyArg = args.find((a) => a.startsWith('--only='));
const only = onlyArg ? new Set(onlyArg.slice('--only='.length).split(',')) : null;
const write = args.includes('--write') || (!args.includes('--no-write') && !quick && !only);
const wanted = (id: string) => only === null || only.has(id);

const output: string[] = [];
function emit(text: string): void {
	console.log(text);
	output.push(text);
}

async function section(id: string, run: () => Section | Promise<Section>): Promise<void> {
	if (!wanted(id)) return;
	const t0 = performance.now();
	let s: Section;
	try {
		s = await run();
	} catch (e) {
		s = { title: `${id}. (failed)`, rows: [], skipped: `the section failed: ${e instanceof Error ? e.message.split('\n')[0] : String(e)}` };
	}
	emit(renderSection(s) + `\n_Section time: ${fmtMs(performance.now() - t0)}._\n`);
}

async function main(): Promise<void> {
	const started = performance.now();
	emit(`# Benchmark results\n\nRun: ${new Date().toISOString()} — \`npm run bench${quick ? ' -- --quick' : ''}\`\n\n${describeMachine()}\n`);

	await section('1', () => benchDsep(quick ? [100, 1_000, 10_000] : [100, 1_000, 10_000, 100_000]));
	await section('2', () => benchListing(quick ? [1_000] : [1_000, 10_000], 200));
	await section('3', () => benchClaims(quick ? [50, 200] : [50, 200, 1_000]));
	await section('4', () => benchData(quick ? [10_000] : [10_000, 100_000, 1_000_000]));
	await section('4', () => benchLogistic(quick ? 100_000 : 1_000_000, quick ? 1 : 3));
	await section(only?.has('4c') ? '4c' : '4', () => benchDataScale(quick ? 100_000 : 1_000_000, quick ? 1 : 3));

	if (wanted('5') || wanted('6') || wanted('4d')) {
		let app: BuiltApp | null = null;
		try {
			app = buildApp();
		} catch (e) {
			const why = `the app could not be built: ${e instanceof Error ? e.message.split('\n')[0] : String(e)}`;
			await section('5', () => ({ title: '5. The editor', rows: [], skipped: why }));
			await section('6', () => ({ title: '6. Production bundle and time to interactive', rows: [], skipped: why }));
		}
		if (app) {
			const built = app;
			const c = chromium();
			const server = c ? await serveApp(built) : null;
			const browser = c ? await launchChromium(c.path) : null;
			const noBrowser = 'Chromium not found (apt-get install chromium, or set CHROMIUM_PATH): browser timings skipped';
			try {
				await section('5', async () =>
					browser && server
						? benchEditor(browser, server.url, quick ? [50] : [50, 300, 1_000], quick ? 200 : 500, quick ? 1 : 5)
						: { title: '5. The editor', rows: [], skipped: noBrowser }
				);
				await section('6', () => benchBundle(built, browser, server?.url ?? null, quick ? 1 : 3, noBrowser));
				await section('4d', () => benchDataBrowser(browser, server?.url ?? null, quick ? 100_000 : 1_000_000));
			} finally {
				await browser?.close();
				server?.stop();
				removeApp(built);
			}
		}
	}

	if (wanted('7')) {
		if (existsSync(new URL('./review.ts', import.meta.url))) {
			const review = (await import('./review')) as { reviewBenchmarkSection?: () => Section };
			const make = review.reviewBenchmarkSection;
			if (make)
				await section('7', () => {
					const s = make();
					return { ...s, title: `7. ${s.title}` };
				});
			else emit('### 7. Reviewer tools\n\nSkipped: bench/review.ts exports no reviewBenchmarkSection().\n');
		} else emit('### 7. Reviewer tools\n\nSkipped: bench/review.ts is not there.\n');
	}

	await section('8', () => benchPaths(quick ? [300] : [300, 1_000], 3));
	await section('layout', () => benchLayout(quick));
	await section('cli', () => benchCli(quick));
	await section('warehouse', () => benchWarehouse(quick ? 100_000 : 1_000_000));

	emit(`_Whole run: ${fmtMs(performance.now() - started)}._`);
	if (write) writeFileSync(new URL('./RESULTS.md', import.meta.url), output.join('\n') + '\n');
}

main().catch((e: unknown) => {
	console.error(e instanceof Error ? e.message : String(e));
	process.exit(1);
});
