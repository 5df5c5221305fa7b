/**
 * Model matrices for regression: an intercept, continuous covariates as they are, binary
 * covariates as 0/1, and categorical or ordinal covariates dummy-coded against their first
 * observed level (treatment coding; the reference is stated in the notes). Complete cases
 * over the outcome and all covariates. O(n·p) time and memory (row-major Float64Array,
 * one row of p numbers per case — the layout the IRLS loop streams through).
 */
import { StatsError } from '../errors';
import { completeRows, numericValues, observedLevels } from '../table/columns';
import type { CodedColumn, Column } from '../table/types';

export interface DesignTerm {
	/** Source column name ("(intercept)" for the intercept). */
	column: string;
	kind: Column['kind'] | 'intercept';
	/** Indices of this term's columns in the design. */
	indices: number[];
	/** Reference level of a dummy-coded term. */
	reference?: string;
}

export interface Design {
	/** Cases (rows) used. */
	n: number;
	/** Number of design columns, intercept included. */
	p: number;
	/** Row-major n × p. Column 0 is the intercept. */
	x: Float64Array;
	/** Outcome, when the design has one. */
	y: Float64Array | null;
	/** Coefficient names, one per design column. */
	names: string[];
	terms: DesignTerm[];
	/** Indices of the data rows used (complete cases). */
	rows: Int32Array;
	notes: string[];
}

export const INTERCEPT = '(intercept)';

/** Name of a binary column's single coefficient: the column name when its levels are 0/1. */
function binaryName(c: CodedColumn, levels: readonly string[]): string {
	return levels[0] === '0' && levels[1] === '1' ? c.name : `${c.name}[${levels[1]}]`;
}

/**
 * Build the design for `outcome` (null for none) on `covariates`. The outcome is read as
 * numbers (continuous values, binary 0/1, ordinal scores).
 */
export function buildDesign(outcome: Column | null, covariates: readonly Column[]): Design {
	const all = outcome ? [outcome, ...covariates] : [...covariates];
	const names = new Set<string>();
	for (const c of all) {
		if (names.has(c.name)) throw new StatsError(`Column '${c.name}' appears twice in the model.`, { column: c.name });
		names.add(c.name);
	}
	const rows = completeRows(all);
	const n = rows.length;
	const notes: string[] = [];
	const terms: DesignTerm[] = [{ column: INTERCEPT, kind: 'intercept', indices: [0] }];
	const coefNames = [INTERCEPT];
	// Each source: a function filling design column `index` from case k.
	const fillers: ((k: number) => number)[] = [() => 1];
	for (const c of covariates) {
		if (c.kind === 'continuous') {
			const v = c.values;
			terms.push({ column: c.name, kind: 'continuous', indices: [coefNames.length] });
			coefNames.push(c.name);
			fillers.push((k) => v[rows[k]]);
			continue;
		}
		const { codes, levels } = observedLevels(c, rows);
		if (levels.length < 2) {
			notes.push(`'${c.name}' has a single observed level ('${levels[0] ?? ''}') in the complete cases; it is left out.`);
			continue;
		}
		const indices: number[] = [];
		if (levels.length === 2) {
			indices.push(coefNames.length);
			coefNames.push(binaryName(c, levels));
			fillers.push((k) => (codes[k] === 1 ? 1 : 0));
		} else
			for (let l = 1; l < levels.length; l++) {
				indices.push(coefNames.length);
				coefNames.push(`${c.name}[${levels[l]}]`);
				fillers.push((k) => (codes[k] === l ? 1 : 0));
			}
		terms.push({ column: c.name, kind: c.kind, indices, reference: levels[0] });
		if (levels.length > 2 || levels[0] !== '0')
			notes.push(`'${c.name}': dummy coding, reference level '${levels[0]}' (the first level).`);
	}
	const p = coefNames.length;
	const x = new Float64Array(n * p);
	for (let j = 0; j < p; j++) {
		const fill = fillers[j];
		for (let k = 0; k < n; k++) x[k * p + j] = fill(k);
	}
	let y: Float64Array | null = null;
	if (outcome) {
		const v = numericValues(outcome);
		y = new Float64Array(n);
		for (let k = 0; k < n; k++) y[k] = v[rows[k]];
	}
	return { n, p, x, y, names: coefNames, terms, rows, notes };
}

/** A design from plain arrays (all predictors numeric), with an intercept. O(n·p). */
export function designFromArrays(y: Float64Array | null, predictors: readonly { name: string; values: Float64Array }[]): Design {
	const n = y ? y.length : (predictors[0]?.values.length ?? 0);
	const p = predictors.length + 1;
	const x = new Float64Array(n * p);
	for (let k = 0; k < n; k++) {
		x[k * p] = 1;
		for (let j = 1; j < p; j++) x[k * p + j] = predictors[j - 1].values[k];
	}
	const rows = new Int32Array(n);
	for (let k = 0; k < n; k++) rows[k] = k;
	return {
		n,
		p,
		x,
		y,
		names: [INTERCEPT, ...predictors.map((q) => q.name)],
		terms: [{ column: INTERCEPT, kind: 'intercept', indices: [0] }, ...predictors.map((q, j) => ({ column: q.name, kind: 'continuous' as const, indices: [j + 1] }))],
		rows,
		notes: []
	};
}
