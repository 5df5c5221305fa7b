/**
 * Runs `causeway` in-process through main() with files injected by path (others read from
 * disk) and captures stdout, stderr and the files it writes; plus a small diagram builder.
 * Shared by the command-line tests.
 */
import { readFileSync } from 'node:fs';
import { main } from '../../../src/cli/main';
import { arrowPairs, M_BIAS_LOWER_CASE } from '../reference/published-diagrams';

export async function runCli(args: string[], files: Record<string, string> = {}) {
	let out = '';
	let err = '';
	const written: Record<string, string> = {};
	const code = await main(args, {
		stdout: (s) => (out += s),
		stderr: (s) => (err += s),
		readFile: async (p) => (p in files ? files[p] : readFileSync(p, 'utf8')),
		writeFile: async (p, c) => {
			written[p] = typeof c === 'string' ? c : Buffer.from(c).toString('utf8');
		}
	});
	return { code, out, err, written };
}

/** A native diagram file from arrows; ids become variables (label = id unless given). */
export function diagramJson(arrows: [string, string][], extra: Record<string, unknown> = {}, labels: Record<string, string> = {}): string {
	const ids = [...new Set(arrows.flat())];
	return JSON.stringify({
		format: 'causeway.diagram',
		version: 1,
		title: 't',
		variables: ids.map((id) => ({ id, label: labels[id] ?? id, measured: true })),
		arrows: arrows.map(([from, to]) => ({ from, to })),
		exposures: [],
		outcomes: [],
		adjusted: [],
		...extra
	});
}

// M-bias (reference/published-diagrams.ts): e ← u1 → m ← u2 → d, e → d.
export const MBIAS = diagramJson(arrowPairs(M_BIAS_LOWER_CASE), { exposures: M_BIAS_LOWER_CASE.exposures, outcomes: M_BIAS_LOWER_CASE.outcomes });
