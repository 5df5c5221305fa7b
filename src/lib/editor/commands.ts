/**
 * Editor commands: every change a user can make to a diagram, as plain data, and one pure
 * function that applies a command to a diagram.
 *
 * Ids are stable: renaming a variable changes its label only; `change-id` is the one command
 * that changes an id, and it updates every reference. Every limit the file readers enforce
 * (src/lib/limits.ts: lengths of names, ids, notes, the title, data settings; numbers of
 * variables and arrows) is checked here, at the moment of the edit, so the app can never
 * write a file it would refuse to open.
 *
 * `applyCommand` never mutates its input; it returns either a new diagram (sharing every
 * untouched variable and arrow) with a one-line summary of the step, or a refusal with a
 * one-line reason, in which case the caller keeps the old diagram unchanged. Arrows that would
 * close a cycle are refused here, naming the cycle, so the diagram is always acyclic.
 * Cost: O(n + m) per command (cycle search is a linear graph walk).
 */
import type { Arrow, Diagram, Variable, VariableData } from '../graph/diagram';
import { InputError } from '../graph/errors';
import { assertDiagramWithinLimits, countProblem, textTooLong } from '../graph/size-limits';
import { findCycle } from '../graph/validate';
import { applyArrowNote, applyChangeId, applyVariableData, applyVariableNote } from './study-commands';

/** The three lists of the question: exposures, outcomes and the planned (adjusted) set. */
export type RoleList = 'exposures' | 'outcomes' | 'adjusted';

export type Command =
	| { kind: 'add-variable'; variable: Variable }
	| { kind: 'remove-elements'; ids: readonly string[]; arrows: readonly { from: string; to: string }[] }
	| { kind: 'rename-variable'; id: string; label: string }
	| { kind: 'move-variables'; moves: readonly { id: string; x: number; y: number }[] }
	| { kind: 'set-measured'; id: string; measured: boolean }
	| { kind: 'set-note'; id: string; note: string }
	| { kind: 'change-id'; id: string; newId: string }
	| { kind: 'set-arrow-note'; from: string; to: string; note: string }
	| { kind: 'set-variable-data'; id: string; data: VariableData | undefined }
	| { kind: 'add-arrow'; from: string; to: string }
	| { kind: 'reverse-arrow'; from: string; to: string }
	| { kind: 'set-role'; list: RoleList; id: string; member: boolean }
	| { kind: 'set-adjusted'; ids: readonly string[] }
	| { kind: 'set-title'; title: string }
	| { kind: 'replace-diagram'; diagram: Diagram; label: string };

export type CommandResult =
	| { ok: true; diagram: Diagram; summary: string }
	| { ok: false; message: string; cycle?: string[] };

const ROLE_NAME: Record<RoleList, string> = { exposures: 'exposure', outcomes: 'outcome', adjusted: 'planned set' };

function refuse(message: string, cycle?: string[]): CommandResult {
	return cycle ? { ok: false, message, cycle } : { ok: false, message };
}

function labelOf(d: Diagram, id: string): string {
	return d.variables.find((v) => v.id === id)?.label ?? id;
}

/** "Age → Income → Age" from a list of ids that starts and ends at the same variable. */
export function describeCycle(d: Diagram, cycle: readonly string[]): string {
	return cycle.map((id) => labelOf(d, id)).join(' → ');
}

/**
 * The cycle that adding `from → to` would close, as ids from `from` back to `from`, or null.
 * The diagram is acyclic before the arrow is added, so any cycle found afterwards passes
 * through the new arrow; it is rotated to start with it so the message reads naturally.
 */
export function cycleClosedBy(d: Diagram, from: string, to: string): string[] | null {
	const found = findCycle(
		d.variables.map((v) => v.id),
		[...d.arrows, { from, to }]
	);
	if (!found) return null;
	const ring = found[0] === found[found.length - 1] ? found.slice(0, -1) : [...found];
	let start = ring.findIndex((id, i) => id === from && ring[(i + 1) % ring.length] === to);
	if (start < 0) start = Math.max(0, ring.indexOf(from));
	const rotated = [...ring.slice(start), ...ring.slice(0, start)];
	return [...rotated, rotated[0]];
}

