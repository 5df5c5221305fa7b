/**
 * JSON tokens read straight from UTF-8 bytes (RFC 8259), for the fast reader of native diagram
 * files (fast-native/index.ts explains why it exists). A cursor over the bytes that checks each
 * token as strictly as JSON.parse does — whitespace is space, tab, CR and LF only; a string
 * holds no raw control character and only the escapes \" \\ \/ \b \f \n \r \t \uXXXX; numbers
 * follow the grammar exactly — and leaves the fast path (throws OffFastPath) at anything else.
 * It never builds a value it is not asked for: a string is a span of the bytes until someone
 * decodes it. The bytes must be valid UTF-8 (the caller checks, e.g. with Node's isUtf8), so
 * every byte ≥ 0x80 belongs to a character inside a string.
 *
 * Cost: O(1) per byte; no recursion (the native format is at most three levels deep and the
 * structure reader walks it with loops).
 */

/** Thrown when the input is not what the fast path reads; the caller falls back to the full reader. */
export class OffFastPath extends Error {
	constructor(readonly reason: string) {
		super(reason);
		this.name = 'OffFastPath';
	}
}

export function offFastPath(reason: string): never {
	throw new OffFastPath(reason);
}

const SPACE = 0x20;
const TAB = 0x09;
const LF = 0x0a;
const CR = 0x0d;
const QUOTE = 0x22;
const BACKSLASH = 0x5c;
const MINUS = 0x2d;
const DOT = 0x2e;
const ZERO = 0x30;
const NINE = 0x39;

function isHexDigit(c: number): boolean {
	return (c >= ZERO && c <= NINE) || (c >= 0x41 && c <= 0x46) || (c >= 0x61 && c <= 0x66);
}

/** Bytes that may follow a backslash in a JSON string: " \ / b f n r t u. */
const ESCAPABLE = new Uint8Array(128);
for (const c of '"\\/bfnrtu') ESCAPABLE[c.charCodeAt(0)] = 1;

/** A cursor over the bytes; `start`/`end` give the span of the last string or number read. */
export class JsonBytes {
	pos = 0;
	/** Span of the last string's content (between the quotes) or of the last number. */
	start = 0;
	end = 0;
	/** The last string held an escape (its bytes are not its text). */
	escaped = false;
	/** The last string held a byte ≥ 0x80 (its text is not its bytes read as ASCII). */
	wide = false;

	constructor(readonly bytes: Uint8Array) {}

	/** Skips a UTF-8 byte-order mark at the very start (the text decoders drop one). */
	skipByteOrderMark(): void {
		const b = this.bytes;
		if (this.pos === 0 && b.length >= 3 && b[0] === 0xef && b[1] === 0xbb && b[2] === 0xbf) this.pos = 3;
	}

	/** The next byte after whitespace (the cursor stays on it), or -1 at the end. */
	peek(): number {
		const b = this.bytes;
		let p = this.pos;
		while (p < b.length) {
			const c = b[p];
			if (c !== SPACE && c !== LF && c !== CR && c !== TAB) break;
			p++;
		}
		this.pos = p;
		return p < b.length ? b[p] : -1;
	}

	/** Whitespace, then the byte `c` (consumed), else off the fast path. */
	expect(c: number, what: string): void {
		if (this.peek() !== c) offFastPath(`expected ${what} at byte ${this.pos}`);
		this.pos++;
	}

	/** Whitespace, then `,` (true: another item follows) or `close` (false), else off the fast path. */
	more(close: number): boolean {
		const c = this.peek();
		this.pos++;
		if (c === 0x2c) return true;
		if (c === close) return false;
		return offFastPath(`expected a comma or the end of a list at byte ${this.pos - 1}`);
	}

	/** Whitespace, then `close` (consumed, true) when the list or object is empty. */
	empty(close: number): boolean {
		if (this.peek() !== close) return false;
		this.pos++;
		return true;
	}

