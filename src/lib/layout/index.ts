/** Layout of diagrams without a canvas library: usable from the app, its workers and the CLI. */
export { dagrePositions, needsLayout, withPositions } from './dagre-layout';
export type { LayoutInput, Positions } from './dagre-layout';
