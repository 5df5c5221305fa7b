/**
 * The analysis parts as jobs (job-runner.ts): what one job asks for, its progress and its
 * result. Plain data (structured clone).
 */
import type { Diagram } from '../graph/diagram';
import type { AnalysisLimits, ClaimsPart, SetsPart, VerdictPart } from './analysis-steps';

/** One part of the analysis for one diagram; each worker computes one part at a time. */
export type PartJob = {
	part: 'verdict' | 'sets' | 'claims';
	diagram: Diagram;
	limits: AnalysisLimits;
	/** Send the verdict before its paths are counted (in a worker, so the page shows it at once). */
	early: boolean;
};

export type PartResult =
	| { part: 'verdict'; value: VerdictPart }
	| { part: 'sets'; value: SetsPart }
	| { part: 'claims'; value: ClaimsPart };

export type PartProgress =
	/** The claims listed so far, 0..1. */
	| { kind: 'fraction'; fraction: number }
	/** The verdict before its paths are counted; the complete part follows as the result. */
	| { kind: 'first'; ms: number; value: VerdictPart };
