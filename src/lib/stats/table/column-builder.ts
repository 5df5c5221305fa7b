/**
 * Accumulates one column's cells, row by row, into a typed array and decides its kind at
 * the end. Amortised O(1) per cell (typed arrays grow by doubling); memory is one
 * Float64Array (numbers) or one Int32Array plus the level labels (categories) — never the
 * cell strings.
 *
 * Typing rules (without a declared kind):
 * - all non-missing cells are numbers → continuous, or binary when there are exactly two
 *   distinct numbers;
 * - otherwise, text → binary (two levels) or categorical (up to `levelCap` levels); past
 *   the cap the column is skipped with a message;
 * - a column that is mostly numbers (at least as many number cells as text cells) but has
 *   some text is an error that names the first text cell's row and the column.
 * A declared kind overrides the rules (and is checked: a declared continuous column may
 * not hold text, a declared binary one must have two levels).
 */
import { StatsError } from '../errors';
import { sortLevels } from './columns';
import { parseNumber, trimCell, type MissingTest } from './cells';
import { ByteLabels } from './byte-labels';
import { plainDecimal } from './byte-number';
import { fieldText } from './field-text';
import type { Column, ColumnKind } from './types';

export interface ColumnSpec {
	name: string;
	/** 1-based position in the file. */
	position: number;
	declared: ColumnKind | undefined;
	/** Level order for a declared ordinal column (first = lowest). */
	levelOrder: readonly string[] | undefined;
	levelCap: number;
	decimalComma: boolean;
	isMissing: MissingTest;
	/** Whether the user gave missing-value tokens of their own (a plain number may then be one). */
	extraMissing?: boolean;
}

export type BuiltColumn = { column: Column; notes: string[] } | { skipped: string };

type Mode = 'numeric' | 'coded' | 'overflow';

export class ColumnBuilder {
	private mode: Mode;
	private numbers: Float64Array;
	private codes: Int32Array = new Int32Array(0);
	private levelIndex = new Map<string, number>();
	private levels: string[] = [];
	private length = 0;
	private missing = 0;
	private numberCells = 0;
	private textCells = 0;
	private firstText: { row: number; value: string } | null = null;
	// The first two distinct numbers, to recognise a binary numeric column without a set.
	private distinct: number[] = [];
	private moreThanTwo = false;
	private labels: ByteLabels | null = null;
	/**
	 * While a numeric column (of undeclared kind) has shown at most two distinct numbers, they
	 * are kept as codes (0: the first distinct number, 1: the second, −1: missing) rather than
	 * as doubles: most two-valued columns end up binary, and this halves the memory written
	 * for them (writing fresh memory is most of a million-row read, measured) and the copy
	 * into codes at the end. A third number turns them into doubles (unpair).
	 */
	private pair: Int32Array | null = null;
	/** Numeric mode and no user missing tokens: plain numbers are read from the bytes. */
	private fastNumbers: boolean;
	private readonly decimalComma: boolean;

	constructor(
		private readonly spec: ColumnSpec,
		initialCapacity: number
	) {
		const coded = spec.declared === 'binary' || spec.declared === 'categorical' || spec.declared === 'ordinal';
		this.mode = coded ? 'coded' : 'numeric';
		this.numbers = coded || spec.declared === undefined ? new Float64Array(0) : new Float64Array(initialCapacity);
		if (coded) this.codes = new Int32Array(initialCapacity);
		else if (spec.declared === undefined) this.pair = new Int32Array(initialCapacity);
		this.fastNumbers = !coded && !spec.extraMissing;
		this.decimalComma = spec.decimalComma;
	}

	/**
	 * Add the cell bytes[start, end) of file row `row`: plain numbers of a numeric column are
	 * read from the bytes (byte-number.ts) and repeated labels of a coded column are looked up
	 * by their bytes (byte-labels.ts); every other cell goes through `push` as text, so the
	 * two paths give the same column.
	 */
	pushBytes(bytes: Uint8Array, start: number, end: number, flags: number, row: number): void {
		if (this.fastNumbers) {
			let x = NaN;
			if (start === end) this.missing++;
			else {
				x = plainDecimal(bytes, start, end, this.decimalComma);
				if (x !== x) {
					this.push(fieldText(bytes, start, end, flags, row), row);
					return;
				}
				this.numberCells++;
				if (!this.moreThanTwo) this.noteDistinct(x);
			}
			this.storeNumber(x);
			return;
		} else if (this.mode === 'coded') {
			const labels = (this.labels ??= new ByteLabels());
			const cell = labels.get(bytes, start, end, flags);
			if (cell !== null) {
				if (cell.code < 0) this.missing++;
				else if (cell.isNumber) this.numberCells++;
				else this.textCells++;
				this.append(NaN, cell.code);
				return;
			}
			const numbers = this.numberCells;
			this.push(fieldText(bytes, start, end, flags, row), row);
			if (this.mode === 'coded' && this.length > 0)
				labels.set(bytes, start, end, flags, { code: this.codes[this.length - 1], isNumber: this.numberCells > numbers });
			return;
		}
		this.push(fieldText(bytes, start, end, flags, row), row);
	}

