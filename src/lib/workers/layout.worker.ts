/** Runs the tidy layout off the main thread (layout-steps.ts). */
import { serveJobs } from './job-server';
import { layoutSteps } from './layout-steps';

serveJobs(layoutSteps);
