/** `causeway review robustness`: which single change to the diagram would break the planned set. */
import { planRobustness, setsRobustToAdditions } from '../../../lib/causal';
import { notSufficientToBeginWith, robustnessLines } from '../../../lib/wording/command-line-review';
import { QUESTION, QUESTION_HELP, type Command } from '../../command';

export const robustness: Command = {
	usage: 'causeway review robustness DIAGRAM [--adjust a,b] [--max N] [--exposure …] [--outcome …] [--json]',
	details: `Lists every single change to the assumptions that would make the planned set (--adjust,
else the file's) insufficient: adding one missing arrow (keeping the diagram acyclic),
reversing one arrow, or one planned variable turning out unmeasured. Deleting an arrow never
breaks a sufficient set, so none is listed. Changes are ranked by the length of the path they
would open (shorter first — a rule of thumb: short paths tend to carry more bias), measurement
changes last. Also lists the sufficient sets that survive every single added arrow, if any.
Exit status 1 when the planned set is not sufficient to begin with.
  --adjust a,b   the planned set, replacing the file's (use --adjust "" for none)
  --max N        print at most N changes (default 25; --json prints all)
${QUESTION_HELP}
  --json         {"applicable", "adjusted", "tried", "weaknesses", "robustSets", …}`,
	options: { ...QUESTION, adjust: { type: 'string', multiple: true }, max: { type: 'string' } },
	async run(ctx) {
		const d = await ctx.diagram();
		const max = ctx.count('max');
		const r = planRobustness(d, { ...ctx.question(), adjusted: ctx.list('adjust'), maxWitnesses: ctx.json ? max : (max ?? 25) });
		const robustSets = setsRobustToAdditions(d, ctx.question());
		if (ctx.json) {
			ctx.printJson({ ...r, weaknesses: max === undefined ? r.weaknesses : r.weaknesses.slice(0, max), robustSets });
			return r.applicable ? 0 : 1;
		}
		if (!r.applicable) {
			ctx.print(notSufficientToBeginWith(r.adjusted));
			return 1;
		}
		for (const line of robustnessLines(r, robustSets, d.arrows, max ?? 25)) ctx.print(line);
		return 0;
	}
};
