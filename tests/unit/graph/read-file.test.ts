import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { writeDot } from '../../../src/lib/graph/dot';
import { InputError } from '../../../src/lib/graph/errors';
import { parseDiagramJson } from '../../../src/lib/graph/native-json';
import { diagramFileKind, readDiagramText } from '../../../src/lib/graph/read-file';

const demoText = readFileSync('static/demo/cycling-hypertension.causeway.json', 'utf8');
const demo = parseDiagramJson(demoText);
const demoDot = writeDot(demo);

describe('readDiagramText', () => {
	it('chooses by extension', () => {
		expect(diagramFileKind('study.causeway.json', '')).toBe('json');
		expect(diagramFileKind('study.CAUSEWAY', '')).toBe('json');
		expect(diagramFileKind('study.dot', '')).toBe('dot');
		expect(diagramFileKind('study.gv', '')).toBe('dot');
		expect(readDiagramText('demo.json', demoText)).toEqual(demo);
		expect(readDiagramText('demo.gv', demoDot)).toEqual(demo);
	});

	it('falls back to the content when the extension says nothing', () => {
		expect(diagramFileKind('pasted', '  {"format": 1}')).toBe('json');
		expect(diagramFileKind('pasted', '/* c */\n// d\n# e\n strict digraph {}')).toBe('dot');
		expect(diagramFileKind('x.txt', 'digraph{a}')).toBe('dot');
		expect(diagramFileKind('x.txt', 'hello')).toBeNull();
		expect(readDiagramText('clipboard', demoText)).toEqual(demo);
		expect(readDiagramText('clipboard', demoDot)).toEqual(demo);
	});

	it('puts the file name in front of every message', () => {
		expect(() => readDiagramText('study.json', '{\n "a": }')).toThrow('study.json: Invalid JSON at line 2, column 7: expected a value (found "}")');
		try {
			readDiagramText('study.json', '{\n "a": }');
		} catch (e) {
			expect((e as InputError).where).toBe('study.json:2:7');
		}
		expect(() => readDiagramText('g.dot', 'graph { a -- b }')).toThrow(/^g\.dot: This DOT file describes an undirected graph/);
		expect(() => readDiagramText('notes.txt', 'hello')).toThrow(
			'notes.txt: not a diagram file this version can read: expected a Causeway diagram (.json, starting with "{") or a DOT digraph (.dot or .gv)'
		);
	});

	it('says "empty" for an empty standard input or file whose kind the name does not tell', () => {
		expect(() => readDiagramText('stdin', '')).toThrow('stdin: Standard input is empty: expected a Causeway diagram (JSON) or a DOT digraph');
		expect(() => readDiagramText('stdin', ' \n\t\n')).toThrow('stdin: Standard input is empty');
		expect(() => readDiagramText('diagram', '')).toThrow('diagram: The file is empty: expected a Causeway diagram (JSON) or a DOT digraph');
	});
});
