/**
 * The TikZ export compiled by pdflatex (Debian's texlive-latex-base + texlive-pictures), with
 * hostile labels: LaTeX specials must be escaped so the document compiles and no label runs
 * as a command. Skipped with a message where pdflatex is not installed (CI installs only what
 * .ci/run installs).
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { writeTikz } from '../../../src/lib/export/tikz';
import { escapeLatex } from '../../../src/lib/export/escape';
import { variableRoles } from '../../../src/lib/causal/analysis';
import { demo, hostileDemo, hasProgram } from './helpers';

const pdflatex = hasProgram('pdflatex', '--version');
if (!pdflatex) console.warn('pdflatex not found: skipping the TikZ compile checks (apt-get install texlive-latex-base texlive-pictures)');

const dir = mkdtempSync(join(tmpdir(), 'causeway-tikz-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function compile(name: string, tex: string): { ok: boolean; log: string } {
	writeFileSync(join(dir, `${name}.tex`), tex);
	const run = spawnSync('pdflatex', ['-interaction=nonstopmode', '-halt-on-error', '-no-shell-escape', `${name}.tex`], { cwd: dir, encoding: 'utf8', timeout: 60_000 });
	return { ok: run.status === 0, log: run.stdout };
}

describe('TikZ export', () => {
	it('names the packages it needs and escapes every label', () => {
		const d = hostileDemo();
		const tikz = writeTikz(d, variableRoles(d));
		expect(tikz).toContain('\\usetikzlibrary{arrows.meta}');
		expect(tikz).toMatch(/^\\begin\{tikzpicture\}/m);
		expect(tikz).toContain(escapeLatex(d.variables[3].label));
		expect(tikz).not.toContain('$x_1$');
		expect(escapeLatex('50% $x_1$ #{a} ~^\\')).toBe('50\\% \\$x\\_1\\$ \\#\\{a\\} \\textasciitilde{}\\textasciicircum{}\\textbackslash{}');
	});

	it.skipIf(!pdflatex)('compiles with pdflatex, in colour and black-and-white, with hostile labels', () => {
		const d = hostileDemo();
		// pdflatex cannot draw CJK or emoji without extra packages: those stay out of this check
		// (docs/export.md says to use LuaLaTeX or XeLaTeX for them).
		d.variables[6].label = 'Ünïcödé — café';
		for (const [name, mono] of [
			['colour', false],
			['mono', true]
		] as const) {
			const { ok, log } = compile(name, writeTikz(d, variableRoles(d), { standalone: true, mono }));
			expect(ok, log.split('\n').filter((l) => l.startsWith('!')).join('\n')).toBe(true);
			expect(readFileSync(join(dir, `${name}.pdf`)).subarray(0, 5).toString()).toBe('%PDF-');
			// Escaped text means no undefined control sequence from a label.
			expect(log).not.toContain('Undefined control sequence');
		}
	});

	it.skipIf(!pdflatex)('compiles as a picture inside a user document', () => {
		const d = demo();
		const doc = `\\documentclass{article}\n\\usepackage{tikz}\n\\usetikzlibrary{arrows.meta}\n\\usepackage{graphicx}\n\\begin{document}\nFigure:\n\n\\resizebox{\\linewidth}{!}{%\n${writeTikz(d, variableRoles(d), { legend: false })}}\n\\end{document}\n`;
		const { ok, log } = compile('inline', doc);
		expect(ok, log.slice(-2000)).toBe(true);
	});
});
