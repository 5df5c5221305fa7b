/**
 * Small numbers naming the table's arrays (a column's values or codes), for the keys of the
 * caches of sufficient statistics: two columns built on the same array (a column and its
 * retyped copy) share their statistics; an array dropped by the table is dropped here too
 * (WeakMap). O(1).
 */
const ids = new WeakMap<object, number>();
let next = 1;

export function keyOf(array: object): number {
	let id = ids.get(array);
	if (id === undefined) {
		id = next++;
		ids.set(array, id);
	}
	return id;
}
