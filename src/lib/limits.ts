/**
 * Causeway's stated limits, in one place: the largest inputs the importers accept and the
 * longest listings the engine produces. Past a limit the importer refuses the input at once
 * with a message naming the limit (so the app stays responsive instead of freezing on a file
 * it cannot draw), and the engine stops a listing and says it was cut short.
 *
 * Why these numbers (measured on the two-core test machine, docs/editor.md and docs/reliability.md):
 * - the canvas was measured responsive up to 300 variables (median key-to-frame under 0.25 s) and
 *   listing every claim of such a diagram takes 3–4 s in the worker; 2,000 variables and 10,000
 *   arrows leave room for large protocol diagrams while keeping drawing and analysis in seconds;
 * - a diagram file of 2,000 variables with notes is well under 1 MB, so 5 MiB of text is room
 *   enough, and refusing bigger text early keeps a pasted or hostile file from stalling the page;
 * - labels and titles are drawn on the canvas: 1,000 characters is a paragraph, far longer than
 *   any readable node label; notes are free text and may be long, but not megabytes;
 * - a data file is read as a stream into typed arrays (8 bytes per number cell); 512 MiB of CSV
 *   is about ten million rows of a dozen columns, the most a browser tab holds comfortably, and
 *   500 columns is far more than any diagram has variables to match them with.
 *
 * Pure constants: no imports, usable from the app, workers and the CLI.
 */

/** Most variables a diagram file may hold. */
export const MAX_VARIABLES = 2_000;
/** Most arrows a diagram file may hold. */
export const MAX_ARROWS = 10_000;
/** Longest diagram file, in characters of text (UTF-16 code units, about bytes for ASCII). */
export const MAX_DIAGRAM_CHARS = 5 * 1024 * 1024;
/** Longest variable id, label and diagram title, in characters (also a data column name, reference level, value and value label). */
export const MAX_LABEL_CHARS = 1_000;
/** Longest variable or arrow note, in characters. */
export const MAX_NOTE_CHARS = 100_000;
/**
 * Most value labels one variable may carry. A coded column has at most a few dozen levels
 * (the table reader leaves out text columns of more than 20 by default); 500 is room for
 * hand-made code lists while keeping a file's labels drawable in the Data section.
 */
export const MAX_VALUE_LABELS = 500;

/** Deepest nesting of { } in a DOT file (subgraphs, node groups); diagrams use two or three. */
export const MAX_DOT_NESTING = 100;

/** Largest data (CSV) file, in bytes when read as a file, in characters when given as text. */
export const MAX_TABLE_BYTES = 512 * 1024 * 1024;
/** Most columns a data file may have. */
export const MAX_TABLE_COLUMNS = 500;

/** Default number of exposure–outcome paths listed, and the most that can be asked for. */
export const DEFAULT_LISTED_PATHS = 1_000;
export const MAX_LISTED_PATHS = 10_000;

/**
 * The command line's own, larger limits (`causeway …` in pipelines; docs/cli.md). The app's
 * limits above are about drawing and staying responsive; the command draws nothing, so its
 * limits are about memory and time instead. Measured (bench/cli.ts): a diagram of 100,000
 * variables and 200,000 arrows is about 12 MiB of native JSON and is read, checked and answered
 * by `dsep` in about a second, with a peak of about 0.5 GB of memory; JSON.parse needs roughly
 * 20 bytes of memory per byte of text, so 64 MiB of text stays under ~1.5 GB, within Node's
 * default heap on a 64-bit machine. 250,000 variables and 1,000,000 arrows fit in 64 MiB.
 */
export const CLI_MAX_VARIABLES = 250_000;
export const CLI_MAX_ARROWS = 1_000_000;
/** Longest diagram the command reads, in bytes of a file or of standard input (and characters of text). */
export const CLI_MAX_DIAGRAM_BYTES = 64 * 1024 * 1024;

/**
 * Sets `causeway sets` lists unless --max says otherwise. The listing has polynomial delay but
 * each set costs a pass over the diagram: measured (bench/cli.ts) about 1 ms per set at 2,000
 * variables and 0.25 s per set at 100,000, so 100 sets answer a 2,000-variable diagram in well
 * under a second and a 100,000-variable one in about half a minute; the number of minimal sets
 * itself can grow exponentially with the diagram, so some cap is always needed.
 */
export const CLI_DEFAULT_LISTED_SETS = 100;
/**
 * Most pairs `causeway claims` goes through without --max: one claim per non-adjacent pair,
 * n(n − 1)/2 pairs in all; 5,000,000 pairs is about 3,160 variables. Measured: all claims of
 * 2,000 variables (2 million pairs) take about a minute, so a larger diagram needs --max N.
 */
export const CLI_MAX_CLAIM_PAIRS = 5_000_000;

/**
 * Most work `causeway roles` takes on without --only, as variables × (variables + arrows): the
 * collider test is one flow search over the diagram per variable (roles.ts). Measured
 * (bench/cli.ts, node --cpu-prof): 10,000 variables and 20,000 arrows (3·10⁸) take about 10 s
 * of CPU, all but a few percent in that test, so the limit of 6·10⁸ is about 20 s — some
 * 14,000 variables of average degree 4. A 100,000-variable diagram (3·10¹⁰) would take about
 * a quarter of an hour; --only a,b asks about chosen variables at O(n + m) each.
 */
export const CLI_MAX_ROLES_WORK = 600_000_000;

/** "5 MiB", "512 MiB", "1,000": sizes as messages state them. */
export function describeBytes(bytes: number): string {
	if (bytes >= 1024 * 1024) return `${Number((bytes / (1024 * 1024)).toFixed(1))} MiB`;
	if (bytes >= 1024) return `${Number((bytes / 1024).toFixed(1))} KiB`;
	return `${bytes} bytes`;
}

export function describeCount(n: number): string {
	// Whole numbers are grouped by hand: the first toLocaleString call starts ICU, which took
	// about a tenth of a second of the command's start-up (node --cpu-prof), and the help texts
	// state limits. Same output as en-GB: 250,000.
	if (!Number.isSafeInteger(n)) return n.toLocaleString('en-GB');
	const digits = String(Math.abs(n)).replace(/\B(?=(\d{3})+$)/g, ',');
	return n < 0 ? `-${digits}` : digits;
}
