// The study-document edits: the explicit id change (every reference follows, undoable as one
// step), notes on variables and arrows, each variable's data settings, and the readers'
// limits enforced at the moment of each edit (so Save never writes a file Open refuses).
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { applyCommand, type Command } from '../../../src/lib/editor/commands';
import { createHistory, record, undo } from '../../../src/lib/editor/history';
import { idChangeBetween, slugify, MAX_GENERATED_ID } from '../../../src/lib/editor/ids';
import { emptyDiagram, type Diagram } from '../../../src/lib/graph/diagram';
import { parseDiagramJson, writeDiagramJson } from '../../../src/lib/graph/native-json';
import { parseDot, writeDot } from '../../../src/lib/graph/dot';
import { validateDiagram } from '../../../src/lib/graph/validate';
import { MAX_ARROWS, MAX_LABEL_CHARS, MAX_NOTE_CHARS, MAX_VALUE_LABELS, MAX_VARIABLES } from '../../../src/lib/limits';

const demo = parseDiagramJson(readFileSync('static/demo/cycling-hypertension.causeway.json', 'utf8'));

function apply(d: Diagram, ...cmds: Command[]): Diagram {
	for (const c of cmds) {
		const r = applyCommand(d, c);
		if (!r.ok) throw new Error(r.message);
		d = r.diagram;
	}
	return d;
}

function refusal(d: Diagram, cmd: Command): string {
	const r = applyCommand(d, cmd);
	if (r.ok) throw new Error('expected a refusal');
	return r.message;
}

describe('change-id', () => {
	const settled = apply(
		demo,
		{ kind: 'set-variable-data', id: 'age', data: { column: 'age', kind: 'continuous' } },
		{ kind: 'set-note', id: 'age', note: 'Age in whole years at enrolment' },
		{ kind: 'set-arrow-note', from: 'age', to: 'cycling', note: 'Older people cycle less.' }
	);

	it('updates the variable, its arrows, the question and the planned set; notes and settings travel with it', () => {
		const r = applyCommand(settled, { kind: 'change-id', id: 'age', newId: 'age_years' });
		expect(r.ok).toBe(true);
		if (!r.ok) return;
		const d = r.diagram;
		expect(r.summary).toBe('Change the id of Age from "age" to "age_years"');
		expect(d.variables.find((v) => v.id === 'age_years')).toMatchObject({ label: 'Age', note: 'Age in whole years at enrolment', data: { column: 'age', kind: 'continuous' } });
		expect(d.variables.some((v) => v.id === 'age')).toBe(false);
		expect(d.arrows.filter((a) => a.from === 'age_years').map((a) => a.to)).toEqual(['cycling', 'hypertension', 'income']);
		expect(d.arrows.find((a) => a.from === 'age_years' && a.to === 'cycling')?.note).toBe('Older people cycle less.');
		expect(d.arrows.some((a) => a.from === 'age' || a.to === 'age')).toBe(false);
		expect(d.adjusted).toEqual(['age_years', 'income', 'diet']);
		expect(validateDiagram(d, { needQuestion: true })).toEqual([]);
		// The file holds the new id everywhere and reads back the same.
		expect(parseDiagramJson(writeDiagramJson(d))).toEqual(d);
		expect(writeDiagramJson(d)).not.toMatch(/"age"(?!,)/);
	});

	it('changes exposure and outcome ids too, and is one undoable step', () => {
		const r = applyCommand(demo, { kind: 'change-id', id: 'cycling', newId: 'bike_commute' });
		expect(r.ok && r.diagram.exposures).toEqual(['bike_commute']);
		if (!r.ok) return;
		const h = record(createHistory(demo), r.diagram, r.summary);
		expect(undo(h).present).toBe(demo);
	});

	it('refuses empty, unchanged, taken, over-long and unwritable ids, leaving the diagram as it was', () => {
		expect(refusal(demo, { kind: 'change-id', id: 'age', newId: '  ' })).toBe('An id cannot be empty.');
		expect(refusal(demo, { kind: 'change-id', id: 'age', newId: 'age' })).toBe('The id is unchanged.');
		expect(refusal(demo, { kind: 'change-id', id: 'age', newId: 'income' })).toBe('There is already a variable with the id "income".');
		expect(refusal(demo, { kind: 'change-id', id: 'age', newId: 'a'.repeat(MAX_LABEL_CHARS + 1) })).toBe('The id is too long: 1,001 characters, at most 1,000 are allowed; the old id is kept.');
		expect(refusal(demo, { kind: 'change-id', id: 'age', newId: 'two\nlines' })).toMatch(/line break/);
		expect(refusal(demo, { kind: 'change-id', id: 'age', newId: 'ends\\' })).toMatch(/backslash/);
	});
});

