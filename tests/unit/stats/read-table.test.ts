// The delimited-text reader: files written by R's write.csv / write.csv2 / write.table
// (tests/fixtures/stats, from make-fixtures.R), bad input messages, declared types, and
// the streaming reader against the whole-text reader.
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { matchColumns, parseTable, parseTableStream, type Column, type ParseResult, type Table } from '../../../src/lib/stats';
import { expectClose, fixture } from './fixtures';

const aq = fixture('airquality.json');
const text = (name: string) => readFileSync(fileURLToPath(new URL(`../../fixtures/stats/${name}`, import.meta.url)), 'utf8');

function ok(r: ParseResult): Table {
	if (!r.ok) throw new Error(r.error.message);
	return r.table;
}
function err(r: ParseResult) {
	if (r.ok) throw new Error('expected an error');
	return r.error;
}
function column(t: Table, name: string): Column {
	const c = t.columns.find((x) => x.name === name);
	if (!c) throw new Error(`no column ${name}`);
	return c;
}

function checkAirquality(t: Table): void {
	expect(t.rowCount).toBe(aq.rows);
	for (const name of aq.names as string[]) expect(column(t, name).missing).toBe(aq.missing[name]);
	const ozone = column(t, 'Ozone');
	expect(ozone.kind).toBe('continuous');
	if (ozone.kind === 'continuous') (aq.ozone as number[]).forEach((v, i) => (Number.isNaN(v) ? expect(ozone.values[i]).toBeNaN() : expect(ozone.values[i]).toBe(v)));
	const wind10 = column(t, 'Wind10');
	if (wind10.kind === 'continuous') (aq.wind10 as number[]).forEach((v, i) => expectClose(wind10.values[i], v, 1e-14));
	const hot = column(t, 'Hot');
	expect(hot.kind).toBe('binary');
	if (hot.kind !== 'continuous') {
		expect(hot.levels).toEqual(['no', 'yes']);
		(aq.hot as string[]).forEach((v, i) => expect(hot.levels[hot.codes[i]]).toBe(v));
	}
	expect(column(t, 'Month').kind).toBe('continuous');
}

describe('reading files written by R', () => {
	it('write.csv: comma, quoted header, NA, unnamed row-name column', () => {
		const t = ok(parseTable(text('airquality.csv')));
		expect(t.format).toEqual({ delimiter: ',', decimalComma: false, header: true });
		expect(t.columns[0].name).toBe('column1');
		checkAirquality(t);
	});
	it('write.csv2: semicolon and decimal comma, detected', () => {
		const t = ok(parseTable(text('airquality-csv2.csv')));
		expect(t.format).toEqual({ delimiter: ';', decimalComma: true, header: true });
		expect(t.notes.join(' ')).toMatch(/decimal comma \(detected\)/);
		checkAirquality(t);
	});
	it('write.table with tabs', () => {
		const t = ok(parseTable(text('airquality.tsv')));
		expect(t.format.delimiter).toBe('\t');
		checkAirquality(t);
	});
});

