/**
 * Linking the diagram's variables to the table's columns, and the diagram the data checks
 * reason on: every measured variable without a column is treated as unmeasured there, so
 * claims and adjustment sets use only what the data hold. O(variables + columns) after the
 * name matching (src/lib/stats/table/match-columns.ts).
 */
// Not the stats façade: the app loads this module up front, and the façade pulls @stdlib's
// modules in with it (+49 KB gzip up front, measured with vite build, December 2026).
import { own } from '../stats/own';
import type { Diagram } from '../graph/diagram';
import { InputError } from '../graph/errors';
// The module itself, not the stats façade, for the same reason.
import { matchColumns } from '../stats/table/match-columns';
import type { MappingOverrides, VariableMapping } from './types';

export function mapVariables(diagram: Diagram, columnNames: readonly string[], overrides: MappingOverrides = {}): VariableMapping {
	const measured = diagram.variables.filter((v) => v.measured);
	const unmeasured = diagram.variables.filter((v) => !v.measured).map((v) => v.id);
	const known = new Set(diagram.variables.map((v) => v.id));
	const columnSet = new Set(columnNames);
	for (const [id, column] of Object.entries(overrides)) {
		if (!known.has(id)) throw new InputError(`The mapping names "${id}", which is not a variable of the diagram`);
		if (column !== null && !columnSet.has(column)) throw new InputError(`The mapping links "${id}" to column "${column}", which is not in the data`);
		if (unmeasured.includes(id) && column !== null) throw new InputError(`"${id}" is marked unmeasured in the diagram; mark it measured to link it to column "${column}"`);
	}
	const manualColumns = new Set(Object.values(overrides).filter((c): c is string => c !== null));
	const auto = matchColumns(
		columnNames.filter((c) => !manualColumns.has(c)),
		measured.filter((v) => !Object.hasOwn(overrides, v.id))
	);
	const columns: Record<string, string> = {};
	const by: Record<string, 'id' | 'label' | 'manual'> = {};
	for (const m of auto.matched) {
		columns[m.variableId] = m.column;
		by[m.variableId] = m.by;
	}
	const taken = new Map<string, string>();
	for (const v of measured) {
		const manual = own(overrides, v.id);
		if (manual === undefined || manual === null) continue;
		const other = taken.get(manual);
		if (other !== undefined) throw new InputError(`Column "${manual}" is linked to both "${other}" and "${v.id}"`);
		taken.set(manual, v.id);
		columns[v.id] = manual;
		by[v.id] = 'manual';
	}
	const used = new Set(Object.values(columns));
	const ambiguous = auto.ambiguous.filter((a) => own(columns, a.variableId) === undefined);
	const unmapped = measured.map((v) => v.id).filter((id) => own(columns, id) === undefined);
	const notes: string[] = [];
	if (unmapped.length > 0)
		notes.push(
			`No column for ${unmapped.map((id) => `"${id}"`).join(', ')}: treated as unmeasured for the data checks (claims and adjustment sets use only variables with data).`
		);
	return {
		columns,
		by,
		unmapped,
		unmeasured,
		unusedColumns: columnNames.filter((c) => !used.has(c)),
		ambiguous,
		notes
	};
}

/** The diagram as the data see it: variables without a column become unmeasured. O(n). */
export function dataDiagram(diagram: Diagram, mapping: Pick<VariableMapping, 'columns'>): Diagram {
	return {
		...diagram,
		variables: diagram.variables.map((v) => (v.measured && own(mapping.columns, v.id) === undefined ? { ...v, measured: false } : v))
	};
}

/**
 * The column linked to a variable the caller knows is linked (the seen diagram's measured
 * variables all are); read as an own property, so ids such as "constructor" are just names.
 */
export function mappedColumn(mapping: Pick<VariableMapping, 'columns'>, id: string): string {
	const name = own(mapping.columns, id);
	if (name === undefined) throw new Error(`no column is linked to "${id}"`);
	return name;
}
