/** `causeway review verdict`: is the planned set sufficient, and every reason when it is not (exit 1). */
import { checkFirst } from '../../../lib/causal';
import { unmeasuredQuestionNote } from '../../../lib/wording/adjustment';
import { arrowTest } from '../../../lib/wording/names';
import { noteLine, quickVerdictLines } from '../../../lib/wording/command-line';
import { QUESTION, QUESTION_HELP, type Command } from '../../command';

export const verdict: Command = {
	usage: 'causeway review verdict DIAGRAM [--adjust a,b] [--exposure …] [--outcome …] [--json]',
	details: `Says whether the planned set (the file's "adjusted" list, or --adjust) is a sufficient
adjustment set for the total effect, and gives every reason when it is not: each forbidden
variable (mediator, descendant of a mediator or of the outcome, unmeasured…) and each
non-causal path left open (a back-door path when it starts with an arrow into the exposure).
The quick form of "causeway review": no fixes, so it answers diagrams of 100,000 variables in
seconds. Exit status 1 when the set is not sufficient.
  --adjust a,b     the planned set, replacing the file's (use --adjust "" for none)
${QUESTION_HELP}
  --json           {"adjusted", "valid", "problems": [{"kind": "open-path", "path"} |
                   {"kind": "forbidden", "variable", "why"}]}`,
	options: { ...QUESTION, adjust: { type: 'string', multiple: true } },
	async run(ctx) {
		const d = await ctx.diagram();
		// The reasons list at most 50 open paths and the count is not printed, so the search
		// stops there (`causeway plan paths` counts them): on 100,000 variables counting to
		// 10,000 took 25 s.
		const r = checkFirst(d, { ...ctx.question(), adjusted: ctx.list('adjust') });
		if (ctx.json) {
			ctx.printJson({ adjusted: r.adjusted, valid: r.valid, problems: r.problems });
		} else {
			for (const line of quickVerdictLines(r, arrowTest(d.arrows))) ctx.print(line);
			const q = ctx.question();
			const note = unmeasuredQuestionNote(d, (id) => id, q.exposures ?? d.exposures, q.outcomes ?? d.outcomes);
			if (note) ctx.print(noteLine(note));
		}
		return r.valid ? 0 : 1;
	}
};
