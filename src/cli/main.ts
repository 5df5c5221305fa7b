/**
 * The `causeway` command: a thin layer over src/lib/graph and src/lib/causal, so pipelines get
 * exactly the answers the app shows. `causeway JOB [VIEW] FILE… [options]`: the jobs and their
 * views are in jobs.ts, each view in src/cli/commands/<job>/<view>.ts. Contract (DESIGN.md):
 * `--json` prints one JSON object; exit 0 = done, 1 = negative verdict (`review`), 2 = bad
 * usage or bad input, with one line on stderr and no stack trace.
 */
import { generalHelp, jobHelp, spelling, VERSION } from './help';
import type { CliIo } from './io';
import { findJob, RENAMED, type Job, type View } from './jobs';
import { processIo } from './process-io';
import { failWith, runView } from './run-view';

export type { CliIo } from './io';
export { processIo };

/** What the words of a call name: a view to run on `args`, or a job whose help is asked for. */
type Call = { job: Job; view: View; args: readonly string[]; notice?: string } | { job: Job; help: true } | { error: string };

const HELP = new Set(['--help', '-h']);
/** A word that can only be a mistyped view, not a file: files have an extension or a folder. */
const BARE_WORD = /^[a-z]+(-[a-z]+)*$/;

function resolve(word: string, rest: readonly string[]): Call {
	if (Object.hasOwn(RENAMED, word)) {
		const renamed = RENAMED[word];
		const job = findJob(renamed.job) as Job;
		const view = job.views.find((v) => v.name === (renamed.view ?? '')) as View;
		const notice = `note: "causeway ${word}" is now "causeway ${spelling(job, view)}"; the old name goes in the next version`;
		return { job, view, args: renamed.args ? renamed.args(rest) : rest, notice };
	}
	const job = findJob(word);
	if (!job) return { error: `unknown job "${word}"; run "causeway --help" for the list` };
	if (job.views.length === 1) return { job, view: job.views[0], args: rest };
	const named = job.views.find((v) => v.name === rest[0]);
	if (named) return { job, view: named, args: rest.slice(1) };
	if (rest.some((a) => HELP.has(a))) return { job, help: true };
	if (rest.length > 1 && BARE_WORD.test(rest[0])) {
		return { error: `unknown view "${rest[0]}" of ${job.name}; its views: ${job.views.map((v) => v.name).join(', ')} (a file with that name: write ./${rest[0]})` };
	}
	return { job, view: job.views[0], args: rest };
}

export async function main(argv: readonly string[], io: CliIo): Promise<number> {
	const [word, ...rest] = argv;
	if (word === undefined) return failWith(io, 'no job given; run "causeway --help" for the list');
	if (HELP.has(word) || (word === 'help' && rest.length === 0)) {
		io.stdout(`${generalHelp()}\n`);
		return 0;
	}
	if (word === '--version' || word === '-V') {
		io.stdout(`${VERSION}\n`);
		return 0;
	}
	// "causeway help plan sets" is "causeway plan sets --help".
	const call = word === 'help' ? resolve(rest[0], [...rest.slice(1), '--help']) : resolve(word, rest);
	if ('error' in call) return failWith(io, call.error);
	if ('help' in call) {
		io.stdout(`${await jobHelp(call.job)}\n`);
		return 0;
	}
	const status = await runView(spelling(call.job, call.view), await call.view.load(), call.args, io);
	// Said after the output and never beside a failure, which stays the one line on stderr.
	if (call.notice && status !== 2) io.stderr(`causeway: ${call.notice}\n`);
	return status;
}
