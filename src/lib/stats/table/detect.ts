/**
 * Format detection on the first part of a delimited text file: binary content, line
 * ending, delimiter, decimal comma and header row. Each function reads a bounded sample
 * (O(sample length)).
 */
import { parseNumber, trimCell, type MissingTest } from './cells';

export type Delimiter = ',' | ';' | '\t';
export type Newline = '\n' | '\r\n' | '\r';

/**
 * Binary content: a NUL byte, a ZIP/OLE signature (spreadsheet workbooks) or more than
 * 1 % control characters in the first 4096 characters.
 */
export function looksBinary(sample: string): boolean {
	const head = sample.slice(0, 4096);
	if (head.startsWith('PK\u0003\u0004') || head.startsWith('\u00d0\u00cf\u0011\u00e0')) return true;
	let control = 0;
	for (let i = 0; i < head.length; i++) {
		const c = head.charCodeAt(i);
		if (c === 0) return true;
		if (c < 32 && c !== 9 && c !== 10 && c !== 13 && c !== 12) control++;
		else if (c === 0xfffd) control++; // replacement character: bytes that were not UTF-8 text
	}
	return head.length > 0 && control / head.length > 0.01;
}

/** The first line ending outside double quotes; '\n' when there is none. */
export function detectNewline(sample: string): Newline {
	let quoted = false;
	for (let i = 0; i < sample.length; i++) {
		const c = sample[i];
		if (c === '"') quoted = !quoted;
		else if (!quoted && c === '\r') return sample[i + 1] === '\n' ? '\r\n' : '\r';
		else if (!quoted && c === '\n') return '\n';
	}
	return '\n';
}

/** Counts of each candidate delimiter, outside quotes, in each of the first `maxLines` records. */
function countsPerRecord(sample: string, maxLines: number): Record<Delimiter, number[]> {
	const counts: Record<Delimiter, number[]> = { ',': [], ';': [], '\t': [] };
	let quoted = false;
	let current = { ',': 0, ';': 0, '\t': 0 };
	let lineHasContent = false;
	const push = () => {
		if (lineHasContent) for (const d of [',', ';', '\t'] as const) counts[d].push(current[d]);
		current = { ',': 0, ';': 0, '\t': 0 };
		lineHasContent = false;
	};
	for (let i = 0; i < sample.length && counts[','].length < maxLines; i++) {
		const c = sample[i];
		if (c === '"') quoted = !quoted;
		if (quoted) {
			lineHasContent = true;
			continue;
		}
		if (c === '\n' || c === '\r') push();
		else {
			lineHasContent = true;
			if (c === ',' || c === ';' || c === '\t') current[c]++;
		}
	}
	// The last record counts only when the sample is the whole file (it may be cut short),
	// except when it is the only one: a one-line file ("age,bmi" with no line break) is
	// judged by that line rather than by no evidence at all (which chose tab).
	if (counts[','].length === 0) push();
	return counts;
}

/**
 * Delimiter: the candidate (tab, semicolon, comma — in that order of preference) that
 * splits every sampled record into the same number (> 1) of fields. Semicolon is preferred
 * over comma because files with a decimal comma use semicolons. When none is consistent,
 * the candidate with the most records agreeing on its most common count wins.
 */
export function detectDelimiter(sample: string): Delimiter {
	const counts = countsPerRecord(sample, 50);
	const order: Delimiter[] = ['\t', ';', ','];
	for (const d of order) {
		const c = counts[d];
		if (c.length > 0 && c[0] > 0 && c.every((x) => x === c[0])) return d;
	}
	let best: Delimiter = ',';
	let bestScore = -1;
	for (const d of order) {
		const tally = new Map<number, number>();
		for (const x of counts[d]) if (x > 0) tally.set(x, (tally.get(x) ?? 0) + 1);
		const score = Math.max(0, ...tally.values());
		if (score > bestScore) {
			best = d;
			bestScore = score;
		}
	}
	return best;
}

/**
 * Decimal comma: only possible when the delimiter is not a comma; chosen when some sampled
 * cells look like "12,5" and none looks like "12.5".
 */
export function detectDecimalComma(rows: readonly (readonly string[])[], delimiter: Delimiter): boolean {
	if (delimiter === ',') return false;
	let comma = 0;
	let point = 0;
	for (const row of rows)
		for (const raw of row) {
			const s = trimCell(raw);
			if (/^[+-]?\d*,\d+$/.test(s)) comma++;
			else if (/^[+-]?\d*\.\d+$/.test(s)) point++;
		}
	return comma > 0 && point === 0;
}

/**
 * Header row: absent when every cell of the first row is a number or missing; absent also
 * when every text cell of the first row reappears below it in its own column (it then
 * looks like data); present otherwise.
 */
export function detectHeader(
	rows: readonly (readonly string[])[],
	decimalComma: boolean,
	isMissing: MissingTest
): boolean {
	if (rows.length === 0) return true;
	const first = rows[0].map(trimCell);
	const textCells = first
		.map((s, j) => ({ s, j }))
		.filter(({ s }) => !isMissing(s) && Number.isNaN(parseNumber(s, decimalComma)));
	if (textCells.length === 0) return false;
	if (rows.length === 1) return true;
	return !textCells.every(({ s, j }) => rows.slice(1).some((r) => trimCell(r[j] ?? '') === s));
}
