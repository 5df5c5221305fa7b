/**
 * One table of actions: docs/editor.md's keys table, read with markdown-it (CommonMark + GFM
 * tables), must equal the list the keys dialog shows (key-rows.ts, made from the actions
 * tables); no two actions share a key where they work; the question's keys are the X, Y, Z of
 * the causal-inference literature (Pearl 2009, Causality §3.3: "Z satisfies the back-door
 * criterion relative to (X, Y)"), not initials of role names; the menus name real actions.
 */
import { readFileSync } from 'node:fs';
import MarkdownIt from 'markdown-it';
import { describe, expect, it } from 'vitest';
import { APP_ACTIONS } from '../../../src/lib/ui/actions/app-actions';
import { CANVAS_ACTIONS, MENUS, actionById } from '../../../src/lib/ui/actions/canvas-actions';
import { keyRows } from '../../../src/lib/ui/actions/key-rows';
import { chordId, parseChord } from '../../../src/lib/ui/actions/keys';
import type { Action, Mode } from '../../../src/lib/ui/actions/action';

/** The rows of the first table after the "keys table" comment of docs/editor.md, as cell texts. */
function docsKeysTable(): string[][] {
	const tokens = new MarkdownIt({ html: true }).parse(readFileSync(new URL('../../../docs/editor.md', import.meta.url), 'utf8'), {});
	const start = tokens.findIndex((t) => t.type === 'html_block' && t.content.includes('keys table'));
	expect(start, 'docs/editor.md has the <!-- keys table … --> comment').toBeGreaterThanOrEqual(0);
	const open = tokens.findIndex((t, i) => i > start && t.type === 'table_open');
	const close = tokens.findIndex((t, i) => i > open && t.type === 'table_close');
	const rows: string[][] = [];
	let inBody = false;
	for (const t of tokens.slice(open, close)) {
		if (t.type === 'tbody_open') inBody = true;
		else if (t.type === 'tr_open' && inBody) rows.push([]);
		else if (t.type === 'inline' && inBody) rows[rows.length - 1].push(t.content.trim());
	}
	return rows;
}

const ALL: readonly Action<never, never>[] = [...CANVAS_ACTIONS, ...APP_ACTIONS];

describe('the actions table', () => {
	it('docs/editor.md lists exactly the keys the app has, in its words and order', () => {
		expect(docsKeysTable()).toEqual(keyRows().map((r) => [r.keys, r.words, r.where]));
	});

	it('gives no key to two actions where they work', () => {
		const modes: Mode[] = ['canvas', 'drawing', 'window'];
		for (const mode of modes) {
			const seen = new Map<string, string>();
			for (const a of ALL.filter((x) => x.mode === mode)) {
				for (const k of a.keys) {
					const id = chordId(parseChord(k));
					expect(seen.get(id), `${k} in ${mode}: ${seen.get(id)} and ${a.id}`).toBeUndefined();
					seen.set(id, a.id);
				}
			}
		}
		// A canvas key reaches the window too: they share Escape only (the canvas clears the
		// selection, the window the highlight), never a key with two unrelated meanings.
		const canvasKeys = new Set(ALL.filter((a) => a.mode === 'canvas').flatMap((a) => a.keys.map((k) => chordId(parseChord(k)))));
		const shared = ALL.filter((a) => a.mode === 'window').flatMap((a) => a.keys.map((k) => chordId(parseChord(k)))).filter((k) => canvasKeys.has(k));
		expect(shared).toEqual(['Escape']);
	});

	it('takes the question’s keys from the notation: X exposure, Y outcome, Z planned set', () => {
		const keys = (id: string) => actionById(id).keys;
		expect(keys('exposure')).toEqual(['X']);
		expect(keys('outcome')).toEqual(['Y']);
		expect(keys('planned')).toEqual(['Z']);
		expect(keys('unmeasured')).toEqual(['H']);
		expect(keys('add-variable')).toEqual(['V', 'Insert']);
		expect(keys('draw-arrow')).toEqual(['>']);
		// Not the initials of exposure, outcome, planned, unmeasured, new, arrow.
		const canvasLetters = CANVAS_ACTIONS.flatMap((a) => a.keys).filter((k) => /^[A-Z]$/.test(k));
		for (const initial of ['E', 'O', 'P', 'U', 'N', 'A']) expect(canvasLetters).not.toContain(initial);
	});

	it('has menus that name real actions, and every action with menu words in a menu', () => {
		const inMenus = new Set(Object.values(MENUS).flat());
		for (const id of inMenus) expect(() => actionById(id)).not.toThrow();
		for (const a of CANVAS_ACTIONS.filter((x) => x.label !== undefined)) expect(inMenus.has(a.id), a.id).toBe(true);
	});

	it('has chords that parse and ids that are unique', () => {
		for (const a of ALL) for (const k of a.keys) expect(() => parseChord(k)).not.toThrow();
		expect(new Set(ALL.map((a) => a.id)).size).toBe(ALL.length);
	});
});