function hasVariable(d: Diagram, id: string): boolean {
	return d.variables.some((v) => v.id === id);
}

function hasArrow(d: Diagram, from: string, to: string): boolean {
	return d.arrows.some((a) => a.from === from && a.to === to);
}

function replaceVariable(d: Diagram, id: string, change: (v: Variable) => Variable): Diagram {
	return { ...d, variables: d.variables.map((v) => (v.id === id ? change(v) : v)) };
}

function applyAddVariable(d: Diagram, variable: Variable): CommandResult {
	if (variable.id.length === 0) return refuse('A variable needs a non-empty id.');
	if (hasVariable(d, variable.id)) return refuse(`There is already a variable with the id "${variable.id}".`);
	if (variable.label.trim().length === 0) return refuse('A variable needs a name.');
	const problem = countProblem(d, { variables: 1 }) ?? textTooLong('The name', variable.label, 'label') ?? textTooLong('The id', variable.id, 'id');
	if (problem) return refuse(`${problem}; no variable was added.`);
	return { ok: true, diagram: { ...d, variables: [...d.variables, variable] }, summary: `Add variable ${variable.label}` };
}

/**
 * Deletes variables (with every arrow touching them and their place in the question) and
 * arrows, as one step. Ids and arrows that do not exist are ignored; nothing to delete is a refusal.
 */
function applyRemove(d: Diagram, ids: readonly string[], arrows: readonly { from: string; to: string }[]): CommandResult {
	const gone = new Set(ids.filter((id) => hasVariable(d, id)));
	const key = (a: { from: string; to: string }) => JSON.stringify([a.from, a.to]);
	const goneArrows = new Set(arrows.filter((a) => hasArrow(d, a.from, a.to) && !gone.has(a.from) && !gone.has(a.to)).map(key));
	if (gone.size === 0 && goneArrows.size === 0) return refuse('Nothing to delete.');
	const keep = (id: string) => !gone.has(id);
	const names = [...gone].map((id) => labelOf(d, id));
	const parts: string[] = [];
	if (gone.size === 1) parts.push(`variable ${names[0]}`);
	else if (gone.size > 1) parts.push(`${gone.size} variables`);
	if (goneArrows.size === 1) {
		const [from, to] = JSON.parse([...goneArrows][0]) as [string, string];
		parts.push(`arrow ${labelOf(d, from)} → ${labelOf(d, to)}`);
	} else if (goneArrows.size > 1) parts.push(`${goneArrows.size} arrows`);
	return {
		ok: true,
		diagram: {
			...d,
			variables: gone.size ? d.variables.filter((v) => keep(v.id)) : d.variables,
			arrows: d.arrows.filter((a) => keep(a.from) && keep(a.to) && !goneArrows.has(key(a))),
			exposures: d.exposures.filter(keep),
			outcomes: d.outcomes.filter(keep),
			adjusted: d.adjusted.filter(keep)
		},
		summary: `Delete ${parts.join(' and ')}`
	};
}

function applyRename(d: Diagram, id: string, rawLabel: string): CommandResult {
	const v = d.variables.find((x) => x.id === id);
	if (!v) return refuse(`No variable with the id "${id}".`);
	const label = rawLabel.trim();
	if (label.length === 0) return refuse('A variable needs a name; the old name is kept.');
	if (label === v.label) return refuse('The name is unchanged.');
	const long = textTooLong('The name', label, 'label');
	if (long) return refuse(`${long}; the old name is kept.`);
	// The id stays: files, mappings and the command line refer to it (change-id changes it).
	return { ok: true, diagram: replaceVariable(d, id, (x) => ({ ...x, label })), summary: `Rename ${v.label} to ${label}` };
}

