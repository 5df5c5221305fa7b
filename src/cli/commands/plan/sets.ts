/** `causeway plan sets` (the plan's default view): the minimal sufficient adjustment sets. */
import { adjustmentSets, type Effect } from '../../../lib/causal';
import { CLI_DEFAULT_LISTED_SETS } from '../../../lib/limits';
import { formatCount, optimalSetSentence, unmeasuredQuestionNote } from '../../../lib/wording';
import { braces, noteLine, setsHeader, stoppedLine } from '../../../lib/wording/command-line';
import { QUESTION, QUESTION_HELP, type Command } from '../../command';
import { UsageError } from '../../io';

export const sets: Command = {
	usage: 'causeway plan [sets] DIAGRAM [--effect total|direct] [--max N] [--exposure …] [--outcome …] [--json]',
	details: `Lists the minimal sufficient adjustment sets for the effect of the exposure(s) on the
outcome(s), by the adjustment criterion (Shpitser, VanderWeele & Robins 2010) in its
constructive form (van der Zander, Liśkiewicz & Textor 2019), using measured variables only.
Also prints a minimum-size set and the efficiency-optimal set O (Henckel, Perković &
Maathuis 2022) when it is made of measured variables. --effect direct lists the sets for the
direct effect by Pearl's single-door criterion (one exposure, one outcome).
  --effect total|direct   which effect (default total)
  --max N                 list at most N sets (default ${formatCount(CLI_DEFAULT_LISTED_SETS)}; the output states
                          the cap and says when more sets exist)
${QUESTION_HELP}
  --json                  {"exposures", "outcomes", "effect", "identifiable", "sets", "truncated",
                          "max", "optimal", "minimum"}`,
	options: { ...QUESTION, effect: { type: 'string' }, max: { type: 'string' } },
	async run(ctx) {
		const d = await ctx.diagram();
		const effect = ctx.values.effect ?? 'total';
		if (effect !== 'total' && effect !== 'direct') throw new UsageError(`--effect must be "total" or "direct", not "${String(effect)}"`);
		const max = ctx.count('max') ?? CLI_DEFAULT_LISTED_SETS;
		const r = adjustmentSets(d, { ...ctx.question(), effect: effect as Effect, max });
		if (ctx.json) {
			const { exposures, outcomes, identifiable, sets, truncated, optimal, minimum } = r;
			ctx.printJson({ exposures, outcomes, effect: r.effect, identifiable, sets, truncated, max, optimal, minimum });
			return 0;
		}
		ctx.print(setsHeader(r, max));
		if (!r.identifiable) return 0;
		for (const s of r.sets) ctx.print(`  ${braces(s)}`);
		if (r.truncated) ctx.print(`  ${stoppedLine(r.sets.length, 'set', `the cap, --max ${max}`)}`);
		if (r.minimum) ctx.print(`Smallest set: ${braces(r.minimum)}`);
		if (r.effect === 'total') ctx.print(optimalSetSentence(r, braces).replace(/\.$/, ''));
		const note = unmeasuredQuestionNote(d, (id) => id, r.exposures, r.outcomes);
		if (note) ctx.print(noteLine(note));
		return 0;
	}
};
