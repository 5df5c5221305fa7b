/**
 * The project's own source files as text, for tests of its layout (tests/unit/layers.test.ts):
 * listing them, their line counts, what they import and the code with comments and strings
 * blanked out. Plain text processing, nothing a `git grep` could not do: a small scanner, not
 * a parser (a regular expression literal holding a quote or `//` may blank the rest of its line,
 * which only ever hides code from a check, never invents any).
 */
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

export const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '../..');

/** Extensions of hand-written source: code, and the scripts that drive R and Python. */
export const SOURCE_EXTENSIONS = ['.ts', '.js', '.mjs', '.cjs', '.mts', '.svelte', '.py', '.R', '.sh'];

/** Every file under `dir` (relative to the root, forward slashes) with one of `extensions`. */
export function sourceFiles(dir: string, extensions: readonly string[] = SOURCE_EXTENSIONS): string[] {
	const out: string[] = [];
	const walk = (abs: string) => {
		for (const name of readdirSync(abs).sort()) {
			if (name === 'node_modules' || name.startsWith('.')) continue;
			const path = join(abs, name);
			if (statSync(path).isDirectory()) walk(path);
			else if (extensions.some((e) => name.endsWith(e))) out.push(relative(ROOT, path).split('\\').join('/'));
		}
	};
	if (existsSync(join(ROOT, dir))) walk(join(ROOT, dir));
	return out;
}

export function readSource(file: string): string {
	return readFileSync(join(ROOT, file), 'utf8');
}

export function lineCount(text: string): number {
	return text.length === 0 ? 0 : text.split('\n').length - (text.endsWith('\n') ? 1 : 0);
}

/**
 * The text with comments removed and, when `blankStrings`, the contents of string and template
 * literals replaced by spaces (line breaks kept, so line numbers still hold).
 */
export function codeOnly(text: string, blankStrings: boolean): string {
	let out = '';
	let i = 0;
	const n = text.length;
	const keepBreaks = (s: string) => s.replace(/[^\n]/g, ' ');
	while (i < n) {
		const c = text[i];
		const next = text[i + 1];
		if (c === '/' && next === '/') {
			const end = text.indexOf('\n', i);
			i = end < 0 ? n : end;
		} else if (c === '/' && next === '*') {
			const end = text.indexOf('*/', i + 2);
			const stop = end < 0 ? n : end + 2;
			out += keepBreaks(text.slice(i, stop));
			i = stop;
		} else if (c === "'" || c === '"' || c === '`') {
			let j = i + 1;
			while (j < n && text[j] !== c && !(c !== '`' && text[j] === '\n')) j += text[j] === '\\' ? 2 : 1;
			const body = text.slice(i + 1, Math.min(j, n));
			out += c + (blankStrings ? keepBreaks(body) : body) + (j < n ? text[j] : '');
			i = j + 1;
		} else {
			out += c;
			i++;
		}
	}
	return out;
}

/**
 * What a file imports: static and dynamic imports, re-exports, side-effect imports and worker
 * scripts (`new URL('./x.worker.ts', import.meta.url)`, which the bundler follows too).
 */
export function importSpecifiers(text: string): string[] {
	const code = codeOnly(text, false);
	const patterns = [
		/\b(?:import|export)\s[^'"`;]*?\bfrom\s*['"]([^'"\n]+)['"]/g,
		/\bimport\s*['"]([^'"\n]+)['"]/g,
		/\bimport\s*\(\s*['"]([^'"\n]+)['"]\s*\)/g,
		/\bnew\s+URL\(\s*['"]([^'"\n]+)['"]\s*,\s*import\.meta\.url\s*\)/g
	];
	const found = new Set<string>();
	for (const p of patterns) for (const m of code.matchAll(p)) found.add(m[1]);
	return [...found];
}

/** A bare import's package name (`@scope/name` or `name`); null for a path. */
export function packageOf(spec: string): string | null {
	if (spec.startsWith('.') || spec.startsWith('/') || spec.startsWith('$lib')) return null;
	const parts = spec.split('/');
	return spec.startsWith('@') ? parts.slice(0, 2).join('/') : parts[0];
}

/** The project file an import names, relative to the root; null for a package or a missing file. */
export function resolveImport(fromFile: string, spec: string): string | null {
	let base: string;
	if (spec.startsWith('$lib/') || spec === '$lib') base = join(ROOT, 'src/lib', spec.slice(4));
	else if (spec.startsWith('.')) base = resolve(join(ROOT, dirname(fromFile)), spec);
	else return null;
	const candidates = [base, `${base}.ts`, `${base}.js`, `${base}.svelte`, join(base, 'index.ts'), join(base, 'index.js'), base.replace(/\.js$/, '.ts')];
	for (const c of candidates) if (existsSync(c) && statSync(c).isFile()) return relative(ROOT, c).split('\\').join('/');
	return null;
}

/** Every project file and package reached from `entries` by following imports. */
export function reachableFrom(entries: readonly string[]): { files: Set<string>; packages: Set<string> } {
	const files = new Set<string>();
	const packages = new Set<string>();
	const stack = [...entries];
	while (stack.length > 0) {
		const file = stack.pop() as string;
		if (files.has(file)) continue;
		files.add(file);
		for (const spec of importSpecifiers(readSource(file))) {
			const pkg = packageOf(spec);
			if (pkg !== null) packages.add(pkg);
			const target = resolveImport(file, spec);
			if (target !== null && /\.(ts|js|mjs|svelte)$/.test(target)) stack.push(target);
		}
	}
	return { files, packages };
}
