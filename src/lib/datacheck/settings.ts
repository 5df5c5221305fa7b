/**
 * Each variable's data settings (Variable.data in the diagram file: column, kind, reference
 * level, value labels) applied to a table, with the caller's overrides on top (the CLI's
 * --map and --type flags). The one place where the diagram file's settings become the
 * mapping, column kinds and levels the checks use, so the app, `causeway test` and
 * `causeway estimate` reproduce each other from the same two files.
 *
 * Two ways to meet a setting the data cannot honour (a column the file does not have, a kind
 * its values do not fit, a reference level it lacks): `refuse` (the command line: the numbers
 * would silently differ from the study's, so it stops with one line naming the setting) or
 * `note` (the app: the setting is left out for this table, the report says so, and the user
 * can fix it in the Data section). O(variables + columns), plus O(rows) per changed column.
 */
import type { Diagram } from '../graph/diagram';
import { InputError } from '../graph/errors';
import { own, StatsError, type Column, type ColumnKind, type Table } from '../stats';
import { mapVariables } from './mapping';
import { applyLevels, retypeColumn, type LevelSettings } from './retype';
import type { MappingOverrides, TypeOverrides, VariableMapping } from './types';

export type SettingProblems = 'refuse' | 'note';

/** The `where` of a refused setting: the command line names the data file and the flag that overrides it. */
export const SETTINGS_WHERE = 'data-settings';

/** One variable as the checks used it: the column, its kind, and where each came from. */
export interface ColumnUse {
	variable: string;
	column: string;
	/** How the column was found: by the variable's id or label, or chosen (file or flag). */
	by: 'id' | 'label' | 'manual';
	kind: ColumnKind;
	/** True when the kind was chosen (diagram file or --type), false when detected. */
	kindChosen: boolean;
	/** First level of a coded column (after the settings), null for a numeric one. */
	reference: string | null;
	/** Value labels applied. */
	labels: number;
}

export interface SettingsInput {
	/** Variable id → column (null: no data), over the diagram's settings. */
	mapping?: MappingOverrides;
	/** Column → kind, over the diagram's settings and the detected kinds. */
	types?: TypeOverrides;
	settingProblems?: SettingProblems;
}

export interface SettledTable {
	table: Table;
	columnOf: (name: string) => Column;
	mapping: VariableMapping;
	used: ColumnUse[];
	/** Settings left out for this table (only with settingProblems 'note'). */
	notes: string[];
}

const quoteId = (id: string) => `"${id}"`;

/**
 * Column links from the diagram's settings (measured variables only), with the caller's on
 * top. A linked column the data lack is refused, or dropped with a note so the variable is
 * matched by name. O(n).
 */
export function settingsMapping(diagram: Diagram, columnNames: readonly string[], input: SettingsInput = {}): { overrides: Record<string, string | null>; notes: string[] } {
	const have = new Set(columnNames);
	const overrides: Record<string, string | null> = {};
	const notes: string[] = [];
	for (const v of diagram.variables) {
		const column = v.data?.column;
		if (!v.measured || column === undefined || Object.hasOwn(input.mapping ?? {}, v.id)) continue;
		if (column !== null && !have.has(column)) {
			const message = `The diagram links ${quoteId(v.id)} to column "${column}", which is not in the data`;
			if (input.settingProblems !== 'note') throw new InputError(message, SETTINGS_WHERE);
			notes.push(`${message}: matched by name instead.`);
			continue;
		}
		overrides[v.id] = column;
	}
	return { overrides: { ...overrides, ...(input.mapping ?? {}) }, notes };
}

/**
 * The table with every setting applied: links, kinds (the caller's --type first, then the
 * variable's kind), reference levels and value labels.
 */
export function applyDataSettings(diagram: Diagram, table: Table, input: SettingsInput = {}): SettledTable {
	const names = table.columns.map((c) => c.name);
	const types = input.types ?? {};
	for (const name of Object.keys(types))
		if (!names.includes(name)) throw new StatsError(`A type is given for column '${name}', which is not in the data.`, { column: name });
	const { overrides, notes } = settingsMapping(diagram, names, input);
	const mapping = mapVariables(diagram, names, overrides);
	const byVariable = new Map(diagram.variables.map((v) => [v.id, v]));
	const variableOf = new Map(Object.entries(mapping.columns).map(([id, column]) => [column, id]));
	const note = (e: unknown, what: string): void => {
		if (!(e instanceof StatsError) || input.settingProblems !== 'note') throw e;
		notes.push(`${e.message} ${what}`);
	};
	const chosen = new Set<string>();
	const columns = table.columns.map((column) => {
		const id = variableOf.get(column.name);
		const data = id === undefined ? undefined : byVariable.get(id)?.data;
		let c = column;
		const kind = own(types, column.name) ?? data?.kind;
		if (kind !== undefined) {
			try {
				c = retypeColumn(c, kind);
				chosen.add(column.name);
			} catch (e) {
				if (own(types, column.name) !== undefined) throw e; // a flag is the user's explicit word now
				note(e, `Its detected kind (${column.kind}) is used.`);
			}
		}
		const levels: LevelSettings = { reference: data?.reference, labels: data?.labels };
		if (data?.reference !== undefined || data?.labels?.length) {
			if (c.kind === 'continuous') {
				if (data.reference !== undefined || data.labels?.length) notes.push(`The reference level and value labels of ${quoteId(id as string)} are not used: its column '${c.name}' is analysed as continuous.`);
			} else {
				if (c.kind === 'ordinal' && data.reference !== undefined) notes.push(`The reference level of ${quoteId(id as string)} is not used: its column '${c.name}' is ordinal, so its lowest level is the reference.`);
				try {
					c = applyLevels(c, levels);
				} catch (e) {
					note(e, 'Its levels are used as they are.');
				}
			}
		}
		return c;
	});
	const settled: Table = { ...table, columns };
	const byName = new Map(columns.map((c) => [c.name, c]));
	const used: ColumnUse[] = Object.entries(mapping.columns).map(([variable, name]) => {
		const c = byName.get(name) as Column;
		return {
			variable,
			column: name,
			by: own(mapping.by, variable) ?? 'manual',
			kind: c.kind,
			kindChosen: chosen.has(name),
			reference: c.kind === 'continuous' ? null : (c.levels[0] ?? null),
			labels: byVariable.get(variable)?.data?.labels?.length ?? 0
		};
	});
	return {
		table: settled,
		columnOf: (name) => {
			const c = byName.get(name);
			if (!c) throw new InputError(`Column "${name}" is not in the data`);
			return c;
		},
		mapping: { ...mapping, notes: [...notes, ...mapping.notes] },
		used,
		notes
	};
}
