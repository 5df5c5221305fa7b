import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { emptyDiagram, type Diagram } from '../../../src/lib/graph/diagram';
import { InputError } from '../../../src/lib/graph/errors';
import { parseDiagramJson, writeDiagramJson } from '../../../src/lib/graph/native-json';
import { validateDiagram } from '../../../src/lib/graph/validate';

const DEMO_PATH = 'static/demo/cycling-hypertension.causeway.json';

/** A file text from a partial top-level object, with format/version filled in. */
function file(body: Record<string, unknown>): string {
	return JSON.stringify({ format: 'causeway.diagram', version: 1, variables: [], arrows: [], ...body });
}

function errorOf(text: string): InputError {
	try {
		parseDiagramJson(text);
	} catch (e) {
		expect(e).toBeInstanceOf(InputError);
		return e as InputError;
	}
	throw new Error('expected an InputError');
}

describe('the demo file', () => {
	const text = readFileSync(DEMO_PATH, 'utf8');
	const d = parseDiagramJson(text);

	it('parses with the study question and planned set of DESIGN.md', () => {
		expect(d.variables).toHaveLength(13);
		expect(d.arrows).toHaveLength(21);
		expect(d.exposures).toEqual(['cycling']);
		expect(d.outcomes).toEqual(['hypertension']);
		expect(d.adjusted).toEqual(['age', 'income', 'diet']);
		expect(d.variables.find((v) => v.id === 'health_consciousness')?.measured).toBe(false);
	});

	it('validates without issues, also when a question is required', () => {
		expect(validateDiagram(d, { needQuestion: true })).toEqual([]);
	});

	it('is already in the canonical form the writer produces (byte for byte, but the final newline)', () => {
		expect(writeDiagramJson(d).trimEnd()).toBe(text.trimEnd());
	});
});

describe('defaults', () => {
	it('fills label = id, measured = true, empty roles and an empty title', () => {
		const d = parseDiagramJson(file({ variables: [{ id: 'age' }] }));
		expect(d).toEqual({
			title: '',
			variables: [{ id: 'age', label: 'age', measured: true }],
			arrows: [],
			exposures: [],
			outcomes: [],
			adjusted: []
		} satisfies Diagram);
	});

	it('keeps optional keys absent rather than inventing them', () => {
		const [v] = parseDiagramJson(file({ variables: [{ id: 'a' }] })).variables;
		expect(Object.keys(v).sort()).toEqual(['id', 'label', 'measured']);
	});

	it('reads a file that starts with a byte-order mark', () => {
		expect(parseDiagramJson('\uFEFF' + file({ title: 'T' })).title).toBe('T');
	});
});

describe('unknown keys', () => {
	const text = file({
		$schema: './causeway.diagram.schema.json',
		reviewer: { name: 'B. Okafor', date: '2025-03-01' },
		variables: [{ id: 'age', colourHint: 'blue', sources: ['survey', 2] }],
		arrows: [{ from: 'age', to: 'age', evidence: 'cohort studies', strength: 0.4 }]
	});

	it('are kept in extra at the top level, in variables and in arrows', () => {
		const d = parseDiagramJson(text);
		expect(d.extra).toEqual({ $schema: './causeway.diagram.schema.json', reviewer: { name: 'B. Okafor', date: '2025-03-01' } });
		expect(d.variables[0].extra).toEqual({ colourHint: 'blue', sources: ['survey', 2] });
		expect(d.arrows[0].extra).toEqual({ evidence: 'cohort studies', strength: 0.4 });
	});

	it('survive a write and a second read', () => {
		const d = parseDiagramJson(text);
		expect(parseDiagramJson(writeDiagramJson(d))).toEqual(d);
		const written = JSON.parse(writeDiagramJson(d));
		expect(written.reviewer).toEqual({ name: 'B. Okafor', date: '2025-03-01' });
		expect(written.variables[0].colourHint).toBe('blue');
		expect(written.arrows[0].strength).toBe(0.4);
	});

	it('never overwrite a known key when writing', () => {
		const d: Diagram = { ...emptyDiagram('T'), variables: [{ id: 'a', label: 'A', measured: true, extra: { id: 'other', label: 'x' } }] };
		const written = JSON.parse(writeDiagramJson(d));
		expect(written.variables[0]).toEqual({ id: 'a', label: 'A', measured: true });
	});
});

