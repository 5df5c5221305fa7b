/** Public API of the diagram layer: model, files (native JSON, DOT), checks, graph model. */
export * from './diagram';
export * from './compiled';
export { InputError } from './errors';
export { parseDiagramJson, writeDiagramJson, diagramSchema } from './native-json';
export { parseDot, writeDot } from './dot';
export { validateDiagram, assertValidDiagram, findCycle } from './validate';
export type { DiagramIssue, DiagramIssueCode, ValidateOptions } from './validate';
export { readDiagramText, readDiagramBytes, diagramFileKind } from './read-file';
export type { DiagramFileKind } from './read-file';
