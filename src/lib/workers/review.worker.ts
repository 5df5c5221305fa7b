/**
 * The reviewer-tools worker: one job at a time (a review or a stress test); the app cancels by
 * terminating it. Progress goes out at most every 100 ms.
 */
import { serveJobs } from './job-server';
import { reviewSteps } from './review-steps';

serveJobs(reviewSteps, { progressEveryMs: 100 });
