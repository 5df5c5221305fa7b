/**
 * The palette is the one place colours live: the generated CSS matches it, no other source
 * file writes a colour as a hex literal, and the text colours keep WCAG 2.1 AA contrast
 * (success criterion 1.4.3, 4.5:1; relative luminance and contrast ratio as the WCAG 2.1
 * glossary defines them, https://www.w3.org/TR/WCAG21/).
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join, relative, sep } from 'node:path';
import { describe, expect, it } from 'vitest';
import { cssVariable, palette, paletteCss, type PaletteName } from '../../../src/lib/palette';
import { contrast } from '../wcag-contrast';

const ROOT = join(__dirname, '../../..');
const SRC = join(ROOT, 'src');

/** Files allowed to hold hex colours. */
const ALLOWED = [
	'src/lib/palette.ts',
	'src/lib/ui/palette.css'
];

/** A CSS hex colour: #rgb, #rgba, #rrggbb, #rrggbbaa (not an HTML character reference like &#955;). */
const HEX = /(?<![&\w])#(?:[0-9a-fA-F]{8}|[0-9a-fA-F]{6}|[0-9a-fA-F]{3,4})\b/g;

function sourceFiles(dir: string): string[] {
	return readdirSync(dir, { withFileTypes: true }).flatMap((e) => (e.isDirectory() ? sourceFiles(join(dir, e.name)) : [join(dir, e.name)]));
}

describe('palette', () => {
	it('src/lib/ui/palette.css is what `npm run build:palette` writes now', () => {
		expect(readFileSync(join(SRC, 'lib/ui/palette.css'), 'utf8')).toBe(paletteCss());
	});

	it('names every colour by meaning, as six-digit hex', () => {
		for (const [name, value] of Object.entries(palette)) expect(value, name).toMatch(/^#[0-9a-fA-F]{6}$/);
		// The trade word is "open non-causal path".
		expect(Object.keys(palette).some((n) => /bias/i.test(n))).toBe(false);
		expect(cssVariable('openPath')).toBe('--colour-open-path');
	});

	it('no source file outside the palette writes a hex colour', () => {
		const found: string[] = [];
		for (const file of sourceFiles(SRC)) {
			const path = relative(ROOT, file).split(sep).join('/');
			if (ALLOWED.some((a) => (a.endsWith('/') ? path.startsWith(a) : path === a))) continue;
			const text = readFileSync(file, 'utf8');
			for (const m of text.matchAll(HEX)) found.push(`${path}: ${m[0]}`);
		}
		expect(found).toEqual([]);
	});

	it('the check finds a hex colour where one is written', () => {
		expect('color: #1a1a1a; fill="#FFF"; x: #abcd; &#955; #notes'.match(HEX)).toEqual(['#1a1a1a', '#FFF', '#abcd']);
	});

	const onWhite: PaletteName[] = ['text', 'textSoft', 'muted', 'hint', 'faded', 'accentText', 'errorText', 'warningText', 'problemText', 'againstText', 'noticeText', 'noticeTextDeep', 'weakText', 'unmeasured'];
	it.each(onWhite)('%s on the surface meets 4.5:1', (name) => {
		expect(contrast(palette[name], palette.surface)).toBeGreaterThanOrEqual(4.5);
	});

	it.each([
		['muted', 'sunken'],
		['text', 'exposure'],
		['text', 'outcome'],
		['noticeTextDeep', 'warningSurface'],
		['againstText', 'warningSurfaceSoft'],
		['weakText', 'weakSurface'],
		['accentText', 'selectedRow'],
		['text', 'info'],
		['surface', 'contradicted']
	] as [PaletteName, PaletteName][])('%s on %s meets 4.5:1', (fg, bg) => {
		expect(contrast(palette[fg], palette[bg])).toBeGreaterThanOrEqual(4.5);
	});
});
