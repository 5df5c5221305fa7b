/**
 * `causeway review [advice]` (the review's default view): a reviewer's verdict on a stated
 * adjustment set, with every reason and the fixes.
 */
import { efficiencyAdvice, reviewAdjustment } from '../../../lib/causal';
import { arrowTest, reasonWords, reviewVerdict, setWords, unmeasuredQuestionNote } from '../../../lib/wording';
import { QUESTION, QUESTION_HELP, type Command } from '../../command';

const id = (x: string) => x;

export const advice: Command = {
	usage: 'causeway review [advice] DIAGRAM [--adjust a,b] [--exposure …] [--outcome …] [--json]',
	details: `Reviews the set a paper adjusted for (--adjust, else the file's planned set) for the total
effect, by the adjustment criterion (Shpitser, VanderWeele & Robins 2010). Prints the verdict
in plain words with every reason — open non-causal paths (a back-door path when it starts
with an arrow into the exposure), overadjustment
(an adjusted mediator or its descendant), collider bias (an adjusted collider or its
descendant), an adjusted descendant of the outcome — and then: the members that could each be
dropped, the smallest set of variables to add (if any superset is valid), the nearest minimal
sufficient set (fewest variables added plus dropped), and efficiency advice (Henckel,
Perković & Maathuis 2022). Exit status 1 when the stated set is not sufficient.
  --adjust a,b     the stated set, replacing the file's (use --adjust "" for none)
${QUESTION_HELP}
  --json           {"adjusted", "valid", "reasons", "droppable", "extension", "nearest", …,
                   "efficiency"}`,
	options: { ...QUESTION, adjust: { type: 'string', multiple: true } },
	async run(ctx) {
		const d = await ctx.diagram();
		const opts = { ...ctx.question(), adjusted: ctx.list('adjust') };
		const r = reviewAdjustment(d, opts);
		const efficiency = efficiencyAdvice(d, opts);
		if (ctx.json) {
			ctx.printJson({ ...r, efficiency: { add: efficiency.add, drop: efficiency.drop, optimal: efficiency.optimal, plannedIsOptimal: efficiency.plannedIsOptimal } });
			return r.valid ? 0 : 1;
		}
		const arrows = arrowTest(d.arrows);
		ctx.print(reviewVerdict(r, id));
		for (const reason of r.reasons) ctx.print(`  - ${reasonWords(reason, arrows, id)}`);
		if (r.openPathsTruncated) ctx.print('  - … more open paths exist than are listed');
		const note = unmeasuredQuestionNote(d, id, r.exposures, r.outcomes);
		if (note) ctx.print(`Note: ${note}`);
		if (r.valid) {
			if (r.droppable.length > 0) ctx.print(`Could be dropped one at a time without harm: ${r.droppable.join(', ')}.`);
			if (r.minimalSubset && r.minimalSubset.length < r.adjusted.length) ctx.print(`A minimal sufficient set inside it: ${setWords(r.minimalSubset, id)}.`);
		} else if (r.extension) {
			ctx.print(`Smallest addition that makes it sufficient: ${setWords(r.extension, id)}.`);
		} else if (r.extensionBlockedBy.length > 0) {
			ctx.print(`No addition can make it sufficient while it contains ${r.extensionBlockedBy.join(', ')}.`);
		} else {
			ctx.print('No addition of measured variables makes it sufficient.');
		}
		if (r.nearest) {
			const n = r.nearest;
			const change = [n.add.length ? `add ${n.add.join(', ')}` : '', n.drop.length ? `drop ${n.drop.join(', ')}` : ''].filter(Boolean).join('; ');
			ctx.print(`Nearest minimal sufficient set: ${setWords(n.set, id)}${change ? ` (${change})` : ' (the stated set itself)'}${n.truncated ? ` — among the first ${n.scanned} minimal sets` : ''}.`);
		} else {
			ctx.print('No set of measured variables is sufficient under this diagram.');
		}
		if (efficiency.applicable) {
			for (const a of efficiency.add) if (a.helps) ctx.print(`Precision: adding ${a.variable} keeps the set sufficient and should narrow the confidence interval.`);
			for (const x of efficiency.drop) if (x.helps) ctx.print(`Instrument-like: ${x.variable} only explains the exposure given the rest; dropping it should narrow the interval (and adjusting for it can amplify residual confounding bias).`);
			if (efficiency.optimal) ctx.print(efficiency.plannedIsOptimal ? 'This is the efficiency-optimal set (Henckel et al. 2022).' : `Efficiency-optimal set (Henckel et al. 2022): ${setWords(efficiency.optimal, id)}.`);
		}
		return r.valid ? 0 : 1;
	}
};
