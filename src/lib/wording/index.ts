/**
 * Every sentence and number format that people read — in the app, the command line and the
 * report — so that each idea has one wording. Engine modules (graph, causal, stats,
 * datacheck) return data; the words are made here. Pure functions, no DOM.
 */
export * from './names';
export * from './numbers';
export * from './roles';
export * from './adjustment';
export * from './paths';
export * from './claims';
export * from './data';
export * from './review';
export * from './review-fixes';
export * from './confounding';
export * from './measures';
export * from './two-way';
export * from './analysis-code';
export * from './study';
