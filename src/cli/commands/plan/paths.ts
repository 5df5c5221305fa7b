/** `causeway plan paths`: every exposure–outcome path, causal or not, open or blocked under the planned set. */
import { exposureOutcomePaths } from '../../../lib/causal';
import { pathCountSentence } from '../../../lib/wording';
import { arrowTest } from '../../../lib/wording/names';
import { NO_PATH, pathLine, stoppedLine } from '../../../lib/wording/command-line';
import { QUESTION, QUESTION_HELP, type Command } from '../../command';

export const paths: Command = {
	usage: 'causeway plan paths DIAGRAM [--adjust a,b] [--max N] [--exposure …] [--outcome …] [--json]',
	details: `Lists every path between exposure and outcome (capped by --max, default 1000): a causal path,
a back-door path (a non-causal path that starts with an arrow into the exposure) or another
non-causal path; open or blocked under the planned set, and which variables block it or hold
it open. The open non-causal paths come first and are counted exactly up to 10,000 (the count
the app's Adjustment section gives); then causal paths, then blocked ones.
  --adjust a,b   the planned set, replacing the file's
  --max N        list at most N paths
${QUESTION_HELP}
  --json         {"paths": [{"nodes", "causal", "open", "reasons"}], "truncated", "openNonCausal"}`,
	options: { ...QUESTION, adjust: { type: 'string', multiple: true }, max: { type: 'string' } },
	async run(ctx) {
		const d = await ctx.diagram();
		const r = exposureOutcomePaths(d, { ...ctx.question(), adjusted: ctx.list('adjust'), max: ctx.count('max') });
		if (ctx.json) {
			ctx.printJson(r);
			return 0;
		}
		const arrows = arrowTest(d.arrows);
		for (const p of r.paths) ctx.print(pathLine(p, arrows));
		if (r.paths.length === 0) ctx.print(NO_PATH);
		else ctx.print(pathCountSentence(r.openNonCausal));
		if (r.truncated) ctx.print(stoppedLine(r.paths.length, 'path', '--max'));
		return 0;
	}
};
