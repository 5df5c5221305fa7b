/**
 * The text of `causeway review` (advice, robustness) and `causeway compare`: the reviewer's
 * shared sentences (review.ts, review-fixes.ts) laid out as the command's lines, variables
 * named by their ids. The commands print these lines as they are. O(size of the results).
 */
import type { AdjustmentReview, DiagramComparison, EfficiencyAdvice, PlanRobustness, RobustSets } from '../causal';
import { braces, noteLine } from './command-line';
import { countText, idAsLabel, type ArrowTest } from './names';
import { reasonWords, reviewVerdict, weaknessWords } from './review';
import {
	droppableText,
	extensionBlockedText,
	extensionText,
	instrumentLikeAdviceText,
	minimalSubsetText,
	nearestText,
	notJudgedText,
	optimalAdviceText,
	precisionAdviceText,
	REVIEW_FIX_TEXT
} from './review-fixes';

const id = idAsLabel;

/** `causeway review advice`: the verdict, every reason, an optional note, the fixes and the efficiency advice. */
export function adviceLines(r: AdjustmentReview, efficiency: EfficiencyAdvice, arrows: ArrowTest, note: string | null): string[] {
	const lines = [reviewVerdict(r, id), ...r.reasons.map((reason) => `  - ${reasonWords(reason, arrows, id)}`)];
	if (r.openPathsTruncated) lines.push(`  - ${REVIEW_FIX_TEXT.moreOpenPaths}`);
	if (note) lines.push(noteLine(note));
	if (r.valid) {
		if (r.droppable.length > 0) lines.push(droppableText(r.droppable, id));
		if (r.minimalSubset && r.minimalSubset.length < r.adjusted.length) lines.push(minimalSubsetText(r.minimalSubset, id));
	} else if (r.extension) lines.push(extensionText(r.extension, id));
	else if (r.extensionBlockedBy.length > 0) lines.push(extensionBlockedText(r.extensionBlockedBy, id));
	else lines.push(REVIEW_FIX_TEXT.noExtension);
	lines.push(r.nearest ? nearestText(r.nearest, id) : REVIEW_FIX_TEXT.noSufficientSet);
	if (efficiency.applicable) {
		for (const a of efficiency.add) if (a.helps) lines.push(precisionAdviceText(a.variable, id));
		for (const x of efficiency.drop) if (x.helps) lines.push(instrumentLikeAdviceText(x.variable, id));
		lines.push(optimalAdviceText(efficiency.optimal, efficiency.plannedIsOptimal, id));
	}
	return lines;
}

/** `causeway review robustness` when the planned set is sufficient: what was tried, what breaks it, which sets survive. */
export function robustnessLines(r: PlanRobustness, robust: RobustSets, arrows: readonly { from: string; to: string }[], max: number): string[] {
	const t = r.tried;
	const lines = [
		`Planned set ${braces(r.adjusted)}: tried ${countText(t.additions, 'added arrow')}, ${countText(t.reversals, 'reversal')} and ${countText(t.unmeasured, 'unmeasured variable')} (${countText(t.deletions, 'deletion')} cannot break it).`
	];
	const structural = r.weaknesses.filter((w) => w.failure !== 'unmeasured').length;
	lines.push(structural === 0 ? 'No single added or reversed arrow breaks it.' : `${countText(structural, 'single arrow change')} would break it, most direct first:`);
	const shown = r.weaknesses.slice(0, max);
	for (const w of shown) lines.push(`  - ${weaknessWords(w, arrows, id)}`);
	if (shown.length < r.weaknesses.length) lines.push(`  … ${countText(r.weaknesses.length - shown.length, 'more change')} (--max, or --json for all)`);
	const how = robust.exhaustive ? 'among all sets' : `among ${countText(robust.tried, 'candidate set')} (minimal, optimal, largest)`;
	lines.push(
		robust.sets.length === 0
			? `No sufficient set survives every single added arrow (${how}).`
			: `Sufficient sets that survive every single added arrow (${how}): ${robust.sets.map((s) => braces(s)).join(', ')}`
	);
	return lines;
}

/** Said when robustness is asked of a set that is not sufficient to begin with. */
export function notSufficientToBeginWith(adjusted: readonly string[]): string {
	return `Adjusting for ${braces(adjusted)} is not sufficient to begin with; run "causeway review" first.`;
}

const arrowList = (arrows: readonly { from: string; to: string }[]) => arrows.map((a) => `${a.from} → ${a.to}`).join(', ');

/** `causeway compare`: one line per kind of difference that exists, then the sets and the verdicts. */
export function compareLines(c: DiagramComparison): string[] {
	const lines: string[] = [];
	const line = (label: string, items: string) => items && lines.push(`${label}: ${items}`);
	line('Renamed', c.renamed.map((r) => (r.first === r.second ? `${r.first} (label "${r.firstLabel}" → "${r.secondLabel}")` : `${r.first} → ${r.second} (matched by ${r.how})`)).join(', '));
	line('Variables added', c.added.join(', '));
	line('Variables removed', c.removed.join(', '));
	line('Arrows added', arrowList(c.arrowsAdded));
	line('Arrows removed', arrowList(c.arrowsRemoved));
	line('Arrows reversed (now)', c.arrowsReversed.map((a) => `${a.to} → ${a.from}`).join(', '));
	line('Arrows of added variables', arrowList(c.arrowsOfAdded));
	line('Arrows of removed variables', arrowList(c.arrowsOfRemoved));
	line('Measured status changed', c.measuredChanged.map((m) => `${m.id} now ${m.measured ? 'measured' : 'unmeasured'}`).join(', '));
	const sets = (s: string[][] | null) => (s === null ? 'not computed (no question)' : s.length === 0 ? 'none (not identifiable)' : s.map((x) => braces(x)).join(', '));
	lines.push(`Minimal sets, first: ${sets(c.sets.first)}`, `Minimal sets, second: ${sets(c.sets.second)}`);
	const v = c.verdicts;
	const verdict = (x: boolean | null) => (x === null ? 'not judged' : x ? 'sufficient' : 'NOT sufficient');
	lines.push(`Planned set ${braces(v.planned)}: ${verdict(v.first)} under the first, ${verdict(v.second)} under the second${v.notJudged ? ` (${notJudgedText(v.notJudged, id)})` : ''}.`);
	return lines;
}
