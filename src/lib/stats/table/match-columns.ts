/**
 * Linking data columns to diagram variables by name, ignoring case, accents, spaces and
 * punctuation ("Body-mass index" matches "body_mass_index"). O((columns + variables) ×
 * name length).
 */

export interface ColumnMatching {
	/** One entry per matched variable, in the order of `variables`. */
	matched: { variableId: string; column: string; by: 'id' | 'label' }[];
	/** Variables with no matching column. */
	unmatchedVariables: string[];
	/** Columns matched to no variable, in file order. */
	unusedColumns: string[];
	/** Variables that match more than one column equally well (left unmatched). */
	ambiguous: { variableId: string; columns: string[] }[];
}

/** Lower-case letters and digits only, accents removed. */
export function normalizeName(name: string): string {
	return name
		.normalize('NFKD')
		.replace(/\p{M}/gu, '')
		.toLowerCase()
		.replace(/[^\p{L}\p{N}]/gu, '');
}

/**
 * Match columns to variables: first by id, then by label, each compared after
 * normalizeName; a column is used at most once (an exact id match takes precedence).
 */
export function matchColumns(columnNames: readonly string[], variables: readonly { id: string; label: string }[]): ColumnMatching {
	const byKey = new Map<string, string[]>();
	for (const c of columnNames) {
		const key = normalizeName(c);
		if (key === '') continue;
		byKey.set(key, [...(byKey.get(key) ?? []), c]);
	}
	const used = new Set<string>();
	const found = new Map<string, { column: string; by: 'id' | 'label' }>();
	const ambiguous: { variableId: string; columns: string[] }[] = [];
	const ambiguousIds = new Set<string>();

	for (const by of ['id', 'label'] as const) {
		for (const v of variables) {
			if (found.has(v.id) || ambiguousIds.has(v.id)) continue;
			const exact = by === 'id' && columnNames.includes(v.id) && !used.has(v.id) ? [v.id] : null;
			const candidates = exact ?? (byKey.get(normalizeName(by === 'id' ? v.id : v.label)) ?? []).filter((c) => !used.has(c));
			if (candidates.length === 1) {
				found.set(v.id, { column: candidates[0], by });
				used.add(candidates[0]);
			} else if (candidates.length > 1) {
				ambiguous.push({ variableId: v.id, columns: candidates });
				ambiguousIds.add(v.id);
			}
		}
	}
	return {
		matched: variables.filter((v) => found.has(v.id)).map((v) => ({ variableId: v.id, ...(found.get(v.id) as { column: string; by: 'id' | 'label' }) })),
		unmatchedVariables: variables.filter((v) => !found.has(v.id) && !ambiguousIds.has(v.id)).map((v) => v.id),
		unusedColumns: columnNames.filter((c) => !used.has(c)),
		ambiguous
	};
}