	/** Add the cell of file row `row` (1-based, header = row 1). */
	push(raw: string, row: number): void {
		const s = trimCell(raw);
		if (this.spec.isMissing(s)) {
			this.missing++;
			this.append(NaN, -1);
			return;
		}
		const x = parseNumber(s, this.spec.decimalComma);
		const isNumber = !Number.isNaN(x);
		if (isNumber) this.numberCells++;
		else {
			this.textCells++;
			if (this.firstText === null) this.firstText = { row, value: s };
		}
		if (this.mode === 'numeric') {
			if (isNumber) {
				this.noteDistinct(x);
				this.append(x, 0);
				return;
			}
			if (this.spec.declared === 'continuous')
				throw new StatsError(`Row ${row}, column '${this.spec.name}': '${s}' is not a number (the column is declared continuous).`, {
					row,
					column: this.spec.name
				});
			this.switchToCoded();
		}
		if (this.mode === 'coded') {
			this.append(NaN, this.codeOf(isNumber ? String(x) : s));
			if (this.levels.length > this.spec.levelCap) this.overflow();
		} else this.length++;
	}

	finish(): BuiltColumn {
		const { name } = this.spec;
		if (this.numberCells + this.textCells === 0) return { skipped: `Column '${name}' has only missing values; it is left out.` };
		if (this.spec.declared === undefined && this.textCells > 0 && this.numberCells >= this.textCells && this.firstText) {
			const { row, value } = this.firstText;
			throw new StatsError(
				`Row ${row}, column '${name}': '${value}' is not a number in a numeric column; mark it as missing or declare the column categorical.`,
				{ row, column: name }
			);
		}
		if (this.mode === 'overflow')
			return {
				skipped: `Column '${name}' has more than ${this.spec.levelCap} distinct text values, too many for a categorical column; it is left out (raise the level limit or declare its type to use it).`
			};
		if (this.mode === 'numeric') return this.finishNumeric();
		return this.finishCoded();
	}

	private finishNumeric(): BuiltColumn {
		const { name } = this.spec;
		const pair = this.pair;
		if (pair !== null && this.distinct.length === 2) {
			// Codes by first appearance; the reference level is the smaller number.
			const [d0, d1] = this.distinct;
			const codes = fitted(pair, this.length);
			if (d1 < d0) for (let i = 0; i < codes.length; i++) if (codes[i] >= 0) codes[i] = 1 - codes[i];
			const [lo, hi] = d0 < d1 ? [d0, d1] : [d1, d0];
			return {
				column: { name, kind: 'binary', codes, levels: [String(lo), String(hi)], missing: this.missing },
				notes: [`'${name}': binary (values ${lo} and ${hi}; reference ${lo}).`]
			};
		}
		if (pair !== null) this.unpair();
		const values = fitted(this.numbers, this.length);
		if (this.spec.declared !== 'continuous' && this.distinct.length === 2 && !this.moreThanTwo) {
			const [lo, hi] = this.distinct[0] < this.distinct[1] ? this.distinct : [this.distinct[1], this.distinct[0]];
			const codes = new Int32Array(this.length);
			for (let i = 0; i < codes.length; i++) {
				const v = values[i];
				codes[i] = v === lo ? 0 : v === hi ? 1 : -1; // NaN (missing) equals neither
			}
			return {
				column: { name, kind: 'binary', codes, levels: [String(lo), String(hi)], missing: this.missing },
				notes: [`'${name}': binary (values ${lo} and ${hi}; reference ${lo}).`]
			};
		}
		const notes = this.distinct.length === 1 ? [`'${name}' has a single value (${this.distinct[0]}).`] : [];
		return { column: { name, kind: 'continuous', values, missing: this.missing }, notes };
	}

