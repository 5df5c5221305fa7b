/**
 * R code for a chosen adjustment set: read.csv with Causeway's missing-value codes, complete
 * cases, factors with relevel() to Causeway's reference level, glm (binomial) or lm for the
 * crude and adjusted models, Wald intervals (confint.default) and, for a binary exposure and
 * outcome, standardized risks by g-computation with delta-method intervals written out in
 * base R. Objects the tests read: fit_crude, fit_adjusted, standardized. O(columns).
 */
import { CODE_STEP, codeHeaderLines } from '../../wording/analysis-code';
import { codeHeader, modelColumns, type CodeSpec, type CodeTerm } from './spec';

const RESERVED = new Set(['if', 'else', 'repeat', 'while', 'function', 'for', 'next', 'break', 'TRUE', 'FALSE', 'NULL', 'Inf', 'NaN', 'NA', 'NA_integer_', 'NA_real_', 'NA_character_', 'in']);

/** A double-quoted R string. */
export const rString = (s: string) => JSON.stringify(s);

/** A name usable in a formula: as it is when syntactic, else in backticks. */
export function rName(name: string): string {
	const syntactic = /^((([A-Za-z]|[.][._A-Za-z])[._A-Za-z0-9]*)|[.])$/.test(name) && !RESERVED.has(name);
	return syntactic ? name : `\`${name.replace(/[`\\]/g, (c) => `\\${c}`)}\``;
}

const column = (name: string) => `d[[${rString(name)}]]`;

/** The outcome's name in the formulas (a new column when it is recoded). */
function outcomeName(s: CodeSpec): string {
	const c = s.outcome.col.column;
	return s.outcome.prep.kind === 'as-is' ? c : s.outcome.prep.kind === 'event' ? `${c}_event` : `${c}_score`;
}

function levelValue(t: CodeTerm, level: string): string {
	return t.as === 'numeric' ? level : `factor(${rString(level)}, levels = levels(${column(t.col.column)}))`;
}

export function rCode(s: CodeSpec): string {
	const out: string[] = codeHeaderLines({ ...codeHeader(s), language: 'r' }).map((l) => `# ${l}`);
	const sep = s.format.delimiter === '\t' ? '\\t' : s.format.delimiter;
	const names = modelColumns(s).map((c) => c.column);
	out.push('', `# ${CODE_STEP.read}`);
	out.push(
		`d <- read.csv(${rString(s.dataFile)}, sep = "${sep}", dec = "${s.format.decimalComma ? ',' : '.'}", check.names = FALSE,`,
		'              na.strings = c("", "NA", ".", "NaN", "NULL"))'
	);
	out.push(`# ${CODE_STEP.complete}`);
	out.push(`model_columns <- c(${names.map(rString).join(', ')})`, 'd <- d[complete.cases(d[, model_columns]), model_columns]');
	const factors = [s.exposure, ...s.covariates].filter((t) => t.as === 'factor');
	if (factors.length > 0) {
		out.push(`# ${CODE_STEP.factors}`);
		for (const t of factors) out.push(`${column(t.col.column)} <- relevel(factor(${column(t.col.column)}), ref = ${rString(t.reference!)})`);
	}
	const y = outcomeName(s);
	const prep = s.outcome.prep;
	if (prep.kind === 'event') out.push(`# ${CODE_STEP.outcomeEvent}`, `d[[${rString(y)}]] <- as.integer(${column(s.outcome.col.column)} == ${s.outcome.col.numbersInFile ? prep.event : rString(prep.event)})`);
	if (prep.kind === 'scores')
		out.push(`# ${CODE_STEP.outcomeScores}`, `d[[${rString(y)}]] <- match(as.character(${column(s.outcome.col.column)}), c(${prep.levels.map(rString).join(', ')})) - 1`);
	const x = rName(s.exposure.col.column);
	const rhs = [x, ...s.covariates.map((t) => rName(t.col.column))].join(' + ');
	const fit = s.model === 'logistic' ? (f: string) => `glm(${f}, family = binomial, data = d)` : (f: string) => `lm(${f}, data = d)`;
	out.push('', `# ${CODE_STEP.crude}`, `fit_crude <- ${fit(`${rName(y)} ~ ${x}`)}`);
	out.push(`# ${CODE_STEP.adjusted}`, `fit_adjusted <- ${fit(`${rName(y)} ~ ${rhs}`)}`, 'summary(fit_adjusted)');
	if (s.model === 'logistic') {
		out.push(`# ${CODE_STEP.oddsRatios}`);
		out.push('exp(cbind(OR = coef(fit_crude), confint.default(fit_crude)))', 'exp(cbind(OR = coef(fit_adjusted), confint.default(fit_adjusted)))');
	} else out.push('cbind(estimate = coef(fit_adjusted), confint(fit_adjusted))');
	if (s.standardize) {
		out.push('', `# ${CODE_STEP.standardize}`);
		out.push(
			`d1 <- d; d1[[${rString(s.exposure.col.column)}]] <- ${levelValue(s.exposure, s.standardize.exposed)}`,
			`d0 <- d; d0[[${rString(s.exposure.col.column)}]] <- ${levelValue(s.exposure, s.standardize.unexposed)}`,
			'rhs_terms <- delete.response(terms(fit_adjusted))',
			'X1 <- model.matrix(rhs_terms, d1); X0 <- model.matrix(rhs_terms, d0)',
			'b <- coef(fit_adjusted); V <- vcov(fit_adjusted)',
			'p1 <- plogis(drop(X1 %*% b)); p0 <- plogis(drop(X0 %*% b))',
			'risk1 <- mean(p1); risk0 <- mean(p0)',
			'g1 <- colMeans(X1 * (p1 * (1 - p1))); g0 <- colMeans(X0 * (p0 * (1 - p0)))',
			'delta_se <- function(g) sqrt(drop(t(g) %*% V %*% g))',
			'z <- qnorm(0.975)',
			'rd <- risk1 - risk0; se_rd <- delta_se(g1 - g0)',
			'log_rr <- log(risk1 / risk0); se_log_rr <- delta_se(g1 / risk1 - g0 / risk0)',
			'log_or <- qlogis(risk1) - qlogis(risk0); se_log_or <- delta_se(g1 / (risk1 * (1 - risk1)) - g0 / (risk0 * (1 - risk0)))',
			'standardized <- rbind(',
			'  risk_exposed = c(risk1, NA, NA), risk_unexposed = c(risk0, NA, NA),',
			'  risk_difference = c(rd, rd - z * se_rd, rd + z * se_rd),',
			'  risk_ratio = exp(c(log_rr, log_rr - z * se_log_rr, log_rr + z * se_log_rr)),',
			'  marginal_odds_ratio = exp(c(log_or, log_or - z * se_log_or, log_or + z * se_log_or)))',
			'colnames(standardized) <- c("estimate", "lower", "upper")',
			'standardized'
		);
	}
	return `${out.join('\n')}\n`;
}
