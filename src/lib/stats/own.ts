/**
 * A record's own value for a key, never one inherited from Object.prototype. Records keyed by
 * user text (column names, variable ids: "constructor", "toString"…) are read through this, so
 * a column named like a JavaScript built-in is just a name. O(1).
 */
export function own<T>(record: Readonly<Record<string, T>> | null | undefined, key: string): T | undefined {
	return record != null && Object.prototype.hasOwnProperty.call(record, key) ? record[key] : undefined;
}