describe('typing and options', () => {
	const csv = 'id,sex,group,score,flag,grade\n1,f,a,1.5,0,low\n2,m,b,NA,1,high\n3,f,c,2.5,1,mid\n4,m,a,.,0,low\n5,f,b,3.25,1,high\n6,m,c,NULL,0,mid\n';
	it('detects binary (text and 0/1), categorical and continuous; counts NA, ".", NULL as missing', () => {
		const t = ok(parseTable(csv));
		expect(t.columns.map((c) => [c.name, c.kind])).toEqual([
			['id', 'continuous'],
			['sex', 'binary'],
			['group', 'categorical'],
			['score', 'continuous'],
			['flag', 'binary'],
			['grade', 'categorical']
		]);
		expect(column(t, 'score').missing).toBe(3);
		expect(t.rowCount).toBe(6);
		const flag = column(t, 'flag');
		if (flag.kind !== 'continuous') expect([...flag.codes]).toEqual([0, 1, 1, 0, 1, 0]);
	});
	it('user override: declared ordinal with a level order, categorical for numbers, extra missing token', () => {
		const t = ok(parseTable(csv, { types: { grade: 'ordinal', id: 'categorical' }, levelOrder: { grade: ['low', 'mid', 'high'] } }));
		const grade = column(t, 'grade');
		expect(grade.kind).toBe('ordinal');
		if (grade.kind !== 'continuous') {
			expect(grade.levels).toEqual(['low', 'mid', 'high']);
			expect([...grade.codes]).toEqual([0, 2, 1, 0, 2, 1]);
		}
		expect(column(t, 'id').kind).toBe('categorical');
		const t2 = ok(parseTable('a,b\n1,x\n-99,y\n3,x\n', { missingTokens: ['-99'] }));
		expect(column(t2, 'a').missing).toBe(1);
	});
	it('a header is not assumed when the first row is all numbers', () => {
		const t = ok(parseTable('1,2.5\n3,4.5\n5,6.5\n'));
		expect(t.format.header).toBe(false);
		expect(t.rowCount).toBe(3);
		expect(t.columns.map((c) => c.name)).toEqual(['V1', 'V2']);
	});
	it('quoted fields with delimiters, quotes and line breaks; CRLF; blank lines; byte-order mark', () => {
		const t = ok(parseTable('\ufeffname,note\r\n"Smith, J","said ""hi""\r\nthen left"\r\n\r\nDoe,ok\r\n'));
		expect(t.rowCount).toBe(2);
		const note = column(t, 'note');
		if (note.kind !== 'continuous') expect(note.levels).toContain('said "hi"\r\nthen left');
	});
	it('a text column past the level cap is left out with a message; the rest of the table loads', () => {
		const rows = Array.from({ length: 30 }, (_, i) => `p${i},${i % 2}`).join('\n');
		const t = ok(parseTable(`patient,y\n${rows}\n`));
		expect(t.columns.map((c) => c.name)).toEqual(['y']);
		expect(t.skipped[0].message).toMatch(/'patient' has more than 20 distinct text values/);
		expect(ok(parseTable(`patient,y\n${rows}\n`, { levelCap: 50 })).columns.map((c) => c.kind)).toEqual(['categorical', 'binary']);
	});
});

describe('bad input gets one line naming the problem and where', () => {
	it('ragged row names the row', () => {
		const e = err(parseTable('a,b,c\n1,2,3\n4,5\n6,7,8\n'));
		expect(e.message).toBe('Row 3 has 2 fields but the header has 3.');
		expect(e.row).toBe(3);
	});
	it('a quoted header with a line break stays on one line in the message (found by fuzzing)', () => {
		const e = err(parseTable('"bmi\nkg/m2",age\n22.1,34\nabc,41\n27.3,52\n'));
		expect(e.message).toBe("Row 3, column 'bmi↵kg/m2': 'abc' is not a number in a numeric column; mark it as missing or declare the column categorical.");
	});
	it('duplicate header', () => {
		expect(err(parseTable('age,sex,age\n1,2,3\n')).message).toBe("Duplicate column name 'age' (columns 1 and 3).");
	});
	it('no rows, empty file, one column', () => {
		expect(err(parseTable('a,b\n')).message).toBe('The file has a header row but no data rows.');
		expect(err(parseTable('')).message).toBe('The file is empty.');
		expect(err(parseTable('  \n\n')).message).toBe('The file is empty.');
		expect(err(parseTable('a\n1\n2\n')).message).toMatch(/^Only one column was found/);
	});
	it('binary content (a NUL byte; a ZIP-based workbook)', () => {
		expect(err(parseTable('a,b\n1,\u00002\n')).message).toMatch(/binary data/);
		expect(err(parseTable('PK\u0003\u0004\u0014\u0000\u0006\u0000')).message).toMatch(/spreadsheet workbook/);
	});
	it('a text value in a numeric column names the row and the column', () => {
		const e = err(parseTable('age,bmi\n34,22.1\n41,abc\n52,27.3\n60,24.0\n'));
		expect(e.message).toBe("Row 3, column 'bmi': 'abc' is not a number in a numeric column; mark it as missing or declare the column categorical.");
		expect([e.row, e.column]).toEqual([3, 'bmi']);
		const declared = err(parseTable('age,bmi\n34,22.1\n41,x\n', { types: { bmi: 'continuous' } }));
		expect(declared.message).toBe("Row 3, column 'bmi': 'x' is not a number (the column is declared continuous).");
	});
	it('a declared binary column with three values; a type declared for a missing column; an unclosed quote', () => {
		expect(err(parseTable('a,b\nx,1\ny,2\nz,3\n', { types: { a: 'binary' } })).message).toBe("Column 'a' is declared binary but has 3 distinct values.");
		expect(err(parseTable('a,b\n1,2\n', { types: { c: 'binary' } })).message).toMatch(/'c', which is not in the file/);
		expect(err(parseTable('a,b\n1,"2\n3,4\n')).message).toMatch(/quoted field is never closed/);
	});
});

