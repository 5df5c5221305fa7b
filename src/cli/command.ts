/**
 * What one view of a `causeway` job is (`causeway plan sets`, `causeway export`…): its help
 * text, its options and its run function, given a context that reads the diagram and prints.
 * Each lives in src/cli/commands/<job>/<view>.ts and is listed, with its one-line summary, in
 * the job tree (jobs.ts).
 */
import type { ParseArgsConfig } from 'node:util';
import type { Diagram } from '../lib/graph/diagram';
import type { CliIo } from './io';

export type Options = ParseArgsConfig['options'];
export type Values = Record<string, string | boolean | string[] | undefined>;

export interface Command {
	usage: string;
	details: string;
	options: Options;
	run(ctx: Context): Promise<number>;
}

export interface Context {
	/** How the command was spelled in its new form, for messages: "plan sets", "compare". */
	name: string;
	io: CliIo;
	values: Values;
	positionals: string[];
	json: boolean;
	print(text: string): void;
	printJson(value: unknown): void;
	diagram(): Promise<Diagram>;
	question(): { exposures?: string[]; outcomes?: string[] };
	list(name: string): string[] | undefined;
	count(name: string): number | undefined;
}

export const QUESTION: Options = {
	exposure: { type: 'string', multiple: true },
	outcome: { type: 'string', multiple: true }
};
export const COMMON: Options = { json: { type: 'boolean' }, help: { type: 'boolean', short: 'h' } };

export const QUESTION_HELP = `  --exposure a,b   exposure variable(s), replacing those in the file
  --outcome c      outcome variable(s), replacing those in the file`;

