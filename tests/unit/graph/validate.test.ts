import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import type { Diagram } from '../../../src/lib/graph/diagram';
import { InputError } from '../../../src/lib/graph/errors';
import { parseDiagramJson } from '../../../src/lib/graph/native-json';
import { assertValidDiagram, findCycle, validateDiagram, type DiagramIssue } from '../../../src/lib/graph/validate';

/** A diagram from ids and "a>b" arrow shorthands. */
function diagram(ids: string[], arrows: string[], roles: Partial<Pick<Diagram, 'exposures' | 'outcomes' | 'adjusted'>> = {}): Diagram {
	return {
		title: 't',
		variables: ids.map((id) => ({ id, label: id, measured: true })),
		arrows: arrows.map((s) => {
			const [from, to] = s.split('>');
			return { from, to };
		}),
		exposures: roles.exposures ?? [],
		outcomes: roles.outcomes ?? [],
		adjusted: roles.adjusted ?? []
	};
}

const demo = parseDiagramJson(readFileSync('static/demo/cycling-hypertension.causeway.json', 'utf8'));

describe('validateDiagram: one message per problem', () => {
	const cases: [string, Diagram, DiagramIssue[]][] = [
		[
			'duplicate-id',
			diagram(['age', 'diet', 'age'], []),
			[{ code: 'duplicate-id', message: 'Variable 3 has the id "age", already used by variable 1', ids: ['age'] }]
		],
		[
			'unknown-arrow-end (head)',
			diagram(['age', 'income', 'cycling', 'diet', 'bmi'], ['age>cycling', 'income>cycling', 'income>diet', 'diet>bmi2']),
			[{ code: 'unknown-arrow-end', message: 'Arrow 4 (diet → bmi2) points to "bmi2", which is not a variable', ids: ['bmi2'] }]
		],
		[
			'unknown-arrow-end (tail)',
			diagram(['bmi'], ['diet>bmi']),
			[{ code: 'unknown-arrow-end', message: 'Arrow 1 (diet → bmi) starts at "diet", which is not a variable', ids: ['diet'] }]
		],
		[
			'unknown-arrow-end (both)',
			diagram(['bmi'], ['x>y']),
			[{ code: 'unknown-arrow-end', message: 'Arrow 1 (x → y) starts at "x" and points to "y", neither of which is a variable', ids: ['x', 'y'] }]
		],
		['self-loop', diagram(['a', 'b'], ['a>b', 'b>b']), [{ code: 'self-loop', message: 'Arrow 2 (b → b) points from "b" to itself; the analysis needs an acyclic diagram (a DAG), so remove this arrow', ids: ['b'] }]],
		[
			'duplicate-arrow',
			diagram(['a', 'b', 'c'], ['a>b', 'b>c', 'a>b']),
			[{ code: 'duplicate-arrow', message: 'Arrow 3 (a → b) repeats arrow 1', ids: ['a', 'b'] }]
		],
		[
			'cycle',
			diagram(['a', 'b', 'c', 'd'], ['d>a', 'b>c', 'c>a', 'a>b']),
			[{ code: 'cycle', message: 'The diagram has a cycle: a → b → c → a; the analysis needs an acyclic diagram (a DAG), so remove or reverse one of these arrows', ids: ['a', 'b', 'c'] }]
		],
		[
			'unknown-role-id',
			diagram(['a', 'b'], ['a>b'], { exposures: ['x'], outcomes: ['y'], adjusted: ['z'] }),
			[
				{ code: 'unknown-role-id', message: 'Exposure "x" is not a variable', ids: ['x'] },
				{ code: 'unknown-role-id', message: 'Outcome "y" is not a variable', ids: ['y'] },
				{ code: 'unknown-role-id', message: 'The planned adjustment set lists "z", which is not a variable', ids: ['z'] }
			]
		],
		[
			'exposure-is-outcome',
			diagram(['a', 'b'], ['a>b'], { exposures: ['a'], outcomes: ['a', 'b'] }),
			[{ code: 'exposure-is-outcome', message: '"a" is both an exposure and an outcome', ids: ['a'] }]
		],
		[
			'adjusted-is-exposure-or-outcome',
			diagram(['a', 'b', 'c'], ['a>b', 'c>a', 'c>b'], { exposures: ['a'], outcomes: ['b'], adjusted: ['a', 'b', 'c'] }),
			[
				{ code: 'adjusted-is-exposure-or-outcome', message: '"a" is in the planned adjustment set but is an exposure', ids: ['a'] },
				{ code: 'adjusted-is-exposure-or-outcome', message: '"b" is in the planned adjustment set but is an outcome', ids: ['b'] }
			]
		]
	];
	it.each(cases)('%s', (_name, d, expected) => {
		expect(validateDiagram(d)).toEqual(expected);
	});

	it('missing-exposure and missing-outcome only when a question is needed', () => {
		const d = diagram(['a', 'b'], ['a>b']);
		expect(validateDiagram(d)).toEqual([]);
		expect(validateDiagram(d, { needQuestion: true })).toEqual([
			{ code: 'missing-exposure', message: 'No exposure is chosen: mark at least one variable as the exposure', ids: [] },
			{ code: 'missing-outcome', message: 'No outcome is chosen: mark at least one variable as the outcome', ids: [] }
		]);
		expect(validateDiagram({ ...d, exposures: ['a'], outcomes: ['b'] }, { needQuestion: true })).toEqual([]);
	});

	it('quotes ids that are not plain words, keeping the message on one line', () => {
		const [issue] = validateDiagram(diagram(['body mass', 'say "hi"\nthere'], ['body mass>say "hi"\nthere', 'say "hi"\nthere>body mass']));
		expect(issue.message).toBe('The diagram has a cycle: "body mass" → "say \\"hi\\"\\nthere" → "body mass"; the analysis needs an acyclic diagram (a DAG), so remove or reverse one of these arrows');
		expect(issue.message).not.toMatch(/\n/);
	});

	it('reports a self-loop once, not also as a cycle', () => {
		expect(validateDiagram(diagram(['a'], ['a>a'])).map((i) => i.code)).toEqual(['self-loop']);
	});

	it('lists problems in a fixed order: variables, arrows, cycle, roles', () => {
		const d = diagram(['a', 'b', 'a'], ['a>b', 'b>a', 'a>q'], { exposures: ['nope'] });
		expect(validateDiagram(d).map((i) => i.code)).toEqual(['duplicate-id', 'unknown-arrow-end', 'cycle', 'unknown-role-id']);
	});

	it('accepts the demo diagram (DESIGN.md demo study) and rejects it once an arrow closes a cycle', () => {
		expect(validateDiagram(demo, { needQuestion: true })).toEqual([]);
		const cyclic = { ...demo, arrows: [...demo.arrows, { from: 'hypertension', to: 'income' }] };
		expect(validateDiagram(cyclic)).toEqual([
			// income → cycling, cycling → fitness, fitness → bmi and bmi → hypertension are arrows of the
			// demo; depth-first search from "age" meets this cycle before the shorter income ⇄ hypertension.
			{
				code: 'cycle',
				message: 'The diagram has a cycle: income → cycling → fitness → bmi → hypertension → income; the analysis needs an acyclic diagram (a DAG), so remove or reverse one of these arrows',
				ids: ['income', 'cycling', 'fitness', 'bmi', 'hypertension']
			}
		]);
	});
});

