/**
 * Grouped (frequency-weighted) tables: read as as many rows as their counts say, every check
 * equals the row-level one (the demo study grouped here, compared to 1e-9), and R's glm with
 * weights = n on the same counts (tests/fixtures/grouped/make-grouped-fixtures.R, R 4.2.2,
 * UCBAdmissions).
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { runDataChecks } from '../../../src/lib/datacheck';
import { reportDataFromChecks } from '../../../src/lib/export/from-datacheck';
import { labelLookup } from '../../../src/lib/wording';
import { expandGroupedTable, MAX_GROUPED_ROWS, parseTable, StatsError, suggestCountColumn, type Table } from '../../../src/lib/stats';
import { demoDir, readDiagram, tableOf } from '../datacheck/helpers';
import { expectSameNumbers } from './report-compare';

const groupedDir = fileURLToPath(new URL('../../fixtures/grouped/', import.meta.url));
const R = JSON.parse(readFileSync(`${groupedDir}grouped.json`, 'utf8'));

/** Lines of `csv` grouped by the chosen columns, with their counts in column n (as GROUP BY … COUNT(*) would). */
export function groupLines(csv: string, keep: readonly string[]): string {
	const [head, ...lines] = csv.trim().split('\n');
	const names = head.split(',');
	const at = keep.map((k) => names.indexOf(k));
	const counts = new Map<string, number>();
	for (const line of lines) {
		const cells = line.split(',');
		const key = at.map((i) => cells[i]).join(',');
		counts.set(key, (counts.get(key) ?? 0) + 1);
	}
	return [`${keep.join(',')},n`, ...[...counts].map(([k, n]) => `${k},${n}`)].join('\n');
}

function onlyColumns(csv: string, keep: readonly string[]): string {
	const [head, ...lines] = csv.trim().split('\n');
	const at = keep.map((k) => head.split(',').indexOf(k));
	return [keep.join(','), ...lines.map((l) => at.map((i) => l.split(',')[i]).join(','))].join('\n');
}

const demoCsv = readFileSync(`${demoDir}cycling-hypertension.csv`, 'utf8');
const demoDiagram = readDiagram(`${demoDir}cycling-hypertension.causeway.json`);

describe('a grouped table is read as its rows', () => {
	const keep = ['age', 'cycling', 'hypertension', 'family_history', 'app_panel', 'antihypertensive', 'distance'];
	const rows = tableOf(onlyColumns(demoCsv, keep));
	const grouped = expandGroupedTable(tableOf(groupLines(demoCsv, keep)), 'n');

	it('has the rows, columns and kinds of the row-level table', () => {
		expect(grouped.rowCount).toBe(rows.rowCount);
		expect(grouped.columns.map((c) => [c.name, c.kind])).toEqual(rows.columns.map((c) => [c.name, c.kind]));
		expect(grouped.notes.at(-1)).toMatch(/^Grouped table: [\d,]+ lines stand for 5,000 rows \(counts in column 'n'\)\.$/);
	});

	it('gives every arrow check, claim check, estimate and confounder check of the rows, to 1e-9', () => {
		// Age (whole years) and distance enter the logistic fits as continuous covariates.
		const options = { pictures: false, settingProblems: 'note' as const };
		const { grouped: source, ...a } = runDataChecks(demoDiagram, grouped, options);
		const b = runDataChecks(demoDiagram, rows, options);
		expect(source).toEqual({ lines: grouped.grouped!.lines, countColumn: 'n' });
		expect(a.arrows.checks.length).toBeGreaterThan(3);
		expect(a.estimates?.rows.length).toBeGreaterThan(0);
		expectSameNumbers(a, b);
	});
});

describe('against R glm with weights = n (UCBAdmissions, make-grouped-fixtures.R)', () => {
	const table = expandGroupedTable(tableOf(readFileSync(`${groupedDir}ucb-grouped.csv`, 'utf8')), 'n');
	const diagram = readDiagram(`${groupedDir}ucb.causeway.json`);
	const report = runDataChecks(diagram, table, { pictures: false });

	it('reads 24 lines as 4,526 applicants', () => {
		expect(table.rowCount).toBe(R.total);
	});

	it('adjusted and crude odds ratios of Male vs Female equal glm(weights = n)', () => {
		const rows = report.estimates!.rows;
		const planned = rows.find((r) => r.roles.includes('planned'))!;
		const crude = rows.find((r) => r.roles.includes('crude'))!;
		const z = 1.959963984540054;
		// glm(rejected ~ Gender + Dept, binomial, weights = n): coefficient GenderMale and its SE.
		expect(Math.log(planned.estimate)).toBeCloseTo(R.adjusted.coef[1], 8);
		expect(Math.log(planned.ci[1] / planned.ci[0]) / (2 * z)).toBeCloseTo(R.adjusted.se[1], 6);
		// glm(rejected ~ Gender, binomial, weights = n).
		expect(Math.log(crude.estimate)).toBeCloseTo(R.crude.coef[1], 8);
		expect(Math.log(crude.ci[1] / crude.ci[0]) / (2 * z)).toBeCloseTo(R.crude.se[1], 6);
	});

	it("the gender → admit two-way table's X² equals chisq.test(xtabs(n ~ Gender + Admit), correct = FALSE)", () => {
		const check = report.arrows.checks.find((c) => c.from === 'gender' && c.to === 'admit')!;
		expect(check.table!.chiSquare!.statistic).toBeCloseTo(R.chisq.statistic, 8);
		expect(check.table!.chiSquare!.df).toBe(R.chisq.df);
		expect(check.table!.n).toBe(R.total);
	});
});