describe('prototype pollution', () => {
	const hostile =
		'{"format":"causeway.diagram","version":1,"__proto__":{"polluted":"top"},"constructor":{"prototype":{"polluted":"ctor"}},' +
		'"variables":[{"id":"a","__proto__":{"polluted":"var"},"meta":{"__proto__":{"polluted":"deep"},"ok":1}}],' +
		'"arrows":[{"from":"a","to":"a","__proto__":{"polluted":"arrow"}}]}';

	it('drops __proto__ / constructor / prototype keys at every depth', () => {
		const d = parseDiagramJson(hostile);
		expect(d.extra).toBeUndefined();
		expect(d.variables[0].extra).toEqual({ meta: { ok: 1 } });
		expect(Object.keys(d.variables[0].extra?.meta as object)).toEqual(['ok']);
		expect(d.arrows[0].extra).toBeUndefined();
	});

	it('leaves Object.prototype and the parsed objects untouched', () => {
		const d = parseDiagramJson(hostile);
		const probe: Record<string, unknown> = {};
		expect(probe.polluted).toBeUndefined();
		expect(Object.getPrototypeOf(d.variables[0])).toBe(Object.prototype);
		expect((d.variables[0] as unknown as Record<string, unknown>).polluted).toBeUndefined();
		// A consumer that merges extra into a plain object must not change that object's prototype.
		const merged = Object.assign({}, d.variables[0].extra);
		expect(Object.getPrototypeOf(merged)).toBe(Object.prototype);
	});
});

describe('writer', () => {
	it('puts format and version first and the known keys in schema order', () => {
		const d: Diagram = {
			title: 'T',
			variables: [{ id: 'a', label: 'A', measured: false, x: 1, y: 2, note: 'n', extra: { z: 1, b: 2 } }],
			arrows: [],
			exposures: [],
			outcomes: [],
			adjusted: [],
			extra: { zeta: 1, alpha: 2 }
		};
		const written = JSON.parse(writeDiagramJson(d));
		expect(Object.keys(written)).toEqual(['format', 'version', 'title', 'variables', 'arrows', 'exposures', 'outcomes', 'adjusted', 'alpha', 'zeta']);
		expect(Object.keys(written.variables[0])).toEqual(['id', 'label', 'measured', 'x', 'y', 'note', 'b', 'z']);
	});

	it('is stable: writing twice gives the same text', () => {
		const d = parseDiagramJson(readFileSync(DEMO_PATH, 'utf8'));
		expect(writeDiagramJson(parseDiagramJson(writeDiagramJson(d)))).toBe(writeDiagramJson(d));
	});

	it('refuses a non-finite coordinate instead of writing null', () => {
		const d: Diagram = { ...emptyDiagram(), variables: [{ id: 'a', label: 'a', measured: true, x: Number.NaN, y: 0 }] };
		expect(() => writeDiagramJson(d)).toThrow(/Variable "a" has x = NaN; a position must be a finite number/);
	});

	it('keeps unicode, quotes, backslashes and line breaks in labels and notes', () => {
		const d: Diagram = {
			...emptyDiagram('Vélo → tension «artérielle»'),
			variables: [{ id: 'bp', label: 'Blood "pressure"\\n\nmmHg ✓ 血压', measured: true, note: 'tab\there\u2028sep' }]
		};
		expect(parseDiagramJson(writeDiagramJson(d))).toEqual(d);
	});
});

