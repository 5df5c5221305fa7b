/**
 * How the data checks name a column's kind and the size of an association, in the measure a
 * practitioner reads: an odds ratio per level against the reference, Cohen's d for a numeric
 * column between the two levels of a binary one, a correlation for two numeric columns,
 * Cramér's V only for two discrete columns with no binary one. Sizes are described in that
 * measure, without a verdict word; where the data section still says "weak", the rule of
 * thumb behind it (Cohen 1988) is named beside it. Pure functions, O(1) unless stated.
 */
import type { AnalysedColumn, ReadMeasure } from '../datacheck';
import type { ColumnKind } from '../stats';
import type { LabelOf } from './names';
import { formatCi, formatCount, formatNumber, pText } from './numbers';

/** The kind a column is analysed as, in one or two words. */
export const KIND_WORD: Readonly<Record<ColumnKind, string>> = {
	continuous: 'continuous',
	binary: 'binary',
	categorical: 'categorical',
	ordinal: 'ordinal'
};

/** What a kind means in a regression model (said beside estimates that use the column). */
export const KIND_IN_MODEL: Readonly<Record<ColumnKind, string>> = {
	continuous: 'one straight-line term',
	binary: 'one indicator, the second level against the first',
	categorical: 'one indicator per level against the reference level',
	ordinal: 'one indicator per level against the reference level'
};

/** "0, 1, 2 and 3" — the values of a code-like column. */
export function codeList(values: readonly number[]): string {
	const shown = values.map((v) => formatNumber(v, 15));
	return shown.length <= 1 ? shown.join('') : `${shown.slice(0, -1).join(', ')} and ${shown[shown.length - 1]}`;
}

/**
 * The kind beside a result: "continuous", "continuous — values look like category codes 0, 1, 2 and 3",
 * "binary (reference 0)", "categorical, 4 levels (reference 0-5yrs)".
 */
export function kindText(c: { kind: ColumnKind; levels: readonly string[]; codeValues?: readonly number[] | null }): string {
	if (c.kind === 'continuous') return c.codeValues ? `continuous — values look like category codes ${codeList(c.codeValues)}` : 'continuous';
	const reference = c.levels[0] === undefined ? '' : `reference ${c.levels[0]}`;
	if (c.kind === 'binary') return `binary${reference ? ` (${reference})` : ''}`;
	return `${KIND_WORD[c.kind]}, ${formatCount(c.levels.length)} levels${reference ? ` (${reference})` : ''}`;
}

/** A column name → the label of the variable it holds (the column name when none). O(columns) to build. */
export function columnLabels(columns: readonly Pick<AnalysedColumn, 'variable' | 'column'>[], labelOf: LabelOf): LabelOf {
	const byColumn = new Map(columns.map((c) => [c.column, labelOf(c.variable)]));
	return (column) => byColumn.get(column) ?? column;
}

const SHORT_NAME: Readonly<Record<ReadMeasure['type'], string>> = {
	'odds-ratio': 'OR',
	'standardized-difference': 'd',
	correlation: 'r',
	'cramers-v': 'V',
	'correlation-ratio': '√η²'
};

/** The measure's symbol: OR, d, r (ρ for Spearman), V, √η² or √ε². */
export function measureSymbol(m: ReadMeasure): string {
	if (m.type === 'correlation' && /rho/i.test(m.name)) return 'ρ';
	if (m.type === 'correlation-ratio' && /epsilon/.test(m.name)) return '√ε²';
	return SHORT_NAME[m.type];
}

/** "OR 1.62", "d = −0.27", "r = 0.21": for a narrow table cell. */
export function measureShort(m: ReadMeasure): string {
	return m.type === 'odds-ratio' ? `OR ${formatNumber(m.value)}` : `${measureSymbol(m)} = ${formatNumber(m.value)}`;
}

/** "1.21 to 2.17", or "" when the measure has no interval. */
export function measureCi(m: ReadMeasure): string {
	return m.ci ? formatCi(m.ci) : '';
}

