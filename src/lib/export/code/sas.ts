/**
 * SAS code for a chosen adjustment set: PROC IMPORT, complete cases in a DATA step, CLASS
 * statements with (ref="…") for categorical columns, PROC LOGISTIC (or PROC GLM for a numeric
 * outcome) for the crude and adjusted models with Wald intervals and, for a binary exposure and
 * outcome, standardized risks by scoring the stored model with the exposure set to each level
 * (PROC PLM) and averaging. SAS cannot run on our machines: tests check this text's structure
 * only. O(columns).
 */
import { CODE_STEP, codeHeaderLines, SAS_DECIMAL_COMMA, SAS_IMPORT_CAUTION, unusableNameComment } from '../../wording/analysis-code';
import { codeHeader, modelColumns, type CodeSpec, type CodeTerm } from './spec';

/** A SAS name: as it is when standard, else a name literal ("…"n). */
export function sasName(column: string): string {
	return /^[A-Za-z_][A-Za-z0-9_]{0,31}$/.test(column) ? column : `"${column.replace(/"/g, '""')}"n`;
}

const sasString = (s: string) => `"${s.replace(/"/g, '""')}"`;
/** A comment that cannot end early. */
const comment = (s: string) => `/* ${s.replace(/\*\//g, '* /')} */`;

export function sasCode(s: CodeSpec): string {
	const out: string[] = codeHeaderLines({ ...codeHeader(s), language: 'sas' }).map(comment);
	const cols = modelColumns(s);
	const literal = cols.some((c) => sasName(c.column) !== c.column);
	for (const c of cols) if (sasName(c.column) !== c.column) out.push(comment(unusableNameComment(c.column, sasName(c.column), 'sas')));
	out.push(comment(SAS_IMPORT_CAUTION));
	if (s.format.decimalComma) out.push(comment(SAS_DECIMAL_COMMA));
	out.push('');
	if (literal) out.push('options validvarname=any;');
	const dbms = s.format.delimiter === ',' ? 'csv' : s.format.delimiter === '\t' ? 'tab' : 'dlm';
	out.push(comment(CODE_STEP.read), `proc import datafile=${sasString(s.dataFile)} out=work.study dbms=${dbms} replace;`);
	if (dbms === 'dlm') out.push(`  delimiter=${sasString(s.format.delimiter)};`);
	out.push('  getnames=yes;', '  guessingrows=max;', 'run;');
	const y = sasName(s.outcome.col.column);
	const prep = s.outcome.prep;
	out.push(comment(CODE_STEP.complete), 'data work.cc;', '  set work.study;', `  if cmiss(of ${cols.map((c) => sasName(c.column)).join(' ')}) = 0;`);
	let outcome = y;
	if (prep.kind === 'scores') {
		outcome = sasName(`${s.outcome.col.column}_score`);
		out.push(`  ${comment(CODE_STEP.outcomeScores)}`);
		prep.levels.forEach((l, i) => out.push(`  ${i === 0 ? '' : 'else '}if ${y} = ${s.outcome.col.numbersInFile ? l : sasString(l)} then ${outcome} = ${i};`));
	}
	out.push('run;');
	const x = sasName(s.exposure.col.column);
	const rhs = [x, ...s.covariates.map((t) => sasName(t.col.column))].join(' ');
	const logistic = s.model === 'logistic';
	const event = logistic ? `(event=${sasString(prep.kind === 'event' ? prep.event : '1')})` : '';
	const model = (terms: readonly CodeTerm[], right: string, store: boolean) => {
		const factors = terms.filter((t) => t.as === 'factor');
		const cls = factors.length ? [`  class ${factors.map((t) => `${sasName(t.col.column)} (ref=${sasString(t.reference!)})`).join(' ')}${logistic ? ' / param=ref' : ''};`] : [];
		return logistic
			? ['proc logistic data=work.cc;', ...cls, `  model ${outcome}${event} = ${right} / clodds=wald;`, ...(store ? ['  store work.fit_adjusted;'] : []), 'run;']
			: ['proc glm data=work.cc;', ...cls, `  model ${outcome} = ${right} / solution clparm;`, 'run;', 'quit;'];
	};
	out.push('', comment(CODE_STEP.crude), ...model([s.exposure], x, false));
	out.push(comment(`${CODE_STEP.adjusted}${logistic ? ` ${CODE_STEP.oddsRatios}` : ''}`), ...model([s.exposure, ...s.covariates], rhs, s.standardize !== null));
	if (s.standardize) {
		const set = (level: string) => (s.exposure.col.numbersInFile ? level : sasString(level));
		out.push('', comment(CODE_STEP.standardizePoint), comment(CODE_STEP.noStandardizedCi));
		out.push(`data work.cc1; set work.cc; ${x} = ${set(s.standardize.exposed)}; run;`, `data work.cc0; set work.cc; ${x} = ${set(s.standardize.unexposed)}; run;`);
		out.push('proc plm restore=work.fit_adjusted;', '  score data=work.cc1 out=work.pred1 predicted=p / ilink;', '  score data=work.cc0 out=work.pred0 predicted=p / ilink;', 'run;');
		out.push(
			'proc sql;',
			'  select r1.risk1, r0.risk0, r1.risk1 - r0.risk0 as risk_difference, r1.risk1 / r0.risk0 as risk_ratio,',
			'         (r1.risk1 / (1 - r1.risk1)) / (r0.risk0 / (1 - r0.risk0)) as marginal_odds_ratio',
			'  from (select mean(p) as risk1 from work.pred1) as r1, (select mean(p) as risk0 from work.pred0) as r0;',
			'quit;'
		);
	}
	return `${out.join('\n')}\n`;
}