	private finishCoded(): BuiltColumn {
		const { name, declared, levelOrder } = this.spec;
		let order: string[];
		if (declared === 'ordinal' && levelOrder) {
			const unknown = this.levels.filter((l) => !levelOrder.includes(l));
			if (unknown.length > 0)
				throw new StatsError(`Column '${name}': value '${unknown[0]}' is not in the declared level order.`, { column: name });
			order = levelOrder.filter((l) => this.levelIndex.has(l));
		} else order = sortLevels([...this.levels]);
		const kind = declared === 'ordinal' || declared === 'categorical' || declared === 'binary' ? declared : order.length === 2 ? 'binary' : 'categorical';
		if (kind === 'binary' && order.length !== 2)
			throw new StatsError(`Column '${name}' is declared binary but has ${order.length} distinct values.`, { column: name });
		const remap = new Int32Array(this.levels.length);
		order.forEach((label, code) => (remap[this.levelIndex.get(label) as number] = code));
		const codes = fitted(this.codes, this.length);
		for (let i = 0; i < codes.length; i++) if (codes[i] >= 0) codes[i] = remap[codes[i]];
		const notes: string[] = [];
		if (kind !== 'binary') notes.push(`'${name}': ${kind}, ${order.length} levels; reference level '${order[0]}'.`);
		else notes.push(`'${name}': binary ('${order[0]}' / '${order[1]}'; reference '${order[0]}').`);
		if (declared === 'ordinal' && !levelOrder) notes.push(`'${name}': no level order given; levels ordered ${order.every((l) => Number.isFinite(Number(l))) ? 'numerically' : 'alphabetically'}.`);
		return { column: { name, kind, codes, levels: order, missing: this.missing }, notes };
	}

	private noteDistinct(x: number): void {
		if (this.moreThanTwo) return;
		const d = this.distinct;
		if (d[0] === x || d[1] === x) return; // (SameValueZero as includes: 0 and −0 are one value)
		if (this.distinct.length < 2) this.distinct.push(x);
		else this.moreThanTwo = true;
	}

	private codeOf(label: string): number {
		let code = this.levelIndex.get(label);
		if (code === undefined) {
			code = this.levels.length;
			this.levels.push(label);
			this.levelIndex.set(label, code);
		}
		return code;
	}

	/** A number (NaN: missing) of a numeric column, as a pair code or a double. */
	private storeNumber(x: number): void {
		const pair = this.pair;
		if (pair !== null) {
			let code = -1;
			if (x === x) {
				const d = this.distinct;
				code = d[0] === x ? 0 : d[1] === x ? 1 : -2;
				// A third number, or a zero of the other sign than the one kept (−0 and 0 are one value but are stored as read).
				if (code === -2 || (x === 0 && !Object.is(x, d[code]))) {
					this.unpair();
					this.storeNumber(x);
					return;
				}
			}
			if (this.length === pair.length) {
				const bigger = new Int32Array(Math.max(16, pair.length * 2));
				bigger.set(pair);
				this.pair = bigger;
			}
			(this.pair as Int32Array)[this.length++] = code;
			return;
		}
		const length = this.length;
		if (length === this.numbers.length) this.grow();
		this.numbers[length] = x;
		this.length = length + 1;
	}

	/** Pair codes back to the numbers they stand for. */
	private unpair(): void {
		const pair = this.pair as Int32Array;
		const d = this.distinct;
		const numbers = new Float64Array(pair.length);
		for (let i = 0; i < this.length; i++) numbers[i] = pair[i] < 0 ? NaN : d[pair[i]];
		this.numbers = numbers;
		this.pair = null;
	}

	/** First text cell in a so-far numeric column: re-code the numbers seen as labels. */
	private switchToCoded(): void {
		if (this.pair !== null) this.unpair();
		this.mode = 'coded';
		this.fastNumbers = false;
		this.codes = new Int32Array(this.numbers.length);
		for (let i = 0; i < this.length; i++) {
			const x = this.numbers[i];
			this.codes[i] = Number.isNaN(x) ? -1 : this.codeOf(String(x));
		}
		this.numbers = new Float64Array(0);
		if (this.levels.length > this.spec.levelCap) this.overflow();
	}

	/** Past the level cap: keep counting (for the messages), hold no data. */
	private overflow(): void {
		this.mode = 'overflow';
		this.fastNumbers = false;
		this.labels = null;
		this.codes = new Int32Array(0);
		this.levelIndex.clear();
		this.levels = [];
	}

	private grow(): void {
		const bigger = new Float64Array(Math.max(16, this.numbers.length * 2));
		bigger.set(this.numbers);
		this.numbers = bigger;
	}

	private append(x: number, code: number): void {
		if (this.mode === 'numeric') {
			this.storeNumber(x);
			return;
		}
		if (this.mode === 'coded') {
			if (this.length === this.codes.length) {
				const bigger = new Int32Array(Math.max(16, this.codes.length * 2));
				bigger.set(this.codes);
				this.codes = bigger;
			}
			this.codes[this.length] = code;
		}
		this.length++;
	}
}

/**
 * The first `length` entries: a view when the unused tail is under 1/8 of the buffer (no
 * copy, little waste), else a tight copy.
 */
function fitted<T extends Float64Array | Int32Array>(a: T, length: number): T {
	return (a.length - length <= a.length / 8 ? a.subarray(0, length) : a.slice(0, length)) as T;
}
