/**
 * `causeway data code DIAGRAM DATA.csv --language r|stata|sas|python`: analysis code for one
 * adjustment set (the planned set by default; --set optimal, minimal, minimal:2, crude), using
 * the data settings (columns, kinds, reference levels, the file's delimiter) — the same
 * models as `causeway data estimates`, for the analysis plan. src/lib/export/code makes the text.
 */
import { writeFile } from 'node:fs/promises';
import type { EstimateRow } from '../../../lib/datacheck';
import { InputError } from '../../../lib/graph/errors';
import { analysisCode, CODE_FILE, CODE_LANGUAGES, codeSpec, isCodeLanguage, type CodeLanguage } from '../../../lib/export/code';
import { SOFTWARE_NAME, SOFTWARE_VERSION } from '../../../lib/export/version';
import { QUESTION, QUESTION_HELP, type Command } from '../../command';
import { UsageError } from '../../io';
import { DATA_HELP, DATA_OPTIONS, runOnData } from './input';

const USAGE = `causeway data code DIAGRAM DATA.csv --language ${CODE_LANGUAGES.join('|')} [--set planned|optimal|minimal[:N]|crude] [--adjust a,b] [--count COLUMN] [-o FILE] [--json]`;

/** The language from --language, or from the output file's extension. */
function languageOf(named: unknown, out: string, name: string): CodeLanguage {
	if (typeof named === 'string') {
		if (!isCodeLanguage(named)) throw new UsageError(`--language must be one of ${CODE_LANGUAGES.join(', ')}, not "${named}"`);
		return named;
	}
	const byExtension = CODE_LANGUAGES.find((l) => out.toLowerCase().endsWith(CODE_FILE[l].extension.toLowerCase()));
	if (!byExtension) throw new UsageError(`${name} needs --language (${CODE_LANGUAGES.join(', ')})`);
	return byExtension;
}

/** The estimate row for --set: planned (default), optimal, crude, minimal or minimal:N (1-based). */
function pickRow(rows: readonly EstimateRow[], wanted: string): EstimateRow {
	const m = /^(planned|optimal|crude|minimal)(?::(\d+))?$/.exec(wanted);
	if (!m || (m[2] !== undefined && m[1] !== 'minimal')) throw new UsageError(`--set must be planned, optimal, crude, minimal or minimal:N, not "${wanted}"`);
	const matching = rows.filter((r) => r.roles.includes(m[1] as EstimateRow['roles'][number]));
	const index = m[2] === undefined ? 0 : Number(m[2]) - 1;
	const row = matching[index];
	if (!row) {
		const what = m[1] === 'minimal' ? `minimal set ${index + 1} (there ${matching.length === 1 ? 'is 1' : `are ${matching.length}`})` : `${m[1]} set`;
		throw new InputError(`No ${what} to write code for`);
	}
	if (row.message) throw new InputError(`The ${m[1]} set ${row.label.replace(/^[^{]*/, '')} cannot be estimated: ${row.message}`);
	return row;
}

export const code: Command = {
	usage: USAGE,
	details: `Writes the analysis code for one adjustment set, for the statistical analysis plan: reading
the data file, complete cases, categorical columns as factors with Causeway's reference level,
the crude and the adjusted model (logistic regression for a binary outcome, linear otherwise)
with Wald 95 % intervals and, for a binary exposure and outcome, the standardized risks by
g-computation with delta-method intervals (R, Python, Stata's margins; SAS: point estimates).
The R and Python code reproduces Causeway's coefficients (tested to 1e-6).
  --language L     r (glm), stata, sas or python (statsmodels); or taken from -o's extension
                   (.R, .do, .sas, .py)
  --set S          planned (default), optimal, crude, minimal (the first) or minimal:N
  --adjust a,b     the planned set, replacing the file's
  -o, --output F   write to F instead of standard output
  --json           {"language", "set": {"roles", "adjustedFor", "sufficient"}, "code"}
${DATA_HELP}
${QUESTION_HELP}`,
	options: { ...DATA_OPTIONS, ...QUESTION, language: { type: 'string' }, set: { type: 'string' }, adjust: { type: 'string', multiple: true }, output: { type: 'string', short: 'o' } },
	async run(ctx) {
		const out = typeof ctx.values.output === 'string' ? ctx.values.output : '-';
		const language = languageOf(ctx.values.language, out, ctx.name);
		if (ctx.values.summary === true) throw new UsageError('analysis code needs a data file, not a summary matrix (--summary)');
		const { report, diagram, dataName } = await runOnData(ctx, USAGE, { planned: ctx.list('adjust'), parts: { arrows: false, claims: false, confounders: false } });
		if (!report.estimates) throw new InputError(report.estimatesMessage ?? 'No estimates can be made for this question');
		const row = pickRow(report.estimates.rows, typeof ctx.values.set === 'string' ? ctx.values.set : 'planned');
		const spec = codeSpec(diagram, report, row, dataName, `${SOFTWARE_NAME} ${SOFTWARE_VERSION}`);
		const code = analysisCode(language, spec);
		if (ctx.json) {
			ctx.printJson({ language, set: { roles: row.roles, adjustedFor: row.adjustedFor, sufficient: row.sufficient }, code });
			return 0;
		}
		if (out === '-') ctx.io.stdout(code);
		else await (ctx.io.writeFile ?? writeFile)(out, code);
		return 0;
	}
};
