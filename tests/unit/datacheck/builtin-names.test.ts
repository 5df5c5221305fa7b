/**
 * Variables and columns named like JavaScript built-ins ("constructor", "toString", "valueOf",
 * "hasOwnProperty") are just names: the data checks on such a study equal the checks on the
 * same study with plain names. Before, a record lookup found Object.prototype's members and
 * a column named toString was refused as "too many to use as function toString() { … } levels".
 */
import { describe, expect, it } from 'vitest';
import { runDataChecks } from '../../../src/lib/datacheck';
import { parseTable } from '../../../src/lib/stats';
import type { Diagram } from '../../../src/lib/graph/diagram';
import { xorshift } from '../../../bench/random-dag';

const BUILT_IN = ['constructor', 'toString', 'valueOf', 'hasOwnProperty'];
const PLAIN = ['c', 't', 'v', 'h'];

function study(names: readonly string[]): { diagram: Diagram; csv: string } {
	const [c, t, v, h] = names;
	const diagram: Diagram = {
		title: 'built-in names',
		variables: names.map((id) => ({ id, label: id, measured: true })),
		arrows: [
			{ from: c, to: t },
			{ from: v, to: c },
			{ from: v, to: t },
			{ from: h, to: t }
		],
		exposures: [c],
		outcomes: [t],
		adjusted: [v]
	};
	const rand = xorshift(11);
	const normal = () => Math.sqrt(-2 * Math.log(rand() || 1e-12)) * Math.cos(2 * Math.PI * rand());
	const lines = [names.join(',')];
	for (let i = 0; i < 300; i++) {
		const vv = normal();
		const hh = normal();
		const cc = vv + normal() > 0 ? 1 : 0;
		const tt = cc + vv + hh + normal();
		lines.push(`${cc},${tt.toFixed(3)},${vv.toFixed(3)},${hh.toFixed(3)}`);
	}
	return { diagram, csv: lines.join('\n') };
}

function checks(names: readonly string[]) {
	const { diagram, csv } = study(names);
	const parsed = parseTable(csv);
	if (!parsed.ok) throw new Error(parsed.error.message);
	const r = runDataChecks(diagram, parsed.table);
	const rename = (s: string) => names.reduce((acc, n, i) => acc.split(n).join(`#${i}`), s);
	return {
		linked: Object.keys(r.mapping.columns).length,
		arrows: r.arrows.checks.map((a) => [rename(a.from), rename(a.to), a.support, a.measure?.value]),
		claims: r.claims.checks.map((c) => c.p),
		estimates: r.estimates?.rows.map((e) => [e.estimate, e.ci]),
		confounders: r.confounders?.candidates.length
	};
}

describe('variables and columns named like JavaScript built-ins', () => {
	it('give the same checks and estimates as plain names', () => {
		const built = checks(BUILT_IN);
		const plain = checks(PLAIN);
		expect(built.linked).toBe(4);
		expect(built.arrows.length).toBe(4);
		expect(built.claims.length).toBe(2);
		expect(built.estimates?.length).toBeGreaterThan(0);
		expect(built).toEqual(plain);
	});
});
