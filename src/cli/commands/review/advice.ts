/**
 * `causeway review [advice]` (the review's default view): a reviewer's verdict on a stated
 * adjustment set, with every reason and the fixes.
 */
import { efficiencyAdvice, reviewAdjustment } from '../../../lib/causal';
import { arrowTest, unmeasuredQuestionNote } from '../../../lib/wording';
import { adviceLines } from '../../../lib/wording/command-line-review';
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
		for (const line of adviceLines(r, efficiency, arrowTest(d.arrows), unmeasuredQuestionNote(d, id, r.exposures, r.outcomes))) ctx.print(line);
		return r.valid ? 0 : 1;
	}
};
