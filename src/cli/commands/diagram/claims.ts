/** `causeway diagram [claims]` (the diagram job's default view): the independencies the diagram implies. */
import { impliedClaims } from '../../../lib/causal';
import { CLI_MAX_CLAIM_PAIRS } from '../../../lib/limits';
import type { Command } from '../../command';
import { UsageError } from '../../io';
import { countText, formatCount } from '../../../lib/wording';
import { claimLine, NO_CLAIMS } from '../../../lib/wording/command-line';

export const claims: Command = {
	usage: 'causeway diagram [claims] DIAGRAM [--max N] [--json]',
	details: `For each pair of measured variables with no arrow between them, prints a minimal set of
measured variables given which the diagram says they are independent (d-separated), or says
that no measured set makes them independent. These are the diagram's testable claims
("causeway data tests" holds them to data). Without --max every pair is listed, up to
${formatCount(CLI_MAX_CLAIM_PAIRS)} pairs (about 3,160 variables); a larger diagram needs --max.
  --max N   list at most N claims
  --json    {"claims": [{"a", "b", "given"}]} ("given": null when no measured set separates them)`,
	options: { max: { type: 'string' } },
	async run(ctx) {
		const d = await ctx.diagram();
		const max = ctx.count('max');
		const n = d.variables.length;
		const pairs = (n * (n - 1)) / 2;
		if (max === undefined && pairs > CLI_MAX_CLAIM_PAIRS) {
			throw new UsageError(
				`${ctx.name} looks at every pair of variables: this diagram has ${countText(n, 'variable')}, so ${countText(pairs, 'pair')}, more than the ${formatCount(CLI_MAX_CLAIM_PAIRS)} the command goes through in full (its limit); give --max N to list the first N claims`
			);
		}
		const list = impliedClaims(d, { max });
		if (ctx.json) {
			ctx.printJson({ claims: list });
			return 0;
		}
		for (const c of list) ctx.print(claimLine(c));
		if (list.length === 0) ctx.print(NO_CLAIMS);
		return 0;
	}
};
