// `causeway data … --count n`: a grouped table read as its rows, bad counts as one line (exit 2).
import { describe, expect, it } from 'vitest';
import { runCli as run } from '../cli/harness';

const UCB = 'tests/fixtures/grouped/ucb.causeway.json';
const UCB_CSV = 'tests/fixtures/grouped/ucb-grouped.csv';

describe('causeway data --count', () => {
	it('reads each line as n rows and says so', async () => {
		const r = await run(['data', 'estimates', UCB, UCB_CSV, '--count', 'n']);
		expect(r.code).toBe(0);
		expect(r.out).toMatch(/Data: tests\/fixtures\/grouped\/ucb-grouped\.csv, 4,526 rows/);
		expect(r.out).toMatch(/Grouped table: 24 lines stand for 4,526 rows \(counts in column 'n'\)\./);
	});

	it('without --count, hints at the column and reads it as a column', async () => {
		const r = await run(['data', 'tests', UCB, UCB_CSV]);
		expect(r.code).toBe(0);
		expect(r.out).toMatch(/24 rows/);
		expect(r.out).toMatch(/Column 'n' looks like counts of rows \(a grouped table\); it is read as an ordinary column\. To read each line as that many rows, add --count n\./);
	});

	it('a bad count: exit 2, one line naming file, row and column', async () => {
		const r = await run(['data', 'tests', UCB, UCB_CSV, '--count', 'Dept']);
		expect(r.code).toBe(2);
		expect(r.err.trim()).toBe(`causeway: ${UCB_CSV}: Column 'Dept' holds text ('A'), not counts of rows.`);
	});
});
