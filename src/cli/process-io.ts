/**
 * The command's real surroundings: standard output and error written with writeSync on the file
 * descriptors. main.ts hands over its output in large pieces, so this is a few system calls per
 * run; writing synchronously also means Node's stream machinery is never loaded (a measurable
 * part of start-up, bench/cli.ts) and a failed write is known at once, as one OutputError line
 * (closed pipe, full disk) instead of an asynchronous 'error' event after the command ended.
 */
import { writeSync } from 'node:fs';
import { OutputError, type CliIo } from './io';

const WAIT = new Int32Array(new SharedArrayBuffer(4));

/** One line saying why writing `what` failed, from a Node system error's code. */
export function writeFailure(err: unknown, what: string): string {
	const code = (err as { code?: unknown } | null)?.code;
	switch (code) {
		case 'EPIPE':
			return `cannot write ${what}: the reader closed the pipe (EPIPE)`;
		case 'ENOSPC':
			return `cannot write ${what}: no space left on the device (ENOSPC)`;
		case 'EDQUOT':
			return `cannot write ${what}: the disk quota is used up (EDQUOT)`;
		case 'ENOENT':
			return `cannot write ${what}: its folder does not exist`;
		case 'ENOTDIR':
			return `cannot write ${what}: part of its path is a file, not a folder`;
		case 'EISDIR':
			return `cannot write ${what}: it is a folder`;
		case 'EACCES':
		case 'EPERM':
			return `cannot write ${what}: permission denied`;
		case 'EROFS':
			return `cannot write ${what}: the file system is read-only`;
		default:
			return `cannot write ${what}: ${typeof code === 'string' ? code : (err as Error)?.message ?? String(err)}`;
	}
}

/** Writes all of `text` to a file descriptor, waiting out a non-blocking pipe that is full. */
function writeAll(fd: number, text: string, what: string): void {
	const bytes = Buffer.from(text, 'utf8');
	let done = 0;
	while (done < bytes.length) {
		try {
			done += writeSync(fd, bytes, done, bytes.length - done);
		} catch (err) {
			if ((err as { code?: unknown }).code === 'EAGAIN') {
				Atomics.wait(WAIT, 0, 0, 2); // the reader is slower than us: let it catch up
				continue;
			}
			throw new OutputError(writeFailure(err, what));
		}
	}
}

export function processIo(): CliIo {
	return {
		stdout: (text) => writeAll(1, text, 'the output'),
		stderr: (text) => {
			try {
				writeAll(2, text, 'to standard error');
			} catch {
				// nowhere left to say it; the exit status still tells
			}
		}
	};
}
