/** What the command needs from its surroundings, so tests can run it in-process. */
export interface CliIo {
	/** Receives the output in large pieces (main.ts buffers it); may throw OutputError. */
	stdout: (text: string) => void;
	stderr: (text: string) => void;
	/** Reads a file as text; defaults to the file system. "-" means standard input. */
	readFile?: (path: string) => Promise<string>;
	/** Writes a file; defaults to the file system. */
	writeFile?: (path: string, content: string | Uint8Array) => Promise<void>;
}

/** A mistake in how the command was called: one line on stderr, exit 2. */
export class UsageError extends Error {
	constructor(message: string) {
		super(message);
		this.name = 'UsageError';
	}
}

/** The output could not be written (closed pipe, full disk, missing folder): one line, exit 2. */
export class OutputError extends Error {
	constructor(message: string) {
		super(message);
		this.name = 'OutputError';
	}
}
