/**
 * Key chords (src/lib/ui/actions/keys.ts): parsing the text the tables show, matching key
 * presses. Expected values follow the KeyboardEvent `key` values of the UI Events KeyboardEvent
 * key Values specification (W3C): letters arrive upper-case with Shift or Caps Lock, "?" and ">"
 * arrive with Shift on a US layout, named keys by name ("ArrowLeft", "F10", "ContextMenu").
 */
import { describe, expect, it } from 'vitest';
import { chordId, chordLabel, matches, parseChord } from '../../../src/lib/ui/actions/keys';

const press = (key: string, mods: { ctrl?: boolean; meta?: boolean; shift?: boolean; alt?: boolean } = {}) => ({
	key,
	ctrlKey: !!mods.ctrl,
	metaKey: !!mods.meta,
	shiftKey: !!mods.shift,
	altKey: !!mods.alt
});

describe('chords', () => {
	it('parses modifiers and the key, including the plus key itself', () => {
		expect(parseChord('Ctrl+Shift+Z')).toMatchObject({ key: 'z', ctrl: true, shift: true, alt: false });
		expect(parseChord('+')).toMatchObject({ key: '+', ctrl: false, shift: false });
		expect(parseChord('Ctrl++')).toMatchObject({ key: '+', ctrl: true });
		expect(parseChord('Alt+Shift+ArrowLeft')).toMatchObject({ key: 'ArrowLeft', alt: true, shift: true });
		expect(() => parseChord('Hyper+X')).toThrow(/unknown modifier Hyper/);
	});

	it('matches a letter in either case, with Shift only when written', () => {
		const x = parseChord('X');
		expect(matches(x, press('x'))).toBe(true);
		expect(matches(x, press('X'))).toBe(true); // Caps Lock
		expect(matches(x, press('X', { shift: true }))).toBe(false);
		expect(matches(x, press('x', { ctrl: true }))).toBe(false);
		expect(matches(x, press('x', { alt: true }))).toBe(false);
		expect(matches(parseChord('Ctrl+Z'), press('z', { meta: true }))).toBe(true); // ⌘ counts as Ctrl
		expect(matches(parseChord('Ctrl+Shift+Z'), press('Z', { ctrl: true, shift: true }))).toBe(true);
		expect(matches(parseChord('Ctrl+Z'), press('Z', { ctrl: true, shift: true }))).toBe(false);
	});

	it('matches other characters whatever Shift typed them, named keys with Shift as written', () => {
		expect(matches(parseChord('>'), press('>', { shift: true }))).toBe(true);
		expect(matches(parseChord('?'), press('?', { shift: true }))).toBe(true);
		expect(matches(parseChord('?'), press('?', { shift: true, ctrl: true }))).toBe(false);
		expect(matches(parseChord('Shift+F10'), press('F10', { shift: true }))).toBe(true);
		expect(matches(parseChord('Shift+F10'), press('F10'))).toBe(false);
		expect(matches(parseChord('ArrowLeft'), press('ArrowLeft', { shift: true }))).toBe(false);
	});

	it('shows chords as people read them and normalises them for comparison', () => {
		expect(chordLabel('ContextMenu')).toBe('Menu key');
		expect(chordLabel('-')).toBe('−');
		expect(chordLabel('x')).toBe('X');
		expect(chordLabel('Ctrl+Shift+z')).toBe('Ctrl+Shift+Z');
		expect(chordId(parseChord('Ctrl+Shift+z'))).toBe(chordId(parseChord('Ctrl+Shift+Z')));
		expect(chordId(parseChord('Shift+?'))).toBe(chordId(parseChord('?')));
	});
});
