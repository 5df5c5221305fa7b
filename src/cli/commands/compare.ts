/** `causeway compare FIRST SECOND`: what changes between two diagrams of the same question. */
import type { Diagram } from '../../lib/graph/diagram';
import { compareDiagrams } from '../../lib/causal';
import { compareLines } from '../../lib/wording/command-line-review';
import { UsageError } from '../io';
import { readDiagramInput } from '../read-input';
import type { Command, Context } from '../command';

/** Same reading rules and limits as the other commands (read-input.ts). */
const readDiagram = (ctx: Context, path: string): Promise<Diagram> => readDiagramInput(ctx.io, path);

export const compare: Command = {
	usage: 'causeway compare FIRST SECOND [--json]',
	details: `Compares two diagrams (for example the authors' and a reviewer's). Variables are matched by
id, then by label (ignoring case, spaces, "_", "-" and "."), then id against label, then by
identical matched parents and children; the rest are added or removed. Lists arrows added,
removed and reversed, how the minimal sufficient sets change, and whether the first
diagram's planned set is sufficient under each diagram (the second is asked the first's
question).
  --json   {"renamed", "added", "removed", "arrowsAdded", "arrowsRemoved", "arrowsReversed", …,
           "sets": {"first", "second"}, "verdicts": {"planned", "first", "second", "notJudged"}}`,
	options: {},
	async run(ctx) {
		if (ctx.positionals.length !== 2) throw new UsageError(`${ctx.name} needs two diagram files (usage: ${compare.usage})`);
		const first = await readDiagram(ctx, ctx.positionals[0]);
		const second = await readDiagram(ctx, ctx.positionals[1]);
		const c = compareDiagrams(first, second);
		if (ctx.json) {
			ctx.printJson(c);
			return 0;
		}
		for (const line of compareLines(c)) ctx.print(line);
		return 0;
	}
};
