/**
 * Reading the esbuild metafile of the command's bundle (dist-cli/meta.json, written by
 * scripts/build-cli.mjs): which output files start-up loads. Shared by the bundle test and
 * bench/cli.ts.
 */
import { readFileSync } from 'node:fs';

export interface BundleMeta {
	outputs: Record<string, { bytes: number; inputs: Record<string, unknown>; imports: { path: string; kind: string }[] }>;
}

export function readBundleMeta(file = 'dist-cli/meta.json'): BundleMeta {
	return JSON.parse(readFileSync(file, 'utf8')) as BundleMeta;
}

/** The entry and every output it imports statically, transitively: what start-up loads. */
export function eagerOutputs(meta: BundleMeta, entry = 'dist-cli/causeway.mjs'): string[] {
	const eager = new Set<string>();
	const stack = [entry];
	while (stack.length > 0) {
		const file = stack.pop() as string;
		if (eager.has(file) || !meta.outputs[file]) continue;
		eager.add(file);
		for (const i of meta.outputs[file].imports) if (i.kind === 'import-statement') stack.push(i.path);
	}
	return [...eager];
}
