/** `causeway compare FIRST SECOND`: what changes between two diagrams of the same question. */
import type { Diagram } from '../../lib/graph/diagram';
import { compareDiagrams } from '../../lib/causal';
import { setWords } from '../../lib/wording';
import { UsageError } from '../io';
import { readDiagramInput } from '../read-input';
import type { Command, Context } from '../command';

const id = (x: string) => x;

/** Same reading rules and limits as the other commands (read-input.ts). */
const readDiagram = (ctx: Context, path: string): Promise<Diagram> => readDiagramInput(ctx.io, path);

const arrowList = (arrows: readonly { from: string; to: string }[]) => arrows.map((a) => `${a.from} → ${a.to}`).join(', ');

export const compare: Command = {
	usage: 'causeway compare FIRST SECOND [--json]',
	details: `Compares two diagrams (for example the authors' and a reviewer's). Variables are matched by
id, then by label (ignoring case, spaces, "_", "-" and "."), then id against label, then by
identical matched parents and children; the rest are added or removed. Lists arrows added,
removed and reversed, how the minimal sufficient sets change, and whether the first
diagram's planned set is sufficient under each diagram (the second is asked the first's
question).
  --json   {"renamed", "added", "removed", "arrowsAdded", "arrowsRemoved", "arrowsReversed", …,
           "sets": {"first", "second"}, "verdicts"}`,
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
		const line = (label: string, items: string) => items && ctx.print(`${label}: ${items}`);
		line('Renamed', c.renamed.map((r) => (r.first === r.second ? `${r.first} (label "${r.firstLabel}" → "${r.secondLabel}")` : `${r.first} → ${r.second} (matched by ${r.how})`)).join(', '));
		line('Variables added', c.added.join(', '));
		line('Variables removed', c.removed.join(', '));
		line('Arrows added', arrowList(c.arrowsAdded));
		line('Arrows removed', arrowList(c.arrowsRemoved));
		line('Arrows reversed (now)', c.arrowsReversed.map((a) => `${a.to} → ${a.from}`).join(', '));
		line('Arrows of added variables', arrowList(c.arrowsOfAdded));
		line('Arrows of removed variables', arrowList(c.arrowsOfRemoved));
		line('Measured status changed', c.measuredChanged.map((m) => `${m.id} now ${m.measured ? 'measured' : 'unmeasured'}`).join(', '));
		const sets = (s: string[][] | null) => (s === null ? 'not computed (no question)' : s.length === 0 ? 'none (not identifiable)' : s.map((x) => setWords(x, id)).join(', '));
		ctx.print(`Minimal sets, first: ${sets(c.sets.first)}`);
		ctx.print(`Minimal sets, second: ${sets(c.sets.second)}`);
		const v = c.verdicts;
		const verdict = (x: boolean | null) => (x === null ? 'not judged' : x ? 'sufficient' : 'NOT sufficient');
		ctx.print(`Planned set ${setWords(v.planned, id)}: ${verdict(v.first)} under the first, ${verdict(v.second)} under the second${v.note ? ` (${v.note})` : ''}.`);
		return 0;
	}
};
