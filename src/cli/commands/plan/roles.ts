/** `causeway plan roles`: the role of each variable for the question. */
import { variableRoles } from '../../../lib/causal';
import { CLI_MAX_ROLES_WORK } from '../../../lib/limits';
import { adjustTogetherText, CONFOUNDER_UNDECIDED, countText, formatCount } from '../../../lib/wording';
import { ROLE_TEXT } from '../../../lib/wording/command-line';
import { QUESTION, QUESTION_HELP, type Command } from '../../command';
import { UsageError } from '../../io';

export const roles: Command = {
	usage: 'causeway plan roles DIAGRAM [--only a,b] [--exposure …] [--outcome …] [--json]',
	details: `Prints the role of each variable for the effect of the exposure(s) on the outcome(s):
confounder (a pre-exposure variable in some minimal sufficient adjustment set, VanderWeele &
Shpitser 2013), common cause, mediator, collider, descendant of exposure or outcome,
instrument-like, precision variable or unrelated (several may apply; a confounder that is
also a collider is printed with what it must be adjusted together with).
Each variable's collider test searches the whole diagram, so without --only the command
takes on at most ${formatCount(CLI_MAX_ROLES_WORK)} steps of variables × (variables + arrows), about 14,000
variables of average degree 4 (its limit); --only asks about chosen variables at any size.
  --only a,b     give the roles of these variables only
${QUESTION_HELP}
  --json         {"roles": [{"id", "roles", …}]}`,
	options: { ...QUESTION, only: { type: 'string', multiple: true } },
	async run(ctx) {
		const d = await ctx.diagram();
		const only = ctx.list('only');
		const n = d.variables.length;
		const work = n * (n + d.arrows.length);
		if (only === undefined && work > CLI_MAX_ROLES_WORK) {
			throw new UsageError(
				`${ctx.name} tests each variable with a search over the whole diagram: ${countText(n, 'variable')} × (${formatCount(n)} + ${countText(d.arrows.length, 'arrow')}) = ${countText(work, 'step')}, over the command's limit of ${formatCount(CLI_MAX_ROLES_WORK)} (about 20 s); give --only a,b for the roles of chosen variables`
			);
		}
		const list = variableRoles(d, { ...ctx.question(), only });
		if (ctx.json) {
			ctx.printJson({ roles: list });
			return 0;
		}
		const width = Math.max(...list.map((r) => r.id.length), 1);
		for (const r of list) {
			const undecided = r.confounderUndecided ? `; ${CONFOUNDER_UNDECIDED}` : '';
			ctx.print(`${r.id.padEnd(width)}  ${r.roles.map((x) => ROLE_TEXT[x]).join(', ')}${adjustTogetherText(r)}${undecided}`);
		}
		return 0;
	}
};