describe('notes', () => {
	it('sets, replaces and removes notes on variables and arrows', () => {
		const d = apply(demo, { kind: 'set-arrow-note', from: 'income', to: 'diet', note: 'Healthy food costs more (assumed).' });
		expect(d.arrows.find((a) => a.from === 'income' && a.to === 'diet')?.note).toBe('Healthy food costs more (assumed).');
		const cleared = apply(d, { kind: 'set-arrow-note', from: 'income', to: 'diet', note: '   ' });
		expect(cleared.arrows.find((a) => a.from === 'income' && a.to === 'diet')).toEqual({ from: 'income', to: 'diet' });
		const noNote = apply(demo, { kind: 'set-note', id: 'age', note: '' });
		expect(noNote.variables[0]).not.toHaveProperty('note');
	});

	it('refuses a note on a missing arrow and notes past the limit', () => {
		expect(refusal(demo, { kind: 'set-arrow-note', from: 'bmi', to: 'age', note: 'x' })).toBe('There is no arrow Body-mass index → Age.');
		expect(refusal(demo, { kind: 'set-arrow-note', from: 'age', to: 'income', note: 'x'.repeat(MAX_NOTE_CHARS + 1) })).toBe(
			'The note is too long: 100,001 characters, at most 100,000 are allowed; the old note is kept.'
		);
		expect(refusal(demo, { kind: 'set-note', id: 'age', note: 'x'.repeat(MAX_NOTE_CHARS + 1) })).toMatch(/^The note is too long/);
	});
});

describe('data settings', () => {
	it('stores column, kind, reference and value labels in file order and says what changed', () => {
		const r = applyCommand(demo, {
			kind: 'set-variable-data',
			id: 'income',
			data: { kind: 'categorical', reference: '2', labels: [{ value: '2', label: 'high' }, { value: '10', label: 'ten' }, { value: '0', label: 'low' }, { value: '1', label: ' ' }] }
		});
		expect(r.ok).toBe(true);
		if (!r.ok) return;
		expect(r.diagram.variables[1].data).toEqual({ kind: 'categorical', reference: '2', labels: [{ value: '0', label: 'low' }, { value: '2', label: 'high' }, { value: '10', label: 'ten' }] });
		expect(r.summary).toBe('Household income: analysed as categorical, reference level "2", value labels');
		// No settings left: the key goes.
		const cleared = apply(r.diagram, { kind: 'set-variable-data', id: 'income', data: {} });
		expect(cleared.variables[1]).not.toHaveProperty('data');
	});

	it('refuses a blank column, a name given to two values, a reference on an ordinal column and over-long settings', () => {
		expect(refusal(demo, { kind: 'set-variable-data', id: 'age', data: { column: ' ' } })).toMatch(/^A column name cannot be blank/);
		expect(refusal(demo, { kind: 'set-variable-data', id: 'age', data: { labels: [{ value: '0', label: 'x' }, { value: '1', label: 'x' }] } })).toBe(
			'Two values of Age would both be named "x"; give each value its own name.'
		);
		expect(refusal(demo, { kind: 'set-variable-data', id: 'age', data: { kind: 'ordinal', reference: '3' } })).toMatch(/^Age is ordinal/);
		expect(refusal(demo, { kind: 'set-variable-data', id: 'age', data: { column: 'c'.repeat(MAX_LABEL_CHARS + 1) } })).toBe(
			'The column name of Age is too long: 1,001 characters, at most 1,000 are allowed; the settings are unchanged.'
		);
		const many = Array.from({ length: MAX_VALUE_LABELS + 1 }, (_, i) => ({ value: String(i), label: `l${i}` }));
		expect(refusal(demo, { kind: 'set-variable-data', id: 'age', data: { labels: many } })).toMatch(/^Age has 501 value labels/);
		expect(refusal(demo, { kind: 'set-variable-data', id: 'age', data: { labels: [{ value: '__proto__', label: 'x' }] } })).toMatch(/cannot be labelled/);
	});
});