function applyMove(d: Diagram, moves: readonly { id: string; x: number; y: number }[]): CommandResult {
	const to = new Map(moves.map((m) => [m.id, m]));
	let changed = 0;
	const variables = d.variables.map((v) => {
		const m = to.get(v.id);
		if (!m || !Number.isFinite(m.x) || !Number.isFinite(m.y) || (m.x === v.x && m.y === v.y)) return v;
		changed++;
		return { ...v, x: m.x, y: m.y };
	});
	if (changed === 0) return refuse('Nothing moved.');
	const first = moves.find((m) => to.has(m.id));
	return {
		ok: true,
		diagram: { ...d, variables },
		summary: changed === 1 && first ? `Move ${labelOf(d, first.id)}` : `Move ${changed} variables`
	};
}

function applyAddArrow(d: Diagram, from: string, to: string): CommandResult {
	if (!hasVariable(d, from)) return refuse(`No variable with the id "${from}".`);
	if (!hasVariable(d, to)) return refuse(`No variable with the id "${to}".`);
	const name = `${labelOf(d, from)} → ${labelOf(d, to)}`;
	if (from === to) return refuse(`An arrow cannot start and end at ${labelOf(d, from)}.`);
	if (hasArrow(d, from, to)) return refuse(`There is already an arrow ${name}.`);
	const tooMany = countProblem(d, { arrows: 1 });
	if (tooMany) return refuse(`${tooMany}; arrow ${name} was not drawn.`);
	const cycle = cycleClosedBy(d, from, to);
	if (cycle) return refuse(`Arrow ${name} refused: it would close the cycle ${describeCycle(d, cycle)}.`, cycle);
	return { ok: true, diagram: { ...d, arrows: [...d.arrows, { from, to }] }, summary: `Draw arrow ${name}` };
}

function applyReverse(d: Diagram, from: string, to: string): CommandResult {
	const index = d.arrows.findIndex((a) => a.from === from && a.to === to);
	if (index < 0) return refuse('Nothing to reverse: no such arrow.');
	const name = `${labelOf(d, from)} → ${labelOf(d, to)}`;
	if (hasArrow(d, to, from)) return refuse(`Cannot reverse ${name}: the opposite arrow already exists.`);
	const without: Diagram = { ...d, arrows: d.arrows.filter((_, i) => i !== index) };
	const cycle = cycleClosedBy(without, to, from);
	if (cycle) return refuse(`Reversing ${name} refused: it would close the cycle ${describeCycle(d, cycle)}.`, cycle);
	const arrows: Arrow[] = d.arrows.map((a, i) => (i === index ? { ...a, from: to, to: from } : a));
	return { ok: true, diagram: { ...d, arrows }, summary: `Reverse arrow ${name}` };
}

/**
 * Exposure, outcome and planned set are exclusive for a variable: giving it one of these
 * roles takes it out of the other two lists, because the engine needs exposures and outcomes
 * disjoint and an exposure or outcome can never be adjusted for.
 */
function applySetRole(d: Diagram, list: RoleList, id: string, member: boolean): CommandResult {
	if (!hasVariable(d, id)) return refuse(`No variable with the id "${id}".`);
	const name = labelOf(d, id);
	const isMember = d[list].includes(id);
	if (isMember === member) return refuse(member ? `${name} is already in the ${ROLE_NAME[list]}.` : `${name} is not in the ${ROLE_NAME[list]}.`);
	if (!member) {
		return { ok: true, diagram: { ...d, [list]: d[list].filter((x) => x !== id) }, summary: removeSummary(list, name) };
	}
	// Lists that do not change keep their identity: the canvas redraws only what changed.
	const without = (xs: string[]) => (xs.includes(id) ? xs.filter((x) => x !== id) : xs);
	const next: Diagram = {
		...d,
		exposures: list === 'exposures' ? [...d.exposures, id] : without(d.exposures),
		outcomes: list === 'outcomes' ? [...d.outcomes, id] : without(d.outcomes),
		adjusted: list === 'adjusted' ? [...d.adjusted, id] : without(d.adjusted)
	};
	return { ok: true, diagram: next, summary: addSummary(list, name) };
}

