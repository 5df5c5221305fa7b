/**
 * The diagram model: what a user draws and what the native file format (version 2) stores.
 * Plain data, no methods, so it can be cloned, posted to a worker and serialised as is.
 * Unknown keys read from a file are kept in `extra` so that a round trip loses nothing.
 *
 * Version 2 adds, per variable, the settings that link it to a data table (`data`: column,
 * kind, reference level, value labels) and notes on arrows. A study's diagram file is thus
 * enough to reproduce its data checks and estimates from the same data file.
 */

export type Extra = Record<string, unknown>;

/** How a variable's column is analysed (the same words as the data side's column kinds). */
export type DataKind = 'binary' | 'categorical' | 'ordinal' | 'continuous';
export const DATA_KINDS: readonly DataKind[] = ['binary', 'categorical', 'ordinal', 'continuous'];

/** A name for one value of a coded column, e.g. 0 = "manual". */
export interface ValueLabel {
	/** The value as it is written in the data file. */
	value: string;
	label: string;
}

/**
 * How a variable meets the data: every field is optional, and what is left out is decided
 * when data are loaded (column matched by id or label, kind detected from the values, first
 * level as reference).
 */
export interface VariableData {
	/** The column holding the variable; null: no data for it (treated as unmeasured by the checks). */
	column?: string | null;
	/** The column's kind, over the detected one. */
	kind?: DataKind;
	/** The reference level (a value as written in the data) for binary and categorical columns. */
	reference?: string;
	/** Names for values of a coded column, shown instead of the codes. */
	labels?: ValueLabel[];
	/** Keys of the file's `data` object that this version does not know. */
	extra?: Extra;
}

export interface Variable {
	/** Non-empty, unique within the diagram. */
	id: string;
	/** Shown on the canvas; defaults to the id. */
	label: string;
	/** False for variables that are not (or cannot be) measured: never proposed for adjustment. */
	measured: boolean;
	x?: number;
	y?: number;
	note?: string;
	/** Link to the data table (version 2). */
	data?: VariableData;
	/** Keys of the file's variable object that this version does not know, kept for the round trip. */
	extra?: Extra;
}

export interface Arrow {
	from: string;
	to: string;
	/** Why the arrow is assumed (e.g. with a citation); version 2. */
	note?: string;
	extra?: Extra;
}

export interface Diagram {
	title: string;
	variables: Variable[];
	arrows: Arrow[];
	exposures: string[];
	outcomes: string[];
	/** The planned adjustment set. */
	adjusted: string[];
	/** Top-level keys this version does not know, kept for the round trip. */
	extra?: Extra;
}

export const DIAGRAM_FORMAT = 'causeway.diagram';
export const DIAGRAM_VERSION = 2;
/** Versions this reader understands: version 1 files are version 2 files without the new keys. */
export const READABLE_VERSIONS: readonly number[] = [1, 2];

/**
 * Value labels in the order a JSON object keeps its keys (the file stores them as one):
 * array-index-like values ("0", "12") ascending, then the others as listed; a repeated value
 * keeps its last label. Keeping the model in this order makes write → read the identity. O(k log k).
 */
export function canonicalLabels(labels: readonly ValueLabel[]): ValueLabel[] {
	const last = new Map<string, string>();
	for (const l of labels) {
		last.delete(l.value);
		last.set(l.value, l.label);
	}
	const isIndex = (v: string) => /^(0|[1-9][0-9]*)$/.test(v) && Number(v) < 4294967295;
	const entries = [...last].map(([value, label]) => ({ value, label }));
	const indices = entries.filter((l) => isIndex(l.value)).sort((a, b) => Number(a.value) - Number(b.value));
	return [...indices, ...entries.filter((l) => !isIndex(l.value))];
}

/** True when the settings hold nothing (no column choice, kind, reference, labels or kept keys). */
export function isEmptyVariableData(data: VariableData | undefined): boolean {
	return (
		!data ||
		(data.column === undefined && data.kind === undefined && data.reference === undefined && (data.labels === undefined || data.labels.length === 0) && (!data.extra || Object.keys(data.extra).length === 0))
	);
}

export function emptyDiagram(title = 'Untitled diagram'): Diagram {
	return { title, variables: [], arrows: [], exposures: [], outcomes: [], adjusted: [] };
}

/**
 * Keys never copied from a file into a diagram object (top level, variables, arrows, `extra`):
 * assigning them to a plain object could change its prototype ("prototype pollution") in code
 * that later merges the object with Object.assign or a loop.
 */
export function isUnsafeKey(key: string): boolean {
	return key === '__proto__' || key === 'constructor' || key === 'prototype';
}
