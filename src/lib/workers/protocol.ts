/** Messages between the app and the analysis workers. Plain data (structured clone). */
import type { Diagram } from '../graph/diagram';
import type { AnalysisLimits, ClaimsPart, SetsPart, VerdictPart } from './analysis-steps';

/** One part of the analysis for one diagram; each worker computes one part at a time. */
export type PartRequest = { id: number; part: 'verdict' | 'sets' | 'claims'; diagram: Diagram; limits: AnalysisLimits };

export type PartResult =
	| { part: 'verdict'; value: VerdictPart }
	| { part: 'sets'; value: SetsPart }
	| { part: 'claims'; value: ClaimsPart };

export type WorkerReply =
	| { id: number; kind: 'progress'; fraction: number }
	/** The verdict before its paths are counted; the complete part follows as 'done'. */
	| { id: number; kind: 'first'; ms: number; part: 'verdict'; value: VerdictPart }
	| ({ id: number; kind: 'done'; ms: number } & PartResult)
	| { id: number; kind: 'failed'; message: string };
