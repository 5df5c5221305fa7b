/**
 * DOT (the Graphviz language, https://graphviz.org/doc/info/lang.html) ⇄ Diagram: the open
 * text interchange format. The parts live in ./dot/: lexer.ts (text → tokens), parser.ts
 * (tokens → Graphviz's nodes and edges: chains, subgraph endpoints, defaults, strict),
 * direction.ts (the arrow Graphviz draws: dir), read.ts (into a Diagram, with Causeway's own
 * attributes, limits and messages), text.ts (label text codecs), write.ts (Diagram → DOT).
 * docs/graph-io.md says what is read, kept and dropped.
 */
export { parseDot } from './dot/read';
export { writeDot } from './dot/write';
