/**
 * The `causeway` command: a thin layer over src/lib/graph and src/lib/causal, so pipelines get
 * exactly the answers the app shows. Contract (DESIGN.md): `--json` prints one JSON object;
 * exit 0 = done, 1 = negative verdict (`check`), 2 = bad usage or bad input, with one line on
 * stderr and no stack trace.
 */
import { adjustTogetherText, CONFOUNDER_UNDECIDED, optimalSetSentence, pathCountSentence } from '../lib/wording';
import { writeFile } from 'node:fs/promises';
import { parseArgs } from 'node:util';
import type { Diagram } from '../lib/graph/diagram';
import { InputError } from '../lib/graph/errors';
import { writeDiagramJson } from '../lib/graph/native-json';
import {
	adjustmentSets,
	checkFirst,
	dSeparation,
	exposureOutcomePaths,
	impliedClaims,
	variableRoles
} from '../lib/causal';
import type { Effect } from '../lib/causal';
import { OutputError, UsageError, type CliIo } from './io';
import { readDiagramInput } from './read-input';
import { processIo, writeFailure } from './process-io';
import { COMMON, QUESTION, QUESTION_HELP, type Command, type Context, type Values } from './command';
import { CLI_DEFAULT_LISTED_SETS, CLI_MAX_CLAIM_PAIRS, CLI_MAX_ROLES_WORK, describeCount } from '../lib/limits';
import { braces, pathText, problemText, reasonText, ROLE_TEXT } from '../lib/wording/command-line';
import { SUMMARY, type LazyName } from './summaries';

export type { CliIo } from './io';
export { processIo };

const VERSION = '0.1.0';

function arrowLookup(d: Diagram): (a: string, b: string) => boolean {
	const arrows = new Set(d.arrows.map((a) => `${a.from}\u0000${a.to}`));
	return (a, b) => arrows.has(`${a}\u0000${b}`);
}