describe('bad counts are refused with the row and column', () => {
	const read = (text: string): Table => tableOf(text);
	const refused = (text: string, column = 'n') => {
		try {
			expandGroupedTable(read(text), column);
		} catch (e) {
			expect(e).toBeInstanceOf(StatsError);
			return (e as Error).message;
		}
		throw new Error('not refused');
	};

	it('negative, non-integer, empty, text, missing column', () => {
		expect(refused('x,n\na,3\nb,-2\nc,4\n')).toBe("Row 3, column 'n': the count -2 is negative; a count of rows is a whole number, 0 or more.");
		expect(refused('x,n\na,3\nb,2.5\nc,4\n')).toBe("Row 3, column 'n': the count 2.5 is not a whole number; a count of rows is a whole number, 0 or more.");
		expect(refused('x,n\na,3\nb,2\nc,\n')).toBe("Row 4, column 'n': the count is empty; every line of a grouped table needs its number of rows.");
		expect(refused('x,n\na,three\nb,two\n')).toBe("Column 'n' holds text ('three'), not counts of rows.");
		// A number column with a text cell is refused by the reader itself, with its row.
		expect(parseTable('x,n\na,3\nb,two\nc,4\n')).toMatchObject({ ok: false, error: { row: 3, column: 'n' } });
		expect(refused('x,n\na,3\n', 'freq')).toBe("There is no column 'freq' to read counts of rows from.");
	});

	it('more represented rows than the limit', () => {
		expect(refused(`x,n\na,${MAX_GROUPED_ROWS}\nb,1\n`)).toBe(
			"The counts in column 'n' add up to more than 10,000,000 rows (reached at row 3), the most Causeway reads."
		);
	});

	it('lines with count 0 are dropped with the levels only they had', () => {
		const t = expandGroupedTable(read('x,y,n\na,1,3\nb,2,0\nc,1,2\n'), 'n');
		expect(t.rowCount).toBe(5);
		const x = t.columns.find((c) => c.name === 'x')!;
		expect(x.kind !== 'continuous' && x.levels).toEqual(['a', 'c']);
	});
});

describe('count column hint', () => {
	it('suggests a column named n, count or freq of whole numbers ≥ 1, nothing else', () => {
		const hint = (text: string) => {
			const r = parseTable(text);
			if (!r.ok) throw new Error(r.error.message);
			return suggestCountColumn(r.table);
		};
		expect(hint('x,Count\na,3\nb,1\n')).toBe('Count');
		expect(hint('x,freq\na,3\nb,12\n')).toBe('freq');
		expect(hint('x,n\na,0\nb,1\n')).toBeNull(); // a 0/1 indicator named n
		expect(hint('x,n\na,2.5\nb,1\n')).toBeNull(); // a measurement
		expect(hint('x,total\na,3\nb,1\n')).toBeNull(); // not one of the names
		expect(hint('n,count\n3,3\n1,1\n')).toBeNull(); // two candidates: no guess
	});
});

describe('the report names the data source', () => {
	it('grouped counts: lines, count column, no row-level data; rows: nothing added', () => {
		const table = expandGroupedTable(tableOf(readFileSync(`${groupedDir}ucb-grouped.csv`, 'utf8')), 'n');
		const diagram = readDiagram(`${groupedDir}ucb.causeway.json`);
		const label = labelLookup(diagram);
		const grouped = reportDataFromChecks(runDataChecks(diagram, table, { pictures: false }), label, 'ucb-grouped.csv');
		expect(grouped.source).toEqual({
			name: 'ucb-grouped.csv',
			rows: 4526,
			kind: "Source: grouped counts, 24 lines each read as as many rows as its count (column 'n'); no row-level data were read."
		});
		const rows = reportDataFromChecks(runDataChecks(diagram, tableOf('Admit,Gender,Dept\nAdmitted,Male,A\nRejected,Female,B\nAdmitted,Female,A\nRejected,Male,B\n'), { pictures: false }), label, 'rows.csv');
		expect(rows.source).toEqual({ name: 'rows.csv', rows: 4 });
	});
});
