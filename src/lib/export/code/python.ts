/**
 * Python code for a chosen adjustment set: pandas.read_csv with Causeway's missing-value
 * codes, complete cases, statsmodels formulas with C(x, Treatment(reference=…)) for
 * categorical columns, GLM (binomial) or OLS for the crude and adjusted models, Wald intervals
 * and, for a binary exposure and outcome, standardized risks by g-computation with
 * delta-method intervals (patsy design matrices). Objects the tests read: fit_crude,
 * fit_adjusted, standardized. O(columns).
 */
import { CODE_STEP, codeHeaderLines } from '../../wording/analysis-code';
import { codeHeader, modelColumns, type CodeSpec, type CodeTerm } from './spec';

/** A double-quoted Python string. */
export const pyString = (s: string) => JSON.stringify(s);

/** A single-quoted Python string, for use inside a formula (itself in double quotes). */
const pySingle = (s: string) => `'${s.replace(/\\/g, '\\\\').replace(/'/g, "\\'")}'`;

/** A column in a patsy formula: its name when it is an identifier, else Q('…'). */
export function pyName(name: string): string {
	return /^[A-Za-z_][A-Za-z0-9_]*$/.test(name) ? name : `Q(${pySingle(name)})`;
}

/** A level literal: a number for columns the file holds as numbers, else a string. */
const literal = (t: CodeTerm, level: string) => (t.col.numbersInFile ? level : pyString(level));
const formulaLiteral = (t: CodeTerm, level: string) => (t.col.numbersInFile ? level : pySingle(level));

function formulaTerm(t: CodeTerm): string {
	return t.as === 'numeric' ? pyName(t.col.column) : `C(${pyName(t.col.column)}, Treatment(reference=${formulaLiteral(t, t.reference!)}))`;
}

function outcomeName(s: CodeSpec): string {
	const c = s.outcome.col.column;
	return s.outcome.prep.kind === 'as-is' ? c : s.outcome.prep.kind === 'event' ? `${c}_event` : `${c}_score`;
}

export function pythonCode(s: CodeSpec): string {
	const out: string[] = codeHeaderLines({ ...codeHeader(s), language: 'python' }).map((l) => `# ${l}`);
	out.push('', 'import numpy as np', 'import pandas as pd', 'import patsy', 'import statsmodels.api as sm', 'import statsmodels.formula.api as smf', 'from scipy.stats import norm');
	const names = modelColumns(s).map((c) => c.column);
	const text = modelColumns(s).filter((c) => !c.numbersInFile);
	const sep = s.format.delimiter === '\t' ? '\\t' : s.format.delimiter;
	out.push('', `# ${CODE_STEP.read}`);
	out.push(
		`d = pd.read_csv(${pyString(s.dataFile)}, sep="${sep}", decimal="${s.format.decimalComma ? ',' : '.'}",`,
		`                na_values=["", "NA", ".", "NaN", "NULL"], keep_default_na=False${text.length ? `, dtype={${text.map((c) => `${pyString(c.column)}: str`).join(', ')}}` : ''})`
	);
	out.push(`# ${CODE_STEP.complete}`, `model_columns = [${names.map(pyString).join(', ')}]`, 'd = d[model_columns].dropna().copy()');
	const y = outcomeName(s);
	const prep = s.outcome.prep;
	const ycol = `d[${pyString(s.outcome.col.column)}]`;
	if (prep.kind === 'event') out.push(`# ${CODE_STEP.outcomeEvent}`, `d[${pyString(y)}] = (${ycol} == ${s.outcome.col.numbersInFile ? prep.event : pyString(prep.event)}).astype(int)`);
	if (prep.kind === 'scores')
		out.push(
			`# ${CODE_STEP.outcomeScores}`,
			`d[${pyString(y)}] = ${ycol}.map({${prep.levels.map((l, i) => `${s.outcome.col.numbersInFile ? l : pyString(l)}: ${i}`).join(', ')}})`
		);
	const rhs = [s.exposure, ...s.covariates].map(formulaTerm).join(' + ');
	const fit =
		s.model === 'logistic'
			? (f: string) => `smf.glm(${pyString(f)}, data=d, family=sm.families.Binomial()).fit()`
			: (f: string) => `smf.ols(${pyString(f)}, data=d).fit()`;
	out.push('', `# ${CODE_STEP.crude}`, `fit_crude = ${fit(`${pyName(y)} ~ ${formulaTerm(s.exposure)}`)}`);
	out.push(`# ${CODE_STEP.adjusted}`, `fit_adjusted = ${fit(`${pyName(y)} ~ ${rhs}`)}`, 'print(fit_adjusted.summary())');
	out.push('', 'def with_intervals(fit, transform=lambda x: x):', '    table = pd.concat([fit.params, fit.conf_int()], axis=1)', '    table.columns = ["estimate", "lower", "upper"]', '    return transform(table)', '');
	if (s.model === 'logistic') out.push(`# ${CODE_STEP.oddsRatios}`, 'print(with_intervals(fit_crude, np.exp))', 'print(with_intervals(fit_adjusted, np.exp))');
	else out.push('print(with_intervals(fit_adjusted))');
	if (s.standardize) {
		const x = pyString(s.exposure.col.column);
		out.push('', `# ${CODE_STEP.standardize}`);
		out.push(
			`d1 = d.copy(); d1[${x}] = ${literal(s.exposure, s.standardize.exposed)}`,
			`d0 = d.copy(); d0[${x}] = ${literal(s.exposure, s.standardize.unexposed)}`,
			'design = fit_adjusted.model.data.design_info',
			'X1 = np.asarray(patsy.dmatrix(design, d1)); X0 = np.asarray(patsy.dmatrix(design, d0))',
			'b = fit_adjusted.params.values; V = fit_adjusted.cov_params().values',
			'p1 = 1 / (1 + np.exp(-X1 @ b)); p0 = 1 / (1 + np.exp(-X0 @ b))',
			'risk1, risk0 = p1.mean(), p0.mean()',
			'g1 = (X1 * (p1 * (1 - p1))[:, None]).mean(axis=0); g0 = (X0 * (p0 * (1 - p0))[:, None]).mean(axis=0)',
			'def delta_se(g):',
			'    return float(np.sqrt(g @ V @ g))',
			'z = norm.ppf(0.975)',
			'rd, se_rd = risk1 - risk0, delta_se(g1 - g0)',
			'log_rr, se_log_rr = np.log(risk1 / risk0), delta_se(g1 / risk1 - g0 / risk0)',
			'log_or = np.log(risk1 / (1 - risk1)) - np.log(risk0 / (1 - risk0))',
			'se_log_or = delta_se(g1 / (risk1 * (1 - risk1)) - g0 / (risk0 * (1 - risk0)))',
			'standardized = pd.DataFrame({',
			'    "risk_exposed": [risk1, np.nan, np.nan], "risk_unexposed": [risk0, np.nan, np.nan],',
			'    "risk_difference": [rd, rd - z * se_rd, rd + z * se_rd],',
			'    "risk_ratio": np.exp([log_rr, log_rr - z * se_log_rr, log_rr + z * se_log_rr]),',
			'    "marginal_odds_ratio": np.exp([log_or, log_or - z * se_log_or, log_or + z * se_log_or]),',
			'}, index=["estimate", "lower", "upper"]).T',
			'print(standardized)'
		);
	}
	return `${out.join('\n')}\n`;
}
