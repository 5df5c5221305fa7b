/**
 * Which columns a summary must carry for the current diagram and column mapping: the column
 * of every measured variable linked to one (the checks reason on those only, mapping.ts), each
 * discrete or continuous. Without a data table the links come from the diagram's data
 * settings and the caller's overrides, else a variable's id is taken as its column's name;
 * kinds from the table, the settings or the overrides, and a variable whose kind is unknown
 * is grouped by its values (exact for any kind). O(variables + columns).
 */
import type { Diagram } from '../../graph/diagram';
import type { ColumnKind } from '../../stats';
import { mapVariables } from '../mapping';
import { settingsMapping } from '../settings';
import type { MappingOverrides } from '../types';

export interface SummaryColumn {
	name: string;
	/** Continuous: carried as sums and cross-products in the moments query; else grouped. */
	continuous: boolean;
}

export interface SummaryPlan {
	columns: SummaryColumn[];
	/** Name of the count column of the grouped counts: n, unless a data column is named so. */
	countName: string;
}

export interface PlanInput {
	/** The data table's column names and kinds, when one is at hand (a sample, or the rows). */
	table?: { name: string; kind: ColumnKind }[];
	mapping?: MappingOverrides;
	types?: Readonly<Record<string, ColumnKind>>;
}

const COUNT_NAMES = ['n', 'n_rows', 'causeway_n'];

/** The summary's columns, in the diagram's variable order, each once. */
export function summaryPlan(diagram: Diagram, input: PlanInput = {}): SummaryPlan {
	const byVariable = new Map<string, string>();
	if (input.table) {
		const names = input.table.map((c) => c.name);
		const { overrides } = settingsMapping(diagram, names, { mapping: input.mapping, settingProblems: 'note' });
		const mapping = mapVariables(diagram, names, overrides);
		for (const [id, column] of Object.entries(mapping.columns)) byVariable.set(id, column);
	} else {
		for (const v of diagram.variables) {
			if (!v.measured) continue;
			const over = input.mapping && Object.hasOwn(input.mapping, v.id) ? input.mapping[v.id] : undefined;
			const column = over !== undefined ? over : v.data?.column !== undefined ? v.data.column : v.id;
			if (column !== null) byVariable.set(v.id, column);
		}
	}
	const tableKind = new Map((input.table ?? []).map((c) => [c.name, c.kind]));
	const settingKind = new Map(diagram.variables.flatMap((v) => (v.data?.kind && byVariable.has(v.id) ? [[byVariable.get(v.id)!, v.data.kind] as const] : [])));
	const seen = new Set<string>();
	const columns: SummaryColumn[] = [];
	for (const v of diagram.variables) {
		const name = byVariable.get(v.id);
		if (name === undefined || seen.has(name)) continue;
		seen.add(name);
		const kind = input.types?.[name] ?? settingKind.get(name) ?? tableKind.get(name);
		columns.push({ name, continuous: kind === 'continuous' });
	}
	const taken = new Set(columns.map((c) => c.name.toLowerCase()));
	const countName = COUNT_NAMES.find((n) => !taken.has(n)) ?? `n_${columns.length}`;
	return { columns, countName };
}
