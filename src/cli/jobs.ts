/**
 * The command tree, organized around the jobs of someone planning or reviewing an
 * observational study: `causeway JOB [VIEW] FILE… [options]`. Each job answers one question
 * and offers views of it; the first view is the job's default, so `causeway plan d.json` is
 * `causeway plan sets d.json`. The summaries live here so that the help is printed without
 * loading any view's code; each view is its own module, loaded only when called (esbuild
 * splits every dynamic import into its own chunk, scripts/build-cli.mjs).
 */
import type { Command } from './command';

export interface View {
	name: string;
	summary: string;
	load: () => Promise<Command>;
}

export interface Job {
	name: string;
	/** One line for `causeway --help`. */
	summary: string;
	/** What a job of several views is for, atop `causeway JOB --help` (one view: its own help). */
	about?: string;
	/** The files its views read, for the usage line. */
	files: string;
	/** The first is the default; a job with one view has no view words. */
	views: readonly View[];
	/** Whether the job can end with exit status 1 (a negative verdict). */
	verdict?: true;
}

export const JOBS: readonly Job[] = [
	{
		name: 'plan',
		files: 'DIAGRAM',
		summary: 'what to adjust for',
		about: 'What to adjust for, to estimate the effect of the exposure(s) on the outcome(s).',
		views: [
			{ name: 'sets', summary: 'the minimal sufficient adjustment sets, the smallest and the efficiency-optimal one', load: async () => (await import('./commands/plan/sets')).sets },
			{ name: 'roles', summary: "each variable's role: confounder, mediator, collider, instrument-like…", load: async () => (await import('./commands/plan/roles')).roles },
			{ name: 'paths', summary: 'every exposure–outcome path: causal or non-causal, open or blocked under the planned set', load: async () => (await import('./commands/plan/paths')).paths },
			{ name: 'instruments', summary: 'conditional instruments for the exposure, each with its conditioning set', load: async () => (await import('./commands/plan/instruments')).instruments }
		]
	},
	{
		name: 'review',
		files: 'DIAGRAM',
		summary: 'judge a stated adjustment set (exit 1 when it is not sufficient)',
		about: "Judges a stated adjustment set (the file's planned set, or --adjust); exit status 1 when it\nis not sufficient.",
		verdict: true,
		views: [
			{ name: 'advice', summary: 'verdict, every reason, and the fixes: what to drop, add, or use instead', load: async () => (await import('./commands/review/advice')).advice },
			{ name: 'verdict', summary: 'verdict and reasons only; fast on diagrams of 100,000 variables', load: async () => (await import('./commands/review/verdict')).verdict },
			{ name: 'robustness', summary: 'which single change to the diagram would break the set', load: async () => (await import('./commands/review/robustness')).robustness }
		]
	},
	{
		name: 'compare',
		files: 'FIRST SECOND',
		summary: 'what changes between two diagrams: variables, arrows, sets, the verdict',
		views: [{ name: '', summary: '', load: async () => (await import('./commands/compare')).compare }]
	},
	{
		name: 'data',
		files: 'DIAGRAM DATA',
		summary: 'hold the diagram to data, estimate the effect, write the analysis code',
		about: 'Works with a data file (CSV or TSV, or a correlation or covariance matrix) beside the diagram.',
		views: [
			{ name: 'tests', summary: "the arrows and the implied independencies tested against the data", load: async () => (await import('./commands/data/tests')).tests },
			{ name: 'estimates', summary: 'crude and adjusted estimates for each sufficient set and the planned set', load: async () => (await import('./commands/data/estimates')).estimates },
			{ name: 'code', summary: 'analysis code (R, Stata, SAS, Python) for one adjustment set', load: async () => (await import('./commands/data/code')).code }
		]
	},
	{
		name: 'diagram',
		files: 'DIAGRAM',
		summary: 'what the diagram implies, whatever the question',
		about: 'What the diagram itself implies, whatever the exposure and outcome.',
		views: [
			{ name: 'claims', summary: 'the independencies between measured variables the diagram implies', load: async () => (await import('./commands/diagram/claims')).claims },
			{ name: 'separation', summary: 'whether two sets are d-separated given a third, with an open path when not', load: async () => (await import('./commands/diagram/separation')).separation }
		]
	},
	{
		name: 'export',
		files: 'DIAGRAM',
		summary: 'the diagram as JSON or DOT, the figure, tables or the protocol report',
		views: [{ name: '', summary: '', load: async () => (await import('./commands/export/export')).exportView }]
	}
];

/**
 * The verbs of version 0.1, kept for one version as hidden aliases: not in the help, and each
 * use says its new spelling on stderr. `review` and `export` kept their names. `convert` is
 * `export` (its format from -o's extension; "-o -" meant native JSON).
 */
export const RENAMED: Readonly<Record<string, { job: string; view?: string; args?: (rest: readonly string[]) => string[] }>> = {
	sets: { job: 'plan', view: 'sets' },
	roles: { job: 'plan', view: 'roles' },
	paths: { job: 'plan', view: 'paths' },
	instruments: { job: 'plan', view: 'instruments' },
	check: { job: 'review', view: 'verdict' },
	robust: { job: 'review', view: 'robustness' },
	diff: { job: 'compare' },
	test: { job: 'data', view: 'tests' },
	estimate: { job: 'data', view: 'estimates' },
	code: { job: 'data', view: 'code' },
	claims: { job: 'diagram', view: 'claims' },
	dsep: { job: 'diagram', view: 'separation' },
	convert: { job: 'export', args: convertArgs }
};

/** `convert IN -o -` wrote native JSON; `export` asks for the format when it cannot see one. */
function convertArgs(rest: readonly string[]): string[] {
	const named = rest.some((a) => a === '--to' || a === '--format' || a.startsWith('--to=') || a.startsWith('--format='));
	const o = rest.findIndex((a) => a === '-o' || a === '--output');
	const toStdout = (o >= 0 && rest[o + 1] === '-') || rest.includes('--output=-') || rest.includes('-o-');
	return named || !toStdout ? [...rest] : [...rest, '--format', 'json'];
}

export function findJob(name: string): Job | undefined {
	return JOBS.find((j) => j.name === name);
}
