// How the data checks' numbers are written (the same in the app and the CLI), the column
// summary the app's mapping table shows, and the forest plot's short row names.
import { describe, expect, it } from 'vitest';
import { describeTable } from '../../../src/lib/datacheck';
import { formatCi, formatNumber, formatP, formatPercent, pText } from '../../../src/lib/wording';
import type { EstimateRow } from '../../../src/lib/datacheck';
import { shortRowLabels } from '../../../src/lib/wording';
import { tableOf } from '../datacheck/helpers';

describe('number formats', () => {
	it('p-values: two significant digits, "< 0.001" below, dash when missing', () => {
		expect(formatP(0.0342)).toBe('0.034');
		expect(formatP(0.5)).toBe('0.50');
		expect(formatP(0.00012)).toBe('< 0.001');
		expect(pText(0.00012)).toBe('p < 0.001');
		expect(pText(0.2)).toBe('p = 0.20');
		expect(formatP(NaN)).toBe('—');
	});

	it('estimates: three significant digits, intervals and signed percentages', () => {
		expect(formatNumber(0.60912)).toBe('0.609');
		expect(formatNumber(68.52)).toBe('68.5');
		expect(formatNumber(Infinity)).toBe('—');
		expect(formatNumber(null)).toBe('—');
		expect(formatP(0.0012)).toBe('0.0012');
		expect(formatPercent(Number.NaN)).toBe('—');
	});

	it('never e-notation: thousands grouped, small values in decimals, a true minus sign', () => {
		expect(formatNumber(123456)).toBe('123,000');
		expect(formatNumber(12345)).toBe('12,300');
		expect(formatNumber(999.96)).toBe('1,000');
		expect(formatNumber(0.000123)).toBe('0.000123');
		expect(formatNumber(1.23e-7)).toBe('0.000000123');
		expect(formatNumber(-4.567)).toBe('\u22124.57');
		expect(formatNumber(1.5)).toBe('1.5');
		expect(formatNumber(0.1 + 0.2)).toBe('0.3');
		expect(formatNumber(1e-10)).toBe('≈ 0');
		expect(formatNumber(1.2e23)).toBe('> 1,000,000,000,000');
		expect(formatNumber(-1.2e23)).toBe('< \u22121,000,000,000,000');
		for (const x of [1e-8, 3.3e-5, 7e5, 4.2e11, -2.5e-4, 6.02e10]) expect(formatNumber(x)).not.toMatch(/e[+-]?\d/);
		expect(formatCi([0.52351, 0.70712])).toBe('0.524 to 0.707');
		expect(formatPercent(28.44)).toBe('+28.4 %');
		expect(formatPercent(-17.04)).toBe('−17.0 %');
	});
});

describe('column summary for the mapping table', () => {
	it('keeps file positions around a column left out, flags constant columns, counts missing values', () => {
		const levels = Array.from({ length: 30 }, (_, i) => `L${i}`);
		const rows = ['a,many,b,c', ...levels.map((l, i) => `${i % 2 === 0 ? 'NA' : i},${l},7,${i % 3}`)];
		const info = describeTable(tableOf(rows.join('\n')), 't.csv');
		expect(info.skipped.map((s) => s.position)).toEqual([2]);
		expect(info.columns.map((c) => [c.name, c.position])).toEqual([
			['a', 1],
			['b', 3],
			['c', 4]
		]);
		expect(info.columns[0].missing).toBe(15);
		expect(info.columns[1].constant).toBe(true);
		expect(info.columns[2].constant).toBe(false);
	});
});

describe('forest plot row names', () => {
	const row = (roles: EstimateRow['roles']) => ({ roles }) as EstimateRow;
	it('numbers minimal sets only when there are several, and joins roles', () => {
		expect(shortRowLabels([row(['crude']), row(['minimal', 'planned']), row(['optimal'])])).toEqual(['Crude', 'Minimal · Planned', 'Optimal']);
		expect(shortRowLabels([row(['crude']), row(['minimal']), row(['minimal', 'optimal'])])).toEqual(['Crude', 'Minimal 1', 'Minimal 2 · Optimal']);
	});
});
