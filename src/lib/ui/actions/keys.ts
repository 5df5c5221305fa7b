/**
 * Key chords of the action tables, written as people read them ("X", "Shift+F10",
 * "Ctrl+Shift+Z", "ArrowLeft") and matched against keyboard events.
 *
 * Hand-written (about 40 lines) rather than a key-binding library: those attach their own
 * listeners and take chords in their own syntax, whereas here the same text must be shown in
 * the menus, the keys dialog and docs/editor.md, and parsed back by the test that compares them.
 */

export interface Chord {
	/** `KeyboardEvent.key` of the key itself ("x", "F10", "ArrowLeft", "["). */
	key: string;
	ctrl: boolean;
	shift: boolean;
	alt: boolean;
	/** The chord as written in the table. */
	text: string;
}

/** What a chord is matched against (a KeyboardEvent has these). */
export interface KeyPress {
	key: string;
	ctrlKey: boolean;
	metaKey: boolean;
	shiftKey: boolean;
	altKey: boolean;
}

/** "Ctrl+Shift+Z" → a chord; "+" and "Ctrl++" name the plus key. */
export function parseChord(text: string): Chord {
	const parts = text.endsWith('++') ? [...text.slice(0, -2).split('+'), '+'] : text === '+' ? ['+'] : text.split('+');
	const key = parts[parts.length - 1];
	const mods = new Set(parts.slice(0, -1));
	for (const m of mods) if (m !== 'Ctrl' && m !== 'Shift' && m !== 'Alt') throw new Error(`unknown modifier ${m} in the chord ${text}`);
	if (key === '') throw new Error(`no key in the chord ${text}`);
	return { key: isLetter(key) ? key.toLowerCase() : key, ctrl: mods.has('Ctrl'), shift: mods.has('Shift'), alt: mods.has('Alt'), text };
}

const isLetter = (k: string) => /^[a-z]$/i.test(k);

/**
 * Letters match in either case (Caps Lock) with Shift as written; other single characters
 * ("?", "+", "[", ">") whatever Shift it takes to type them on the keyboard's layout; named
 * keys (Enter, F10, arrows) with Shift as written. Ctrl and ⌘ are one modifier.
 */
export function matches(c: Chord, e: KeyPress): boolean {
	if ((e.ctrlKey || e.metaKey) !== c.ctrl || e.altKey !== c.alt) return false;
	if (isLetter(c.key)) return e.key.toLowerCase() === c.key && e.shiftKey === c.shift;
	if (c.key.length === 1) return e.key === c.key;
	return e.key === c.key && e.shiftKey === c.shift;
}

const NAMES: Record<string, string> = { ContextMenu: 'Menu key', '-': '−', ' ': 'Space' };

/** How one chord is shown: "X", "Shift+F10", "Menu key", "−". */
export function chordLabel(text: string): string {
	const c = parseChord(text);
	const key = NAMES[c.key] ?? (isLetter(c.key) ? c.key.toUpperCase() : c.key);
	return `${c.ctrl ? 'Ctrl+' : ''}${c.alt ? 'Alt+' : ''}${c.shift ? 'Shift+' : ''}${key}`;
}

/** One normal form per chord, to find two actions sharing a key. */
export function chordId(c: Chord): string {
	return `${c.ctrl ? 'ctrl+' : ''}${c.alt ? 'alt+' : ''}${c.shift && (isLetter(c.key) || c.key.length > 1) ? 'shift+' : ''}${c.key}`;
}
