/** `causeway diagram separation`: are two sets d-separated given a third, with an open path when not. */
import { dSeparation } from '../../../lib/causal';
import { arrowTest } from '../../../lib/wording/names';
import { separationLine } from '../../../lib/wording/command-line';
import type { Command } from '../../command';
import { UsageError } from '../../io';

export const separation: Command = {
	usage: 'causeway diagram separation DIAGRAM --from a,b --to c [--given e,f] [--json]',
	details: `Says whether the --from and --to variables are d-separated given the --given variables
(Pearl 1988), and when they are not, shows one open path.
  --from a,b     first set
  --to c         second set
  --given e,f    conditioning set (default none)
  --json         {"separated", "path"} ("path": one open path, or null when separated)`,
	options: { from: { type: 'string', multiple: true }, to: { type: 'string', multiple: true }, given: { type: 'string', multiple: true } },
	async run(ctx) {
		const from = ctx.list('from');
		const to = ctx.list('to');
		if (!from || from.length === 0) throw new UsageError(`${ctx.name} needs --from`);
		if (!to || to.length === 0) throw new UsageError(`${ctx.name} needs --to`);
		const d = await ctx.diagram();
		const given = ctx.list('given') ?? [];
		const r = dSeparation(d, from, to, given);
		if (ctx.json) {
			ctx.printJson({ separated: r.separated, path: r.path });
			return 0;
		}
		ctx.print(separationLine(from, to, given, r.separated ? null : (r.path ?? []), arrowTest(d.arrows)));
		return 0;
	}
};
