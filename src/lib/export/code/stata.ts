/**
 * Stata code for a chosen adjustment set: import delimited, Causeway's missing-value codes,
 * complete cases, factor variables with the base level Causeway uses (ib#. on the codes; text
 * columns encoded with a value label whose first code is the reference), logit … , or (or
 * regress) for the crude and adjusted models and, for a binary exposure and outcome,
 * standardized risks with margins (delta method, covariates as observed) and the risk and
 * odds ratios with nlcom. Stata cannot run on our machines: tests check this text's structure
 * only. O(columns).
 */
import { CODE_STEP, codeHeaderLines, unusableNameComment } from '../../wording/analysis-code';
import { codeHeader, modelColumns, type CodeColumn, type CodeSpec, type CodeTerm } from './spec';

/** A valid Stata name: as it is, or with other characters made "_" (32 characters at most). */
export function stataName(column: string): string {
	if (/^[A-Za-z_][A-Za-z0-9_]{0,31}$/.test(column)) return column;
	const cleaned = column.replace(/[^A-Za-z0-9_]/g, '_');
	return (/^[A-Za-z_]/.test(cleaned) ? cleaned : `_${cleaned}`).slice(0, 32);
}

const stataString = (s: string) => (s.includes('"') ? `\`"${s}"'` : `"${s}"`);

/** How a factor is written: the variable used and the code of each level (reference first). */
interface Coded {
	name: string;
	codeOf: (level: string) => number;
	/** Lines that make the coded variable, if one is made. */
	make: string[];
}

function coded(t: CodeTerm): Coded {
	const c = t.col;
	const name = stataName(c.column);
	const levels = c.levels.map((l) => (c.numbersInFile ? String(Number(l)) : l));
	if (c.numbersInFile && levels.every((l) => /^\d+$/.test(l))) return { name, codeOf: Number, make: [] };
	const made = `${name.slice(0, 30)}_c`;
	if (c.numbersInFile) {
		// egen group() numbers the values 1, 2, … in ascending order.
		const sorted = [...levels].sort((a, b) => Number(a) - Number(b));
		return { name: made, codeOf: (l) => sorted.indexOf(l) + 1, make: [`egen ${made} = group(${name})`] };
	}
	// A value label defined before encode fixes the codes: the reference level gets 1.
	const order = [t.reference!, ...levels.filter((l) => l !== t.reference)];
	const label = `${name.slice(0, 26)}_lbl`;
	return {
		name: made,
		codeOf: (l) => order.indexOf(l) + 1,
		make: [`label define ${label} ${order.map((l, i) => `${i + 1} ${stataString(l)}`).join(' ')}`, `encode ${name}, generate(${made}) label(${label})`]
	};
}

function termText(t: CodeTerm, forMargins: boolean): string {
	if (t.as === 'numeric') return forMargins ? `i.${stataName(t.col.column)}` : stataName(t.col.column);
	const c = coded(t);
	return `ib${c.codeOf(t.reference!)}.${c.name}`;
}

function outcomeName(s: CodeSpec): string {
	const c = stataName(s.outcome.col.column);
	return s.outcome.prep.kind === 'as-is' ? c : `${c.slice(0, 26)}_${s.outcome.prep.kind === 'event' ? 'event' : 'score'}`;
}

const value = (c: CodeColumn, level: string) => (c.numbersInFile ? level : stataString(level));

export function stataCode(s: CodeSpec): string {
	const out: string[] = codeHeaderLines({ ...codeHeader(s), language: 'stata' }).map((l) => `* ${l}`);
	const cols = modelColumns(s);
	for (const c of cols) if (stataName(c.column) !== c.column) out.push(`* ${unusableNameComment(c.column, stataName(c.column), 'stata')}`);
	const delimiter = s.format.delimiter === '\t' ? 'tab' : `"${s.format.delimiter}"`;
	out.push('', 'version 16', `* ${CODE_STEP.read}`);
	out.push(`import delimited using ${stataString(s.dataFile)}, clear varnames(1) case(preserve) delimiters(${delimiter})${s.format.decimalComma ? ' decimalseparator(,)' : ''} encoding("utf-8")`);
	const numeric = cols.filter((c) => c.numbersInFile).map((c) => stataName(c.column));
	const text = cols.filter((c) => !c.numbersInFile).map((c) => stataName(c.column));
	if (numeric.length) out.push(`foreach v in ${numeric.join(' ')} {`, '    capture confirm numeric variable `v\'', '    if _rc destring `v\', replace force', '}');
	if (text.length) out.push(`foreach v in ${text.join(' ')} {`, '    replace `v\' = "" if inlist(`v\', "NA", ".", "NaN", "NULL")', '}');
	out.push(`* ${CODE_STEP.complete}`, `drop if missing(${cols.map((c) => stataName(c.column)).join(', ')})`);
	const factors = [s.exposure, ...s.covariates].filter((t) => t.as === 'factor').flatMap((t) => coded(t).make);
	if (factors.length) out.push(`* ${CODE_STEP.factors}`, ...factors);
	const y = outcomeName(s);
	const yc = stataName(s.outcome.col.column);
	const prep = s.outcome.prep;
	if (prep.kind === 'event') out.push(`* ${CODE_STEP.outcomeEvent}`, `generate byte ${y} = (${yc} == ${value(s.outcome.col, prep.event)})`);
	if (prep.kind === 'scores') {
		out.push(`* ${CODE_STEP.outcomeScores}`, `generate ${y} = .`);
		prep.levels.forEach((l, i) => out.push(`replace ${y} = ${i} if ${yc} == ${value(s.outcome.col, l)}`));
	}
	const command = s.model === 'logistic' ? 'logit' : 'regress';
	const option = s.model === 'logistic' ? ', or' : '';
	const x = termText(s.exposure, s.standardize !== null);
	const rhs = [x, ...s.covariates.map((t) => termText(t, false))].join(' ');
	out.push('', `* ${CODE_STEP.crude}`, `${command} ${y} ${x}${option}`);
	out.push(`* ${CODE_STEP.adjusted}${s.model === 'logistic' ? ` ${CODE_STEP.oddsRatios}` : ''}`, `${command} ${y} ${rhs}${option}`);
	if (s.standardize) {
		const xv = x.replace(/^i?b?\d*\./, '');
		const code = (level: string) => (s.exposure.as === 'numeric' ? Number(level) : coded(s.exposure).codeOf(level));
		const [e1, e0] = [`_b[${code(s.standardize.exposed)}.${xv}]`, `_b[${code(s.standardize.unexposed)}.${xv}]`];
		out.push('', `* ${CODE_STEP.standardize}`);
		out.push(`margins ${xv}`, `margins r.${xv}`, `margins ${xv}, post`);
		out.push(`nlcom (log_risk_ratio: ln(${e1} / ${e0})) (log_marginal_odds_ratio: ln(${e1} / (1 - ${e1})) - ln(${e0} / (1 - ${e0})))`);
		out.push('* The last two are logarithms: exponentiate the estimates and the interval limits.');
	}
	return `${out.join('\n')}\n`;
}
