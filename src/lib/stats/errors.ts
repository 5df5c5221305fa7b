/**
 * The one error type of the statistics library. Its message is a single line that names
 * the problem and where it is (row, column name, variable), fit to show to a user as is;
 * callers (CLI, worker, UI) catch it and never show a stack trace.
 */
export class StatsError extends Error {
	/** 1-based row of the file (the header is row 1), when the problem is in one row. */
	readonly row: number | undefined;
	/** Column name, when the problem is in one column. */
	readonly column: string | undefined;

	constructor(message: string, where: { row?: number; column?: string } = {}) {
		// Names and values quoted from a file may hold line breaks (a quoted CSV header can):
		// shown as ↵ so that the message stays one line, as promised above.
		super(message.replace(/\r\n|[\r\n\u2028\u2029]/g, '↵'));
		this.name = 'StatsError';
		this.row = where.row;
		this.column = where.column;
	}
}
