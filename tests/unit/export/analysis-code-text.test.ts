/**
 * The text of the generated analysis code where it cannot be run here. Stata and SAS are not
 * installed on our machines (and cannot be), so their code is checked for structure: the
 * import with the file's delimiter and decimal comma, complete cases, factor declarations with
 * the reference level Causeway uses (Stata ib#. on codes fixed by a value label defined before
 * encode; SAS class … (ref="…") / param=ref), the event modelled, the models, the
 * standardization steps, names that need quoting, and comments that cannot end early. The R
 * and Python code is run and compared with Causeway's fits in analysis-code.test.ts.
 * The syntax expected is from the languages' manuals (from memory): Stata's import delimited,
 * encode, factor-variable notation, margins and nlcom; SAS's PROC IMPORT, PROC LOGISTIC
 * (CLASS … REF=, MODEL y(EVENT=), CLODDS=WALD, STORE), PROC PLM SCORE … / ILINK, PROC GLM.
 */
import { describe, expect, it } from 'vitest';
import { runDataChecks } from '../../../src/lib/datacheck';
import { analysisCode, codeSpec } from '../../../src/lib/export/code';
import { stataName } from '../../../src/lib/export/code/stata';
import { sasName } from '../../../src/lib/export/code/sas';
import { rName } from '../../../src/lib/export/code/r';
import { pyName } from '../../../src/lib/export/code/python';
import { parseTable } from '../../../src/lib/stats';
import { demo } from './helpers';

const CSV = [
	'bikes to work;bp;age group;band;diet',
	'yes;1;0;Q1 "low";1,5',
	'no;0;1;Q2 high;2,5',
	'no;1;2;Q2 high;NA',
	'yes;0;3;Q1 "low";3,25',
	'no;0;0;Q2 high;2',
	'yes;1;1;Q1 "low";1,75',
	'no;1;2;Q1 "low";2,25',
	'yes;0;3;Q2 high;1'
].join('\n');

function spec(outcomeKind: 'binary' | 'continuous' = 'binary') {
	const parsed = parseTable(CSV);
	if (!parsed.ok) throw new Error(parsed.error.message);
	const d = { ...demo(), outcomes: outcomeKind === 'binary' ? ['hypertension'] : ['diet'] };
	const r = runDataChecks(d, parsed.table, {
		mapping: { cycling: 'bikes to work', hypertension: 'bp', age: 'age group', income: 'band', diet: outcomeKind === 'binary' ? 'diet' : 'diet' },
		types: { 'age group': 'categorical' },
		parts: { arrows: false, claims: false }
	});
	const set = outcomeKind === 'binary' ? ['age', 'diet', 'income'] : ['age', 'income'];
	return codeSpec(d, r, { roles: ['planned'], adjustedFor: set, sufficient: true }, 'study data.csv', 'Causeway test');
}

describe('names that a language cannot use as they are', () => {
	it('R backticks, patsy Q(), Stata underscores, SAS name literals', () => {
		expect(rName('age')).toBe('age');
		expect(rName('age group')).toBe('`age group`');
		expect(rName('if')).toBe('`if`');
		expect(pyName('age_group')).toBe('age_group');
		expect(pyName('age group')).toBe("Q('age group')");
		expect(pyName("it's")).toBe("Q('it\\'s')");
		expect(stataName('age group')).toBe('age_group');
		expect(stataName('2nd')).toBe('_2nd');
		expect(stataName('x'.repeat(40))).toHaveLength(32);
		expect(sasName('age group')).toBe('"age group"n');
		expect(sasName('a"b')).toBe('"a""b"n');
	});
});

