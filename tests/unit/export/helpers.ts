/** Diagrams shared by the export tests: the demo study, and one with hostile labels. */
import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import type { Diagram } from '../../../src/lib/graph/diagram';
import { parseDiagramJson } from '../../../src/lib/graph/native-json';

export const DEMO_PATH = 'static/demo/cycling-hypertension.causeway.json';
export const demo = (): Diagram => parseDiagramJson(readFileSync(DEMO_PATH, 'utf8'));

/** Labels that are markup, entities, TeX, CSV formulas or Markdown in other languages. */
export const HOSTILE_LABELS = [
	'<img src=x onerror=alert(1)>',
	'<script>alert("x")</script>',
	'Tom & Jerry &amp; "quotes" \'single\'',
	'50% of $x_1$ #{braces} ~tilde^ \\back',
	'=HYPERLINK("http://x")',
	'a | b *em* _u_ [link](javascript:alert(1))',
	'Ünïcödé — 血压 🚲',
	'# heading-like',
	'1. list-like',
	']]> </text></svg> --> <!--'
];

/** Demo study with the first variables renamed to the hostile labels (ids unchanged). */
export function hostileDemo(): Diagram {
	const d = demo();
	HOSTILE_LABELS.forEach((label, i) => (d.variables[i].label = label));
	return d;
}

/** True when an outside program runs (`dot -V`, `pdflatex --version`); tests that need it skip otherwise. */
export function hasProgram(command: string, versionFlag: string): boolean {
	try {
		execFileSync(command, [versionFlag], { stdio: 'ignore' });
		return true;
	} catch {
		return false;
	}
}
