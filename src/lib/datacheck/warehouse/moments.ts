/**
 * Reading back what momentsSql (queries.ts) returned: a header `n, sum(a), …, sum(a*a),
 * sum(a*b), …` and one line of numbers. The covariances follow as
 * (Σab − Σa·Σb/n)/(n − 1) — what R's cov() gives on the same complete rows — and go to the
 * summary path with the means (summary.ts: Pearson, partial correlations, linear
 * regressions). O(k²) for k columns.
 */
import Papa from 'papaparse';
import { StatsError, type SummaryStatistics } from '../../stats';
import { productAlias, sumAlias } from './queries';

/** Whether a text's header is that of a moments result (starts n, sum(…)). */
export function isMomentsText(text: string): boolean {
	return /^\uFEFF?"?n"?\s*[,;\t]\s*"?sum\(/i.test(text.trimStart());
}

/** The summary statistics of a moments result. Throws StatsError naming the cell or header. */
export function readMoments(text: string): SummaryStatistics {
	const parsed = Papa.parse<string[]>(text.replace(/^\uFEFF/, '').trim(), { skipEmptyLines: 'greedy' });
	const [head, values, ...more] = parsed.data;
	if (!head || !values) throw new StatsError('A moments summary needs a header row and one row of numbers.');
	if (more.length > 0) throw new StatsError(`A moments summary has one row of numbers; row ${3} is one too many (strata are not read back: use the grouped counts).`, { row: 3 });
	const names: string[] = [];
	for (let i = 1; i < head.length; i++) {
		const m = /^sum\((.*)\)$/.exec(head[i].trim());
		if (!m || m[1].includes('*')) break;
		names.push(m[1]);
	}
	const k = names.length;
	const expected = ['n', ...names.map(sumAlias)];
	names.forEach((a, i) => names.slice(i).forEach((b) => expected.push(productAlias(a, b))));
	if (k < 2 || head.length !== expected.length)
		throw new StatsError(`Row 1: expected the header n, sum(a), …, then sum(a*b) for each pair (${expected.length} columns for ${k} variables), found ${head.length} columns.`, { row: 1 });
	const number = (j: number): number => {
		const cell = (values[j] ?? '').trim();
		if (head[j].trim() !== expected[j]) throw new StatsError(`Row 1, column ${j + 1}: expected '${expected[j]}', found '${head[j].trim()}'.`, { row: 1 });
		const x = cell === '' ? NaN : Number(cell);
		if (!Number.isFinite(x)) throw new StatsError(`Row 2, column '${expected[j]}': '${cell}' is not a number.`, { row: 2, column: expected[j] });
		return x;
	};
	const n = number(0);
	if (!(Number.isInteger(n) && n > 1)) throw new StatsError(`Row 2, column 'n': n must be a whole number above 1 (got ${values[0]}).`, { row: 2, column: 'n' });
	const sums = names.map((_, i) => number(1 + i));
	const matrix = names.map(() => new Array<number>(k).fill(0));
	let j = 1 + k;
	for (let a = 0; a < k; a++)
		for (let b = a; b < k; b++) {
			const cov = (number(j++) - (sums[a] * sums[b]) / n) / (n - 1);
			matrix[a][b] = matrix[b][a] = cov;
		}
	return { names, matrix, type: 'covariance', n, means: sums.map((s) => s / n) };
}