describe('assertValidDiagram', () => {
	it('throws an InputError with the first issue', () => {
		const d = diagram(['a', 'b'], ['a>b', 'b>a'], { exposures: ['zz'] });
		expect(() => assertValidDiagram(d)).toThrow(InputError);
		expect(() => assertValidDiagram(d)).toThrow('The diagram has a cycle: a → b → a');
		try {
			assertValidDiagram(d);
		} catch (e) {
			expect((e as InputError).where).toBe('a, b');
		}
	});

	it('passes the needQuestion option through', () => {
		const d = diagram(['a', 'b'], ['a>b']);
		expect(() => assertValidDiagram(d)).not.toThrow();
		expect(() => assertValidDiagram(d, { needQuestion: true })).toThrow('No exposure is chosen');
	});
});

describe('findCycle', () => {
	it('returns null for a DAG and for an empty graph', () => {
		expect(findCycle([], [])).toBeNull();
		expect(findCycle(['a', 'b', 'c'], [{ from: 'a', to: 'b' }, { from: 'a', to: 'c' }, { from: 'b', to: 'c' }])).toBeNull();
	});

	it('returns a closed walk starting at the first-listed variable of the cycle', () => {
		const arrows = [
			{ from: 'c', to: 'd' },
			{ from: 'd', to: 'b' },
			{ from: 'b', to: 'c' }
		];
		expect(findCycle(['a', 'b', 'c', 'd'], arrows)).toEqual(['b', 'c', 'd', 'b']);
	});

	it('reports a self-loop as [a, a]', () => {
		expect(findCycle(['a'], [{ from: 'a', to: 'a' }])).toEqual(['a', 'a']);
	});

	it('ignores arrows naming unknown ids', () => {
		expect(findCycle(['a'], [{ from: 'a', to: 'x' }, { from: 'x', to: 'a' }])).toBeNull();
	});

	it('handles a 100,000-variable path without recursion (it would overflow the call stack)', () => {
		const n = 100_000;
		const ids = Array.from({ length: n }, (_, i) => `v${i}`);
		const arrows = ids.slice(1).map((id, i) => ({ from: ids[i], to: id }));
		expect(findCycle(ids, arrows)).toBeNull();
		const cyclic = findCycle(ids, [...arrows, { from: ids[n - 1], to: ids[0] }]);
		expect(cyclic).toHaveLength(n + 1);
		expect(cyclic?.[0]).toBe('v0');
		expect(cyclic?.[n - 1]).toBe(`v${n - 1}`);
	});

	// Speed on large diagrams is measured by `npm run bench`, not asserted here; this checks
	// that a long chain is handled at all (a recursive walk would overflow the stack).
	it('validateDiagram handles a 100,000-variable chain', () => {
		const n = 100_000;
		const ids = Array.from({ length: n }, (_, i) => `v${i}`);
		const d = diagram(ids, []);
		d.arrows = ids.slice(1).map((id, i) => ({ from: ids[i], to: id }));
		expect(validateDiagram(d)).toEqual([]);
	});
});
