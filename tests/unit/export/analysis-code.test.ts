/**
 * The generated analysis code, run by the software it is written for, must reproduce
 * Causeway's own regression: the R code by Rscript (Debian's r-base-core: glm, lm, predict by
 * model.matrix) and the Python code by /usr/bin/python3 (Debian's python3-statsmodels, pandas,
 * patsy). Every coefficient of the crude and adjusted models must equal Causeway's fit to 1e-6
 * (relative, plus 1e-9 absolute for coefficients near 0); standard errors to 1e-6 from
 * statsmodels and to 1e-4 from R (R's vcov uses the weights of the last IRLS step, one step
 * before the final estimates, and glm stops at a relative deviance change of 1e-8 — measured
 * here: 3e-5 on the intercept; see also tests/fixtures/stats/make-confounding-fixtures.R);
 * standardized risks, risk difference, risk ratio and marginal odds ratio to 1e-6 and their
 * delta-method limits to 1e-5.
 * Data: the demo study's CSV (static/demo/cycling-hypertension.csv) as it is, and recoded here
 * into a semicolon-separated file with decimal commas, text yes/no columns, a text
 * categorical column whose name has a space, a 0/1/2/3 code column declared categorical and
 * missing cells — so factors, reference levels, name quoting and missing codes are exercised.
 * Stata and SAS cannot run on our machines: their text is checked for structure only.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { prepareTable, runDataChecks, type DataCheckOptions } from '../../../src/lib/datacheck';
import { analysisCode, codeSpec, type CodeSetChoice } from '../../../src/lib/export/code';
import type { Diagram } from '../../../src/lib/graph/diagram';
import { estimateExposureEffect, parseTable, standardize, type Column } from '../../../src/lib/stats';
import { expectClose } from '../stats/fixtures';
import { demo } from './helpers';

const DEMO_CSV = readFileSync('static/demo/cycling-hypertension.csv', 'utf8');

/** The demo rows recoded: see the file comment. Deterministic (no randomness). */
function recodedDemo(): string {
	const lines = DEMO_CSV.trim().split('\n');
	const head = lines[0].split(',');
	const at = (name: string) => head.indexOf(name);
	const out = ['bikes to work;high_bp;age group;income band;diet;family_history'];
	lines.slice(1).forEach((line, i) => {
		const f = line.split(',');
		const age = Number(f[at('age')]);
		const income = Number(f[at('income')]);
		const band = income < 30 ? 'Q1 low' : income < 40 ? 'Q2 mid' : income < 50 ? 'Q3 high' : 'Q4 top';
		const diet = f[at('diet')].replace('.', ',');
		out.push(
			[
				f[at('cycling')] === '1' ? 'yes' : 'no',
				f[at('hypertension')] === '1' ? 'yes' : 'no',
				String(Math.min(3, Math.max(0, Math.floor((age - 20) / 12)))),
				i % 97 === 5 ? '' : band,
				i % 89 === 3 ? 'NA' : diet,
				f[at('family_history')]
			].join(';')
		);
	});
	return `${out.join('\n')}\n`;
}

interface Case {
	name: string;
	csv: string;
	file: string;
	diagram: Diagram;
	options: DataCheckOptions;
	set: (report: ReturnType<typeof runDataChecks>) => CodeSetChoice;
}

const planned = (r: ReturnType<typeof runDataChecks>) => r.estimates!.rows.find((x) => x.roles.includes('planned'))!;
const recodedMapping = { cycling: 'bikes to work', hypertension: 'high_bp', age: 'age group', income: 'income band' };

const CASES: Case[] = [
	{ name: 'demo data, planned set {age, diet, income} (logistic)', csv: DEMO_CSV, file: 'cycling-hypertension.csv', diagram: demo(), options: {}, set: planned },
	{
		name: 'demo data, planned set plus the collider and family history',
		csv: DEMO_CSV,
		file: 'cycling-hypertension.csv',
		diagram: { ...demo(), adjusted: ['age', 'diet', 'income', 'app_panel', 'family_history'] },
		options: {},
		set: planned
	},
	{
		name: 'recoded demo: text yes/no exposure and outcome, "income band" text categories, 0–3 codes as categories, ";" and decimal comma',
		csv: recodedDemo(),
		file: 'recoded.csv',
		diagram: demo(),
		options: { mapping: recodedMapping, types: { 'age group': 'categorical' } },
		set: planned
	},
	{
		name: 'recoded demo, numeric outcome (diet) by linear regression with categorical covariates',
		csv: recodedDemo(),
		file: 'recoded.csv',
		diagram: { ...demo(), outcomes: ['diet'], adjusted: [] },
		options: { mapping: recodedMapping, types: { 'age group': 'categorical' } },
		set: () => ({ roles: ['planned'], adjustedFor: ['age', 'income', 'family_history'], sufficient: true })
	},
	{
		name: 'recoded demo, the 0–3 codes as an ordered outcome (scores, linear regression)',
		csv: recodedDemo(),
		file: 'recoded.csv',
		diagram: { ...demo(), outcomes: ['age'], exposures: ['cycling'], adjusted: [] },
		options: { mapping: recodedMapping, types: { 'age group': 'ordinal' } },
		set: () => ({ roles: ['planned'], adjustedFor: ['income'], sufficient: true })
	}
];

const EMIT_R = `
emit <- function(tag, x) cat(sprintf("@@\\t%s\\t%s\\t%.17g\\n", tag, names(x), x), sep = "")
emit("crude", coef(fit_crude)); emit("adjusted", coef(fit_adjusted)); emit("adjusted_se", sqrt(diag(vcov(fit_adjusted))))
if (exists("standardized")) for (k in colnames(standardized)) emit(k, standardized[, k])
`;
const EMIT_PY = `
def emit(tag, s):
    for k, v in s.items():
        print(f"@@\\t{tag}\\t{k}\\t{float(v)!r}")
emit("crude", fit_crude.params); emit("adjusted", fit_adjusted.params); emit("adjusted_se", fit_adjusted.bse)
if "standardized" in globals():
    for k in standardized.columns:
        emit(k, standardized[k])
`;

