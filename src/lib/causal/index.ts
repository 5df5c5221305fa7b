/**
 * The engine's one façade, in terms of variable ids: what the CLI prints, the app shows and the
 * workers compute. Every function validates the diagram and the question first and throws
 * InputError with a one-line message naming the problem.
 *
 * Convention inside this folder: functions whose names end in `Idx` (and types ending in `Idx`)
 * work on a CompiledDag (src/lib/graph/compiled.ts), where variables are indices 0..n-1 in the
 * diagram's order and sets are number arrays or Uint8Array masks; they do no validation and
 * never see ids. The façade modules (analysis.ts, reviewer.ts, absent-arrows.ts) turn ids into
 * indices (question.ts), call the `Idx` functions, and turn the answers back into sorted ids.
 * Code outside src/lib/causal imports from this file only.
 */
export { compareIds, compareSets, sortIds } from './question';
export type { QuestionOptions } from './question';
export {
	adjustmentSets,
	analyse,
	checkAdjustment,
	checkAndPaths,
	checkFirst,
	dSeparation,
	exposureOutcomePaths,
	impliedClaims,
	listImpliedClaims,
	variableRoles
} from './analysis';
export type { Analysis } from './analysis';
export {
	compareDiagrams,
	conditionalInstruments,
	efficiencyAdvice,
	planRobustness,
	reviewAdjustment,
	setsRobustToAdditions
} from './reviewer';
export { criticalAbsentArrows, withPlannedReasons } from './absent-arrows';
export type { AbsentArrowOptions, AbsentArrowReport, CriticalAbsentArrow } from './absent-arrows';
export type * from './types';
export type * from './review-types';
