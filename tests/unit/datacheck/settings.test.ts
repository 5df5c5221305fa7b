// Each variable's data settings in the diagram (column link, kind, reference level, value
// labels) drive the checks, checked against R on the infert dataset
// (tests/fixtures/datacheck/make-settings-fixtures.R → settings.json): relevel() for a
// reference level, factor() for a numeric column declared categorical, and the reciprocal
// model for an outcome with reference level 1. Flags (the CLI's --map / --type) override the
// file; a setting the data cannot honour is refused, or noted in the app's mode.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { applyDataSettings, kindProblem, runDataChecks, describeTable } from '../../../src/lib/datacheck';
import { applyCommand, type Command } from '../../../src/lib/editor/commands';
import type { Diagram } from '../../../src/lib/graph/diagram';
import { InputError } from '../../../src/lib/graph/errors';
import { StatsError } from '../../../src/lib/stats';
import { expectClose } from '../stats/fixtures';
import { fixtureDir, readDiagram, readTable } from './helpers';

const ref = JSON.parse(readFileSync(`${fixtureDir}settings.json`, 'utf8'));
const study = readDiagram(`${fixtureDir}infert-settings.causeway.json`);
const table = readTable(`${fixtureDir}infert.csv`);

function edit(d: Diagram, ...cmds: Command[]): Diagram {
	for (const c of cmds) {
		const r = applyCommand(d, c);
		if (!r.ok) throw new Error(r.message);
		d = r.diagram;
	}
	return d;
}

const planned = (d: Diagram, options = {}) => {
	const e = runDataChecks(d, table, { parts: { arrows: false, claims: false }, ...options }).estimates!;
	return e.rows.find((r) => r.roles.includes('planned'))!;
};

/** Odds ratios and Wald intervals of glm + confint.default (tolerances as in reference.test.ts). */
function expectOddsRatio(row: { estimate: number; ci: [number, number]; n: number }, want: { or: number; ci: [number, number] }) {
	expect(row.n).toBe(ref.n);
	expectClose(row.estimate, want.or, 1e-6);
	expectClose(row.ci[0], want.ci[0], 2e-5);
	expectClose(row.ci[1], want.ci[1], 2e-5);
}

describe('settings from the diagram file (R 4.2 on infert)', () => {
	it('links "abortions" to column spontaneous, declared categorical with named levels: equals glm on factor(spontaneous)', () => {
		const report = runDataChecks(study, table);
		expect(report.mapping.columns.abortions).toBe('spontaneous');
		expect(report.mapping.by.abortions).toBe('manual');
		const use = report.columnsUsed!.find((u) => u.variable === 'abortions')!;
		expect(use).toEqual({ variable: 'abortions', column: 'spontaneous', by: 'manual', kind: 'categorical', kindChosen: true, reference: 'none', labels: 3 });
		expect(report.columnsUsed!.find((u) => u.variable === 'age')).toMatchObject({ kind: 'continuous', kindChosen: false, reference: null });
		const row = report.estimates!.rows.find((r) => r.roles.includes('planned'))!;
		expect(row.adjustedFor).toEqual(['age', 'induced', 'parity']);
		expect(row.term).toContain('one');
		expectOddsRatio(row, ref.spontaneousCategorical);
	});

	it('a reference level reorders the levels: education against 12+ yrs equals relevel()', () => {
		const d = edit(study, { kind: 'set-role', list: 'exposures', id: 'abortions', member: false }, { kind: 'set-role', list: 'exposures', id: 'education', member: true }, { kind: 'set-adjusted', ids: ['age', 'parity'] });
		const row = planned(d);
		expect(row.term).toContain('0-5yrs');
		expectOddsRatio(row, ref.educationRef12);
	});

	it('the outcome with reference level 1 models the other level: every odds ratio is the reciprocal (R: glm on 1 - case)', () => {
		const d = edit(study, { kind: 'set-variable-data', id: 'case', data: { kind: 'binary', reference: '1' } });
		expectOddsRatio(planned(d), ref.caseReference1);
		expectClose(ref.caseReference1.or * ref.spontaneousCategorical.or, 1, 1e-9);
	});

	it('the settings survive renaming the variable (the id is stable) and travel with an id change', () => {
		const renamed = edit(study, { kind: 'rename-variable', id: 'abortions', label: 'Spontaneous abortions, number' });
		expectOddsRatio(planned(renamed), ref.spontaneousCategorical);
		const moved = edit(study, { kind: 'change-id', id: 'abortions', newId: 'sab' });
		expect(moved.exposures).toEqual(['sab']);
		expectOddsRatio(planned(moved), ref.spontaneousCategorical);
	});
});

