// Helpers shared by the DOT tests: the InputError a text is refused with, whether Graphviz's
// `dot` is installed, and XML text as `dot -Tsvg` escapes it.
import { execFileSync } from 'node:child_process';
import { expect } from 'vitest';
import { parseDot } from '../../../src/lib/graph/dot';
import { InputError } from '../../../src/lib/graph/errors';

/** The InputError parseDot refuses `text` with (app limits); fails the test when it reads it. */
export function dotError(text: string): InputError {
	try {
		parseDot(text);
	} catch (e) {
		expect(e).toBeInstanceOf(InputError);
		return e as InputError;
	}
	throw new Error('expected an InputError');
}

/** True when Graphviz's `dot` runs; the callers skip their checks with a message otherwise. */
export function hasGraphviz(): boolean {
	try {
		execFileSync('dot', ['-V'], { stdio: 'ignore' });
		return true;
	} catch {
		return false;
	}
}

/** Text of an SVG text node: the XML entities decoded. */
export function xmlText(s: string): string {
	return s.replace(/&(#x[0-9a-fA-F]+|#[0-9]+|lt|gt|amp|quot|apos);/g, (_m, e: string) => {
		if (e[0] === '#') return String.fromCodePoint(e[1] === 'x' ? parseInt(e.slice(2), 16) : parseInt(e.slice(1), 10));
		return { lt: '<', gt: '>', amp: '&', quot: '"', apos: "'" }[e] ?? '';
	});
}
