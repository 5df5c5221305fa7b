// parseDot against Graphviz itself on generated DOT files (fast-check): each file mixes node
// and edge statements, chains whose endpoints are comma lists or subgraphs (nested, named,
// reopened), ports and compass points, node/edge defaults in scopes, `"a" + "b"` names,
// strict graphs, `key`, and `dir` / arrow shapes. `dot -Tjson` (Graphviz, Debian) reads the
// same text; we must agree on the variables (names and order) and on the arrows with their
// attributes, each arrow being the one Graphviz draws (_hdraw_ / _tdraw_: which end got the
// arrowhead); where Graphviz draws some edge with two arrowheads or none, parseDot must refuse
// the file and name that edge. Then HTML-like labels: the lines parseDot reads must be the
// rows of text `dot -Tsvg` draws. Skipped where Graphviz is not installed.
import { spawnSync } from 'node:child_process';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseDot } from '../../../src/lib/graph/dot';
import { hasGraphviz, xmlText } from './dot-test-helpers';

const graphviz = hasGraphviz();
if (!graphviz) console.warn('Graphviz `dot` not found: skipping the generated-DOT comparison (apt-get install graphviz)');

/**
 * Graphviz's output for each of `texts`, from one `dot` process (a process per file took
 * 0.2 s of wall time each on our shared machine): dot reads every graph of its input in turn
 * and prints one document per graph, each ending with a line holding only `}` (JSON) or
 * `</svg>` (SVG).
 */
function runDot(format: 'json' | 'svg', texts: string[]): string[] {
	const run = spawnSync('dot', [`-T${format}`], { input: texts.join('\n'), encoding: 'utf8', maxBuffer: 256 * 1024 * 1024 });
	expect(run.status, `dot -T${format} failed: ${run.stderr}`).toBe(0);
	const docs = run.stdout.split(format === 'json' ? /(?<=^\})\n/m : /(?<=<\/svg>)\n/).filter((d) => d.trim() !== '');
	expect(docs).toHaveLength(texts.length);
	return docs;
}

// ——— Generated files ———

/** Names as written in DOT, with the id Graphviz (and we) read from them. */
const NAMES: [string, string][] = [
	['a', 'a'],
	['b', 'b'],
	['c', 'c'],
	['d', 'd'],
	['Age', 'Age'],
	['"two words"', 'two words'],
	['"x" + "y"', 'xy'],
	['Âge', 'Âge'],
	['12', '12'],
	['-3.5', '-3.5'],
	['"say \\"hi\\""', 'say "hi"']
];
const PORTS = ['', ':p', ':ne', ':p:sw', ':"p x":c', ':w'];
const ATTRS = ['color=red', 'style=dashed', 'dir=back', 'dir=forward', 'dir=both', 'dir=none', 'arrowtail=dot', 'arrowhead=none', 'arrowtail=none', 'headlabel="h"', 'shape=box', 'key=k1', 'label="L"'];

const name = fc.constantFrom(...NAMES.map(([dot]) => dot));
const ref = fc.tuple(name, fc.constantFrom(...PORTS)).map(([n, p]) => n + p);
const attrList = fc.option(fc.uniqueArray(fc.constantFrom(...ATTRS), { minLength: 1, maxLength: 3 }).map((a) => ` [${a.join(', ')}]`), { nil: '' });
const subName = fc.option(fc.constantFrom('s1', 's2'), { nil: null }).map((n) => (n === null ? '' : `subgraph ${n} `));

/** Statements, `depth` levels of subgraphs deep at most (this generator's recursion is bounded). */
function statements(depth: number): fc.Arbitrary<string> {
	const endpoint: fc.Arbitrary<string> =
		depth <= 0
			? fc.array(ref, { minLength: 1, maxLength: 2 }).map((r) => r.join(', '))
			: fc.oneof({ weight: 3, arbitrary: fc.array(ref, { minLength: 1, maxLength: 2 }).map((r) => r.join(', ')) }, { weight: 1, arbitrary: fc.tuple(subName, statements(depth - 1)).map(([s, body]) => `${s}{ ${body} }`) });
	const statement = fc.oneof(
		fc.tuple(ref, attrList).map(([r, a]) => r + a),
		fc.tuple(fc.array(endpoint, { minLength: 2, maxLength: 3 }), attrList).map(([e, a]) => e.join(' -> ') + a),
		fc.tuple(fc.constantFrom('node', 'edge', 'NODE', 'Edge'), fc.constantFrom(...ATTRS)).map(([k, a]) => `${k} [${a}]`),
		...(depth > 0 ? [fc.tuple(subName, statements(depth - 1)).map(([s, body]) => `${s}{ ${body} }`)] : [])
	);
	return fc.array(fc.tuple(statement, fc.constantFrom(';', '\n', ' ', ' /* c */ ', ' // c\n')), { maxLength: 5 }).map((list) => list.map(([s, sep]) => s + sep).join(''));
}
const file = fc.tuple(fc.boolean(), statements(2)).map(([strict, body]) => `${strict ? 'strict ' : ''}digraph {\n${body}\n}\n`);

// ——— Graphviz's reading, as arrows ———

interface GvJson {
	_subgraph_cnt?: number;
	objects?: { name: string; [k: string]: unknown }[];
	edges?: { tail: number; head: number; _hdraw_?: unknown[]; _tdraw_?: unknown[]; [k: string]: unknown }[];
}
const LAYOUT = new Set(['_gvid', 'pos', 'lp', 'head_lp', 'tail_lp', 'xlp', 'tail', 'head', 'dir', 'key', 'label']);
const otherEnd = (key: string) => key.replace(/head|tail/, (w) => (w === 'head' ? 'tail' : 'head'));

