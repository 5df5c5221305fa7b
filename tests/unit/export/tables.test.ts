/**
 * CSV and Markdown tables, read back with papaparse (RFC 4180) and markdown-it: the same ids,
 * labels, roles and sets the engine gives, hostile labels kept whole, spreadsheet formulas
 * defused.
 */
import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import MarkdownIt from 'markdown-it';
import { arrowsCsv, setsCsv, setsMarkdown, variablesCsv } from '../../../src/lib/export/tables';
import { adjustmentSets, checkAdjustment, variableRoles } from '../../../src/lib/causal/analysis';
import { demo, hostileDemo } from './helpers';
import { diagramOf, PEARL_BACK_DOOR } from '../reference/published-diagrams';

const rows = (csv: string) => Papa.parse<string[]>(csv.trimEnd(), { newline: '\r\n' }).data;

describe('CSV tables', () => {
	it('variables: id,label,measured,roles with labels kept whole and formulas defused', () => {
		const d = hostileDemo();
		const table = rows(variablesCsv(d, variableRoles(d)));
		expect(table[0]).toEqual(['id', 'label', 'measured', 'roles']);
		expect(table).toHaveLength(d.variables.length + 1);
		d.variables.forEach((v, i) => {
			const [id, label, measured] = table[i + 1];
			expect(id).toBe(v.id);
			expect(label).toBe(/^[=+\-@\t\r]/.test(v.label) ? `'${v.label}` : v.label);
			expect(measured).toBe(String(v.measured));
		});
		const byId = new Map(table.slice(1).map((r) => [r[0], r[3].split(';')]));
		expect(byId.get('cycling')).toEqual(['exposure']);
		expect(byId.get('age')).toEqual(['confounder', 'common-cause', 'adjusted']);
		expect(byId.get('fitness')).toEqual(['mediator']);
		expect(byId.get('family_history')).toEqual(['precision']);
	});

	it('arrows: one row per arrow with both labels', () => {
		const d = demo();
		const table = rows(arrowsCsv(d));
		expect(table[0]).toEqual(['from', 'to', 'from_label', 'to_label']);
		expect(table.slice(1).map((r) => [r[0], r[1]])).toEqual(d.arrows.map((a) => [a.from, a.to]));
	});

	it('sets: every minimal set, the smallest, the optimal and the planned set with its verdict (Pearl 2009 §3.3.1 back-door example, from memory)', () => {
		// Pearl's 8-variable back-door example: minimal sets {X1,X4}, {X2,X4}, {X3,X4}, {X4,X5}.
		const d = diagramOf(PEARL_BACK_DOOR, { adjusted: ['X4'] });
		const sets = adjustmentSets(d);
		const check = checkAdjustment(d);
		const table = rows(setsCsv(d, { sets, check }));
		expect(table[0]).toEqual(['kind', 'number', 'size', 'ids', 'labels', 'sufficient']);
		const minimal = table.filter((r) => r[0] === 'minimal').map((r) => r[3]);
		expect(minimal).toEqual(['X1;X4', 'X2;X4', 'X3;X4', 'X4;X5']);
		expect(table.find((r) => r[0] === 'planned')).toEqual(['planned', '', '1', 'X4', 'X4', 'false']);
		const md = new MarkdownIt().render(setsMarkdown(d, { sets, check }));
		expect(md).toContain('<td>Minimal sufficient set 1</td>');
		expect((md.match(/<tr>/g) ?? []).length).toBe(1 + 4 + 1 + (sets.optimal ? 1 : 0) + 1);
	});
});