const commands: Record<string, Command> = {
	sets: {
		summary: 'list every minimal sufficient adjustment set',
		usage: 'causeway sets DIAGRAM [--effect total|direct] [--max N] [--exposure …] [--outcome …] [--json]',
		details: `Lists the minimal sufficient adjustment sets for the effect of the exposure(s) on the
outcome(s), by the adjustment criterion (Shpitser, VanderWeele & Robins 2010) in its
constructive form (van der Zander, Liśkiewicz & Textor 2019), using measured variables only.
Also prints a minimum-size set and the efficiency-optimal set O (Henckel, Perković &
Maathuis 2022) when it is made of measured variables. --effect direct lists the sets for the
direct effect by Pearl's single-door criterion (one exposure, one outcome).
  --effect total|direct   which effect (default total)
  --max N                 list at most N sets (default ${describeCount(CLI_DEFAULT_LISTED_SETS)}; the output states
                          the cap and says when more sets exist)
${QUESTION_HELP}`,
		options: { ...QUESTION, effect: { type: 'string' }, max: { type: 'string' } },
		async run(ctx) {
			const d = await ctx.diagram();
			const effect = ctx.values.effect ?? 'total';
			if (effect !== 'total' && effect !== 'direct') throw new UsageError(`--effect must be "total" or "direct", not "${String(effect)}"`);
			const max = ctx.count('max') ?? CLI_DEFAULT_LISTED_SETS;
			const r = adjustmentSets(d, { ...ctx.question(), effect: effect as Effect, max });
			if (ctx.json) {
				ctx.printJson({
					exposures: r.exposures,
					outcomes: r.outcomes,
					effect: r.effect,
					identifiable: r.identifiable,
					sets: r.sets,
					truncated: r.truncated,
					max,
					optimal: r.optimal,
					minimum: r.minimum
				});
				return 0;
			}
			const what = `${r.effect} effect of ${r.exposures.join(', ')} on ${r.outcomes.join(', ')}`;
			if (!r.identifiable) {
				ctx.print(`The ${what} cannot be identified by adjustment: no set of measured variables is sufficient.`);
				return 0;
			}
			ctx.print(`Minimal sufficient adjustment sets for the ${what} (at most ${describeCount(max)} listed; --max N to change):`);
			for (const s of r.sets) ctx.print(`  ${braces(s)}`);
			if (r.truncated) ctx.print(`  … stopped after ${r.sets.length} sets (the cap, --max ${max}); more exist`);
			if (r.minimum) ctx.print(`Smallest set: ${braces(r.minimum)}`);
			if (r.effect === 'total') ctx.print(optimalSetSentence(r, braces).replace(/\.$/, ''));
			return 0;
		}
	},
	check: {
		summary: 'judge a planned adjustment set (exit 1 when it is not sufficient)',
		usage: 'causeway check DIAGRAM [--adjust a,b] [--exposure …] [--outcome …] [--json]',
		details: `Says whether the planned set (the file's "adjusted" list, or --adjust) is a sufficient
adjustment set for the total effect, and gives every reason when it is not: each forbidden
variable (mediator, descendant of a mediator or of the outcome, unmeasured…) and each
non-causal path left open. Exit status 1 when the set is not sufficient.
  --adjust a,b     the planned set, replacing the file's (use --adjust "" for none)
${QUESTION_HELP}`,
		options: { ...QUESTION, adjust: { type: 'string', multiple: true } },
		async run(ctx) {
			const d = await ctx.diagram();
			// The reasons list at most 50 open paths and the count is not printed, so the search
			// stops there (`causeway paths` counts them): on 100,000 variables counting to 10,000
			// took 25 s.
			const r = checkFirst(d, { ...ctx.question(), adjusted: ctx.list('adjust') });
			if (ctx.json) {
				ctx.printJson({ adjusted: r.adjusted, valid: r.valid, problems: r.problems });
			} else {
				ctx.print(
					r.valid
						? `Adjusting for ${braces(r.adjusted)} is sufficient to estimate the total effect.`
						: `Adjusting for ${braces(r.adjusted)} is NOT sufficient to estimate the total effect:`
				);
				const arrows = arrowLookup(d);
				for (const p of r.problems) ctx.print(`  - ${problemText(p, arrows)}`);
			}
			return r.valid ? 0 : 1;
		}
	},
	dsep: {
		summary: 'test d-separation of two sets given a third',
		usage: 'causeway dsep DIAGRAM --from a,b --to c [--given e,f] [--json]',
		details: `Says whether the --from and --to variables are d-separated given the --given variables
(Pearl 1988), and when they are not, shows one open path.
  --from a,b     first set
  --to c         second set
  --given e,f    conditioning set (default none)`,
		options: { from: { type: 'string', multiple: true }, to: { type: 'string', multiple: true }, given: { type: 'string', multiple: true } },
		async run(ctx) {
			const from = ctx.list('from');
			const to = ctx.list('to');
			if (!from || from.length === 0) throw new UsageError('dsep needs --from');
			if (!to || to.length === 0) throw new UsageError('dsep needs --to');
			const d = await ctx.diagram();
			const given = ctx.list('given') ?? [];
			const r = dSeparation(d, from, to, given);
			if (ctx.json) ctx.printJson({ separated: r.separated, path: r.path });
			else if (r.separated) ctx.print(`${braces(from)} and ${braces(to)} are d-separated given ${given.length ? braces(given) : 'nothing'}.`);
			else ctx.print(`${braces(from)} and ${braces(to)} are d-connected given ${given.length ? braces(given) : 'nothing'}; open path: ${pathText(r.path ?? [], arrowLookup(d))}`);
			return 0;
		}
	},
	paths: {
		summary: 'list exposure–outcome paths with their status',
		usage: 'causeway paths DIAGRAM [--adjust a,b] [--max N] [--exposure …] [--outcome …] [--json]',
		details: `Lists every path between exposure and outcome (capped by --max, default 1000): causal or
not, open or blocked under the planned set, and which variables block it or hold it open. The
open non-causal paths come first and are counted exactly up to 10,000 (the count the app's
Adjustment section gives); then causal paths, then blocked ones.
  --adjust a,b   the planned set, replacing the file's
  --max N        list at most N paths
${QUESTION_HELP}`,
		options: { ...QUESTION, adjust: { type: 'string', multiple: true }, max: { type: 'string' } },
		async run(ctx) {
			const d = await ctx.diagram();
			const r = exposureOutcomePaths(d, { ...ctx.question(), adjusted: ctx.list('adjust'), max: ctx.count('max') });
			if (ctx.json) {
				ctx.printJson(r);
				return 0;
			}
			const arrows = arrowLookup(d);
			for (const p of r.paths) {
				const status = `${p.causal ? 'causal' : 'non-causal'}, ${p.open ? 'open' : 'blocked'}`;
				const why = p.reasons.map(reasonText).join('; ');
				ctx.print(`${pathText(p.nodes, arrows)}   [${status}]${why ? ` ${why}` : ''}`);
			}
			if (r.paths.length === 0) ctx.print('No path joins the exposure and the outcome.');
			else ctx.print(pathCountSentence(r.openNonCausal));
			if (r.truncated) ctx.print(`… stopped after ${r.paths.length} paths (--max); more exist`);
			return 0;
		}
	},
	claims: {
		summary: 'list the conditional independencies the diagram implies',
		usage: 'causeway claims DIAGRAM [--max N] [--json]',
		details: `For each pair of measured variables with no arrow between them, prints a minimal set of
measured variables given which the diagram says they are independent (d-separated), or says
that no measured set makes them independent. Without --max every pair is listed, up to
${describeCount(CLI_MAX_CLAIM_PAIRS)} pairs (about 3,160 variables); a larger diagram needs --max.
  --max N   list at most N claims`,
		options: { max: { type: 'string' } },
		async run(ctx) {
			const d = await ctx.diagram();
			const max = ctx.count('max');
			const n = d.variables.length;
			const pairs = (n * (n - 1)) / 2;
			if (max === undefined && pairs > CLI_MAX_CLAIM_PAIRS) {
				throw new UsageError(
					`claims looks at every pair of variables: this diagram has ${describeCount(n)} variables, so ${describeCount(pairs)} pairs, more than the ${describeCount(CLI_MAX_CLAIM_PAIRS)} the command goes through in full (its limit); give --max N to list the first N claims`
				);
			}
			const claims = impliedClaims(d, { max });
			if (ctx.json) {
				ctx.printJson({ claims });
				return 0;
			}
			for (const c of claims) {
				ctx.print(
					c.given === null
						? `${c.a} and ${c.b}: not adjacent, but no set of measured variables makes them independent`
						: `${c.a} ⟂ ${c.b}${c.given.length ? ` | ${c.given.join(', ')}` : ''}`
				);
			}
			if (claims.length === 0) ctx.print('The diagram implies no independence between measured variables.');
			return 0;
		}
	},
	roles: {
		summary: 'give each variable its role for the question',
		usage: 'causeway roles DIAGRAM [--only a,b] [--exposure …] [--outcome …] [--json]',
		details: `Prints the role of each variable for the effect of the exposure(s) on the outcome(s):
confounder (a pre-exposure variable in some minimal sufficient adjustment set, VanderWeele &
Shpitser 2013), common cause, mediator, collider, descendant of exposure or outcome,
instrument-like, precision variable or unrelated (several may apply; a confounder that is
also a collider is printed with what it must be adjusted together with).
Each variable's collider test searches the whole diagram, so without --only the command
takes on at most ${describeCount(CLI_MAX_ROLES_WORK)} steps of variables × (variables + arrows), about 14,000
variables of average degree 4 (its limit); --only asks about chosen variables at any size.
  --only a,b     give the roles of these variables only
${QUESTION_HELP}`,
		options: { ...QUESTION, only: { type: 'string', multiple: true } },
		async run(ctx) {
			const d = await ctx.diagram();
			const only = ctx.list('only');
			const work = d.variables.length * (d.variables.length + d.arrows.length);
			if (only === undefined && work > CLI_MAX_ROLES_WORK) {
				throw new UsageError(
					`roles tests each variable with a search over the whole diagram: ${describeCount(d.variables.length)} variables × (${describeCount(d.variables.length)} + ${describeCount(d.arrows.length)} arrows) = ${work.toExponential(1)} steps, over the command's limit of ${CLI_MAX_ROLES_WORK.toExponential(1)} (about 20 s); give --only a,b for the roles of chosen variables`
				);
			}
			const roles = variableRoles(d, { ...ctx.question(), only });
			if (ctx.json) {
				ctx.printJson({ roles });
				return 0;
			}
			const width = Math.max(...roles.map((r) => r.id.length), 1);
			for (const r of roles)
				ctx.print(`${r.id.padEnd(width)}  ${r.roles.map((x) => ROLE_TEXT[x]).join(', ')}${adjustTogetherText(r)}${r.confounderUndecided ? `; ${CONFOUNDER_UNDECIDED}` : ''}`);
			return 0;
		}
	},
	convert: {
		summary: 'convert a diagram between native JSON and DOT',
		usage: 'causeway convert IN -o OUT',
		details: `Reads a native JSON (.json) or DOT (.dot, .gv) diagram and writes it in the format named by
OUT's extension (.json, .dot or .gv). "-o -" writes native JSON to standard output.
  -o, --output OUT   the file to write`,
		options: { output: { type: 'string', short: 'o' }, to: { type: 'string' } },
		async run(ctx) {
			const out = ctx.values.output;
			if (typeof out !== 'string' || out === '') throw new UsageError('convert needs -o OUT');
			const d = await ctx.diagram();
			const format = typeof ctx.values.to === 'string' ? ctx.values.to : formatFromName(out);
			// The DOT writer (and its parser library) is loaded only when DOT is asked for.
			const text = format === 'dot' ? (await import('../lib/graph/dot')).writeDot(d) : writeDiagramJson(d);
			if (out === '-') ctx.io.stdout(text.endsWith('\n') ? text : `${text}\n`);
			else await (ctx.io.writeFile ?? writeFile)(out, text);
			return 0;
		}
	},
};

