/**
 * The variable and arrow lists of a diagram the fast reader read, made from the scan when every
 * variable has the plain shape {"id", "label", "measured"} and every arrow {"from", "to"} (what
 * Causeway writes without positions or notes). The full reader takes such objects from JSON.parse
 * as they are (native-json.ts, toDiagram), so these are equal to its lists, key order included;
 * the property tests check it. Otherwise the caller uses the full reader's lists.
 *
 * Why: `causeway dsep` and `check` print a path with its arrows' directions (they look the
 * arrows up in the list), and reading the whole file again for that doubled the time of a
 * 100,000-variable `dsep`. O(n + m).
 */
import type { Arrow, Variable } from '../diagram';
import { LABEL_ESCAPED, LABEL_WIDE, type ScannedDiagram } from './scan-diagram';
import { spanText } from './texts';

export function scannedVariables(s: ScannedDiagram, ids: readonly string[]): Variable[] {
	const out = new Array<Variable>(s.n);
	for (let i = 0; i < s.n; i++) {
		const flags = s.labelFlags[i];
		const label = spanText(s.bytes, s.labels[2 * i], s.labels[2 * i + 1], (flags & LABEL_WIDE) !== 0, (flags & LABEL_ESCAPED) !== 0);
		out[i] = { id: ids[i], label, measured: s.measured[i] === 1 };
	}
	return out;
}

export function scannedArrows(ids: readonly string[], from: Int32Array, to: Int32Array): Arrow[] {
	const out = new Array<Arrow>(from.length);
	for (let e = 0; e < from.length; e++) out[e] = { from: ids[from[e]], to: ids[to[e]] };
	return out;
}
