/**
 * The words of the confounder check: kinds stated beside results, sizes in the measure read
 * without a verdict word, the category-code notice naming the column, the homogeneity test
 * flagging effect modification, the split of an odds ratio's change into confounding and
 * non-collapsibility (Greenland, Robins & Pearl, Statistical Science 1999), the two-way table's
 * cells and the analysis code's header. Numbers are never in e-notation.
 */
import { describe, expect, it } from 'vitest';
import type { ReadMeasure, TwoWayTable } from '../../../src/lib/datacheck';
import {
	categoryCodeNotice,
	codeHeaderLines,
	collapsibilitySentence,
	homogeneityText,
	kindsSummary,
	kindText,
	measureMeaning,
	measureShort,
	measureText,
	riskDifferenceText,
	smallSizeRule,
	stratifiedText,
	twoWayCells,
	chiSquareText,
	levelOddsRatioCells
} from '../../../src/lib/wording';

const or: ReadMeasure = {
	name: 'odds ratio, income = 4 vs 1',
	type: 'odds-ratio',
	value: 1.6234,
	ci: [1.21, 2.17],
	smallBelow: null,
	contrast: { variable: 'income', level: '4', reference: '1', of: { variable: 'hypertension', level: '1' } }
};
const d: ReadMeasure = { name: 'standardized difference d (age)', type: 'standardized-difference', value: -0.268, smallBelow: 0.2, contrast: { variable: 'cycling', level: '1', reference: '0', of: { variable: 'age', level: null } } };

describe('kinds beside results', () => {
	it('numbers, binary and categories with the reference; code-like numbers say so', () => {
		expect(kindText({ kind: 'continuous', levels: [], codeValues: null })).toBe('continuous');
		expect(kindText({ kind: 'continuous', levels: [], codeValues: [0, 1, 2, 3] })).toBe('continuous — values look like category codes 0, 1, 2 and 3');
		expect(kindText({ kind: 'binary', levels: ['no', 'yes'] })).toBe('binary (reference no)');
		expect(kindText({ kind: 'categorical', levels: ['A', 'B', 'C'] })).toBe('categorical, 3 levels (reference A)');
		expect(kindText({ kind: 'ordinal', levels: ['low', 'mid', 'high'] })).toBe('ordinal, 3 levels (reference low)');
		expect(
			kindsSummary([
				{ label: 'Age', kind: 'continuous', levels: [] },
				{ label: 'Band', kind: 'continuous', levels: [], codeValues: [1, 2, 3] },
				{ label: 'Sex', kind: 'binary', levels: ['f', 'm'] }
			])
		).toBe('continuous: Age, Band (look like category codes); binary (reference f): Sex');
	});
});

describe('sizes in the measure read, without a verdict word', () => {
	it('odds ratio per level, with whose odds and which levels', () => {
		expect(measureShort(or)).toBe('OR 1.62');
		expect(measureMeaning(or, (c) => c.toUpperCase())).toBe('odds of HYPERTENSION = 1 are 1.62 times as high at INCOME = 4 as at 1');
		expect(measureText(or)).toBe('odds ratio 1.62 (95 % CI 1.21 to 2.17): odds of hypertension = 1 are 1.62 times as high at income = 4 as at 1');
	});
	it("Cohen's d says which way the means differ, with a true minus in the symbol form", () => {
		expect(measureShort(d)).toBe('d = −0.268');
		expect(measureMeaning(d)).toBe("mean age is 0.268 SD lower at cycling = 1 than at 0 (Cohen's d)");
	});
	it('no size word anywhere; the rule of thumb behind "weak" is labelled', () => {
		for (const text of [measureText(or), measureText(d)]) expect(text).not.toMatch(/\b(weak|strong|small|large|moderate)\b/i);
		expect(smallSizeRule(d)).toBe('weak means below Cohen\'s (1988) "small", |d| < 0.2 (a rule of thumb)');
		expect(smallSizeRule(or)).toBe('odds ratios are never called weak: their size is shown as it is');
	});
});

describe('the category-code notice', () => {
	for (const [how, tail] of [
		['app', 'set its kind to categories under Columns.'],
		['cli', 'run again with --type education=categorical.'],
		['report', 'declare it categorical and repeat the analysis.']
	] as const)
		it(`names the column and its codes (${how})`, () => {
			const text = categoryCodeNotice('education', [0, 1, 2, 3], how);
			expect(text.startsWith("Column 'education' holds only the whole numbers 0, 1, 2 and 3: it looks like category codes.")).toBe(true);
			expect(text).toContain('one straight-line term');
			expect(text).toContain('residual confounding');
			expect(text.endsWith(tail)).toBe(true);
		});
});

