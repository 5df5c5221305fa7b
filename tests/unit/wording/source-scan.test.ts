/**
 * Scans the source outside src/lib/wording for two things the wording layer owns: number
 * formats that can fall into e-notation (toExponential, toPrecision: "1.2e+5" is not how a
 * person reads a number; formatNumber in wording/numbers.ts never does it) and the word
 * "biasing" in any string literal or Svelte text (DESIGN.md: an open path is a "non-causal
 * path"). The known places still to move are listed by file with their count, so a new one
 * fails the test and a fixed one must be taken off the list.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { describe, expect, it } from 'vitest';

const ROOT = join(__dirname, '../../..');
const SRC = join(ROOT, 'src');

function sourceFiles(dir: string): string[] {
	return readdirSync(dir).flatMap((name) => {
		const path = join(dir, name);
		if (statSync(path).isDirectory()) return path === join(SRC, 'lib/wording') ? [] : sourceFiles(path);
		return /\.(ts|js|svelte)$/.test(name) && !/\.d\.ts$/.test(name) && !name.endsWith('-validate.js') ? [path] : [];
	});
}

/** The file without its comments (line and block), so that prose about a method is not code. */
function withoutComments(text: string): string {
	return text.replace(/\/\*[\s\S]*?\*\//g, '').replace(/<!--[\s\S]*?-->/g, '').replace(/(^|[^:'"`\\])\/\/.*$/gm, '$1');
}

/** Every quoted literal: '…', "…" and template text (the parts between `${}`). */
function stringLiterals(code: string): string[] {
	return [...code.matchAll(/'(?:[^'\\\n]|\\.)*'|"(?:[^"\\\n]|\\.)*"|`(?:[^`\\]|\\.)*`/g)].map((m) => m[0]);
}

/** The text a Svelte component shows: the markup without scripts, styles, tags and {…} expressions. */
function svelteText(text: string): string {
	return text
		.replace(/<script[\s\S]*?<\/script>/g, '')
		.replace(/<style[\s\S]*?<\/style>/g, '')
		.replace(/<[^>]*>/g, ' ')
		.replace(/\{[^}]*\}/g, ' ');
}

/**
 * Where e-notation formatting is still called outside the wording layer, in files this work
 * could not change (owned by others at the time), with what should replace it.
 */
const E_NOTATION_LEFT: Record<string, number> = {};

const files = sourceFiles(SRC);

describe('the source outside src/lib/wording', () => {
	it('scans a real tree (the scan finds the files it must)', () => {
		const names = files.map((f) => relative(ROOT, f));
		expect(names).toContain('src/cli/main.ts');
		expect(names).toContain('src/lib/ui/App.svelte');
		expect(names.some((n) => n.startsWith('src/lib/wording/'))).toBe(false);
		// The scanners themselves find what they look for.
		expect(stringLiterals("x = 'a biasing path'; y = `n ${k} biasing`")).toHaveLength(2);
		expect(svelteText('<script>const biasing = 1;</script><p>{biasing} text</p>')).not.toMatch(/biasing/);
		expect(withoutComments('a.toPrecision(3) // b.toExponential(1)')).toBe('a.toPrecision(3) ');
	});

	it('formats no number in e-notation (toExponential, toPrecision) except the listed places', () => {
		const found: Record<string, number> = {};
		for (const f of files) {
			const n = [...withoutComments(readFileSync(f, 'utf8')).matchAll(/\.(toExponential|toPrecision)\s*\(/g)].length;
			if (n > 0) found[relative(ROOT, f)] = n;
		}
		expect(found).toEqual(E_NOTATION_LEFT);
	});

	it('never says "biasing" to people: not in a string literal, not in Svelte text', () => {
		const found: string[] = [];
		for (const f of files) {
			const text = readFileSync(f, 'utf8');
			const code = withoutComments(text);
			for (const s of stringLiterals(code)) if (/biasing/i.test(s)) found.push(`${relative(ROOT, f)}: ${s.slice(0, 80)}`);
			if (f.endsWith('.svelte') && /biasing/i.test(svelteText(withoutComments(text)))) found.push(`${relative(ROOT, f)}: in the markup`);
		}
		expect(found).toEqual([]);
	});
});
