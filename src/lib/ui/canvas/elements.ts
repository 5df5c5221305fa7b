/**
 * From the diagram model to Cytoscape elements, and keeping the two in step.
 *
 * The diagram is the single source of truth; the canvas is a view of it. After each edit the
 * elements are diffed against the diagram by id (O(n + m)) inside one Cytoscape batch, so a
 * 300-variable diagram is updated without re-creating the graph or losing the viewport.
 */
import type { Core, ElementDefinition } from 'cytoscape';
import type { Diagram, Variable } from '../../graph/diagram';
import type { Role } from '../../causal';
import { badges } from '../../wording';
import { BADGE_FONT_PX, FONT_FAMILY, LABEL_FONT_PX, LINE_HEIGHT } from './style';

export const nodeKey = (id: string) => `v:${id}`;
export const arrowKey = (from: string, to: string) => `a:${JSON.stringify([from, to])}`;


export type Measure = (text: string, px: number) => number;

/** Text width in CSS pixels with the canvas font; a rough estimate where no canvas exists. */
export function createMeasure(): Measure {
	const ctx = typeof document !== 'undefined' ? document.createElement('canvas').getContext('2d') : null;
	const cache = new Map<string, number>();
	return (text, px) => {
		const key = `${px}|${text}`;
		let w = cache.get(key);
		if (w === undefined) {
			if (ctx) {
				ctx.font = `${px}px ${FONT_FAMILY}`;
				w = ctx.measureText(text).width;
			} else w = text.length * px * 0.6;
			cache.set(key, w);
		}
		return w;
	};
}

export interface NodeLook {
	text: string;
	w: number;
	h: number;
	classes: string;
}

export interface Question {
	exposures: ReadonlySet<string>;
	outcomes: ReadonlySet<string>;
	adjusted: ReadonlySet<string>;
}

export function questionOf(d: Diagram): Question {
	return { exposures: new Set(d.exposures), outcomes: new Set(d.outcomes), adjusted: new Set(d.adjusted) };
}

/**
 * Label and badges of a variable. Exposure and outcome get their badge from the question
 * itself, so they show even before an analysis exists; the other roles come from the engine.
 */
export function nodeLook(v: Variable, roles: readonly Role[], q: Question, measure: Measure): NodeLook {
	const all = new Set<Role>(roles);
	if (q.exposures.has(v.id)) all.add('exposure');
	if (q.outcomes.has(v.id)) all.add('outcome');
	const tags = badges([...all]);
	const badgeLine = tags.length > 0 ? `‹${tags.join(' · ')}›` : '';
	const text = badgeLine ? `${v.label}\n${badgeLine}` : v.label;
	const lines = badgeLine ? 2 : 1;
	const width = Math.max(measure(v.label, LABEL_FONT_PX), badgeLine ? measure(badgeLine, BADGE_FONT_PX) : 0);
	const classes = [
		q.exposures.has(v.id) ? 'exposure' : '',
		q.outcomes.has(v.id) ? 'outcome' : '',
		v.measured ? '' : 'unmeasured'
	]
		.filter(Boolean)
		.join(' ');
	return {
		text,
		w: Math.ceil(Math.max(64, width + 26)),
		h: Math.ceil(lines * LABEL_FONT_PX * LINE_HEIGHT + 18),
		classes
	};
}

// The planned set's box is drawn by canvas/overlay.ts, not styled here.
const LOOK_CLASSES = ['exposure', 'outcome', 'unmeasured'];

export function nodeDefinition(v: Variable, look: NodeLook): ElementDefinition {
	return {
		group: 'nodes',
		data: { id: nodeKey(v.id), vid: v.id, text: look.text, w: look.w, h: look.h },
		classes: look.classes,
		position: { x: v.x ?? 0, y: v.y ?? 0 }
	};
}

export function arrowDefinition(from: string, to: string): ElementDefinition {
	return { group: 'edges', data: { id: arrowKey(from, to), source: nodeKey(from), target: nodeKey(to), from, to } };
}

