/**
 * The malformed-input corpus as one list: the committed files of tests/fixtures/bad (with
 * expectations.json) and the large inputs made at test time (tests/fixtures/bad/large.ts).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { largeInputs, type CorpusEntry, type Expectation } from '../../fixtures/bad/large';

export const CORPUS_DIR = 'tests/fixtures/bad';

export function committedCorpus(): CorpusEntry[] {
	const expectations = JSON.parse(readFileSync(join(CORPUS_DIR, 'expectations.json'), 'utf8')) as Record<string, Expectation>;
	return Object.entries(expectations).map(([name, e]) => ({ name, bytes: new Uint8Array(readFileSync(join(CORPUS_DIR, name))), ...e }));
}

export function wholeCorpus(): CorpusEntry[] {
	return [...committedCorpus(), ...largeInputs()];
}

export const isTable = (e: { name: string }) => e.name.startsWith('csv/');

/** Own enumerable and non-enumerable keys of Object.prototype, to compare before and after. */
export function prototypeKeys(): string[] {
	return [...Object.getOwnPropertyNames(Object.prototype), ...Object.getOwnPropertySymbols(Object.prototype).map(String)].sort();
}

/** True when nothing was written into Object.prototype (a pollution check on a fresh object). */
export function prototypeIsClean(before: readonly string[]): boolean {
	const probe: Record<string, unknown> = {};
	return JSON.stringify(prototypeKeys()) === JSON.stringify(before) && probe.polluted === undefined && Object.keys(probe).length === 0;
}
