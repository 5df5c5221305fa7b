/**
 * Reading a diagram for the command line: from a file or standard input, never more than the
 * command's limit (CLI_MAX_DIAGRAM_BYTES) — a file's size is checked before reading, a pipe is
 * read in pieces and refused as soon as it passes the limit — then decoded and read with the
 * command's own, larger limits (CLI_READ_LIMITS). The DOT reader (and its parser library) is
 * loaded only for DOT files.
 */
import { isUtf8 } from 'node:buffer';
import { closeSync, fstatSync, openSync, readSync } from 'node:fs';
import type { Diagram } from '../lib/graph/diagram';
import { diagramFileKind, requireDiagramFileKind, withFileName } from '../lib/graph/file-kind';
import { FAST_READ_MIN_BYTES } from '../lib/graph/fast-native/min-bytes';
import { parseDiagramJson } from '../lib/graph/native-json';
import { CLI_READ_LIMITS, diagramTooLarge } from '../lib/graph/size-limits';
import { decodeTextFile } from '../lib/graph/text-decoding';
import { describeBytes } from '../lib/limits';
import { InputError } from '../lib/graph/errors';
import { UsageError, type CliIo } from './io';

const PIECE = 1 << 20;
const PAUSE = new Int32Array(new SharedArrayBuffer(4));

/** One line for a failed read of `path`, from a Node system error's code. */
export function describeFsError(err: unknown, path: string): string {
	const code = (err as { code?: unknown } | null)?.code;
	if (code === 'ENOENT') return `cannot read "${path}": no such file`;
	if (code === 'EISDIR') return `cannot read "${path}": it is a folder`;
	if (code === 'EACCES') return `cannot read "${path}": permission denied`;
	return `cannot read "${path}": ${(err as Error)?.message ?? String(err)}`;
}

/** "big.json: The file is too large: …", before any of it is parsed. */
function tooLarge(name: string, size: string): InputError {
	return new InputError(`${name}: ${diagramTooLarge(size, CLI_READ_LIMITS).message}`, name);
}

/** Joins pieces read so far, refusing once their total passes `max`. */
class Bounded {
	private pieces: Uint8Array[] = [];
	private total = 0;
	constructor(
		private readonly name: string,
		private readonly max: number
	) {}
	add(piece: Uint8Array): void {
		this.total += piece.length;
		if (this.total > this.max) throw tooLarge(this.name, `more than ${describeBytes(this.max)}`);
		this.pieces.push(piece);
	}
	bytes(): Uint8Array {
		// One piece (a regular file read whole) is returned as it is: copying 12 MiB took 0.2 s.
		return this.pieces.length === 1 ? this.pieces[0] : Buffer.concat(this.pieces, this.total);
	}
}

/**
 * At most `max` bytes of a file (of any kind: regular, FIFO, device), else InputError. Read
 * synchronously: the command has nothing else to do meanwhile, and the promise-based file
 * handle cost more start-up than the read itself on a small file (node --cpu-prof).
 */
function readFileBounded(path: string, max: number): Uint8Array {
	let fd: number;
	try {
		fd = openSync(path, 'r');
	} catch (err) {
		throw new UsageError(describeFsError(err, path));
	}
	try {
		const info = fstatSync(fd);
		if (info.isDirectory()) throw new UsageError(`cannot read "${path}": it is a folder`);
		if (info.isFile() && info.size > max) throw tooLarge(path, describeBytes(info.size));
		const out = new Bounded(path, max);
		// A regular file is read in one piece of its size (one byte more shows if it grew).
		let size = info.isFile() ? Math.min(max + 1, info.size + 1) : PIECE;
		for (;;) {
			const piece = Buffer.allocUnsafe(size);
			size = PIECE;
			let got;
			try {
				got = readSync(fd, piece, 0, piece.length, null);
			} catch (err) {
				if ((err as { code?: unknown }).code !== 'EAGAIN') throw new UsageError(describeFsError(err, path));
				Atomics.wait(PAUSE, 0, 0, 5); // a non-blocking pipe with nothing in it yet
				continue;
			}
			if (got === 0) break;
			out.add(piece.subarray(0, got));
		}
		return out.bytes();
	} finally {
		closeSync(fd);
	}
}

