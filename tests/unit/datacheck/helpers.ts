/** Shared loading for the data-check tests: fixture diagrams and tables. */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { parseDiagramJson } from '../../../src/lib/graph/native-json';
import type { Diagram } from '../../../src/lib/graph/diagram';
import { parseTable, type Table } from '../../../src/lib/stats';

export const fixtureDir = fileURLToPath(new URL('../../fixtures/datacheck/', import.meta.url));
export const demoDir = fileURLToPath(new URL('../../../static/demo/', import.meta.url));

export function readDiagram(path: string): Diagram {
	return parseDiagramJson(readFileSync(path, 'utf8'));
}

export function readTable(path: string): Table {
	const r = parseTable(readFileSync(path, 'utf8'));
	if (!r.ok) throw new Error(r.error.message);
	return r.table;
}

export function tableOf(text: string): Table {
	const r = parseTable(text);
	if (!r.ok) throw new Error(r.error.message);
	return r.table;
}
