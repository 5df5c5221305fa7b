// A constant exposure or outcome column: the estimates say so, instead of the model's
// "left out of the model (collinear with the adjustment set)" on every row (hostile input).
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { runDataChecks } from '../../../src/lib/datacheck';
import { parseDiagramJson } from '../../../src/lib/graph/native-json';
import { parseTable } from '../../../src/lib/stats';

const demo = parseDiagramJson(readFileSync('static/demo/cycling-hypertension.causeway.json', 'utf8'));
const csv = readFileSync('static/demo/cycling-hypertension.csv', 'utf8');

/** The demo data with one column set to a single value (a few left missing). */
function withConstant(column: string, value: string): string {
	const [header, ...rows] = csv.trim().split('\n');
	const at = header.split(',').indexOf(column);
	return [header, ...rows.map((r, i) => r.split(',').map((x, j) => (j === at ? (i % 97 === 0 ? '' : value) : x)).join(','))].join('\n');
}

function estimatesOf(text: string) {
	const parsed = parseTable(text);
	if (!parsed.ok) throw new Error(parsed.error.message);
	return runDataChecks(demo, parsed.table, { parts: { arrows: false, claims: false } });
}

describe('constant exposure or outcome', () => {
	it('names the variable and its one value', () => {
		const exposure = estimatesOf(withConstant('cycling', '1'));
		expect(exposure.estimates).toBeNull();
		expect(exposure.estimatesMessage).toBe('No estimate: the exposure "cycling" has the single value 1 in every row with data; an effect needs rows that differ in it.');
		const outcome = estimatesOf(withConstant('hypertension', '0'));
		expect(outcome.estimates).toBeNull();
		expect(outcome.estimatesMessage).toBe('No estimate: the outcome "hypertension" has the single value 0 in every row with data; an effect needs rows that differ in it.');
	});

	it('a column with two values is estimated as before', () => {
		const report = estimatesOf(csv);
		expect(report.estimates?.rows.length).toBeGreaterThan(1);
		expect(report.estimates?.rows.every((r) => !r.message)).toBe(true);
	});
});
