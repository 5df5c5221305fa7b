/**
 * Running one view: its options parsed (node:util parseArgs, strict), the context it reads the
 * diagram and prints through, and every failure turned into one line on stderr with exit 2 —
 * never a stack trace (DESIGN.md's command-line contract).
 */
import { writeFile } from 'node:fs/promises';
import { parseArgs } from 'node:util';
import { InputError } from '../lib/graph/errors';
import { COMMON, type Command, type Context, type Values } from './command';
import { OutputError, UsageError, type CliIo } from './io';
import { bufferedOutput, checkedWriter } from './output';
import { readDiagramInput } from './read-input';

/** Splits "a,b" and repeated flags into one list of trimmed, non-empty ids. */
function splitList(value: string | boolean | string[] | undefined): string[] | undefined {
	if (value === undefined || typeof value === 'boolean') return undefined;
	const parts = (Array.isArray(value) ? value : [value]).flatMap((v) => v.split(','));
	return parts.map((p) => p.trim()).filter((p) => p.length > 0);
}

/** One line on stderr, exit status 2: the form of every failure. */
export function failWith(io: CliIo, message: string): number {
	io.stderr(`causeway: ${message.replace(/\s*\n\s*/g, ' ')}\n`);
	return 2;
}

function contextFor(name: string, command: Command, parsed: { values: Values; positionals: string[] }, io: CliIo, print: (text: string) => void): Context {
	return {
		name,
		io: { ...io, stdout: print, writeFile: checkedWriter(io.writeFile ?? writeFile) },
		values: parsed.values,
		positionals: parsed.positionals,
		json: parsed.values.json === true,
		print: (text) => print(`${text}\n`),
		printJson: (value) => print(`${JSON.stringify(value)}\n`),
		async diagram() {
			const files = parsed.positionals;
			if (files.length === 0) throw new UsageError(`${name} needs a diagram file (usage: ${command.usage})`);
			if (files.length > 1) throw new UsageError(`${name} takes one diagram file, got ${files.length}: ${files.join(' ')}`);
			return readDiagramInput(io, files[0]);
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
}

/** Runs `command` (spelled `name`, e.g. "plan sets") on its arguments; returns the exit status. */
export async function runView(name: string, command: Command, args: readonly string[], io: CliIo): Promise<number> {
	let parsed: { values: Values; positionals: string[] };
	try {
		parsed = parseArgs({ args: [...args], options: { ...COMMON, ...command.options }, allowPositionals: true, strict: true }) as typeof parsed;
	} catch (err) {
		return failWith(io, `${(err as Error).message.split('\n')[0]} (see "causeway ${name} --help")`);
	}
	if (parsed.values.help) {
		io.stdout(`Usage: ${command.usage}\n\n${command.details}\n`);
		return 0;
	}
	const out = bufferedOutput(io.stdout);
	try {
		const status = await command.run(contextFor(name, command, parsed, io, out.write));
		out.flush();
		return status;
	} catch (err) {
		if (!(err instanceof OutputError)) {
			try {
				out.flush(); // what was printed before the failure still goes out, before the message
			} catch (flushErr) {
				if (flushErr instanceof OutputError) return failWith(io, flushErr.message);
				throw flushErr;
			}
		}
		if (err instanceof UsageError || err instanceof InputError || err instanceof OutputError) return failWith(io, err.message);
		if (err instanceof RangeError && /allocation|memory|Invalid (string|array) length/i.test(err.message)) {
			return failWith(io, `the diagram is too large for this command: ${err.message}`);
		}
		return failWith(io, `internal error: ${(err as Error)?.message ?? String(err)} (please report this)`);
	}
}