function addSummary(list: RoleList, name: string): string {
	if (list === 'adjusted') return `Add ${name} to the planned set`;
	return `Make ${name} an ${ROLE_NAME[list]}`;
}

function removeSummary(list: RoleList, name: string): string {
	if (list === 'adjusted') return `Take ${name} out of the planned set`;
	return `${name} no longer an ${ROLE_NAME[list]}`;
}

function applySetAdjusted(d: Diagram, ids: readonly string[]): CommandResult {
	for (const id of ids) if (!hasVariable(d, id)) return refuse(`No variable with the id "${id}".`);
	const unique = [...new Set(ids)];
	const same = unique.length === d.adjusted.length && unique.every((id) => d.adjusted.includes(id));
	if (same) return refuse('That is already the planned set.');
	const chosen = new Set(unique);
	const next: Diagram = {
		...d,
		adjusted: unique,
		exposures: d.exposures.filter((x) => !chosen.has(x)),
		outcomes: d.outcomes.filter((x) => !chosen.has(x))
	};
	const names = unique.map((id) => labelOf(d, id));
	return { ok: true, diagram: next, summary: names.length === 0 ? 'Empty the planned set' : `Plan to adjust for ${names.join(', ')}` };
}

export function applyCommand(d: Diagram, cmd: Command): CommandResult {
	switch (cmd.kind) {
		case 'add-variable':
			return applyAddVariable(d, cmd.variable);
		case 'remove-elements':
			return applyRemove(d, cmd.ids, cmd.arrows);
		case 'rename-variable':
			return applyRename(d, cmd.id, cmd.label);
		case 'move-variables':
			return applyMove(d, cmd.moves);
		case 'set-measured': {
			const v = d.variables.find((x) => x.id === cmd.id);
			if (!v) return refuse(`No variable with the id "${cmd.id}".`);
			if (v.measured === cmd.measured) return refuse(`${v.label} is already ${cmd.measured ? 'measured' : 'unmeasured'}.`);
			return {
				ok: true,
				diagram: replaceVariable(d, cmd.id, (x) => ({ ...x, measured: cmd.measured })),
				summary: `Mark ${v.label} ${cmd.measured ? 'measured' : 'unmeasured'}`
			};
		}
		case 'set-note':
			return applyVariableNote(d, cmd.id, cmd.note);
		case 'change-id':
			return applyChangeId(d, cmd.id, cmd.newId);
		case 'set-arrow-note':
			return applyArrowNote(d, cmd.from, cmd.to, cmd.note);
		case 'set-variable-data':
			return applyVariableData(d, cmd.id, cmd.data);
		case 'add-arrow':
			return applyAddArrow(d, cmd.from, cmd.to);
		case 'reverse-arrow':
			return applyReverse(d, cmd.from, cmd.to);
		case 'set-role':
			return applySetRole(d, cmd.list, cmd.id, cmd.member);
		case 'set-adjusted':
			return applySetAdjusted(d, cmd.ids);
		case 'set-title': {
			const title = cmd.title.trim();
			if (title === d.title) return refuse('The title is unchanged.');
			const long = textTooLong('The title', title, 'title');
			if (long) return refuse(`${long}; the old title is kept.`);
			return { ok: true, diagram: { ...d, title }, summary: `Rename the diagram to ${title || '(untitled)'}` };
		}
		case 'replace-diagram':
			try {
				assertDiagramWithinLimits(cmd.diagram);
			} catch (e) {
				if (e instanceof InputError) return refuse(`${e.message}; the diagram is unchanged.`);
				throw e;
			}
			return { ok: true, diagram: cmd.diagram, summary: cmd.label };
	}
}