type Results = Map<string, Map<string, number>>;

function run(command: string, args: string[], cwd: string): Results {
	const r = spawnSync(command, args, { cwd, encoding: 'utf8', timeout: 120_000 });
	if (r.status !== 0) throw new Error(`${command} failed (${r.status}): ${r.stderr}`);
	const results: Results = new Map();
	for (const line of r.stdout.split('\n')) {
		const [mark, tag, name, value] = line.split('\t');
		if (mark !== '@@') continue;
		if (!results.has(tag)) results.set(tag, new Map());
		results.get(tag)!.set(name, Number(value));
	}
	return results;
}

/** One spelling of a coefficient name across R, patsy and Causeway: "income bandQ2 mid", "(intercept)". */
function normalize(name: string): string {
	if (/^\(?intercept\)?$/i.test(name)) return '(intercept)';
	const patsy = /^C\((?:Q\('(.+?)'\)|([^,]+)), Treatment\(reference=.*?\)\)\[T\.(.+)\]$/.exec(name);
	if (patsy) return `${patsy[1] ?? patsy[2]}${patsy[3]}`;
	const quoted = /^Q\('(.+)'\)$/.exec(name);
	if (quoted) return quoted[1];
	return name.replace(/[`[\]]/g, '');
}

function compareFit(got: Map<string, number> | undefined, expected: { name: string; value: number }[], rel: number, what: string) {
	expect(got, what).toBeDefined();
	const byName = new Map([...got!].map(([k, v]) => [normalize(k), v]));
	expect([...byName.keys()].sort(), what).toEqual(expected.map((e) => normalize(e.name)).sort());
	for (const e of expected) {
		const v = byName.get(normalize(e.name))!;
		expect(Math.abs(v - e.value) <= rel * Math.abs(e.value) + 1e-9, `${what}, ${e.name}: ${v} vs Causeway's ${e.value}`).toBe(true);
	}
}

const hasR = spawnSync('Rscript', ['--version']).status === 0;
const hasStatsmodels = spawnSync('/usr/bin/python3', ['-c', 'import statsmodels, pandas, patsy, scipy']).status === 0;

describe('generated R and Python code reproduce Causeway’s fits (Rscript; python3 with statsmodels)', () => {
	it('R and statsmodels are installed (Debian r-base-core, python3-statsmodels; .ci/run installs them)', () => {
		expect(hasR).toBe(true);
		expect(hasStatsmodels).toBe(true);
	});
	for (const c of CASES)
		it(c.name, () => {
			const parsed = parseTable(c.csv);
			if (!parsed.ok) throw new Error(parsed.error.message);
			const report = runDataChecks(c.diagram, parsed.table, { ...c.options, parts: { arrows: false, claims: false } });
			const choice = c.set(report);
			const spec = codeSpec(c.diagram, report, choice, c.file, 'Causeway test');
			// Causeway's own fits on the same columns and kinds.
			const { columnOf } = prepareTable(parsed.table, c.options.types);
			const col = (id: string): Column => columnOf(report.columns.find((x) => x.variable === id)!.column);
			const outcome = col(report.estimates!.outcome);
			const exposure = col(report.estimates!.exposure);
			const covariates = choice.adjustedFor.map(col);
			const effect = estimateExposureEffect(outcome, exposure, covariates);
			const coefficients = (fit: typeof effect.fits.adjusted) => fit.coefficients.map((k) => ({ name: k.name, value: k.estimate }));
			const g = spec.standardize ? standardize(outcome, exposure, covariates) : null;

			const dir = mkdtempSync(join(tmpdir(), 'causeway-code-'));
			writeFileSync(join(dir, c.file), c.csv);
			writeFileSync(join(dir, 'analysis.R'), analysisCode('r', spec) + EMIT_R);
			writeFileSync(join(dir, 'analysis.py'), analysisCode('python', spec) + EMIT_PY);
			for (const [language, results] of [
				['R', run('Rscript', ['analysis.R'], dir)],
				['Python', run('/usr/bin/python3', ['analysis.py'], dir)]
			] as const) {
				compareFit(results.get('crude'), coefficients(effect.fits.crude), 1e-6, `${language} crude`);
				compareFit(results.get('adjusted'), coefficients(effect.fits.adjusted), 1e-6, `${language} adjusted`);
				compareFit(
					results.get('adjusted_se'),
					effect.fits.adjusted.coefficients.map((k) => ({ name: k.name, value: k.se })),
					language === 'R' ? 1e-4 : 1e-6,
					`${language} standard errors`
				);
				if (!g) {
					expect(results.has('estimate'), `${language}: no standardization for this model`).toBe(false);
					continue;
				}
				const est = results.get('estimate')!;
				const lower = results.get('lower')!;
				const upper = results.get('upper')!;
				expectClose(est.get('risk_exposed')!, g.risk1.estimate, 1e-6);
				expectClose(est.get('risk_unexposed')!, g.risk0.estimate, 1e-6);
				for (const [key, m] of [
					['risk_difference', g.riskDifference],
					['risk_ratio', g.riskRatio],
					['marginal_odds_ratio', g.marginalOddsRatio]
				] as const) {
					expectClose(est.get(key)!, m.estimate, 1e-6);
					expectClose(lower.get(key)!, m.ci[0], 1e-5);
					expectClose(upper.get(key)!, m.ci[1], 1e-5);
				}
			}
		}, 120_000);
});
