/** The help texts: `causeway --help` lists the jobs, `causeway JOB --help` a job's views. */
import type { Job } from './jobs';
import { JOBS } from './jobs';

export const VERSION = '0.1.0';

/** "plan sets", or "compare" for a job of one view. */
export function spelling(job: Job, view: Job['views'][number]): string {
	return view.name ? `${job.name} ${view.name}` : job.name;
}

function viewWords(job: Job): string {
	return job.views.map((v, i) => (i === 0 ? `${v.name} (default)` : v.name)).join(', ');
}

export function generalHelp(): string {
	const width = Math.max(...JOBS.map((j) => j.name.length));
	const lines = JOBS.flatMap((j) => [`  ${j.name.padEnd(width)}  ${j.summary}`, ...(j.views.length > 1 ? [`  ${' '.repeat(width)}    views: ${viewWords(j)}`] : [])]);
	return `causeway ${VERSION} — causal diagrams for choosing and justifying adjustment sets

Usage: causeway JOB [VIEW] DIAGRAM [options]

DIAGRAM is a native JSON (.json) or DOT (.dot, .gv) file, or - for standard input.

Jobs:
${lines.join('\n')}

Options of every view: --json (one JSON object on stdout), --help.
Exit status: 0 done, 1 negative verdict (review), 2 bad usage or bad input.
Run "causeway JOB --help" for a job's views and "causeway JOB VIEW --help" for a view's options.

A diagram encodes assumptions; results are only as good as those assumptions. Causeway
supports, and does not replace, review by qualified epidemiologists or statisticians.`;
}

/** A job of several views: what it is for, its views, then the default view's own help. */
export async function jobHelp(job: Job): Promise<string> {
	const first = job.views[0];
	const command = await first.load();
	const width = Math.max(...job.views.map((v) => v.name.length));
	const views = job.views.map((v, i) => `  ${v.name.padEnd(width)}  ${i === 0 ? '(default) ' : ''}${v.summary}`).join('\n');
	return `Usage: causeway ${job.name} [VIEW] ${job.files} [options]

${job.about ?? ''}

Views:
${views}

Run "causeway ${job.name} VIEW --help" for a view's options. The default view, "causeway ${spelling(job, first)}":

Usage: ${command.usage}

${command.details}`;
}