describe('overrides and problems', () => {
	it('--map and --type override the file', () => {
		const r = runDataChecks(study, table, { mapping: { abortions: null }, parts: { arrows: false, claims: false } });
		expect(r.mapping.unmapped).toContain('abortions');
		const numeric = runDataChecks(study, table, { types: { spontaneous: 'continuous' }, parts: { arrows: false, claims: false } });
		expect(numeric.columnsUsed!.find((u) => u.variable === 'abortions')).toMatchObject({ kind: 'continuous', kindChosen: true, reference: null });
		expect(numeric.notes).toContain('The reference level and value labels of "abortions" are not used: its column \'spontaneous\' is analysed as continuous.');
	});

	it('refuses, by default, a setting the data cannot honour, naming it', () => {
		const missing = edit(study, { kind: 'set-variable-data', id: 'age', data: { column: 'age_years' } });
		expect(() => runDataChecks(missing, table)).toThrow(InputError);
		expect(() => runDataChecks(missing, table)).toThrow('The diagram links "age" to column "age_years", which is not in the data');
		const binary = edit(study, { kind: 'set-variable-data', id: 'education', data: { kind: 'binary' } });
		expect(() => runDataChecks(binary, table)).toThrow(StatsError);
		const badRef = edit(study, { kind: 'set-variable-data', id: 'education', data: { kind: 'categorical', reference: 'none' } });
		expect(() => runDataChecks(badRef, table)).toThrow("The reference level 'none' is not a value of column 'education' (its values: '0-5yrs', '12+ yrs', '6-11yrs').");
	});

	it('in the app\'s mode, leaves such a setting out for this table and says so', () => {
		const d = edit(
			study,
			{ kind: 'set-variable-data', id: 'age', data: { column: 'age_years' } },
			{ kind: 'set-variable-data', id: 'education', data: { kind: 'binary' } }
		);
		const r = runDataChecks(d, table, { settingProblems: 'note', parts: { arrows: false, claims: false } });
		expect(r.mapping.columns.age).toBe('age');
		expect(r.notes).toContain('The diagram links "age" to column "age_years", which is not in the data: matched by name instead.');
		expect(r.notes).toContain("Column 'education' cannot be binary: it has 3 distinct values. Its detected kind (categorical) is used.");
	});

	it('the app checks a kind before storing it, with the words the pipeline would use', () => {
		const info = describeTable(applyDataSettings({ ...study, variables: [] }, table).table, 'infert.csv');
		const col = (name: string) => info.columns.find((c) => c.name === name)!;
		expect(col('spontaneous').values).toEqual(['0', '1', '2']);
		expect(kindProblem(col('spontaneous'), 'binary')).toBe("Column 'spontaneous' cannot be binary: it has 3 distinct values.");
		expect(kindProblem(col('spontaneous'), 'ordinal')).toBeNull();
		expect(kindProblem(col('education'), 'continuous')).toBe("Column 'education' cannot be numeric: its value '0-5yrs' is not a number.");
		expect(col('age').values).toBeNull(); // more distinct ages than the level cap
		expect(kindProblem(col('age'), 'categorical')).toBe("Column 'age' has more than 20 distinct values, too many to use as categorical levels.");
	});
});
