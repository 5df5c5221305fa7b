/**
 * Seeded native diagram files for the command-line benchmark (bench/cli.ts): the random DAGs of
 * bench/random-dag.ts (average degree 4, so n variables and 2n arrows) as causeway.diagram JSON,
 * each variable with a label as the app writes it, with the two ends of the first arrow as exposure and outcome and every tenth variable left
 * unmeasured.
 *
 *   node --import tsx bench/cli-diagram.ts 100000 /tmp/big.json    writes one file (≈12 MiB)
 */
import { writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { randomDag } from './random-dag';

export function randomDiagramJson(n: number, seed = n): string {
	const { g, arrows } = randomDag(n, 4, seed);
	const ids = g.ids;
	const [x, y] = arrows[0];
	return JSON.stringify({
		format: 'causeway.diagram',
		version: 2,
		title: `Random DAG, ${n} variables, seed ${seed}`,
		variables: ids.map((id, i) => ({ id, label: `Variable ${i}`, measured: i % 10 !== 9 })),
		arrows: arrows.map(([f, t]) => ({ from: ids[f], to: ids[t] })),
		exposures: [ids[x]],
		outcomes: [ids[y]],
		adjusted: []
	});
}

if (process.argv[1] === fileURLToPath(import.meta.url)) {
	const n = Number(process.argv[2] ?? 100_000);
	const out = process.argv[3] ?? `/tmp/causeway-${n}.json`;
	writeFileSync(out, randomDiagramJson(n));
	console.log(out);
}
