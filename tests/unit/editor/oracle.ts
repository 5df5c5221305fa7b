/**
 * Independent checks for the editor tests: Kahn's topological sort (Kahn, CACM 5(11), 1962)
 * as the oracle for "is this arrow set acyclic", written separately from the depth-first
 * search the editor relies on.
 */
export function isAcyclic(ids: readonly string[], arrows: readonly { from: string; to: string }[]): boolean {
	const indeg = new Map(ids.map((id) => [id, 0]));
	const out = new Map<string, string[]>(ids.map((id) => [id, []]));
	for (const a of arrows) {
		indeg.set(a.to, (indeg.get(a.to) ?? 0) + 1);
		out.get(a.from)?.push(a.to);
	}
	const queue = ids.filter((id) => indeg.get(id) === 0);
	let seen = 0;
	while (queue.length > 0) {
		const v = queue.pop()!;
		seen++;
		for (const w of out.get(v) ?? []) {
			const left = (indeg.get(w) ?? 0) - 1;
			indeg.set(w, left);
			if (left === 0) queue.push(w);
		}
	}
	return seen === ids.length;
}
