/**
 * The data worker: one data session (data-steps.ts) holding the table the page loaded into it.
 * The page loads each new file in a fresh worker and keeps the old one until the new file is
 * read, so a bad file or a cancel leaves the earlier data and results in place. Progress goes
 * out at most every 80 ms.
 */
import { serveJobs } from './job-server';
import { DataSession } from './data-steps';

serveJobs(new DataSession().steps, { progressEveryMs: 80 });
