/** Messages between the app and the reviewer-tools worker (structured clone). */
import type { ReviewJob, ReviewResult, StressResult } from './review-steps';

export type ReviewRequest = ReviewJob & { id: number };

export type ReviewReply =
	| { id: number; kind: 'progress'; fraction: number }
	| { id: number; kind: 'done'; result: ReviewResult | StressResult; ms: number }
	| { id: number; kind: 'failed'; message: string };
