/**
 * Which way an edge's arrow points. In Graphviz `a -> b` always has tail a and head b, and the
 * `dir` attribute only says where arrowheads are drawn: `forward` (the default, and what
 * Graphviz does with a value it does not know — it compares exactly) at b, `back` at a, `both`
 * at both ends, `none` at neither; an end whose arrow shape is `none` (`arrowhead=none`,
 * `arrowtail=none`) has no arrowhead either (lib/common/arrows.c, arrow_flags).
 *
 * A causal diagram means what it shows, so Causeway reads the arrow that is drawn:
 * - an arrowhead at b only: the arrow a → b, as written;
 * - at a only (`dir=back`): the arrow b → a; the end attributes (ports, arrow shapes, end
 *   labels…) swap with it, so writing it back as `b -> a` draws the same arrow;
 * - at both ends or at neither: refused, naming the edge and where `dir` was set; a two-headed
 *   arrow usually stands for an unmeasured common cause, which the message says how to draw.
 * `dir` itself is then spent: it is not kept among the arrow's attributes. O(attributes).
 */
import { InputError, showId } from '../errors';
import type { At } from './lexer';
import type { Attr, Attrs, DotEdge } from './parser';

const KNOWN_DIRS: ReadonlySet<string> = new Set(['forward', 'back', 'both', 'none']);

/** Graphviz's head/tail attribute pairs (https://graphviz.org/doc/info/attrs.html). */
const END_PAIRS: readonly (readonly [string, string])[] = [
	['arrowhead', 'arrowtail'],
	['headport', 'tailport'],
	['headlabel', 'taillabel'],
	['headclip', 'tailclip'],
	['headURL', 'tailURL'],
	['headhref', 'tailhref'],
	['headtarget', 'tailtarget'],
	['headtooltip', 'tailtooltip'],
	['lhead', 'ltail'],
	['samehead', 'sametail']
];
const SWAPPED: ReadonlyMap<string, string> = new Map(END_PAIRS.flatMap(([h, t]) => [[h, t] as const, [t, h] as const]));

/** The edge as the arrow Graphviz draws, or an InputError for a two-headed or headless edge. */
export function orientEdge(edge: DotEdge, at: At): DotEdge {
	const dirAttr = edge.attrs.get('dir');
	const dir = dirAttr && KNOWN_DIRS.has(dirAttr.value) ? dirAttr.value : 'forward';
	const headShape = edge.attrs.get('arrowhead');
	const tailShape = edge.attrs.get('arrowtail');
	const head = (dir === 'forward' || dir === 'both') && headShape?.value !== 'none';
	const tail = (dir === 'back' || dir === 'both') && tailShape?.value !== 'none';

	const attrs: Attrs = new Map();
	if (head && !tail) {
		for (const [k, v] of edge.attrs) if (k !== 'dir') attrs.set(k, v);
		return { ...edge, attrs };
	}
	if (tail && !head) {
		for (const [k, v] of edge.attrs) if (k !== 'dir') attrs.set(SWAPPED.get(k) ?? k, v);
		return { from: edge.to, to: edge.from, attrs, offset: edge.offset };
	}

	const a = showId(edge.from);
	const b = showId(edge.to);
	const p = at(edge.offset);
	const set = (attr: Attr | undefined, what: string) => (attr ? `${what} at ${at(attr.offset).phrase}` : what);
	if (head && tail) {
		throw new InputError(
			`The edge ${a} -> ${b} at ${p.phrase} has arrowheads at both ends (${set(dirAttr, 'dir=both')}); Causeway reads one-way arrows. ` +
				`If ${a} and ${b} share a cause that was not measured, draw it as a variable: U [measured=false]; U -> ${a}; U -> ${b}`,
			p.where
		);
	}
	const cause =
		dir === 'none'
			? set(dirAttr, 'dir=none')
			: dir === 'back'
				? set(tailShape, 'dir=back with arrowtail=none')
				: dir === 'both'
					? set(headShape, 'arrowhead=none and arrowtail=none')
					: set(headShape, 'arrowhead=none');
	throw new InputError(
		`The edge ${a} -> ${b} at ${p.phrase} is drawn without an arrowhead (${cause}), so it has no direction: write the arrow one way, ${a} -> ${b} or ${b} -> ${a}, with its arrowhead, or leave it out`,
		p.where
	);
}
