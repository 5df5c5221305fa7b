/**
 * One pass over the bytes of a native diagram file (`causeway.diagram`, version 2) that keeps
 * only what the compiled graph and the question need: each variable's id as a span of the
 * bytes and its measured flag, each arrow's two ends as spans, and the title and the three id
 * lists as text. Everything else (labels, notes, positions) is checked as the schema and the
 * size limits check it, then skipped.
 *
 * It reads a strict subset of what the full reader (native-json.ts) accepts, and leaves the
 * fast path (OffFastPath) at anything outside it: a key the format does not define or one
 * written twice, an escape inside a key, an id or an arrow end, a variable's `data` settings,
 * version 1, a value of the wrong type, an empty id, a text field whose bytes exceed its limit
 * (its characters may not), more variables or arrows than the limits. The full reader then
 * reads the file and says what, if anything, is wrong with it.
 *
 * It also notes where each label is and whether every variable and arrow has the plain shape
 * Causeway writes, so that the lists can be made later without the full reader (lists.ts).
 *
 * Cost: O(bytes); memory: 18 bytes per variable and 8 per arrow, plus the decoded short texts.
 */
import { MAX_LABEL_CHARS, MAX_NOTE_CHARS } from '../../limits';
import type { ReadLimits } from '../size-limits';
import { JsonBytes, offFastPath } from './json-bytes';

export interface ScannedDiagram {
	readonly bytes: Uint8Array;
	/** Variables: id i is bytes[ids[2i] .. ids[2i+1]), with no escape in it. */
	readonly n: number;
	readonly ids: Int32Array;
	readonly measured: Uint8Array;
	/**
	 * Arrows: arrow e runs from the id that starts at bytes[ends[2e]] to the one at bytes[ends[2e+1]]
	 * (each ends at the next quote: ids hold no escapes). Only the starts are kept: on the
	 * 100,000-variable file the ends' 1.6 MB were as many page faults, at about 10 µs each.
	 */
	readonly m: number;
	readonly ends: Int32Array;
	/** Labels: variable i's is bytes[labels[2i] .. labels[2i+1]), or absent when labels[2i] is -1. */
	readonly labels: Int32Array;
	/** Per label: LABEL_ESCAPED and LABEL_WIDE bits. */
	readonly labelFlags: Uint8Array;
	/** Every variable is written exactly as {"id", "label", "measured"} and every arrow as {"from", "to"}, in that order. */
	readonly plainVariables: boolean;
	readonly plainArrows: boolean;
	readonly title: string;
	readonly exposures: string[];
	readonly outcomes: string[];
	readonly adjusted: string[];
}

const OPEN_OBJECT = 0x7b;
const CLOSE_OBJECT = 0x7d;
const OPEN_LIST = 0x5b;
const CLOSE_LIST = 0x5d;
const COLON = 0x3a;

const TOP_KEYS = ['format', 'version', 'title', 'variables', 'arrows', 'exposures', 'outcomes', 'adjusted'] as const;
const VARIABLE_KEYS = ['id', 'label', 'measured', 'x', 'y', 'note'] as const;
const ARROW_KEYS = ['from', 'to', 'note'] as const;
const TOP_QUOTED = quotedKeys(TOP_KEYS);
const VARIABLE_QUOTED = quotedKeys(VARIABLE_KEYS);
const ARROW_QUOTED = quotedKeys(ARROW_KEYS);
const [FORMAT, VERSION, TITLE, VARIABLES, ARROWS, EXPOSURES, OUTCOMES, ADJUSTED] = [0, 1, 2, 3, 4, 5, 6, 7];
const [ID, LABEL, MEASURED, X, Y, NOTE] = [0, 1, 2, 3, 4, 5];
const [FROM, TO, ARROW_NOTE] = [0, 1, 2];

export const LABEL_ESCAPED = 1;
export const LABEL_WIDE = 2;

/** ignoreBOM: a text may start with U+FEFF, which the default decoder would drop. */
const utf8 = new TextDecoder('utf-8', { ignoreBOM: true });

/** Int32 storage that doubles as it fills. */
class Grow {
	data: Int32Array;
	length = 0;
	constructor(capacity: number) {
		this.data = new Int32Array(capacity);
	}
	push2(a: number, b: number): void {
		if (this.length + 2 > this.data.length) this.grow();
		this.data[this.length++] = a;
		this.data[this.length++] = b;
	}
	private grow(): void {
		const next = new Int32Array(this.data.length * 2);
		next.set(this.data);
		this.data = next;
	}
}

function keyIndex(js: JsonBytes, keys: readonly string[]): number {
	if (!js.escaped) for (let k = 0; k < keys.length; k++) if (js.spanIs(keys[k])) return k;
	return offFastPath(`a key the fast path does not read at byte ${js.start}`);
}

/** Each key of a list as the bytes of its quoted form, `"id"`, to compare in place. */
function quotedKeys(keys: readonly string[]): Uint8Array[] {
	return keys.map((k) => Uint8Array.from(`"${k}"`, (c) => c.charCodeAt(0)));
}