	/**
	 * Whitespace, then a string: sets start/end to its content and `escaped`/`wide`. Checks what
	 * JSON.parse checks: no raw control character (U+0000–U+001F), valid escapes, closed.
	 */
	string(): void {
		if (this.peek() !== QUOTE) offFastPath(`expected a string at byte ${this.pos}`);
		const b = this.bytes;
		const n = b.length;
		let p = this.pos + 1;
		this.start = p;
		let escaped = false;
		let wide = false;
		for (;;) {
			if (p >= n) offFastPath('a string is not closed');
			const c = b[p];
			if (c === QUOTE) break;
			if (c < SPACE) offFastPath(`a control character inside a string at byte ${p}`);
			if (c === BACKSLASH) {
				escaped = true;
				const e = p + 1 < n ? b[p + 1] : 0;
				if (e >= 128 || ESCAPABLE[e] === 0) offFastPath(`an invalid escape at byte ${p}`);
				if (e === 0x75) {
					if (p + 5 >= n || !isHexDigit(b[p + 2]) || !isHexDigit(b[p + 3]) || !isHexDigit(b[p + 4]) || !isHexDigit(b[p + 5])) offFastPath(`an invalid \\u escape at byte ${p}`);
					p += 6;
				} else p += 2;
				continue;
			}
			if (c >= 0x80) wide = true;
			p++;
		}
		this.end = p;
		this.pos = p + 1;
		this.escaped = escaped;
		this.wide = wide;
	}

	/** Whitespace, then a number by the JSON grammar: -?(0|[1-9]\d*)(\.\d+)?([eE][+-]?\d+)?; sets start/end. */
	number(): void {
		this.peek();
		const b = this.bytes;
		const n = b.length;
		let p = this.pos;
		this.start = p;
		if (p < n && b[p] === MINUS) p++;
		if (p >= n || b[p] < ZERO || b[p] > NINE) offFastPath(`expected a number at byte ${this.start}`);
		if (b[p] === ZERO) p++;
		else while (p < n && b[p] >= ZERO && b[p] <= NINE) p++;
		if (p < n && b[p] === DOT) {
			p++;
			if (p >= n || b[p] < ZERO || b[p] > NINE) offFastPath(`a malformed number at byte ${this.start}`);
			while (p < n && b[p] >= ZERO && b[p] <= NINE) p++;
		}
		if (p < n && (b[p] === 0x65 || b[p] === 0x45)) {
			p++;
			if (p < n && (b[p] === 0x2b || b[p] === MINUS)) p++;
			if (p >= n || b[p] < ZERO || b[p] > NINE) offFastPath(`a malformed number at byte ${this.start}`);
			while (p < n && b[p] >= ZERO && b[p] <= NINE) p++;
		}
		this.end = p;
		this.pos = p;
	}

	/** Whitespace, then `true` or `false`; anything else is off the fast path. */
	boolean(): boolean {
		const c = this.peek();
		if (c === 0x74 && this.follows('true')) return true;
		if (c === 0x66 && this.follows('false')) return false;
		return offFastPath(`expected true or false at byte ${this.pos}`);
	}

	/** True (and consumed) when the ASCII `word` is at the cursor. */
	private follows(word: string): boolean {
		const b = this.bytes;
		const p = this.pos;
		if (p + word.length > b.length) return false;
		for (let i = 0; i < word.length; i++) if (b[p + i] !== word.charCodeAt(i)) return false;
		this.pos = p + word.length;
		return true;
	}

	/**
	 * Whitespace, then true (and consumed, its span set as a string without escapes) when the
	 * bytes at the cursor are `quoted`: a string written as `"text"` with no escape in it.
	 */
	consume(quoted: Uint8Array): boolean {
		const b = this.bytes;
		const p = this.peek() === 0x22 ? this.pos : -1;
		const n = quoted.length;
		if (p < 0 || p + n > b.length) return false;
		for (let i = 1; i < n; i++) if (b[p + i] !== quoted[i]) return false;
		this.start = p + 1;
		this.end = p + n - 1;
		this.escaped = false;
		this.wide = false;
		this.pos = p + n;
		return true;
	}

	/** True when the span start..end holds exactly the ASCII text `word`. */
	spanIs(word: string): boolean {
		const b = this.bytes;
		if (this.end - this.start !== word.length) return false;
		for (let i = 0; i < word.length; i++) if (b[this.start + i] !== word.charCodeAt(i)) return false;
		return true;
	}

	/** True when only whitespace is left. */
	atEnd(): boolean {
		return this.peek() === -1;
	}
}
