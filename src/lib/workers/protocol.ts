/** Messages between the app and the analysis worker. Plain data (structured clone). */
import type { Diagram } from '../graph/diagram';
import type { AnalysisLimits, AnalysisProgress, AppAnalysis } from './analysis-steps';

export interface AnalyseRequest {
	id: number;
	diagram: Diagram;
	limits: AnalysisLimits;
}

export type WorkerReply =
	| { id: number; kind: 'progress'; progress: AnalysisProgress; partial: AppAnalysis | null }
	| { id: number; kind: 'done'; analysis: AppAnalysis; ms: number }
	| { id: number; kind: 'failed'; message: string };
