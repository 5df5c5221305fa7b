/**
 * The code's layers read one way (DEVELOPERS.md, "Architecture"): checks anyone can also make
 * with `git grep` and `wc -l`, run on every test run so that a slip shows at once.
 *
 *  (a) nothing outside src/lib/ui imports from it, except the page (src/routes);
 *  (b) the engine (src/lib/causal) and the data side (src/lib/stats) import nothing from the
 *      UI, the editor, Svelte or Cytoscape, and have no `any` type;
 *  (c) the command-line bundle holds no Cytoscape (and no UI code): the imports followed from
 *      src/cli/main.ts, and dist-cli/meta.json when the command is built;
 *  (d) no hand-written source file is over 450 lines;
 *
 * and the workers reach the engine through its façade only.
 */
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { codeOnly, importSpecifiers, lineCount, packageOf, reachableFrom, readSource, resolveImport, ROOT, sourceFiles } from './source-files';
import { readBundleMeta } from './cli/bundle-meta';

const CODE = ['.ts', '.js', '.mjs', '.svelte'];

/** `file: import` for every import of `files` that `bad` says no to. */
function badImports(files: readonly string[], bad: (target: string | null, spec: string) => boolean): string[] {
	return files.flatMap((file) => importSpecifiers(readSource(file)).flatMap((spec) => (bad(resolveImport(file, spec), spec) ? [`${file}: ${spec}`] : [])));
}

describe('layers', () => {
	it('(a) only src/lib/ui itself and the page (src/routes) import from src/lib/ui', () => {
		const outside = [...sourceFiles('src', CODE), ...sourceFiles('bench', CODE), ...sourceFiles('scripts', CODE)].filter(
			(f) => !f.startsWith('src/lib/ui/') && !f.startsWith('src/routes/')
		);
		expect(outside.length).toBeGreaterThan(100);
		expect(badImports(outside, (target) => target !== null && target.startsWith('src/lib/ui/'))).toEqual([]);
		// The same scan sees the page's import of the app.
		expect(badImports(['src/routes/+page.svelte'], (target) => target !== null && target.startsWith('src/lib/ui/'))).toEqual(['src/routes/+page.svelte: $lib/ui/App.svelte']);
	});

	it('(b) the engine and the data side import nothing from the UI, the editor, Svelte or Cytoscape', () => {
		const files = [...sourceFiles('src/lib/causal', CODE), ...sourceFiles('src/lib/stats', CODE)];
		expect(files.length).toBeGreaterThan(50);
		const forbidden = (target: string | null, spec: string) => {
			const pkg = packageOf(spec);
			if (pkg !== null) return pkg === 'svelte' || pkg.startsWith('@sveltejs/') || pkg.startsWith('cytoscape');
			return target !== null && (target.startsWith('src/lib/ui/') || target.startsWith('src/lib/editor/') || target.endsWith('.svelte'));
		};
		expect(badImports(files, forbidden)).toEqual([]);
	});

	it('(b) the engine and the data side have no `any` type', () => {
		const files = [...sourceFiles('src/lib/causal', ['.ts']), ...sourceFiles('src/lib/stats', ['.ts'])];
		const found = files.flatMap((file) =>
			codeOnly(readSource(file), true)
				.split('\n')
				.flatMap((line, k) => (/\bany\b/.test(line) ? [`${file}:${k + 1}: ${line.trim()}`] : []))
		);
		expect(found).toEqual([]);
		// The scan finds the word in code, not in comments or strings.
		expect(codeOnly("const a: any = 1; // any\nconst b = 'any';\n/* any */ let c: Array<any>;", true).split('\n').map((l) => /\bany\b/.test(l))).toEqual([true, false, true]);
	});

	it('the workers call the engine through its façade (src/lib/causal/index.ts) only', () => {
		const files = sourceFiles('src/lib/workers', CODE);
		const internal = (target: string | null) => target !== null && target.startsWith('src/lib/causal/') && target !== 'src/lib/causal/index.ts';
		expect(badImports(files, internal)).toEqual([]);
		expect(badImports(files, (target) => target === 'src/lib/causal/index.ts').length).toBeGreaterThan(0);
	});

	it('(c) the command line reaches no Cytoscape, no Svelte and no UI code through its imports', () => {
		const { files, packages } = reachableFrom(['src/cli/main.ts']);
		// The lazily loaded views are reached too (dynamic imports are followed).
		expect([...files].some((f) => f.startsWith('src/cli/commands/'))).toBe(true);
		expect([...files].filter((f) => f.startsWith('src/lib/ui/') || f.endsWith('.svelte'))).toEqual([]);
		expect([...packages].filter((p) => p.startsWith('cytoscape') || p === 'svelte')).toEqual([]);
		// The same scan from the page reaches Cytoscape (loaded lazily there).
		expect(reachableFrom(['src/routes/+page.svelte']).packages).toContain('cytoscape');
	});

	it.runIf(existsSync(join(ROOT, 'dist-cli/meta.json')))('(c) the built command (dist-cli/meta.json) holds no Cytoscape', () => {
		const meta = readBundleMeta(join(ROOT, 'dist-cli/meta.json'));
		const inputs = Object.values(meta.outputs).flatMap((o) => Object.keys(o.inputs));
		expect(inputs.length).toBeGreaterThan(50);
		expect(inputs.filter((i) => /cytoscape|src\/lib\/ui\/|\.svelte$/.test(i))).toEqual([]);
	});

	it('(d) no hand-written source file is over 450 lines', () => {
		const generated = new Set(['src/lib/graph/diagram-schema-validate.js']);
		const files = [...sourceFiles('src'), ...sourceFiles('tests'), ...sourceFiles('bench'), ...sourceFiles('scripts')].filter((f) => !generated.has(f));
		expect(files.length).toBeGreaterThan(300);
		const long = files.flatMap((f) => {
			const n = lineCount(readSource(f));
			return n > 450 ? [`${f}: ${n} lines`] : [];
		});
		expect(long).toEqual([]);
	});
});