/**
 * After an object's key: the key's index in `keys`, refused if `seen` has it already; consumes
 * the colon. The key Causeway writes next (`guess`) is compared in place first, which spares
 * scanning the key as a string and comparing it with each name.
 */
function nextKey(js: JsonBytes, keys: readonly string[], quoted: readonly Uint8Array[], seen: number, guess: number): number {
	let key = guess;
	if (guess >= keys.length || !js.consume(quoted[guess])) {
		js.string();
		key = keyIndex(js, keys);
	}
	if (seen & (1 << key)) offFastPath(`the key "${keys[key]}" is written twice in one object`);
	js.expect(COLON, 'a colon');
	return key;
}

/** The text of the string just read (exact: JSON.parse decodes an escaped one). */
function text(js: JsonBytes): string {
	const b = js.bytes;
	return js.escaped ? (JSON.parse(utf8.decode(b.subarray(js.start - 1, js.end + 1))) as string) : utf8.decode(b.subarray(js.start, js.end));
}

/** A string whose bytes fit `max` (its characters then fit too: a character takes at least one byte, an escape more). */
function boundedString(js: JsonBytes, max: number, what: string): void {
	js.string();
	if (js.end - js.start > max) offFastPath(`${what} longer than ${max} bytes`);
}

/** A non-empty string with no escape: an id or an arrow end, compared as bytes. */
function plainId(js: JsonBytes, what: string): void {
	js.string();
	if (js.escaped) offFastPath(`an escape in ${what} at byte ${js.start}`);
	if (js.end === js.start) offFastPath(`an empty ${what}`);
	if (js.end - js.start > MAX_LABEL_CHARS) offFastPath(`${what} longer than ${MAX_LABEL_CHARS} bytes`);
}

/** A number that JSON.parse reads as finite (the schema refuses ±Infinity from 1e999). */
function finiteNumber(js: JsonBytes): void {
	js.number();
	const b = js.bytes;
	let exponent = false;
	for (let p = js.start; p < js.end; p++) if (b[p] === 0x65 || b[p] === 0x45) exponent = true;
	// Without an exponent, fewer than 300 digits cannot pass Number.MAX_VALUE (about 1.8e308).
	if (!exponent && js.end - js.start < 300) return;
	if (!Number.isFinite(Number(String.fromCharCode(...b.subarray(js.start, js.end))))) offFastPath('a number too large to be finite');
}

function idList(js: JsonBytes): string[] {
	const out: string[] = [];
	js.expect(OPEN_LIST, 'a list');
	if (js.empty(CLOSE_LIST)) return out;
	do {
		js.string();
		if (js.end === js.start) offFastPath('an empty id in a list');
		out.push(text(js));
	} while (js.more(CLOSE_LIST));
	return out;
}

/**
 * Scans a whole native diagram file, or throws OffFastPath. `limits` caps the variables and
 * arrows (the reader's own limits: past them the full reader gives the message).
 */
export function scanDiagram(bytes: Uint8Array, limits: ReadLimits): ScannedDiagram {
	if (bytes.length > limits.chars) offFastPath('more bytes than the limit');
	return new DiagramScan(bytes, limits).run();
}

/**
 * The scan's state. Plain loops, no callback per object: a closure per variable and arrow and
 * the polymorphic calls through it cost more than the scanning itself (measured, bench/cli.ts).
 */
class DiagramScan {
	private readonly js: JsonBytes;
	private readonly ids: Grow;
	private readonly ends: Grow;
	private readonly labels: Grow;
	private measured: Uint8Array;
	private labelFlags: Uint8Array;
	private plainVariables = true;
	private plainArrows = true;
	private n = 0;

	constructor(
		private readonly bytes: Uint8Array,
		private readonly limits: ReadLimits
	) {
		this.js = new JsonBytes(bytes);
		// Sized for the benchmark's shape (about 120 bytes per variable with its arrows), grown as needed.
		const guess = Math.max(16, Math.min(limits.variables, Math.ceil(bytes.length / 120)));
		this.ids = new Grow(2 * guess);
		this.ends = new Grow(4 * guess);
		this.labels = new Grow(2 * guess);
		this.measured = new Uint8Array(guess);
		this.labelFlags = new Uint8Array(guess);
	}