describe('Stata code (structure only: Stata cannot run here)', () => {
	const code = analysisCode('stata', spec());
	it('reads the file with its delimiter and decimal comma, and turns the missing-value codes into missing', () => {
		expect(code).toContain('import delimited using "study data.csv", clear varnames(1) case(preserve) delimiters(";") decimalseparator(,) encoding("utf-8")');
		expect(code).toMatch(/foreach v in bp age_group diet \{\n {4}capture confirm numeric variable `v'\n {4}if _rc destring `v', replace force\n\}/);
		expect(code).toContain('replace `v\' = "" if inlist(`v\', "NA", ".", "NaN", "NULL")');
		expect(code).toContain('drop if missing(bp, bikes_to_work, age_group, diet, band)');
	});
	it('text factors get codes from a value label with the reference first, numeric codes are used as they are', () => {
		expect(code).toContain('label define bikes_to_work_lbl 1 "no" 2 "yes"');
		expect(code).toContain('encode bikes_to_work, generate(bikes_to_work_c) label(bikes_to_work_lbl)');
		// A level holding double quotes is written with Stata's compound quotes.
		expect(code).toContain('label define band_lbl 1 `"Q1 "low""\' 2 "Q2 high"');
		expect(code).toContain('logit bp ib1.bikes_to_work_c ib0.age_group diet ib1.band_c, or');
		expect(code).toContain('logit bp ib1.bikes_to_work_c, or');
	});
	it('standardizes with margins and forms the ratios with nlcom', () => {
		expect(code).toContain('margins bikes_to_work_c\nmargins r.bikes_to_work_c\nmargins bikes_to_work_c, post');
		expect(code).toContain('ln(_b[2.bikes_to_work_c] / _b[1.bikes_to_work_c])');
	});
	it('names the renamed columns in a comment, and every comment line starts with *', () => {
		expect(code).toContain("* Column 'age group' is not a valid Stata name");
		for (const line of code.split('\n')) if (/Causeway|Column|reference/.test(line) && !/^(label|encode|logit|margins|nlcom)/.test(line)) expect(line.startsWith('*'), line).toBe(true);
	});
	it('a numeric outcome is fitted with regress, without standardization', () => {
		const linear = analysisCode('stata', spec('continuous'));
		expect(linear).toContain('regress diet ib1.bikes_to_work_c ib0.age_group ib1.band_c');
		expect(linear).not.toContain('margins');
	});
});

describe('SAS code (structure only: SAS cannot run here)', () => {
	const code = analysisCode('sas', spec());
	it('imports with the delimiter, states the decimal comma, keeps complete cases', () => {
		expect(code).toContain('options validvarname=any;');
		expect(code).toContain('proc import datafile="study data.csv" out=work.study dbms=dlm replace;\n  delimiter=";";');
		expect(code).toContain('decimal comma');
		expect(code).toContain('if cmiss(of bp "bikes to work"n "age group"n diet band) = 0;');
	});
	it('declares factors with the reference level and models the event', () => {
		expect(code).toContain('class "bikes to work"n (ref="no") "age group"n (ref="0") band (ref="Q1 ""low""") / param=ref;');
		expect(code).toContain('model bp(event="1") = "bikes to work"n "age group"n diet band / clodds=wald;');
		expect(code).toContain('store work.fit_adjusted;');
	});
	it('scores the stored model with the exposure set to each level', () => {
		expect(code).toContain('data work.cc1; set work.cc; "bikes to work"n = "yes"; run;');
		expect(code).toContain('score data=work.cc1 out=work.pred1 predicted=p / ilink;');
		expect(code).toMatch(/as risk_difference/);
	});
	it('comments never end early', () => {
		for (const line of code.split('\n').filter((l) => l.startsWith('/*'))) expect(line.indexOf('*/')).toBe(line.length - 2);
	});
	it('a numeric outcome uses PROC GLM with the reference level', () => {
		const linear = analysisCode('sas', spec('continuous'));
		expect(linear).toContain('proc glm data=work.cc;\n  class "bikes to work"n (ref="no") "age group"n (ref="0") band (ref="Q1 ""low""");\n  model diet = "bikes to work"n "age group"n band / solution clparm;');
	});
});

describe('R and Python text', () => {
	it('R: relevel to the reference, backticks in formulas, the file’s delimiter and decimal comma', () => {
		const code = analysisCode('r', spec());
		expect(code).toContain('d <- read.csv("study data.csv", sep = ";", dec = ",", check.names = FALSE,');
		expect(code).toContain('d[["band"]] <- relevel(factor(d[["band"]]), ref = "Q1 \\"low\\"")');
		expect(code).toContain('d[["age group"]] <- relevel(factor(d[["age group"]]), ref = "0")');
		expect(code).toContain('fit_adjusted <- glm(bp ~ `bikes to work` + `age group` + diet + band, family = binomial, data = d)');
	});
	it('Python: C(x, Treatment(reference=…)) with numbers for numeric codes and text for text', () => {
		const code = analysisCode('python', spec());
		expect(code).toContain("C(Q('age group'), Treatment(reference=0))");
		expect(code).toContain(`C(band, Treatment(reference='Q1 \\"low\\"'))`);
		expect(code).toContain('dtype={"bikes to work": str, "band": str}');
	});
	it('is deterministic', () => {
		expect(analysisCode('r', spec())).toBe(analysisCode('r', spec()));
	});
});
