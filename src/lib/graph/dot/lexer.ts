/**
 * The DOT lexer: text → tokens, one at a time, by the rules of Graphviz's own scanner
 * (lib/cgraph/scan.l, Graphviz 2.43; https://graphviz.org/doc/info/lang.html):
 *
 * - a name is a letter, `_` or any character past U+007F, followed by those or digits; a numeral
 *   is `-?(digits(.digits?)? | .digits)` and ends where its digits end (`1abc` is `1` then `abc`,
 *   as Graphviz splits it, with a warning);
 * - a quoted string keeps every character as written except `\"` (a quote) and a backslash
 *   before a line break (a continuation, removed); `\\` stays two backslashes (labels decode
 *   their escapes later); `"a" + "b"` joins quoted strings into one;
 * - an HTML-like string is `<…>` with balanced angle brackets inside;
 * - `//`, `#` (to the end of the line) and `/* … *\/` are comments; spaces, tabs and line
 *   breaks separate tokens; the keywords `node`, `edge`, `graph`, `digraph`, `subgraph` and
 *   `strict` are names in any case.
 *
 * Hand-written rather than the `ts-graphviz` grammar we used before, measured: its PEG parser
 * refused `a:p:ne -> b` (compass points after a port), `subgraph s {…} -> c` and `"a" + "b"`;
 * it refused edge chains of more than 1,000 links ("too large to read") and, with that guard
 * raised, overflowed the stack at 20,000 links (it recurses once per link, and `dotparser`'s
 * grammar recurses the same way, also once per statement); and it backtracked for minutes on
 * 860 bytes of unclosed nested subgraphs. This lexer is one pass, O(length), no recursion, and
 * every token knows its offset, so every message names its line and column.
 */
import { describePosition, InputError, lineColumn, quote } from '../errors';

export type Keyword = 'node' | 'edge' | 'graph' | 'digraph' | 'subgraph' | 'strict';
const KEYWORDS: ReadonlySet<string> = new Set<Keyword>(['node', 'edge', 'graph', 'digraph', 'subgraph', 'strict']);

export type Punctuation = '{' | '}' | '[' | ']' | '=' | ';' | ',' | ':' | '->' | '--';

export type Token =
	| { kind: 'id'; value: string; written: 'name' | 'numeral' | 'quoted' | 'html'; keyword?: Keyword; offset: number }
	| { kind: Punctuation; offset: number }
	| { kind: 'end'; offset: number };

export type IdToken = Extract<Token, { kind: 'id' }>;

/** Where an offset is, as messages say it ("line 3, column 7") and as InputError.where ("3:7"). */
export type At = (offset: number) => { phrase: string; where: string };

export function positionsIn(text: string): At {
	return (offset) => {
		const p = lineColumn(text, offset);
		return { phrase: describePosition(p), where: `${p.line}:${p.column}` };
	};
}

/** "Invalid DOT at line 3, column 7: …" */
export function syntaxError(at: At, offset: number, what: string): InputError {
	const p = at(offset);
	return new InputError(`Invalid DOT at ${p.phrase}: ${what}`, p.where);
}

const isNameStart = (c: number) => (c >= 97 && c <= 122) || (c >= 65 && c <= 90) || c === 95 || c >= 0x80;
const isDigit = (c: number) => c >= 48 && c <= 57;
const isNamePart = (c: number) => isNameStart(c) || isDigit(c);
const PUNCTUATION = new Set(['{', '}', '[', ']', '=', ';', ',', ':']);

/** How a token is shown in "found …" phrases. */
export function describeToken(t: Token): string {
	if (t.kind === 'end') return 'the end of the file';
	if (t.kind !== 'id') return `"${t.kind}"`;
	if (t.written === 'html') return 'an HTML-like string';
	return t.written === 'quoted' ? `the string ${quote(t.value)}` : quote(t.value);
}

export class Lexer {
	private pos = 0;
	private ahead: Token | null = null;

	constructor(
		private readonly text: string,
		readonly at: At
	) {}

	/** The next token, without consuming it. */
	peek(): Token {
		this.ahead ??= this.scan();
		return this.ahead;
	}

	next(): Token {
		const t = this.peek();
		this.ahead = null;
		return t;
	}

