/**
 * The diagram model: what a user draws and what the native file format (version 1) stores.
 * Plain data, no methods, so it can be cloned, posted to a worker and serialised as is.
 * Unknown keys read from a file are kept in `extra` so that a round trip loses nothing.
 */

export type Extra = Record<string, unknown>;

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
	/** Keys of the file's variable object that this version does not know, kept for the round trip. */
	extra?: Extra;
}

export interface Arrow {
	from: string;
	to: string;
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
export const DIAGRAM_VERSION = 1;

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
