/** The tidy layout as a job step (job-runner.ts): the same entry point as the page and the CLI (src/lib/layout/tidy.ts). */
import { tidyPositions, type LayoutInput, type Positions } from '../layout';
import type { JobSteps } from './job-protocol';

export const layoutSteps: JobSteps<LayoutInput, never, Positions> = (input) => tidyPositions(input);
