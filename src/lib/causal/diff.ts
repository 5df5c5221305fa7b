/**
 * Comparison of two diagrams of the same question (for example the authors' and a
 * reviewer's): which variables correspond, which arrows were added, removed or reversed, and
 * how the minimal sufficient sets and the verdict on the planned sets change.
 *
 * Matching rule (applied in this order, each step only among variables still unmatched, and
 * only when the match is one-to-one):
 *  1. same id;
 *  2. same label after normalising (Unicode NFKC, lower case, runs of spaces, "_", "-" and "."
 *     as one space, trimmed) — reported as a rename;
 *  3. same id on one side as the normalised label on the other — reported as a rename;
 *  4. the same non-empty set of matched parents and matched children — reported as a rename
 *     matched by position.
 * Everything else is added (only in the second diagram) or removed (only in the first).
 * O(n + m) for steps 1–3 and O(n (n + m)) for step 4.
 */
import type { Diagram } from '../graph/diagram';

export interface VariableMatch {
	/** Id in the first diagram. */
	first: string;
	/** Id in the second diagram. */
	second: string;
	how: 'id' | 'label' | 'id-label' | 'neighbours';
}

export interface DiagramDiffStructure {
	matches: VariableMatch[];
	/** Matched variables whose id or label differ. */
	renamed: { first: string; second: string; how: VariableMatch['how']; firstLabel: string; secondLabel: string }[];
	added: string[];
	removed: string[];
	/** Arrows in first-diagram ids where both ends match; arrows touching an added/removed variable are listed as such. */
	arrowsAdded: { from: string; to: string }[];
	arrowsRemoved: { from: string; to: string }[];
	arrowsReversed: { from: string; to: string }[];
	/** Arrows only in the second diagram touching an added variable (second-diagram ids). */
	arrowsOfAdded: { from: string; to: string }[];
	/** Arrows only in the first diagram touching a removed variable. */
	arrowsOfRemoved: { from: string; to: string }[];
	measuredChanged: { id: string; measured: boolean }[];
}

export function normaliseLabel(label: string): string {
	return label.normalize('NFKC').toLowerCase().replace(/[\s_.-]+/g, ' ').trim();
}

/** Pairs items by key where the key is unique on both sides. */
function uniquePairs<T>(left: readonly T[], right: readonly T[], keyL: (t: T) => string, keyR: (t: T) => string): [T, T][] {
	const count = (items: readonly T[], key: (t: T) => string) => {
		const m = new Map<string, T[]>();
		for (const t of items) {
			const k = key(t);
			if (k === '') continue;
			m.set(k, [...(m.get(k) ?? []), t]);
		}
		return m;
	};
	const l = count(left, keyL);
	const r = count(right, keyR);
	const out: [T, T][] = [];
	for (const [k, ls] of l) {
		const rs = r.get(k);
		if (ls.length === 1 && rs?.length === 1) out.push([ls[0], rs[0]]);
	}
	return out;
}

export function matchVariables(a: Diagram, b: Diagram): VariableMatch[] {
	const matches: VariableMatch[] = [];
	const freeA = new Set(a.variables.map((v) => v.id));
	const freeB = new Set(b.variables.map((v) => v.id));
	const labelA = new Map(a.variables.map((v) => [v.id, v.label]));
	const labelB = new Map(b.variables.map((v) => [v.id, v.label]));
	const take = (x: string, y: string, how: VariableMatch['how']) => {
		matches.push({ first: x, second: y, how });
		freeA.delete(x);
		freeB.delete(y);
	};
	for (const id of [...freeA]) if (freeB.has(id)) take(id, id, 'id');
	const step = (how: VariableMatch['how'], keyA: (id: string) => string, keyB: (id: string) => string) => {
		for (const [x, y] of uniquePairs([...freeA], [...freeB], keyA, keyB)) take(x, y, how);
	};
	step('label', (id) => normaliseLabel(labelA.get(id) ?? ''), (id) => normaliseLabel(labelB.get(id) ?? ''));
	step('id-label', (id) => normaliseLabel(id), (id) => normaliseLabel(labelB.get(id) ?? ''));
	step('id-label', (id) => normaliseLabel(labelA.get(id) ?? ''), (id) => normaliseLabel(id));
	// Neighbourhoods in first-diagram ids, repeated while it finds new matches.
	for (let changed = true; changed && freeA.size > 0 && freeB.size > 0; ) {
		const toFirst = new Map(matches.map((m) => [m.second, m.first]));
		const signature = (d: Diagram, id: string, rename: (x: string) => string | undefined) => {
			const parents = d.arrows.filter((e) => e.to === id).map((e) => rename(e.from));
			const children = d.arrows.filter((e) => e.from === id).map((e) => rename(e.to));
			if (parents.length + children.length === 0 || [...parents, ...children].some((x) => x === undefined)) return '';
			return `${[...parents].sort().join(',')}|${[...children].sort().join(',')}`;
		};
		const matchedA = new Set(matches.map((m) => m.first));
		const before = matches.length;
		step('neighbours', (id) => signature(a, id, (x) => (matchedA.has(x) ? x : undefined)), (id) => signature(b, id, (x) => toFirst.get(x)));
		changed = matches.length > before;
	}
	return matches;
}

