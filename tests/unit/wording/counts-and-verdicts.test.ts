/**
 * Counts, plurals and the sentences that carry them: our own thousands formatter (no
 * toLocaleString), the one plural rule, the reviewer's verdict with one or many open
 * non-causal paths, a weakness's path length, the quick verdict of `causeway review verdict`
 * and the E-value sentence shared by the app, the command line and the report.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { AdjustmentReview, PlanWeakness, ReviewReason } from '../../../src/lib/causal';
import {
	axisTickText,
	countText,
	dataChecksDoneText,
	dataSummaryText,
	droppableText,
	instrumentText,
	listedCountText,
	nearestChangeText,
	nearestText,
	notJudgedText,
	openedDiagramText,
	optimalAdviceText,
	eValueText,
	formatCount,
	formatNumber,
	groupThousands,
	idAsLabel,
	plural,
	reviewVerdict,
	weaknessWords
} from '../../../src/lib/wording';
import { problemText, quickVerdictLines } from '../../../src/lib/wording/command-line';
import { pathCountText, countBoundText } from '../../../src/lib/wording/paths';
import '../fast-check-seed';

const MINUS = '\u2212';

describe('our own thousands formatter', () => {
	it('groups the whole part by threes, as en-GB does', () => {
		expect(groupThousands(0)).toBe('0');
		expect(groupThousands(999)).toBe('999');
		expect(groupThousands(1000)).toBe('1,000');
		expect(groupThousands(1234567)).toBe('1,234,567');
		expect(groupThousands(250000)).toBe('250,000');
		expect(groupThousands(-1234)).toBe(`${MINUS}1,234`);
		expect(groupThousands(1234.5)).toBe('1,234.5');
		expect(groupThousands(NaN)).toBe('—');
		expect(formatCount(Infinity)).toBe('—');
	});

	it('never writes e-notation, even past 2^53 and 1e21', () => {
		expect(groupThousands(1e21)).toBe('1,000,000,000,000,000,000,000');
		expect(groupThousands(2 ** 60)).toBe('1,152,921,504,606,846,976');
	});

	it('agrees with toLocaleString("en-GB") on whole numbers (the format it replaces)', () => {
		// The reference is the runtime's ICU, used here only in the test.
		fc.assert(
			fc.property(fc.integer({ min: 0, max: Number.MAX_SAFE_INTEGER }), (n) => groupThousands(n) === n.toLocaleString('en-GB')),
			{ numRuns: 300 }
		);
	});

	it('formatNumber groups with it and keeps decimals of long numerals', () => {
		expect(formatNumber(1234.5678, 6)).toBe('1,234.57');
		expect(formatNumber(1.2e23)).toBe('> 1,000,000,000,000');
		expect(axisTickText(1e5)).toBe('100,000');
		expect(axisTickText(0.000123)).toBe('0.000123');
		expect(axisTickText(-0.5)).toBe(`${MINUS}0.5`);
	});
});

describe('one plural rule', () => {
	it('singular for exactly one, plural otherwise', () => {
		expect(plural(1, 'arrow')).toBe('arrow');
		expect(plural(0, 'arrow')).toBe('arrows');
		expect(plural(2, 'stratum', 'strata')).toBe('strata');
		expect(countText(1, 'arrow')).toBe('1 arrow');
		expect(countText(1500, 'arrow')).toBe('1,500 arrows');
	});

	it('path counts: "1 open non-causal path", bounds grouped', () => {
		expect(pathCountText({ count: 1, bound: 'exact' })).toBe('1 open non-causal path');
		expect(pathCountText({ count: 10000, bound: 'more-than' })).toBe('more than 10,000 open non-causal paths');
		expect(countBoundText({ count: 12345, bound: 'at-least' })).toBe('at least 12,345');
	});
});

const openPath = (path: string[]): ReviewReason => ({ kind: 'open-path', path, backDoor: true });

function review(reasons: ReviewReason[], truncated = false): AdjustmentReview {
	return {
		exposures: ['x'],
		outcomes: ['y'],
		adjusted: [],
		valid: false,
		identifiable: true,
		reasons,
		openPathsTruncated: truncated,
		droppable: [],
		minimalSubset: null,
		extension: ['c'],
		extensionBlockedBy: [],
		nearest: null
	};
}

describe("the reviewer's verdict agrees with its count", () => {
	it('one open path: "a non-causal path"; several: their number; a stopped listing: "at least"', () => {
		expect(reviewVerdict(review([openPath(['x', 'c', 'y'])]), idAsLabel)).toBe(
			'Adjusting for nothing is not sufficient to estimate the total effect of x on y: it leaves a non-causal path open.'
		);
		expect(reviewVerdict(review([openPath(['x', 'c', 'y']), openPath(['x', 'd', 'y'])]), idAsLabel)).toBe(
			'Adjusting for nothing is not sufficient to estimate the total effect of x on y: it leaves 2 non-causal paths open.'
		);
		expect(reviewVerdict(review([openPath(['x', 'c', 'y'])], true), idAsLabel)).toContain('it leaves at least 1 non-causal path open');
		const many = Array.from({ length: 50 }, (_, i) => openPath(['x', `c${i}`, 'y']));
		expect(reviewVerdict(review(many, true), idAsLabel)).toContain('it leaves at least 50 non-causal paths open');
	});

	it('a weakness without a witness states its length with the right noun', () => {
		const w = (length: number): PlanWeakness => ({ change: { kind: 'add-arrow', from: 'a', to: 'b' }, failure: 'open-path', length, witness: null });
		expect(weaknessWords(w(1), [], idAsLabel)).toBe('The plan depends on there being no arrow from a to b: otherwise a non-causal path of 1 arrow would open.');
		expect(weaknessWords(w(3), [], idAsLabel)).toContain('a non-causal path of 3 arrows would open');
	});
});

describe('the quick verdict of the command line', () => {
	const arrows = (a: string, b: string) =>
		(a === 'u1' && b === 'e') || (a === 'u1' && b === 'm') || (a === 'u2' && b === 'm') || (a === 'u2' && b === 'd') || (a === 'e' && b === 'k');
	it('a sufficient set: one line', () => {
		expect(quickVerdictLines({ adjusted: [], valid: true, problems: [] }, arrows)).toEqual(['Adjusting for { } is sufficient to estimate the total effect.']);
	});

	it('an insufficient set: the header, then each problem, a back-door path named as such', () => {
		const lines = quickVerdictLines(
			{
				adjusted: ['m', 'k'],
				valid: false,
				problems: [
					{ kind: 'open-path', path: ['e', 'u1', 'm', 'u2', 'd'] },
					{ kind: 'forbidden', variable: 'k', why: 'descendant-of-exposure' }
				]
			},
			arrows
		);
		expect(lines[0]).toBe('Adjusting for {m, k} is NOT sufficient to estimate the total effect:');
		expect(lines[1]).toBe('  - open back-door path: e ← u1 → m ← u2 → d');
		expect(lines[2]).toBe('  - k is caused by the exposure on the way to the outcome: adjusting for it can bias the estimate');
	});

	it('a non-causal path that leaves the exposure by an arrow out of it is not called back-door', () => {
		expect(problemText({ kind: 'open-path', path: ['e', 'k'] }, arrows)).toBe('open non-causal path: e → k');
	});
});

describe('the E-value sentence', () => {
	it('with and without the confidence limit', () => {
		expect(eValueText({ point: 1.8812, ciBound: 1.3411 })).toBe('E-value of the planned estimate: 1.88; for the CI limit nearer to no effect: 1.34');
		expect(eValueText({ point: 3.9, ciBound: null })).toBe('E-value of the planned estimate: 3.9');
		expect(eValueText({ point: 123456, ciBound: null })).not.toMatch(/e[+-]?\d/);
	});
});

describe('the Data section and the opened-diagram message count with their nouns', () => {
	it('"1 of 1 arrow", "0 of 3 claims", "1,000 variables"', () => {
		expect(dataChecksDoneText(1, 1, 0, 3, true)).toBe('Data checks done: 1 of 1 arrow supported, 0 of 3 claims contradicted, estimates ready.');
		expect(dataSummaryText(1, 1, 'pending')).toBe('1/1 arrow supported · claims…');
		expect(dataSummaryText(2, 3, 'not run')).toBe('2/3 arrows supported · claims not run');
		expect(dataSummaryText(3, 12, 1)).toBe('3/12 arrows supported · 1 contradicted');
		expect(openedDiagramText('chain.json', 1000, 999)).toBe('Opened chain.json: 1,000 variables, 999 arrows.');
		expect(openedDiagramText('one.json', 1, 0)).toBe('Opened one.json: 1 variable, 0 arrows.');
	});
});

describe("the reviewer's fixes, shared by causeway review and the Review section", () => {
	it('one droppable member is not "each of"', () => {
		expect(droppableText(['age'], idAsLabel)).toBe('age could be dropped without harm.');
		expect(droppableText(['age', 'diet'], idAsLabel)).toBe('Each of age and diet could be dropped alone without harm.');
		expect(droppableText([], idAsLabel)).toBe('No member can be dropped without losing sufficiency.');
	});

	it('the nearest set: what changes, and the scope of a stopped search with its noun', () => {
		const n = { set: ['age'], add: ['age'], drop: ['bmi', 'panel'], truncated: true, scanned: 1 };
		expect(nearestChangeText(n, idAsLabel)).toBe('add age; drop bmi and panel');
		expect(nearestText(n, idAsLabel)).toBe('Nearest minimal sufficient set: {age} (add age; drop bmi and panel) (among the first 1 minimal set).');
		expect(nearestChangeText({ add: [], drop: [] }, idAsLabel)).toBe('the stated set itself');
	});

	it('instruments and the efficiency-optimal set', () => {
		expect(instrumentText({ variable: 'distance', given: [] }, idAsLabel)).toBe('distance (no conditioning needed)');
		expect(instrumentText({ variable: 'distance', given: ['age', 'income'] }, idAsLabel)).toBe('distance, given age and income');
		expect(optimalAdviceText(['age'], false, idAsLabel)).toBe('Efficiency-optimal set (Henckel et al. 2022): {age}.');
		expect(optimalAdviceText([], false, idAsLabel)).toBe('Efficiency-optimal set (Henckel et al. 2022): { }.');
	});
});

describe('a comparison that cannot judge the planned set says why, in the right number', () => {
	it('one or several planned variables, or the question', () => {
		expect(notJudgedText({ why: 'planned-missing', ids: ['bmi'] }, idAsLabel)).toBe('planned variable not in the second diagram: bmi');
		expect(notJudgedText({ why: 'planned-missing', ids: ['bmi', 'age'] }, idAsLabel)).toBe('planned variables not in the second diagram: bmi and age');
		expect(notJudgedText({ why: 'question-missing', ids: ['y'] }, idAsLabel)).toBe('exposure or outcome not in the second diagram: y');
	});
});

describe('section summaries', () => {
	it('"1 claim", "12 paths", "1,000+ claims" when the listing stopped', () => {
		expect(listedCountText(1, false, 'claim')).toBe('1 claim');
		expect(listedCountText(12, false, 'path')).toBe('12 paths');
		expect(listedCountText(1000, true, 'claim')).toBe('1,000+ claims');
		expect(listedCountText(1, true, 'path')).toBe('1+ paths');
	});
});
