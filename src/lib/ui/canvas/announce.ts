/**
 * What the canvas says through its polite live region: the selection (a variable's roles,
 * marks, arrows and note; an arrow and its note) and, on focus, what the canvas holds.
 */
import type { Role } from '../../causal';
import type { Diagram } from '../../graph/diagram';
import { singleArrow, singleVariable, type Selection } from '../../editor/selection';
import { badges, countText } from '../../wording';

export const labelIn = (d: Diagram, id: string): string => d.variables.find((v) => v.id === id)?.label ?? id;

/** The sentence for a selection; null when there is nothing to say (nothing selected). */
export function describeSelection(d: Diagram, roles: ReadonlyMap<string, readonly Role[]>, s: Selection): string | null {
	const v = singleVariable(s);
	const a = singleArrow(s);
	const label = (id: string) => labelIn(d, id);
	if (v) {
		const variable = d.variables.find((x) => x.id === v);
		const into = d.arrows.filter((x) => x.to === v).map((x) => label(x.from));
		const out = d.arrows.filter((x) => x.from === v).map((x) => label(x.to));
		const facts = [
			...badges(roles.get(v) ?? []),
			variable && !variable.measured ? 'unmeasured' : '',
			d.adjusted.includes(v) ? 'in the planned set' : '',
			into.length ? `arrows in from ${into.join(', ')}` : 'no arrows in',
			out.length ? `arrows out to ${out.join(', ')}` : 'no arrows out'
		].filter(Boolean);
		return `${label(v)}: ${facts.join('; ')}.${variable?.note ? ` Note: ${variable.note.slice(0, 300)}` : ''}`;
	}
	if (a) {
		const note = d.arrows.find((x) => x.from === a.from && x.to === a.to)?.note;
		return `Arrow ${label(a.from)} → ${label(a.to)}.${note ? ` Note: ${note.slice(0, 300)}` : ''}`;
	}
	if (s.variables.length + s.arrows.length > 1) return `${countText(s.variables.length, 'variable')} and ${countText(s.arrows.length, 'arrow')} selected.`;
	return null;
}

/** Said when the canvas gets the focus with nothing selected. */
export function describeCanvas(d: Diagram, addHint: string): string {
	return d.variables.length === 0 ? `Diagram canvas, empty. ${addHint}` : `Diagram canvas, ${countText(d.variables.length, 'variable')} and ${countText(d.arrows.length, 'arrow')}. Arrow keys select a variable.`;
}