function attributes(o: Record<string, unknown>, skip: ReadonlySet<string>): [string, string][] {
	return Object.entries(o)
		.filter((e): e is [string, string] => typeof e[1] === 'string' && e[1] !== '' && !skip.has(e[0]))
		.sort(([a], [b]) => (a < b ? -1 : 1));
}

describe.skipIf(!graphviz)('parseDot agrees with Graphviz on generated DOT', () => {
	it('variables, arrows (as drawn) and their attributes; refusal exactly where an edge has two arrowheads or none', () => {
		const texts = fc.sample(file, 200);
		const outputs = runDot('json', texts);
		let read = 0;
		let refused = 0;
		for (const [k, text] of texts.entries()) {
			const gv = JSON.parse(outputs[k]) as GvJson;
			const objects = gv.objects ?? [];
			const nodes = objects.slice(gv._subgraph_cnt ?? 0);
			const names = objects.map((o) => o.name);
			const gvArrows: string[] = [];
			let oneWay = true;
			for (const e of gv.edges ?? []) {
				const head = (e._hdraw_?.length ?? 0) > 0;
				const tail = (e._tdraw_?.length ?? 0) > 0;
				if (head === tail) oneWay = false;
				const attrs = attributes(e, LAYOUT);
				gvArrows.push(JSON.stringify(head ? [names[e.tail], names[e.head], attrs] : [names[e.head], names[e.tail], attrs.map(([k, v]) => [otherEnd(k), v]).sort(([a], [b]) => (a < b ? -1 : 1))]));
			}
			if (!oneWay) {
				expect(() => parseDot(text), text).toThrow(/has arrowheads at both ends|is drawn without an arrowhead/);
				refused++;
				continue;
			}
			const d = parseDot(text);
			read++;
			expect(d.variables.map((v) => v.id), text).toEqual(nodes.map((n) => n.name));
			for (const [i, v] of d.variables.entries()) {
				const gvNode = attributes(nodes[i], new Set(['_gvid', 'name', 'pos', 'width', 'height', 'label', '_draw_', '_ldraw_']));
				expect(Object.entries(v.extra ?? {}).sort(([a], [b]) => (a < b ? -1 : 1)), `${text}\nnode ${v.id}`).toEqual(gvNode);
			}
			const ours = d.arrows.map((a) =>
				JSON.stringify([
					a.from,
					a.to,
					Object.entries(a.extra ?? {})
						.filter(([k]) => k !== 'key' && k !== 'label')
						.map(([k, v]) => [k, typeof v === 'string' ? v : (v as { html: string }).html])
						.sort(([x], [y]) => (x < y ? -1 : 1))
				])
			);
			expect(ours.sort(), text).toEqual(gvArrows.sort());
		}
		// Both outcomes were exercised.
		expect(read).toBeGreaterThan(20);
		expect(refused).toBeGreaterThan(20);
	}, 120_000);

	it('HTML-like labels: the lines read are the rows of text Graphviz draws', () => {
		const word = fc.constantFrom('Age', 'years', 'BMI', '&amp;', '&lt;x&gt;', '&eacute;t&eacute;', '(mmHg)', 'q&apos;s');
		const cellText = fc.array(fc.tuple(word, fc.constantFrom('', 'b', 'i', 'font color="red"')), { minLength: 1, maxLength: 3 }).map((ws) => ws.map(([w, tag]) => (tag ? `<${tag}>${w}</${tag.split(' ')[0]}>` : w)).join(' '));
		const table = fc.array(fc.array(cellText, { minLength: 1, maxLength: 3 }), { minLength: 1, maxLength: 3 }).map((rows) => `<table border="0">${rows.map((cells) => `<tr>${cells.map((c) => `<td>${c}</td>`).join('')}</tr>`).join('')}</table>`);
		const lines = fc.array(cellText, { minLength: 1, maxLength: 3 }).map((ls) => ls.join('<br/>'));
		const labels = fc.array(fc.oneof(table, lines), { minLength: 1, maxLength: 6 });
		const texts = fc.sample(labels, 60).map((list) => `digraph {\n${list.map((l, i) => `  n${i} [label=<${l}>];`).join('\n')}\n}\n`);
		const svgs = runDot('svg', texts);
		for (const [k, text] of texts.entries()) {
			const d = parseDot(text);
			for (const m of svgs[k].matchAll(/<title>n(\d+)<\/title>([^]*?)<\/g>/g)) {
				// Text pieces top to bottom (cells of one row differ by a pixel or so in y), a row
				// starting where y jumps by more than 4 px; left to right within a row.
				const pieces = [...m[2].matchAll(/<text[^>]*? x="([-\d.]+)" y="([-\d.]+)"[^>]*>([^<]*)<\/text>/g)]
					.map((t) => ({ x: Number(t[1]), y: Number(t[2]), text: xmlText(t[3]) }))
					.sort((p, q) => p.y - q.y);
				const rows: { y: number; pieces: typeof pieces }[] = [];
				for (const p of pieces) {
					const last = rows[rows.length - 1];
					if (last && p.y - last.y <= 4) last.pieces.push(p);
					else rows.push({ y: p.y, pieces: [p] });
				}
				const drawn = rows
					.map((r) => r.pieces.sort((p, q) => p.x - q.x).map((p) => p.text).join(' ').replace(/[\s\u00a0]+/g, ' ').trim())
					.filter((line) => line !== '');
				expect(d.variables[Number(m[1])].label.split('\n'), text).toEqual(drawn);
			}
		}
	}, 120_000);
});