/**
 * The commands beyond the core ones, each loaded only when called: esbuild splits every
 * dynamic import into its own chunk (scripts/build-cli.mjs), so a core command's start-up never
 * reads the data, export or reviewer code (measured in bench/cli.ts).
 */
const LAZY: Record<LazyName, () => Promise<Command>> = {
	test: async () => (await import('./commands/test')).testCommand,
	estimate: async () => (await import('./commands/estimate')).estimateCommand,
	export: async () => (await import('./commands/export')).exportCommand,
	code: async () => (await import('./commands/code')).codeCommand,
	review: async () => (await import('./commands/review')).review,
	robust: async () => (await import('./commands/robust')).robust,
	diff: async () => (await import('./commands/diff')).diff,
	instruments: async () => (await import('./commands/instruments')).instruments
};

/** Every command's name and one-line summary, in the order the help lists them. */
function summaries(): [string, string][] {
	return [...Object.entries(commands).map(([name, c]): [string, string] => [name, c.summary]), ...Object.entries(SUMMARY)];
}

async function findCommand(name: string): Promise<Command | undefined> {
	if (Object.hasOwn(commands, name)) return commands[name];
	if (Object.hasOwn(LAZY, name)) return LAZY[name as LazyName]();
	return undefined;
}

function formatFromName(name: string): 'json' | 'dot' {
	if (name === '-') return 'json';
	const lower = name.toLowerCase();
	if (lower.endsWith('.dot') || lower.endsWith('.gv')) return 'dot';
	if (lower.endsWith('.json')) return 'json';
	throw new UsageError(`cannot tell the format of "${name}" from its extension: use .json, .dot or .gv`);
}