describe('syntax errors name the line and column', () => {
	it.each([
		['{\n  "format": "causeway.diagram",\n  "version": 1,\n}', 'Invalid JSON at line 4, column 1: expected a key in double quotes (found "}")', '4:1'],
		['{\n "a": }', 'Invalid JSON at line 2, column 7: expected a value (found "}")', '2:7'],
		['{"a": 1', 'Invalid JSON at line 1, column 8: expected a closing brace (}) (found the end of the file)', '1:8'],
		['{"a": 1} // note', 'Invalid JSON at line 1, column 10: comments are not allowed in JSON (found "// note")', '1:10'],
		['{"a": "x\ny"}', 'Invalid JSON at line 1, column 9: a line break inside a string; write it as \\n', '1:9'],
		['{"a": "x\u0001y"}', 'Invalid JSON at line 1, column 7: a control character inside a string; write it as an escape such as \\t or \\u0001 (found "\\"x\\u0001y\\"")', '1:7'],
		['{"a" 1}', 'Invalid JSON at line 1, column 6: expected a colon (:) (found "1")', '1:6']
	])('%j', (text, message, where) => {
		const e = errorOf(text);
		expect(e.message).toBe(message);
		expect(e.where).toBe(where);
	});

	it('says the file is empty', () => {
		expect(errorOf('  \n').message).toBe('The file is empty: expected a Causeway diagram (JSON)');
	});
});

describe('structure errors name the path', () => {
	it.each([
		['[]', 'A Causeway diagram file must hold a JSON object, but this one holds a list', undefined],
		['{"version":1}', 'Not a Causeway diagram: the "format" key is missing (expected "format": "causeway.diagram")', 'format'],
		['{"format":"graphml","version":1}', 'Not a Causeway diagram: "format" is the text "graphml", expected "causeway.diagram" (line 1, column 11)', 'format'],
		['{"format":"causeway.diagram"}', 'The "version" key is missing (this version of Causeway reads versions 1 and 2)', 'version'],
		['{"format":"causeway.diagram","version":3}', 'Unsupported diagram version: found version 3, but this version of Causeway reads versions 1 and 2 (the file was made by a newer version of Causeway) (line 1, column 40)', 'version'],
		['{"format":"causeway.diagram","version":"1"}', 'Unsupported diagram version: found the text "1", but this version of Causeway reads versions 1 and 2 (line 1, column 40)', 'version'],
		[file({ variables: undefined }), 'The diagram is missing the key "variables"', undefined],
		[file({ variables: [{ id: 'a' }, { id: 'b' }, { id: 'c' }, { id: 42 }] }), 'variables[3].id must be text (a string), found the number 42', 'variables[3].id'],
		[file({ variables: [{ id: '' }] }), 'variables[0].id must not be empty', 'variables[0].id'],
		[file({ variables: [{ label: 'Age' }] }), 'variables[0] is missing the key "id"', 'variables[0]'],
		[file({ variables: [{ id: 'a', measured: 'no' }] }), 'variables[0].measured must be true or false, found the text "no"', 'variables[0].measured'],
		[file({ variables: [{ id: 'a', x: '10' }] }), 'variables[0].x must be a number, found the text "10"', 'variables[0].x'],
		[file({ arrows: [{ from: 'a' }] }), 'arrows[0] is missing the key "to"', 'arrows[0]'],
		[file({ arrows: [{ from: 'a', to: null }] }), 'arrows[0].to must be text (a string), found null', 'arrows[0].to'],
		[file({ exposures: 'cycling' }), 'exposures must be a list, found the text "cycling"', 'exposures'],
		[file({ adjusted: ['age', 3] }), 'adjusted[1] must be text (a string), found the number 3', 'adjusted[1]'],
		[file({ title: 5 }), 'title must be text (a string), found the number 5', 'title']
	])('%s', (text, message, where) => {
		const e = errorOf(text);
		// The message ends with the line of the offending value; the first part is exact.
		expect(e.message.replace(/ \(line \d+, column \d+\)$/, '')).toBe(message.replace(/ \(line \d+, column \d+\)$/, ''));
		expect(e.where).toBe(where);
	});

	it('adds the line and column of the offending value', () => {
		const text = '{\n  "format": "causeway.diagram",\n  "version": 1,\n  "variables": [\n    { "id": "a" },\n    { "id": 7 }\n  ],\n  "arrows": []\n}';
		expect(errorOf(text).message).toBe('variables[1].id must be text (a string), found the number 7 (line 6, column 13)');
	});

	it('rejects a coordinate too large to be finite (1e999 reads as Infinity)', () => {
		const text = '{"format":"causeway.diagram","version":1,"variables":[{"id":"a","x":1e999}],"arrows":[]}';
		expect(errorOf(text).message).toBe('variables[0].x must be a finite number, found the number Infinity (too large for a coordinate) (line 1, column 69)');
	});
});
