/**
 * Counts in the command's own sentences: "1 set", "2 sets", "30,000,000,000 steps" — the noun in
 * the right number and the digits grouped, never in e-notation. Uses describeCount rather than
 * toLocaleString: the first toLocaleString call starts ICU, about a tenth of a second of the
 * command's start-up (node --cpu-prof, src/lib/limits.ts).
 */
import { describeCount } from '../lib/limits';

export function counted(n: number, singular: string, plural = `${singular}s`): string {
	return `${describeCount(n)} ${n === 1 ? singular : plural}`;
}