describe('stratified estimate and homogeneity', () => {
	const s = { by: 'levels' as const, strata: ['A', 'B', 'C'], n: 4526, oddsRatio: 1.1053, ci: [0.943, 1.2955] as [number, number], pValue: 0.2, homogeneity: { statistic: 18.83, df: 5, pValue: 0.0021, strataUsed: 6 }, homogeneityMessage: null };
	it('names the method and the interval', () => {
		expect(stratifiedText(s, 'Department')).toBe('Mantel–Haenszel OR 1.11 (95 % CI 0.943 to 1.3, Robins–Breslow–Greenland) over the 3 levels of Department, n = 4,526');
	});
	it('flags effect modification below α and says "little power" above it', () => {
		expect(homogeneityText(s, 0.05)).toBe(
			'Breslow–Day–Tarone X² = 18.8, 5 df, p = 0.0021: the odds ratio differs across the strata (effect modification on the odds-ratio scale); one pooled odds ratio summarises them poorly'
		);
		expect(homogeneityText({ ...s, homogeneity: { ...s.homogeneity, pValue: 0.3 } }, 0.05)).toMatch(/no evidence that the odds ratio differs .* little power/);
		expect(homogeneityText({ ...s, homogeneity: null, homogeneityMessage: 'The Breslow–Day test needs at least 2 strata' }, 0.05)).toBe(
			'Breslow–Day test not possible: The Breslow–Day test needs at least 2 strata'
		);
	});
});

describe('confounding vs non-collapsibility', () => {
	it('gives both steps with their numbers and says which is not bias', () => {
		const text = collapsibilitySentence({ marginalOddsRatio: { estimate: 0.6, ci: [0.5, 0.7] }, conditionalOddsRatio: 0.66, crudeOddsRatio: 0.5 })!;
		expect(text).toContain('crude 0.5 → standardized marginal 0.6 → conditional (the model\'s) 0.66');
		expect(text).toContain('crude to marginal (+20.0 %) is confounding removed by the set');
		expect(text).toContain('marginal to conditional (+10.0 %) is non-collapsibility');
		expect(text).toContain('not bias (Greenland, Robins & Pearl 1999)');
		expect(collapsibilitySentence({ marginalOddsRatio: { estimate: 0.6, ci: [0.5, 0.7] }, conditionalOddsRatio: 0.66, crudeOddsRatio: null })).toBeNull();
	});
	it('risk differences in percentage points, never in e-notation', () => {
		expect(riskDifferenceText({ estimate: -0.0880199, ci: [-0.11348, -0.062561] })).toBe('−8.8 percentage points (95 % CI −11.3 to −6.26)');
		expect(riskDifferenceText({ estimate: 0.0000123, ci: [-0.00001, 0.00003] })).not.toMatch(/e-/);
	});
});

describe('the two-way table as text cells', () => {
	const t: TwoWayTable = {
		rowVariable: 'female',
		colVariable: 'admitted',
		rowLevels: ['0', '1'],
		colLevels: ['0', '1'],
		counts: [
			[1493, 1198],
			[1278, 557]
		],
		rowProportions: [
			[1493 / 2691, 1198 / 2691],
			[1278 / 1835, 557 / 1835]
		],
		n: 4526,
		chiSquare: { statistic: 92.205, df: 1, pValue: 7.8e-22 },
		levelOddsRatios: {
			outcome: 'admitted',
			outcomeLevel: '1',
			variable: 'female',
			reference: { level: '0', n: 2691, events: 1198 },
			levels: [{ level: '1', oddsRatio: 0.5432, ci: [0.4792, 0.6156], pValue: 1e-20, n: 1835, events: 557 }],
			n: 4526,
			warnings: []
		},
		riskDifference: 557 / 1835 - 1198 / 2691,
		message: null
	};
	it('counts with row %, X² with df and p, odds ratios per level (UCBAdmissions by gender, counts from R)', () => {
		const cells = twoWayCells(t, (c) => (c === 'female' ? 'Female' : 'Admitted'));
		expect(cells.head).toEqual(['Female \\ Admitted', '0', '1', 'total']);
		expect(cells.rows).toEqual([
			['0', '1,493 (55 %)', '1,198 (45 %)', '2,691'],
			['1', '1,278 (70 %)', '557 (30 %)', '1,835']
		]);
		expect(chiSquareText(t)).toBe('Pearson X² = 92.2, 1 df, p < 0.001');
		expect(levelOddsRatioCells(t)!.rows).toEqual([['1 vs 0', '0.543', '0.479 to 0.616', '< 0.001']]);
	});
});

describe('the analysis code header', () => {
	it('states the set, sufficiency and how each column enters the model', () => {
		const lines = codeHeaderLines({
			language: 'r',
			software: 'Causeway 0.1.0',
			diagramTitle: 'Demo',
			dataFile: 'demo.csv',
			roles: ['planned'],
			sufficient: false,
			exposure: { label: 'Cycling', column: 'cycling' },
			outcome: { label: 'Hypertension', column: 'hypertension' },
			model: 'logistic',
			columns: [
				{ column: 'hypertension', label: 'Hypertension', kind: 'binary', levels: ['0', '1'], codeValues: null, role: 'outcome' },
				{ column: 'cycling', label: 'Cycling', kind: 'binary', levels: ['0', '1'], codeValues: null, role: 'exposure' },
				{ column: 'education', label: 'Education', kind: 'continuous', levels: [], codeValues: [0, 1, 2, 3], role: 'covariate' }
			]
		});
		expect(lines[0]).toBe('R (glm) code made by Causeway 0.1.0 for the planned set {education}.');
		expect(lines).toContain('Under the diagram this set is NOT sufficient: if the diagram is right, the adjusted estimate stays biased.');
		expect(lines).toContain('  education (Education): continuous — values look like category codes 0, 1, 2 and 3; one straight-line term.');
		expect(lines.some((l) => /change its kind to categorical/.test(l))).toBe(true);
	});
});
