/**
 * Layout of diagrams without a canvas library: usable from the app, its workers and the CLI.
 * `tidyPositions` is the entry point (it picks dagre or the layered layout by size).
 */
export { tidyPositions, layoutMethod, DAGRE_MAX_VARIABLES, DAGRE_MAX_ARROWS } from './tidy';
export { dagrePositions } from './dagre-layout';
export { needsLayout, withPositions } from './positions';
export { layeredPositions, layeredDrawing } from './layered/layered-layout';
export type { LayoutInput, Positions } from './types';
