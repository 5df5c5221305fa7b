/**
 * Parquet read directly (hyparquet): fixtures written by DuckDB's COPY … TO (FORMAT parquet)
 * from tests/fixtures/parquet/make-parquet-fixtures.mjs. The same data as CSV give the same
 * columns and the same checks; a grouped Parquet file reads as its rows with --count.
 */
import { openAsBlob } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { runDataChecks } from '../../../src/lib/datacheck';
import { expandGroupedTable } from '../../../src/lib/stats';
import { blobBytes, isParquetMagic, parseParquet } from '../../../src/lib/stats/table/read-parquet';
import { demoDir, readDiagram, readTable } from '../datacheck/helpers';
import { runCli as run } from '../cli/harness';
import { expectSameNumbers } from './report-compare';

const dir = fileURLToPath(new URL('../../fixtures/parquet/', import.meta.url));
const rows = readTable(`${demoDir}cycling-hypertension.csv`);
const demo = readDiagram(`${demoDir}cycling-hypertension.causeway.json`);

async function parquet(name: string) {
	const blob = await openAsBlob(`${dir}${name}`);
	expect(isParquetMagic(new Uint8Array(await blob.slice(0, 4).arrayBuffer()))).toBe(true);
	const r = await parseParquet(blobBytes(blob));
	if (!r.ok) throw new Error(r.error.message);
	return r.table;
}

describe('Parquet files', () => {
	it('the demo rows (Zstandard): same columns, kinds, levels and checks as the CSV', async () => {
		const t = await parquet('demo.parquet');
		expect(t.rowCount).toBe(rows.rowCount);
		expect(t.columns.map((c) => [c.name, c.kind, c.kind === 'continuous' ? null : c.levels])).toEqual(
			rows.columns.map((c) => [c.name, c.kind, c.kind === 'continuous' ? null : c.levels])
		);
		expect(t.notes[0]).toBe('Parquet file: 5,000 rows, 12 columns.');
		expectSameNumbers(runDataChecks(demo, t, { pictures: false }), runDataChecks(demo, rows, { pictures: false }));
	});

	it('grouped counts as Parquet (Snappy) read with the count column', async () => {
		const t = expandGroupedTable(await parquet('demo-grouped.parquet'), 'n');
		expect(t.rowCount).toBe(5000);
		const age = t.columns.find((c) => c.name === 'age')!;
		expect(age.kind).toBe('continuous');
	});

	it('NULLs are missing values; text stays text', async () => {
		const t = await parquet('with-nulls.parquet');
		const cycles = t.columns.find((c) => c.name === 'cycles')!;
		expect(cycles.kind).not.toBe('continuous');
		expect(cycles.kind !== 'continuous' && cycles.levels).toEqual(['yes']);
		expect(cycles.missing).toBeGreaterThan(0);
		expect(t.rowCount).toBe(50);
	});

	it('a file that is not Parquet: one line', async () => {
		const r = await parseParquet(blobBytes(new Blob(['PAR1 but not really'])));
		expect(r).toMatchObject({ ok: false });
		expect(r.ok || r.error.message).toMatch(/^Could not read the Parquet file: /);
	});

	it('the command reads .parquet files, grouped ones with --count', async () => {
		const direct = await run(['data', 'estimates', 'static/demo/cycling-hypertension.causeway.json', 'tests/fixtures/parquet/demo.parquet', '--json']);
		const csv = await run(['data', 'estimates', 'static/demo/cycling-hypertension.causeway.json', 'static/demo/cycling-hypertension.csv', '--json']);
		expect(direct.code).toBe(0);
		expectSameNumbers(JSON.parse(direct.out).estimates, JSON.parse(csv.out).estimates);
		const grouped = await run(['data', 'tests', 'static/demo/cycling-hypertension.causeway.json', 'tests/fixtures/parquet/demo-grouped.parquet', '--count', 'n']);
		expect(grouped.code).toBe(0);
		expect(grouped.out).toMatch(/5,000 rows/);
	});
});
