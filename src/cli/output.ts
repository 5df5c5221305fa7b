/**
 * What a command prints, gathered and handed on in large pieces, and the file writer given to
 * commands. Standard output itself is written by process-io.ts.
 */
import { OutputError, type CliIo } from './io';
import { writeFailure } from './process-io';

/**
 * Output is gathered and handed on in pieces of at least this many characters: `claims` on 2,000
 * variables used to spend 11% of its time in 1.7 million separate writes (one per line);
 * buffered, it makes a few dozen (bench/cli.ts).
 */
const OUTPUT_PIECE = 1 << 18;

/** Collects printed text and passes it to `write` in large pieces; `flush` sends the rest. */
export function bufferedOutput(write: (text: string) => void): { write: (text: string) => void; flush: () => void } {
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
export function checkedWriter(write: NonNullable<CliIo['writeFile']>): NonNullable<CliIo['writeFile']> {
	return async (path, content) => {
		try {
			await write(path, content);
		} catch (err) {
			if (err instanceof OutputError) throw err;
			throw new OutputError(writeFailure(err, `"${path}"`));
		}
	};
}