describe('limits at the moment of the edit', () => {
	const long = 'x'.repeat(MAX_LABEL_CHARS + 1);

	it('refuses an over-long name when renaming, adding or titling, so Save never writes a file Open refuses', () => {
		expect(refusal(demo, { kind: 'rename-variable', id: 'age', label: long })).toBe('The name is too long: 1,001 characters, at most 1,000 are allowed; the old name is kept.');
		expect(refusal(demo, { kind: 'add-variable', variable: { id: 'x', label: long, measured: true } })).toBe(
			'The name is too long: 1,001 characters, at most 1,000 are allowed; no variable was added.'
		);
		expect(refusal(demo, { kind: 'set-title', title: long })).toMatch(/^The title is too long/);
		// Exactly at the limit is fine, and the file reads back.
		const atLimit = apply(demo, { kind: 'rename-variable', id: 'age', label: 'y'.repeat(MAX_LABEL_CHARS) });
		expect(parseDiagramJson(writeDiagramJson(atLimit)).variables[0].label).toHaveLength(MAX_LABEL_CHARS);
		expect(parseDot(writeDot(atLimit)).variables[0].label).toHaveLength(MAX_LABEL_CHARS);
	});

	it('refuses the variable and arrow past the stated counts', () => {
		const full: Diagram = { ...emptyDiagram(), variables: Array.from({ length: MAX_VARIABLES }, (_, i) => ({ id: `v${i}`, label: `V${i}`, measured: true })) };
		expect(refusal(full, { kind: 'add-variable', variable: { id: 'one_more', label: 'One more', measured: true } })).toBe(
			'A diagram holds at most 2,000 variables; this one has 2,000; no variable was added.'
		);
		// 2,000 variables, each with arrows to the next six, up to the arrow limit (acyclic).
		const arrows: { from: string; to: string }[] = [];
		for (let i = 0; i < MAX_VARIABLES && arrows.length < MAX_ARROWS; i++)
			for (let k = 1; k <= 6 && i + k < MAX_VARIABLES && arrows.length < MAX_ARROWS; k++) arrows.push({ from: `v${i}`, to: `v${i + k}` });
		expect(arrows).toHaveLength(MAX_ARROWS);
		const dense: Diagram = { ...full, arrows };
		expect(refusal(dense, { kind: 'add-arrow', from: 'v0', to: 'v1999' })).toBe('A diagram holds at most 10,000 arrows; this one has 10,000; arrow V0 → V1999 was not drawn.');
	});

	it('refuses to replace the diagram with one past the limits (a pasted or shared diagram)', () => {
		const bad: Diagram = { ...demo, title: long };
		expect(refusal(demo, { kind: 'replace-diagram', diagram: bad, label: 'Open' })).toBe('The title is too long: 1,001 characters, at most 1,000 are allowed; the diagram is unchanged.');
	});

	it('makes readable ids of at most 60 characters from long labels', () => {
		const slug = slugify('A very long label that somebody typed in full because it is the exact wording in the protocol');
		expect(slug.length).toBeLessThanOrEqual(MAX_GENERATED_ID);
		expect(slug).toBe('a_very_long_label_that_somebody_typed_in_full_because_it_is');
	});
});

describe('idChangeBetween (state outside the diagram follows a change of id)', () => {
	const demo = parseDiagramJson(readFileSync('static/demo/cycling-hypertension.causeway.json', 'utf8'));
	const changed = (cmd: Command) => {
		const r = applyCommand(demo, cmd);
		if (!r.ok) throw new Error(r.message);
		return r.diagram;
	};
	it('names the change made by change-id, and its undo', () => {
		const after = changed({ kind: 'change-id', id: 'age', newId: 'age_years' });
		expect(idChangeBetween(demo, after)).toEqual({ from: 'age', to: 'age_years' });
		expect(idChangeBetween(after, demo)).toEqual({ from: 'age_years', to: 'age' });
	});
	it('sees none in other edits: a rename, a new variable, two ids at once, no change', () => {
		const renamed = changed({ kind: 'rename-variable', id: 'age', label: 'Age in years' });
		expect(idChangeBetween(demo, renamed)).toBeNull();
		expect(idChangeBetween(demo, demo)).toBeNull();
		const two = { ...demo, variables: demo.variables.map((v, i) => (i < 2 ? { ...v, id: `${v.id}_x` } : v)) };
		expect(idChangeBetween(demo, two)).toBeNull();
		const fewer = { ...demo, variables: demo.variables.slice(1) };
		expect(idChangeBetween(demo, fewer)).toBeNull();
	});
});
