/**
 * The shared sentences: one wording for an idea in the app, the command line and the report
 * (issue: "one word per idea"). Non-causal paths are "non-causal" (open or blocked); only a
 * non-causal path that starts with an arrow into the exposure is a "back-door path" (Pearl
 * 1995); the empty set is "{ }"; counts agree with their nouns.
 */
import { describe, expect, it } from 'vitest';
import type { AdjustmentCheck, AdjustmentReview, PathInfo } from '../../../src/lib/causal';
import type { Diagram } from '../../../src/lib/graph/diagram';
import {
	arrowTest,
	claimSentence,
	countText,
	idAsLabel,
	labelLookup,
	pathKindWords,
	pathStatus,
	problemText,
	reasonWords,
	reviewVerdict,
	setText,
	unmeasuredQuestionNote,
	verdictSentence
} from '../../../src/lib/wording';
import { setsMarkdown } from '../../../src/lib/export/tables';
import { braces, pathLine, problemText as cliProblemText } from '../../../src/lib/wording/command-line';
import { diagramOf, M_BIAS, renamed, withArrows } from '../reference/published-diagrams';

// M-bias (reference/published-diagrams.ts) with a back door: x ← a → m ← b → y, x → y, and x ← c → y.
function diagram(): Diagram {
	const mBias = renamed(M_BIAS, { X: 'x', Y: 'y', A: 'a', B: 'b', M: 'm' });
	const labels = { x: 'Cycling', y: 'Hypertension', c: 'Age', a: 'A', b: 'B', m: 'Panel' };
	return diagramOf(withArrows(mBias, ['c->x', 'c->y'], 'a measured common cause c added (ours)'), { title: 't', labels });
}

describe('one word per idea', () => {
	const d = diagram();
	const label = labelLookup(d);
	const arrow = arrowTest(d.arrows);

	it('the empty set has one spelling, and sentences say what it means', () => {
		expect(setText([], label)).toBe('{ }');
		expect(braces([])).toBe('{ }');
		const none: AdjustmentCheck = {
			adjusted: [],
			valid: false,
			problems: [{ kind: 'open-path', path: ['x', 'c', 'y'] }],
			openPaths: { count: 1, bound: 'exact' }
		};
		expect(verdictSentence(none, label)).toBe('Adjusting for nothing is not sufficient: a non-causal path stays open.');
		expect(verdictSentence({ adjusted: [], valid: true, problems: [], openPaths: { count: 0, bound: 'exact' } }, label)).toMatch(/^No adjustment is needed/);
		expect(verdictSentence(none, label)).not.toMatch(/no adjustment needed/);
		// While the paths are still being counted, a lower bound says so; an exact count does not.
		const many = { adjusted: [], valid: false, problems: [], openPaths: { count: 50, bound: 'more-than' as const } };
		expect(verdictSentence(many, label, true)).toBe('Adjusting for nothing is not sufficient: more than 50 non-causal paths stay open (still counting the paths).');
		expect(verdictSentence(many, label, false)).toBe('Adjusting for nothing is not sufficient: more than 50 non-causal paths stay open.');
		expect(verdictSentence(none, label, true)).toBe(verdictSentence(none, label));
	});

	it('paths: causal, back-door (into the exposure) or non-causal; never "biasing"', () => {
		const causal: PathInfo = { nodes: ['x', 'y'], causal: true, open: true, reasons: [] };
		const backDoor: PathInfo = { nodes: ['x', 'c', 'y'], causal: false, open: false, reasons: [{ node: 'c', reason: 'adjusted-non-collider' }] };
		const throughCollider: PathInfo = { nodes: ['x', 'a', 'm', 'b', 'y'], causal: false, open: true, reasons: [{ node: 'm', reason: 'collider-adjusted' }] };
		expect(pathKindWords(causal, arrow)).toBe('causal path');
		expect(pathKindWords(backDoor, arrow)).toBe('back-door path');
		expect(pathStatus(backDoor, label)).toBe('blocked at Age (adjusted for, not a collider)');
		expect(pathStatus(throughCollider, label)).toBe('open through Panel (a collider, adjusted for)');
		expect(pathLine(throughCollider, arrow)).toBe('x ← a → m ← b → y   [back-door path, open through m (a collider, adjusted for)]');
		const forward: PathInfo = { nodes: ['x', 'm', 'y'], causal: false, open: true, reasons: [] };
		expect(pathKindWords(forward, (u, v) => (u === 'x' && v === 'm') || (u === 'y' && v === 'm'))).toBe('non-causal path');
	});

	it('the command line and the app give the same reason for a forbidden variable', () => {
		const p = { kind: 'forbidden' as const, variable: 'm', why: 'mediator' as const };
		const app = problemText(p, d, idAsLabel);
		expect(app).toBe(`${cliProblemText(p, arrow)}.`);
		expect(app).toContain('adjusting for it removes part of the effect being estimated');
		const review = reasonWords({ kind: 'overadjustment', variable: 'm', why: 'mediator' }, arrow, idAsLabel);
		expect(review).toContain('adjusting for it removes part of the effect being estimated');
	});

	it('the reviewer says "not sufficient" in the same words', () => {
		const review: AdjustmentReview = {
			exposures: ['x'],
			outcomes: ['y'],
			adjusted: ['m'],
			valid: false,
			identifiable: true,
			reasons: [{ kind: 'open-path', path: ['x', 'a', 'm', 'b', 'y'], backDoor: true }],
			openPathsTruncated: false,
			droppable: [],
			minimalSubset: null,
			extension: ['c'],
			extensionBlockedBy: [],
			nearest: null
		};
		const words = reviewVerdict(review, label);
		expect(words).toBe('Adjusting for Panel is not sufficient to estimate the total effect of Cycling on Hypertension: it leaves a non-causal path open.');
	});

	it('counts agree with their nouns and group thousands', () => {
		expect(countText(1, 'claim')).toBe('1 claim');
		expect(countText(0, 'claim')).toBe('0 claims');
		expect(countText(1000, 'variable')).toBe('1,000 variables');
		expect(countText(2, 'analysis', 'analyses')).toBe('2 analyses');
	});

	it('claims: one sentence for a pair that no measured set separates', () => {
		expect(claimSentence({ a: 'a', b: 'b', given: null }, label)).toBe('A and B are not adjacent, but no set of measured variables makes them independent.');
		expect(claimSentence({ a: 'a', b: 'c', given: ['x', 'y'] }, label)).toBe('A is independent of Age given Cycling and Hypertension.');
	});
});