	/** Skips spaces, line breaks, comments and byte-order marks; returns the next offset. */
	private skipBlank(): number {
		const s = this.text;
		const n = s.length;
		let i = this.pos;
		while (i < n) {
			const c = s.charCodeAt(i);
			if (c === 32 || c === 9 || c === 10 || c === 13 || c === 0xfeff) i++;
			else if (c === 35 /* # */ || (c === 47 /* / */ && s.charCodeAt(i + 1) === 47)) {
				const end = s.indexOf('\n', i);
				i = end < 0 ? n : end + 1;
			} else if (c === 47 && s.charCodeAt(i + 1) === 42 /* * */) {
				const end = s.indexOf('*/', i + 2);
				if (end < 0) throw syntaxError(this.at, i, 'this comment is never closed');
				i = end + 2;
			} else break;
		}
		this.pos = i;
		return i;
	}

	private scan(): Token {
		const s = this.text;
		const start = this.skipBlank();
		if (start >= s.length) return { kind: 'end', offset: start };
		const c = s.charCodeAt(start);
		const ch = s[start];
		if (ch === '"') return this.quotedRun(start);
		if (ch === '<') return this.html(start);
		if (isNameStart(c)) {
			let i = start + 1;
			while (i < s.length && isNamePart(s.charCodeAt(i))) i++;
			this.pos = i;
			const value = s.slice(start, i);
			const lower = value.length <= 8 ? value.toLowerCase() : '';
			return KEYWORDS.has(lower) ? { kind: 'id', value, written: 'name', keyword: lower as Keyword, offset: start } : { kind: 'id', value, written: 'name', offset: start };
		}
		if (ch === '-' && (s[start + 1] === '>' || s[start + 1] === '-')) {
			this.pos = start + 2;
			return { kind: s[start + 1] === '>' ? '->' : '--', offset: start };
		}
		const numeral = /-?(?:[0-9]+(?:\.[0-9]*)?|\.[0-9]+)/y;
		numeral.lastIndex = start;
		const m = numeral.exec(s);
		if (m) {
			this.pos = start + m[0].length;
			return { kind: 'id', value: m[0], written: 'numeral', offset: start };
		}
		if (PUNCTUATION.has(ch)) {
			this.pos = start + 1;
			return { kind: ch as Punctuation, offset: start };
		}
		if (ch === '+') throw syntaxError(this.at, start, 'a + must stand between two quoted strings ("a" + "b")');
		const shown = c < 0x20 || c === 0x7f ? `the control character U+${c.toString(16).toUpperCase().padStart(4, '0')}` : quote(ch);
		throw syntaxError(this.at, start, `unexpected character ${shown}`);
	}

	/** A quoted string and any `+ "…"` joined to it. */
	private quotedRun(start: number): Token {
		let value = this.quoted(start);
		for (;;) {
			const save = this.pos;
			const plus = this.skipBlank();
			if (this.text[plus] !== '+') {
				this.pos = save;
				break;
			}
			this.pos = plus + 1;
			const next = this.skipBlank();
			if (this.text[next] !== '"') throw syntaxError(this.at, plus, 'a + must be followed by a quoted string ("a" + "b")');
			value += this.quoted(next);
		}
		return { kind: 'id', value, written: 'quoted', offset: start };
	}

	/** The value of the quoted string opening at `start`; moves past its closing quote. O(length). */
	private quoted(start: number): string {
		const s = this.text;
		const n = s.length;
		let out = '';
		let from = start + 1;
		let i = from;
		while (i < n) {
			const c = s[i];
			if (c === '"') break;
			if (c !== '\\' || i + 1 >= n) {
				i++;
				continue;
			}
			const e = s[i + 1];
			if (e === '"' || e === '\n' || e === '\r') {
				out += s.slice(from, i);
				if (e === '"') out += '"';
				i += e === '\r' && s[i + 2] === '\n' ? 3 : 2;
				from = i;
			} else i += 2; // `\\` and other escapes stay as written; labels decode them
		}
		if (i >= n) throw syntaxError(this.at, start, 'this quoted string is never closed');
		this.pos = i + 1;
		return out + s.slice(from, i);
	}

	/** An HTML-like string `<…>`: its inside, angle brackets balanced. */
	private html(start: number): Token {
		const s = this.text;
		let depth = 0;
		for (let i = start; i < s.length; i++) {
			const c = s[i];
			if (c === '<') depth++;
			else if (c === '>' && --depth === 0) {
				this.pos = i + 1;
				return { kind: 'id', value: s.slice(start + 1, i), written: 'html', offset: start };
			}
		}
		throw syntaxError(this.at, start, 'this HTML-like string (<…>) is never closed');
	}
}