function generalHelp(): string {
	const all = summaries();
	const width = Math.max(...all.map(([name]) => name.length));
	return `causeway ${VERSION} — causal diagrams for choosing and justifying adjustment sets

Usage: causeway COMMAND DIAGRAM [options]

DIAGRAM is a native JSON (.json) or DOT (.dot, .gv) file, or - for standard input.

Commands:
${all
	.map(([name, summary]) => `  ${name.padEnd(width)}  ${summary}`)
	.join('\n')}

Options for every command: --json (one JSON object on stdout), --help.
Exit status: 0 done, 1 negative verdict (check), 2 bad usage or bad input.
Run "causeway COMMAND --help" for a command's options.

A diagram encodes assumptions; results are only as good as those assumptions. Causeway
supports, and does not replace, review by qualified epidemiologists or statisticians.`;
}

/** Splits "a,b" and repeated flags into one list of trimmed, non-empty ids. */
function splitList(value: string | boolean | string[] | undefined): string[] | undefined {
	if (value === undefined || typeof value === 'boolean') return undefined;
	const parts = (Array.isArray(value) ? value : [value]).flatMap((v) => v.split(','));
	return parts.map((p) => p.trim()).filter((p) => p.length > 0);
}

/**
 * Output is gathered and handed on in pieces of at least this many characters: `claims` on 2,000
 * variables used to spend 11% of its time in 1.7 million separate writes (one per line);
 * buffered, it makes a few dozen (bench/cli.ts).
 */
