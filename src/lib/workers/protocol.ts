/** Messages between the app and the analysis worker. Plain data (structured clone). */
import type { Diagram } from '../graph/diagram';
import type { Claim } from '../causal';
import type { AnalysisLimits, AnalysisProgress, AppAnalysis } from './analysis-steps';

export interface AnalyseRequest {
	id: number;
	diagram: Diagram;
	limits: AnalysisLimits;
	/** Claims already listed for this structure (see claimsKey), so the worker skips them. */
	knownClaims?: { claims: Claim[]; truncated: boolean };
}

export type WorkerReply =
	| { id: number; kind: 'progress'; progress: AnalysisProgress; partial: AppAnalysis | null }
	| { id: number; kind: 'done'; analysis: AppAnalysis; ms: number }
	| { id: number; kind: 'failed'; message: string };