	run(): ScannedDiagram {
		const js = this.js;
		js.skipByteOrderMark();
		let title = '';
		let exposures: string[] = [];
		let outcomes: string[] = [];
		let adjusted: string[] = [];
		js.expect(OPEN_OBJECT, 'an object');
		let seen = 0;
		if (!js.empty(CLOSE_OBJECT))
			do {
				const key = nextKey(js, TOP_KEYS, TOP_QUOTED, seen, FORMAT);
				seen |= 1 << key;
				if (key === FORMAT) {
					js.string();
					if (js.escaped || !js.spanIs('causeway.diagram')) offFastPath('not the causeway.diagram format');
				} else if (key === VERSION) {
					js.number();
					if (!js.spanIs('2')) offFastPath('not version 2');
				} else if (key === TITLE) {
					js.string();
					title = text(js);
					if (title.length > MAX_LABEL_CHARS) offFastPath('a title over the limit');
				} else if (key === VARIABLES) this.variables();
				else if (key === ARROWS) this.arrows();
				else if (key === EXPOSURES) exposures = idList(js);
				else if (key === OUTCOMES) outcomes = idList(js);
				else adjusted = idList(js);
			} while (js.more(CLOSE_OBJECT));
		if (!js.atEnd()) offFastPath('text after the diagram');
		const required = (1 << FORMAT) | (1 << VERSION) | (1 << VARIABLES) | (1 << ARROWS);
		if ((seen & required) !== required) offFastPath('a required key is missing');
		const n = this.n;
		return {
			bytes: this.bytes,
			n,
			ids: this.ids.data.subarray(0, 2 * n),
			measured: this.measured.subarray(0, n),
			m: this.ends.length >> 1,
			ends: this.ends.data.subarray(0, this.ends.length),
			labels: this.labels.data.subarray(0, 2 * n),
			labelFlags: this.labelFlags.subarray(0, n),
			plainVariables: this.plainVariables,
			plainArrows: this.plainArrows,
			title,
			exposures,
			outcomes,
			adjusted
		};
	}

	/**
	 * The list of variables at the cursor. (Variables and arrows have a loop each: one loop for
	 * both was compiled by the JIT for variables, then thrown away and compiled again at the
	 * first arrow, as node --trace-deopt showed.)
	 */
	private variables(): void {
		const js = this.js;
		js.expect(OPEN_LIST, 'a list');
		if (js.empty(CLOSE_LIST)) return;
		do this.variable();
		while (js.more(CLOSE_LIST));
	}

	private arrows(): void {
		const js = this.js;
		js.expect(OPEN_LIST, 'a list');
		if (js.empty(CLOSE_LIST)) return;
		do this.arrow();
		while (js.more(CLOSE_LIST));
	}

	private variable(): void {
		const js = this.js;
		const i = this.n;
		if (i >= this.limits.variables) offFastPath('more variables than the limit');
		if (i >= this.measured.length) this.growFlags();
		let measured = 1;
		let seen = 0;
		let keys = 0; // keys read, to tell the plain shape: id, label, measured in that order
		let labelStart = -1;
		let labelEnd = -1;
		js.expect(OPEN_OBJECT, 'an object');
		if (!js.empty(CLOSE_OBJECT))
			do {
				const key = nextKey(js, VARIABLE_KEYS, VARIABLE_QUOTED, seen, keys);
				seen |= 1 << key;
				if (key !== keys++) this.plainVariables = false;
				if (key === ID) {
					plainId(js, 'an id');
					this.ids.push2(js.start, js.end);
				} else if (key === LABEL) {
					boundedString(js, MAX_LABEL_CHARS, 'a label');
					labelStart = js.start;
					labelEnd = js.end;
					this.labelFlags[i] = (js.escaped ? LABEL_ESCAPED : 0) | (js.wide ? LABEL_WIDE : 0);
				} else if (key === MEASURED) measured = js.boolean() ? 1 : 0;
				else if (key === NOTE) boundedString(js, MAX_NOTE_CHARS, 'a note');
				else finiteNumber(js); // x or y
			} while (js.more(CLOSE_OBJECT));
		if (!(seen & (1 << ID))) offFastPath('a variable without an id');
		if (keys !== 3) this.plainVariables = false;
		this.labels.push2(labelStart, labelEnd);
		this.measured[i] = measured;
		this.n = i + 1;
	}

	private growFlags(): void {
		const measured = new Uint8Array(this.measured.length * 2);
		measured.set(this.measured);
		this.measured = measured;
		const flags = new Uint8Array(this.labelFlags.length * 2);
		flags.set(this.labelFlags);
		this.labelFlags = flags;
	}

	private arrow(): void {
		const js = this.js;
		if (this.ends.length >> 1 >= this.limits.arrows) offFastPath('more arrows than the limit');
		let fromStart = 0;
		let seen = 0;
		let keys = 0; // keys read, to tell the plain shape: from, to in that order
		js.expect(OPEN_OBJECT, 'an object');
		if (!js.empty(CLOSE_OBJECT))
			do {
				const key = nextKey(js, ARROW_KEYS, ARROW_QUOTED, seen, keys);
				seen |= 1 << key;
				if (key !== keys++) this.plainArrows = false;
				if (key === FROM) {
					plainId(js, 'an arrow end');
					fromStart = js.start;
				} else if (key === TO) {
					if (fromStart === 0) offFastPath('an arrow whose "to" comes before its "from"'); // Causeway writes `from` first
					plainId(js, 'an arrow end');
					this.ends.push2(fromStart, js.start);
				} else boundedString(js, MAX_NOTE_CHARS, 'a note');
			} while (js.more(CLOSE_OBJECT));
		if (!(seen & (1 << TO))) offFastPath('an arrow without both ends');
		if (keys !== 2) this.plainArrows = false;
	}
}