/**
 * The size in words, in the measure itself and without a verdict:
 * - "odds of Hypertension = 1 are 1.62 times as high at Income band = 3 as at 1";
 * - "mean Age is 0.27 SD lower at Cycling = 1 than at 0" (Cohen's d);
 * - "correlation r = 0.21"; "Cramér's V = 0.08 (no binary column, so no single odds ratio)".
 * `name` turns column names into what the reader knows them by.
 */
export function measureMeaning(m: ReadMeasure, name: LabelOf = (c) => c): string {
	const c = m.contrast;
	if (m.type === 'odds-ratio' && c) {
		const of = `${name(c.of.variable)}${c.of.level === null ? '' : ` = ${c.of.level}`}`;
		const at = `${name(c.variable)} = ${c.level}`;
		return `odds of ${of} are ${formatNumber(m.value)} times as high at ${at} as at ${c.reference}`;
	}
	if (m.type === 'standardized-difference' && c) {
		const direction = m.value < 0 ? 'lower' : 'higher';
		return `mean ${name(c.of.variable)} is ${formatNumber(Math.abs(m.value))} SD ${direction} at ${name(c.variable)} = ${c.level} than at ${c.reference} (Cohen's d)`;
	}
	if (m.type === 'correlation') return `correlation ${measureSymbol(m)} = ${formatNumber(m.value)}`;
	if (m.type === 'cramers-v') return `Cramér's V = ${formatNumber(m.value)} (no binary column, so no single odds ratio)`;
	return `correlation ratio ${measureSymbol(m)} = ${formatNumber(m.value)}`;
}

/** "odds ratio 1.62 (95 % CI 1.21 to 2.17): odds of … are 1.62 times as high …". */
export function measureText(m: ReadMeasure, name: LabelOf = (c) => c): string {
	const head = m.type === 'odds-ratio' ? `odds ratio ${formatNumber(m.value)}` : `${measureSymbol(m)} = ${formatNumber(m.value)}`;
	const ci = m.ci ? ` (95 % CI ${formatCi(m.ci)})` : '';
	return m.type === 'odds-ratio' || m.type === 'standardized-difference' ? `${head}${ci}: ${measureMeaning(m, name)}` : `${head}${ci}`;
}

/**
 * Where a verdict word is still used (the arrow checks), the rule of thumb behind it, for the
 * measure shown: Cohen's (1988) "small" sizes, common practice, not a law. Odds ratios have no
 * such cut: a detected odds ratio is never called weak.
 */
export function smallSizeRule(m: ReadMeasure | null): string {
	if (!m || m.smallBelow === null) return 'odds ratios are never called weak: their size is shown as it is';
	return `weak means below Cohen's (1988) "small", |${measureSymbol(m)}| < ${formatNumber(m.smallBelow)} (a rule of thumb)`;
}

/** A result in the measure read: "odds ratio 1.77 (95 % CI …): odds of …; p < 0.001, n = 5,000". */
export function resultText(m: ReadMeasure | null, pValue: number, n: number, name: LabelOf = (c) => c): string {
	return `${m ? `${measureText(m, name)}; ` : ''}${pText(pValue)}, n = ${formatCount(n)}`;
}

/**
 * The kinds of a set's columns, grouped: "continuous: Age, Diet quality; binary (reference 0):
 * Family history". Columns that look like category codes are marked "(look like codes)". O(k).
 */
export function kindsSummary(items: readonly { label: string; kind: ColumnKind; levels: readonly string[]; codeValues?: readonly number[] | null }[]): string {
	const groups = new Map<string, string[]>();
	for (const it of items) {
		const key = it.kind === 'continuous' ? 'continuous' : kindText(it);
		const name = it.codeValues ? `${it.label} (look like category codes)` : it.label;
		groups.set(key, [...(groups.get(key) ?? []), name]);
	}
	return [...groups].map(([kind, names]) => `${kind}: ${names.join(', ')}`).join('; ');
}
