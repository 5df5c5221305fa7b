/** `causeway plan instruments`: conditional instruments for the exposure, with their conditioning sets. */
import { conditionalInstruments } from '../../../lib/causal';
import { idAsLabel, instrumentText, REVIEW_FIX_TEXT } from '../../../lib/wording';
import { QUESTION, QUESTION_HELP, type Command } from '../../command';

export const instruments: Command = {
	usage: 'causeway plan instruments DIAGRAM [--exposure x] [--outcome y] [--json]',
	details: `Lists the measured variables that are instruments for the total effect of the (single)
exposure on the (single) outcome, each with a conditioning set: ancestral instruments found
with the nearest separator (van der Zander, Textor & Liśkiewicz, IJCAI 2015). An instrument
is an alternative to adjustment when confounding cannot be blocked; its validity rests on
the diagram, like everything else here.
${QUESTION_HELP}
  --json           {"instruments": [{"variable", "given"}]}`,
	options: { ...QUESTION },
	async run(ctx) {
		const d = await ctx.diagram();
		const list = conditionalInstruments(d, ctx.question());
		if (ctx.json) {
			ctx.printJson({ instruments: list });
			return 0;
		}
		if (list.length === 0) ctx.print(REVIEW_FIX_TEXT.noInstrument);
		for (const i of list) ctx.print(instrumentText(i, idAsLabel));
		return 0;
	}
};