describe('contradictions and silence', () => {
	it('an exposure or outcome marked unmeasured gets a word beside the verdict', () => {
		const d = diagram();
		expect(unmeasuredQuestionNote(d, labelLookup(d))).toBeNull();
		d.variables = d.variables.map((v) => (v.id === 'x' ? { ...v, measured: false } : v));
		expect(unmeasuredQuestionNote(d, labelLookup(d))).toBe(
			'Cycling (the exposure) is marked unmeasured: the adjustment sets hold for the diagram, but the effect cannot be estimated from data without it.'
		);
		d.variables = d.variables.map((v) => (v.id === 'y' ? { ...v, measured: false } : v));
		expect(unmeasuredQuestionNote(d, labelLookup(d))).toBe(
			'Cycling (the exposure) and Hypertension (the outcome) are marked unmeasured: the adjustment sets hold for the diagram, but the effect cannot be estimated from data without them.'
		);
	});

	it('an empty planned set that is not sufficient is not called "no adjustment needed" in the sets table', () => {
		const d = diagram();
		const check: AdjustmentCheck = { adjusted: [], valid: false, problems: [{ kind: 'open-path', path: ['x', 'c', 'y'] }], openPaths: { count: 1, bound: 'exact' } };
		const md = setsMarkdown(d, { sets: { effect: 'total', exposures: ['x'], outcomes: ['y'], identifiable: true, sets: [['c']], truncated: false, minimum: ['c'], optimal: null } as never, check });
		expect(md).toContain('| Planned set | { } (nothing adjusted for) | 0 | no |');
		expect(md).not.toContain('no adjustment needed) | 0 | no');
		const none = setsMarkdown(d, { sets: { effect: 'total', exposures: ['x'], outcomes: ['y'], identifiable: true, sets: [[]], truncated: false, minimum: [], optimal: null } as never, check: { ...check, valid: true, problems: [], openPaths: { count: 0, bound: 'exact' } } });
		expect(none).toContain('| Planned set | (none: no adjustment needed) | 0 | yes |');
	});
});
