/**
 * Opening a diagram file whose kind is not known in advance (drag-and-drop, file picker, CLI
 * argument): the extension decides, else the content does (file-kind.ts).
 */
import type { Diagram } from './diagram';
import { parseDot } from './dot';
import { diagramFileKind, requireDiagramFileKind, withFileName, type DiagramFileKind } from './file-kind';
import { parseDiagramJson } from './native-json';
import type { ReadLimits } from './size-limits';
import { decodeTextFile } from './text-decoding';

export { diagramFileKind };
export type { DiagramFileKind };

/**
 * Reads a diagram from a file's name and text, as native JSON or DOT (see diagramFileKind).
 * Throws InputError whose message starts with the file name, e.g.
 * `study.json: Invalid JSON at line 3, column 7: expected a value (found "}")`.
 * `limits` are the app's unless given (the command line has its own).
 */
export function readDiagramText(name: string, text: string, limits?: ReadLimits): Diagram {
	const kind = requireDiagramFileKind(name, text);
	return withFileName(name, () => (kind === 'json' ? parseDiagramJson(text, limits) : parseDot(text, limits)));
}

/**
 * Reads a diagram from a file's name and bytes: decodes them (UTF-8, or UTF-16 after a
 * byte-order mark; binary and non-UTF-8 files are refused, naming the first bad byte), then
 * reads the text as readDiagramText does. Messages start with the file name.
 */
export function readDiagramBytes(name: string, bytes: Uint8Array, limits?: ReadLimits): Diagram {
	const text = withFileName(name, () => decodeTextFile(bytes));
	return readDiagramText(name, text, limits);
}
