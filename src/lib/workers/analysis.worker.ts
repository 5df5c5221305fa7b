/**
 * An analysis worker: computes one part of the analysis (verdict, sets or claims; see
 * analysis-steps.ts) off the main thread, so the canvas never waits for it. The app runs one
 * worker per part, so a planned-set edit is answered while the sets or the claims of the same
 * structure are still being computed next to it; a worker still busy with a stale request is
 * terminated and replaced, since a running computation cannot be interrupted otherwise.
 * Claims progress goes out at most every 100 ms.
 */
import { serveJobs } from './job-server';
import { analysisPartSteps } from './analysis-steps';

serveJobs(analysisPartSteps, { progressEveryMs: 100 });