const OUTPUT_PIECE = 1 << 18;

/** Collects printed text and passes it to `write` in large pieces; `flush` sends the rest. */
function bufferedOutput(write: (text: string) => void): { write: (text: string) => void; flush: () => void } {
	let pending = '';
	const flush = () => {
		if (pending === '') return;
		const text = pending;
		pending = '';
		write(text);
	};
	return {
		write(text) {
			pending += text;
			if (pending.length >= OUTPUT_PIECE) flush();
		},
		flush
	};
}

/** The file writer given to commands: failures become one OutputError line. */
function checkedWriter(write: NonNullable<CliIo['writeFile']>): NonNullable<CliIo['writeFile']> {
	return async (path, content) => {
		try {
			await write(path, content);
		} catch (err) {
			if (err instanceof OutputError) throw err;
			throw new OutputError(writeFailure(err, `"${path}"`));
		}
	};
}

export async function main(argv: readonly string[], io: CliIo): Promise<number> {
	const fail = (message: string) => {
		io.stderr(`causeway: ${message.replace(/\s*\n\s*/g, ' ')}\n`);
		return 2;
	};
	const [name, ...rest] = argv;
	if (name === undefined) return fail('no command given; run "causeway --help" for the list');
	if (name === '--help' || name === '-h' || name === 'help') {
		io.stdout(`${generalHelp()}\n`);
		return 0;
	}
	if (name === '--version' || name === '-V') {
		io.stdout(`${VERSION}\n`);
		return 0;
	}
	const command = await findCommand(name);
	if (!command) return fail(`unknown command "${name}"; run "causeway --help" for the list`);
	let parsed: { values: Values; positionals: string[] };
	try {
		parsed = parseArgs({ args: [...rest], options: { ...COMMON, ...command.options }, allowPositionals: true, strict: true }) as {
			values: Values;
			positionals: string[];
		};
	} catch (err) {
		return fail(`${(err as Error).message.split('\n')[0]} (see "causeway ${name} --help")`);
	}
	if (parsed.values.help) {
		io.stdout(`Usage: ${command.usage}\n\n${command.details}\n`);
		return 0;
	}
	const json = parsed.values.json === true;
	const out = bufferedOutput(io.stdout);
	const commandIo: CliIo = { ...io, stdout: out.write, writeFile: checkedWriter(io.writeFile ?? writeFile) };
	const ctx: Context = {
		io: commandIo,
		values: parsed.values,
		positionals: parsed.positionals,
		json,
		print: (text) => out.write(`${text}\n`),
		printJson: (value) => out.write(`${JSON.stringify(value)}\n`),
		async diagram() {
			if (parsed.positionals.length === 0) throw new UsageError(`${name} needs a diagram file (usage: ${command.usage})`);
			if (parsed.positionals.length > 1) throw new UsageError(`${name} takes one diagram file, got ${parsed.positionals.length}: ${parsed.positionals.join(' ')}`);
			return readDiagramInput(io, parsed.positionals[0]);
		},
		question() {
			return { exposures: splitList(parsed.values.exposure), outcomes: splitList(parsed.values.outcome) };
		},
		list: (key) => splitList(parsed.values[key]),
		count(key) {
			const raw = parsed.values[key];
			if (raw === undefined) return undefined;
			const value = Number(raw);
			if (typeof raw !== 'string' || !/^\d+$/.test(raw.trim()) || !Number.isSafeInteger(value) || value < 1) {
				throw new UsageError(`--${key} must be a whole number of at least 1, not "${String(raw)}"`);
			}
			return value;
		}
	};
	try {
		const status = await command.run(ctx);
		out.flush();
		return status;
	} catch (err) {
		if (!(err instanceof OutputError)) {
			try {
				out.flush(); // what was printed before the failure still goes out, before the message
			} catch (flushErr) {
				if (flushErr instanceof OutputError) return fail(flushErr.message);
				throw flushErr;
			}
		}
		if (err instanceof UsageError || err instanceof InputError || err instanceof OutputError) return fail(err.message);
		if (err instanceof RangeError && /allocation|memory|Invalid (string|array) length/i.test(err.message)) {
			return fail(`the diagram is too large for this command: ${err.message}`);
		}
		return fail(`internal error: ${(err as Error)?.message ?? String(err)} (please report this)`);
	}
}