/**
 * Makes the canvas show `d`. Positions are taken from the diagram except for nodes in
 * `keepPosition` (being dragged right now). Returns true when elements were added or removed.
 */
export function syncElements(
	cy: Core,
	d: Diagram,
	rolesById: ReadonlyMap<string, readonly Role[]>,
	measure: Measure,
	keepPosition: ReadonlySet<string> = new Set()
): boolean {
	const q = questionOf(d);
	let structural = false;
	cy.batch(() => {
		const wantedNodes = new Set(d.variables.map((v) => nodeKey(v.id)));
		const wantedEdges = new Set(d.arrows.map((a) => arrowKey(a.from, a.to)));
		cy.edges().forEach((e) => {
			if (!wantedEdges.has(e.id()) && !e.hasClass('eh-ghost') && !e.hasClass('eh-preview')) {
				e.remove();
				structural = true;
			}
		});
		cy.nodes().forEach((n) => {
			if (!wantedNodes.has(n.id()) && !n.hasClass('eh-ghost')) {
				n.remove();
				structural = true;
			}
		});
		const added: ElementDefinition[] = [];
		for (const v of d.variables) {
			const look = nodeLook(v, rolesById.get(v.id) ?? [], q, measure);
			const node = cy.getElementById(nodeKey(v.id));
			if (node.empty()) {
				added.push(nodeDefinition(v, look));
				continue;
			}
			if (node.data('text') !== look.text || node.data('w') !== look.w || node.data('h') !== look.h) {
				node.data({ text: look.text, w: look.w, h: look.h });
			}
			if (LOOK_CLASSES.filter((c) => node.hasClass(c)).join(' ') !== look.classes) {
				node.removeClass('exposure outcome unmeasured').addClass(look.classes);
			}
			const p = node.position();
			const x = v.x ?? 0;
			const y = v.y ?? 0;
			if (!keepPosition.has(v.id) && (p.x !== x || p.y !== y)) node.position({ x, y });
		}
		if (added.length > 0) {
			cy.add(added);
			structural = true;
		}
		const newEdges: ElementDefinition[] = [];
		for (const a of d.arrows) if (cy.getElementById(arrowKey(a.from, a.to)).empty()) newEdges.push(arrowDefinition(a.from, a.to));
		if (newEdges.length > 0) {
			cy.add(newEdges);
			structural = true;
		}
		// Arrows with a note carry a pencil near their start (class has-note; canvas/style.ts).
		for (const a of d.arrows) {
			const e = cy.getElementById(arrowKey(a.from, a.to));
			const noted = !!a.note?.trim();
			if (e.hasClass('has-note') !== noted) e.toggleClass('has-note', noted);
		}
	});
	return structural;
}

/** What the data say about an arrow (src/lib/datacheck ArrowSupport), shown on the canvas. */
export type ArrowDataMark = 'supported' | 'weak' | 'absent' | 'untested';

const DATA_CLASSES = 'data-supported data-weak data-absent data-untested';

/** The short text tag beside a checked arrow: the non-colour cue of its data verdict. */
export const DATA_TAG: Record<ArrowDataMark, string> = {
	supported: 'data ✓',
	weak: 'data: weak',
	absent: 'data: none found',
	untested: 'data: not tested'
};

/**
 * Puts the data verdicts on the arrows (class data-<verdict> and a `dataTag` label), and
 * takes them off arrows no longer checked. Touches only arrows whose verdict changed. O(m).
 */
export function applyArrowMarks(cy: Core, marks: ReadonlyMap<string, ArrowDataMark>): void {
	cy.batch(() => {
		cy.edges('.data-supported, .data-weak, .data-absent, .data-untested').forEach((e) => {
			if (!marks.has(e.id())) e.removeClass(DATA_CLASSES).removeData('dataTag');
		});
		for (const [key, mark] of marks) {
			const e = cy.getElementById(key);
			if (e.empty() || e.hasClass(`data-${mark}`)) continue;
			e.removeClass(DATA_CLASSES).addClass(`data-${mark}`).data('dataTag', DATA_TAG[mark]);
		}
	});
}