describe('streaming reader', () => {
	function* split(s: string, cuts: number[]): Generator<string> {
		let last = 0;
		for (const c of [...cuts].sort((a, b) => a - b)) {
			yield s.slice(last, c);
			last = c;
		}
		yield s.slice(last);
	}
	const summary = (r: ParseResult) =>
		r.ok
			? { ok: true, rows: r.table.rowCount, format: r.table.format, cols: r.table.columns.map((c) => [c.name, c.kind, c.missing, c.kind === 'continuous' ? [...c.values] : [...c.codes], c.kind === 'continuous' ? [] : c.levels]) }
			: { ok: false, message: r.error.message };

	it('gives the same table as the whole-text reader wherever the chunks are cut (property test, fast-check)', async () => {
		const source = text('airquality-csv2.csv');
		const whole = summary(parseTable(source));
		await fc.assert(
			fc.asyncProperty(fc.array(fc.integer({ min: 0, max: source.length }), { maxLength: 12 }), async (cuts) => {
				expect(summary(await parseTableStream(split(source, cuts)))).toEqual(whole);
			}),
			{ numRuns: 60 }
		);
	});
	it('reads bytes from a Blob (as a File in a Web Worker), splitting multi-byte characters, and reports progress', async () => {
		const csv = 'größe,gruppe\n' + Array.from({ length: 5000 }, (_, i) => `${i / 10},${i % 3 === 0 ? 'ä' : 'ö'}`).join('\n') + '\n';
		const progress: number[] = [];
		const r = ok(await parseTableStream(new Blob([csv]), { onProgress: (p) => progress.push(p.fraction ?? -1) }));
		expect(r.rowCount).toBe(5000);
		expect(r.columns.map((c) => c.name)).toEqual(['größe', 'gruppe']);
		const g = column(r, 'gruppe');
		if (g.kind !== 'continuous') expect(g.levels).toEqual(['ä', 'ö']);
		expect(progress.at(-1)).toBe(1);
	});
	it('decodes UTF-8 byte chunks cut inside multi-byte characters', async () => {
		const csv = 'größe;gruppe\n' + Array.from({ length: 300 }, (_, i) => `${i},${i % 7};${i % 3 === 0 ? 'ä' : 'ö'}`).join('\n') + '\n';
		const bytes = new TextEncoder().encode(csv);
		function* pieces(): Generator<Uint8Array> {
			for (let i = 0; i < bytes.length; i += 7) yield bytes.subarray(i, i + 7);
		}
		expect(summary(await parseTableStream(pieces()))).toEqual(summary(parseTable(csv)));
		expect(ok(parseTable(csv)).format.decimalComma).toBe(true);
	});
	it('returns errors from late chunks with the file row', async () => {
		const good = Array.from({ length: 20000 }, (_, i) => `${i},${i * 2}`).join('\n');
		const e = err(await parseTableStream(split(`a,b\n${good}\n1,2,3\n`, [70000, 140000])));
		expect(e.message).toBe('Row 20002 has 3 fields but the header has 2.');
	});
});

describe('matching columns to diagram variables', () => {
	it('ignores case, accents, spaces and punctuation; ids before labels; reports the rest', () => {
		const m = matchColumns(
			['Age', 'BODY-MASS INDEX', 'Family_History', 'cycling', 'Cycling ', 'zip'],
			[
				{ id: 'age', label: 'Age' },
				{ id: 'bmi', label: 'Body-mass index' },
				{ id: 'family_history', label: 'Family history of hypertension' },
				{ id: 'cycling', label: 'Commutes by bicycle' },
				{ id: 'diet', label: 'Diet quality' }
			]
		);
		expect(m.matched).toEqual([
			{ variableId: 'age', column: 'Age', by: 'id' },
			{ variableId: 'bmi', column: 'BODY-MASS INDEX', by: 'label' },
			{ variableId: 'family_history', column: 'Family_History', by: 'id' },
			{ variableId: 'cycling', column: 'cycling', by: 'id' }
		]);
		expect(m.unmatchedVariables).toEqual(['diet']);
		expect(m.unusedColumns).toEqual(['Cycling ', 'zip']);
		expect(m.ambiguous).toEqual([]);
	});
	it('two columns equally good for a variable are reported as ambiguous', () => {
		const m = matchColumns(['Diet.Quality', 'diet quality'], [{ id: 'diet', label: 'Diet quality' }]);
		expect(m.ambiguous).toEqual([{ variableId: 'diet', columns: ['Diet.Quality', 'diet quality'] }]);
		expect(m.matched).toEqual([]);
	});
});
