// Version 2 of the native format: each variable's data settings (column, kind, reference
// level, value labels) and notes on arrows, in native JSON, DOT, the graph model and share
// links; version 1 files still read; the readers' limits hold for the new fields.
import { describe, expect, it } from 'vitest';
import { DIAGRAM_VERSION, type Diagram } from '../../../src/lib/graph/diagram';
import { parseDot, writeDot } from '../../../src/lib/graph/dot';
import { InputError } from '../../../src/lib/graph/errors';
import { parseDiagramJson, writeDiagramJson } from '../../../src/lib/graph/native-json';
import { validate as validateSchema } from '../../../src/lib/graph/diagram-schema-validate.js';
import { readShareFragment, shareFragment } from '../../../src/lib/export/share-link';
import { MAX_LABEL_CHARS, MAX_NOTE_CHARS, MAX_VALUE_LABELS } from '../../../src/lib/limits';

/** An occupation study: the settings a user makes in the Data section. */
const study: Diagram = {
	title: 'Occupation and blood pressure',
	variables: [
		{ id: 'occupation', label: 'Occupation', measured: true, data: { column: 'occ_code', kind: 'categorical', reference: '0', labels: [{ value: '0', label: 'manual' }, { value: '1', label: 'clerical' }, { value: '2', label: 'professional' }] } },
		{ id: 'age', label: 'Age', measured: true, data: { kind: 'continuous' } },
		{ id: 'sbp', label: 'Systolic blood pressure', measured: true },
		{ id: 'diet', label: 'Diet', measured: true, data: { column: null } }
	],
	arrows: [
		{ from: 'age', to: 'occupation', note: 'Career progression with age (assumed).' },
		{ from: 'occupation', to: 'sbp' },
		{ from: 'age', to: 'sbp', note: 'Blood pressure rises with age.\nSecond line & "quotes".' }
	],
	exposures: ['occupation'],
	outcomes: ['sbp'],
	adjusted: ['age']
};

function inputError(read: () => unknown): InputError {
	try {
		read();
	} catch (e) {
		expect(e).toBeInstanceOf(InputError);
		return e as InputError;
	}
	throw new Error('expected an InputError');
}

describe('native JSON, version 2', () => {
	it('writes version 2 with the settings under "data" and value labels as an object', () => {
		const text = writeDiagramJson(study);
		const file = JSON.parse(text);
		expect(file.version).toBe(DIAGRAM_VERSION);
		expect(DIAGRAM_VERSION).toBe(2);
		expect(file.variables[0].data).toEqual({ column: 'occ_code', kind: 'categorical', reference: '0', labels: { 0: 'manual', 1: 'clerical', 2: 'professional' } });
		expect(file.variables[3].data).toEqual({ column: null });
		expect(file.variables[2]).not.toHaveProperty('data');
		expect(file.arrows[0]).toEqual({ from: 'age', to: 'occupation', note: 'Career progression with age (assumed).' });
		expect(validateSchema(file)).toBe(true);
	});

	it('reads back what it wrote', () => {
		expect(parseDiagramJson(writeDiagramJson(study))).toEqual(study);
	});

	it('reads a version 1 file unchanged, and writes it as version 2', () => {
		const v1 = '{"format":"causeway.diagram","version":1,"variables":[{"id":"a","note":"n"},{"id":"b"}],"arrows":[{"from":"a","to":"b","why":"kept"}]}';
		const d = parseDiagramJson(v1);
		expect(d.variables[0]).toEqual({ id: 'a', label: 'a', measured: true, note: 'n' });
		expect(d.arrows[0]).toEqual({ from: 'a', to: 'b', extra: { why: 'kept' } });
		expect(JSON.parse(writeDiagramJson(d)).version).toBe(2);
	});

	it('keeps unknown keys inside "data" on a round trip', () => {
		const text = '{"format":"causeway.diagram","version":2,"variables":[{"id":"a","data":{"kind":"binary","units":"mmHg"}}],"arrows":[]}';
		const d = parseDiagramJson(text);
		expect(d.variables[0].data).toEqual({ kind: 'binary', extra: { units: 'mmHg' } });
		expect(JSON.parse(writeDiagramJson(d)).variables[0].data).toEqual({ kind: 'binary', units: 'mmHg' });
	});

	it('names the path of a wrong setting', () => {
		const file = (data: unknown) => JSON.stringify({ format: 'causeway.diagram', version: 2, variables: [{ id: 'a', data }], arrows: [] });
		expect(inputError(() => parseDiagramJson(file({ kind: 'number' }))).message).toMatch(/^variables\[0\]\.data\.kind must be one of "binary", "categorical", "ordinal", "continuous", found the text "number"/);
		expect(inputError(() => parseDiagramJson(file({ column: 3 }))).message).toMatch(/^variables\[0\]\.data\.column must be text \(a string\) or null, found the number 3/);
		expect(inputError(() => parseDiagramJson(file({ labels: { 1: true } }))).message).toMatch(/^variables\[0\]\.data\.labels\["1"\] must be text/);
	});

	it('refuses settings and arrow notes past the stated limits, naming them', () => {
		const long = 'x'.repeat(MAX_LABEL_CHARS + 1);
		const withData = (data: Diagram['variables'][0]['data']): Diagram => ({ ...study, variables: [{ ...study.variables[0], data }, ...study.variables.slice(1)] });
		expect(inputError(() => parseDiagramJson(writeDiagramJson(withData({ column: long })))).message).toBe(
			'The column name of Variable 1 ("occupation") is too long: 1,001 characters, at most 1,000 are allowed'
		);
		const many = Array.from({ length: MAX_VALUE_LABELS + 1 }, (_, i) => ({ value: String(i), label: `level ${i}` }));
		expect(inputError(() => parseDiagramJson(writeDiagramJson(withData({ labels: many })))).message).toBe('Variable 1 ("occupation") has 501 value labels; at most 500 are allowed');
		const noted: Diagram = { ...study, arrows: [{ from: 'age', to: 'sbp', note: 'n'.repeat(MAX_NOTE_CHARS + 1) }] };
		expect(inputError(() => parseDiagramJson(writeDiagramJson(noted))).message).toBe('The note of arrow 1 ("age" → "sbp") is too long: 100,001 characters, at most 100,000 are allowed');
	});
});

describe('DOT', () => {
	it('carries the settings as data_* node attributes and arrow notes as an edge attribute', () => {
		const dot = writeDot(study);
		expect(dot).toContain('occupation [label="Occupation", role="exposure", data_column="occ_code", data_kind=categorical, data_reference="0", data_labels="{\\"0\\":\\"manual\\",\\"1\\":\\"clerical\\",\\"2\\":\\"professional\\"}"];');
		expect(dot).toContain('diet [label="Diet", data_column=""];');
		expect(dot).toContain('age -> sbp [note="Blood pressure rises with age.\\nSecond line &amp; \\"quotes\\"."];');
		expect(parseDot(dot)).toEqual(study);
	});

	it('refuses a kind it does not know and labels that are not a JSON object, with the place', () => {
		expect(inputError(() => parseDot('digraph {\n  a [data_kind=numeric];\n}')).message).toBe('Node "a": data_kind "numeric" is not one of binary, categorical, ordinal, continuous (line 2, column 16)');
		expect(inputError(() => parseDot('digraph {\n  a [data_labels="0=manual"];\n}')).message).toMatch(/^Node "a": data_labels must be a JSON object of value → name/);
	});
});

describe('graph model and share links', () => {
	it('a share link carries the settings and the notes', () => {
		expect(readShareFragment(shareFragment(study))).toEqual(study);
	});
});
