/**
 * The reviewer tools as the app runs them: the review of a stated set (verdict, fixes,
 * efficiency advice, instruments) and the stress test (robustness to single changes, sets
 * robust to every added arrow) with progress. Pure functions of the diagram, run on the main
 * thread for small diagrams and in review.worker.ts for large ones.
 */
import type { Diagram } from '../graph/diagram';
import type { JobSteps } from './job-protocol';
import { conditionalInstruments, efficiencyAdvice, planRobustness, reviewAdjustment, setsRobustToAdditions } from '../causal';
import type { AdjustmentReview, EfficiencyAdvice, Instrument, PlanRobustness, RobustSets } from '../causal';

export interface ReviewResult {
	review: AdjustmentReview;
	efficiency: EfficiencyAdvice;
	/** null when the question has more than one exposure or outcome. */
	instruments: Instrument[] | null;
}

export interface StressResult {
	robustness: PlanRobustness;
	robustSets: RobustSets;
}

export type ReviewJob = { kind: 'review'; diagram: Diagram; stated: string[] } | { kind: 'stress'; diagram: Diagram; stated: string[] };

export function runReview(d: Diagram, stated: string[]): ReviewResult {
	const single = d.exposures.length === 1 && d.outcomes.length === 1;
	return {
		// The nearest minimal set is sought among the first 300 listed (the answer says when more exist).
		review: reviewAdjustment(d, { adjusted: stated, maxSets: 300 }),
		efficiency: efficiencyAdvice(d, { adjusted: stated }),
		instruments: single ? conditionalInstruments(d) : null
	};
}

/** Robustness of the stated set, then the sets robust to every addition; progress in [0, 1]. */
export function runStress(d: Diagram, stated: string[], onProgress: (fraction: number) => void = () => {}): StressResult {
	const robustness = planRobustness(d, { adjusted: stated, maxWitnesses: 300, onProgress: (f) => onProgress(0.8 * f) });
	onProgress(0.8);
	const robustSets = setsRobustToAdditions(d);
	onProgress(1);
	return { robustness, robustSets };
}

export function runJob(job: ReviewJob, onProgress?: (fraction: number) => void): ReviewResult | StressResult {
	return job.kind === 'review' ? runReview(job.diagram, job.stated) : runStress(job.diagram, job.stated, onProgress);
}

/** The reviewer tools as job steps (job-runner.ts), for the worker and the main thread alike. */
export const reviewSteps: JobSteps<ReviewJob, number, ReviewResult | StressResult> = (job, context) => runJob(job, (fraction) => context.progress(fraction));