export function diffStructure(a: Diagram, b: Diagram): DiagramDiffStructure {
	const matches = matchVariables(a, b);
	const toFirst = new Map(matches.map((m) => [m.second, m.first]));
	const matchedA = new Set(matches.map((m) => m.first));
	const labelA = new Map(a.variables.map((v) => [v.id, v.label]));
	const labelB = new Map(b.variables.map((v) => [v.id, v.label]));
	const measuredA = new Map(a.variables.map((v) => [v.id, v.measured]));
	const measuredB = new Map(b.variables.map((v) => [v.id, v.measured]));
	const key = (from: string, to: string) => `${from}\u0000${to}`;
	const arrowsA = new Set(a.arrows.map((e) => key(e.from, e.to)));
	const mappedB: { from: string; to: string }[] = [];
	const arrowsOfAdded: { from: string; to: string }[] = [];
	for (const e of b.arrows) {
		const from = toFirst.get(e.from);
		const to = toFirst.get(e.to);
		if (from === undefined || to === undefined) arrowsOfAdded.push({ from: e.from, to: e.to });
		else mappedB.push({ from, to });
	}
	const arrowsB = new Set(mappedB.map((e) => key(e.from, e.to)));
	const arrowsAdded: DiagramDiffStructure['arrowsAdded'] = [];
	const arrowsReversed: DiagramDiffStructure['arrowsReversed'] = [];
	for (const e of mappedB) {
		if (arrowsA.has(key(e.from, e.to))) continue;
		if (arrowsA.has(key(e.to, e.from)) && !arrowsB.has(key(e.to, e.from))) arrowsReversed.push({ from: e.to, to: e.from });
		else arrowsAdded.push(e);
	}
	const arrowsRemoved: DiagramDiffStructure['arrowsRemoved'] = [];
	const arrowsOfRemoved: DiagramDiffStructure['arrowsOfRemoved'] = [];
	for (const e of a.arrows) {
		if (!matchedA.has(e.from) || !matchedA.has(e.to)) arrowsOfRemoved.push({ from: e.from, to: e.to });
		else if (!arrowsB.has(key(e.from, e.to)) && !(arrowsB.has(key(e.to, e.from)) && !arrowsA.has(key(e.to, e.from)))) arrowsRemoved.push({ from: e.from, to: e.to });
	}
	const byPair = (p: { from: string; to: string }, q: { from: string; to: string }) => (p.from < q.from ? -1 : p.from > q.from ? 1 : p.to < q.to ? -1 : p.to > q.to ? 1 : 0);
	return {
		matches,
		renamed: matches
			.filter((m) => m.first !== m.second || labelA.get(m.first) !== labelB.get(m.second))
			.map((m) => ({ first: m.first, second: m.second, how: m.how, firstLabel: labelA.get(m.first) ?? '', secondLabel: labelB.get(m.second) ?? '' })),
		added: b.variables.map((v) => v.id).filter((id) => !toFirst.has(id)),
		removed: a.variables.map((v) => v.id).filter((id) => !matchedA.has(id)),
		arrowsAdded: arrowsAdded.sort(byPair),
		arrowsRemoved: arrowsRemoved.sort(byPair),
		arrowsReversed: arrowsReversed.sort(byPair),
		arrowsOfAdded,
		arrowsOfRemoved,
		measuredChanged: matches
			.filter((m) => measuredA.get(m.first) !== measuredB.get(m.second))
			.map((m) => ({ id: m.first, measured: measuredB.get(m.second) ?? true }))
	};
}