/** At most `max` bytes of standard input, else InputError (the rest is not read). */
async function readStdinBounded(max: number): Promise<Uint8Array> {
	const out = new Bounded('stdin', max);
	for await (const chunk of process.stdin) out.add(chunk as Buffer);
	return out.bytes();
}

function isPlainUtf8(bytes: Uint8Array): boolean {
	return bytes[0] !== 0xff && bytes[0] !== 0xfe && bytes.subarray(0, 64 * 1024).indexOf(0) < 0 && isUtf8(bytes);
}

/**
 * Bytes → text. Plain UTF-8 (no NUL in the first 64 KiB, no UTF-16 byte-order mark) is checked
 * by Node's isUtf8 and decoded by Buffer.toString, several times faster than TextDecoder on a
 * large file (0.84 s of a 3.3 s profile of `dsep` on 12 MiB); anything else goes to the shared
 * strict decoder, which refuses it with the place of the first bad byte.
 */
function decode(bytes: Uint8Array, plain = isPlainUtf8(bytes)): string {
	if (!plain) return decodeTextFile(bytes);
	const text = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.length).toString('utf8');
	return text.charCodeAt(0) === 0xfeff ? text.slice(1) : text; // as TextDecoder drops a UTF-8 byte-order mark
}

/**
 * A native file in plain UTF-8 read by the fast path (src/lib/graph/fast-native: straight to
 * the compiled graph, about half the CPU time of `dsep` on 100,000 variables); null when that
 * reader leaves the file to the full one, which then gives every message. `text` decodes the
 * bytes as the full path does.
 */
async function readFast(shown: string, bytes: Uint8Array, text: () => string): Promise<Diagram | null> {
	if (diagramFileKind(shown, '{') !== 'json') return null;
	// Loaded only when used, so that the start-up of a command on a small file does not grow.
	const { readNativeFast } = await import('../lib/graph/fast-native');
	const read = readNativeFast(bytes, CLI_READ_LIMITS, () => withFileName(shown, () => parseDiagramJson(text(), CLI_READ_LIMITS)));
	return read.ok ? read.diagram : null;
}

/** Reads and checks the diagram at `path` ("-" = standard input) with the command's limits. */
export async function readDiagramInput(io: CliIo, path: string): Promise<Diagram> {
	const shown = path === '-' ? 'stdin' : path;
	let text: string;
	if (io.readFile) {
		try {
			text = await io.readFile(path);
		} catch (err) {
			throw new UsageError(describeFsError(err, path));
		}
		// Text given in-process (the tests) takes the fast path at any size, so that the command's
		// tests exercise it, when the text survives UTF-8 as it is.
		const given = text;
		const fast = /[\uD800-\uDFFF]/.test(given) ? null : await readFast(shown, Buffer.from(given, 'utf8'), () => given);
		if (fast) return fast;
	} else {
		const max = CLI_READ_LIMITS.chars;
		const bytes = path === '-' ? await readStdinBounded(max) : readFileBounded(path, max);
		const plain = isPlainUtf8(bytes);
		// Small files: the full reader is as fast (FAST_READ_MIN_BYTES says why).
		const fast = plain && bytes.length >= FAST_READ_MIN_BYTES ? await readFast(shown, bytes, () => decode(bytes, plain)) : null;
		if (fast) return fast;
		text = withFileName(shown, () => decode(bytes, plain));
	}
	const kind = requireDiagramFileKind(shown, text);
	if (kind === 'json') return withFileName(shown, () => parseDiagramJson(text, CLI_READ_LIMITS));
	const { parseDot } = await import('../lib/graph/dot');
	return withFileName(shown, () => parseDot(text, CLI_READ_LIMITS));
}
