// The confounder check on the command line: `causeway data tests` prints two-way tables of the
// exposure's and outcome's discrete arrows (counts with row %, X² and df, per-level odds
// ratios) and names category-code columns; `causeway data estimates` prints the crude rows,
// the standardized estimates and every candidate's check; `causeway data code` writes the
// analysis code. Numbers are held to R on datasets shipped with R (tests/fixtures/stats/
// make-confounding-fixtures.R): UCBAdmissions (gender → admission, 6 departments) and
// infert (spontaneous abortions coded 0/1/2).
import { describe, expect, it } from 'vitest';
import { diagramJson, runCli as run } from './harness';
import { formatCi, formatCount, formatNumber } from '../../../src/lib/wording';
import { expectAllClose, expectClose, fixture } from '../stats/fixtures';

const R = fixture('confounding.json');
const UCB_CSV = 'tests/fixtures/stats/ucb-admissions-people.csv';
const INFERT_CSV = 'tests/fixtures/stats/infert-people.csv';
const UCB = diagramJson(
	[
		['dept', 'female'],
		['dept', 'admitted'],
		['female', 'admitted']
	],
	{ exposures: ['female'], outcomes: ['admitted'], adjusted: ['dept'] }
);
const INFERT = diagramJson(
	[
		['age', 'spontaneous'],
		['education', 'spontaneous'],
		['age', 'case'],
		['education', 'case'],
		['spontaneous', 'case']
	],
	{ exposures: ['spontaneous'], outcomes: ['case'], adjusted: ['age', 'education'] }
);
const files = { 'ucb.json': UCB, 'infert.json': INFERT };

describe('causeway data tests: two-way tables and category codes', () => {
	it('prints the department × admission table with row %, X² on 5 df and R’s per-level odds ratios', async () => {
		const r = await run(['data', 'tests', 'ucb.json', UCB_CSV], files);
		expect(r.code).toBe(0);
		const [a0, a1] = R.ucb.chisq_dept.counts[0];
		expect(r.out).toMatch(new RegExp(`\\n {4}A\\s+${formatCount(a0)} \\(36 %\\)\\s+${formatCount(a1)} \\(64 %\\)\\s+${formatCount(a0 + a1)}\\n`));
		expect(r.out).toContain(`Pearson X² = ${formatNumber(R.ucb.chisq_dept.statistic)}, 5 df, p < 0.001`);
		R.ucb.level_ors_dept.levels.forEach((level: string, i: number) => {
			expect(r.out).toMatch(new RegExp(`${level} vs A\\s+${formatNumber(R.ucb.level_ors_dept.or[i]).replace('.', '\\.')}\\s+${formatCi([R.ucb.level_ors_dept.ci_low[i], R.ucb.level_ors_dept.ci_high[i]]).replace(/\./g, '\\.')}`));
		});
		// The size is an odds ratio, read as such, with the kinds stated.
		expect(r.out).toMatch(/dept → admitted\s+supported\s+odds ratio 0\.038[^;]*: odds of admitted = 1 are 0\.038 times as high at dept = F as at A; p < 0\.001, n = 4,526 {2}\[Pearson chi-square test; dept: categorical, 6 levels \(reference A\), admitted: binary \(reference 0\)\]/);
	});

	it('--json carries each table with R’s counts and X²', async () => {
		const r = await run(['data', 'tests', 'ucb.json', UCB_CSV, '--json'], files);
		const json = JSON.parse(r.out);
		const check = json.arrows.checks.find((c: { from: string; to: string }) => c.from === 'dept' && c.to === 'admitted');
		expect(check.table.counts).toEqual(R.ucb.chisq_dept.counts);
		expectClose(check.table.chiSquare.statistic, R.ucb.chisq_dept.statistic, 1e-10);
		expect(check.measure.type).toBe('odds-ratio');
		expect(json.columns.map((c: { column: string; kind: string }) => [c.column, c.kind])).toEqual([
			['dept', 'categorical'],
			['female', 'binary'],
			['admitted', 'binary']
		]);
		expect(json.confounders).toBeUndefined();
	});

	it('names a 0/1/2 column read as numbers; declared categorical, the notice goes and the kind says so', async () => {
		const r = await run(['data', 'tests', 'infert.json', INFERT_CSV], files);
		expect(r.out).toContain(
			"Notice: Column 'spontaneous' holds only the whole numbers 0, 1 and 2: it looks like category codes. It is analysed as numbers, so a model that adjusts for it fits one straight-line term across the codes (equal steps between them), which leaves residual confounding if the codes label categories. If they do, run again with --type spontaneous=categorical."
		);
		expect(r.out).toMatch(/spontaneous: continuous — values look like category codes 0, 1 and 2/);
		const json = JSON.parse((await run(['data', 'tests', 'infert.json', INFERT_CSV, '--json'], files)).out);
		expect(json.categoryCodes).toEqual([{ column: 'spontaneous', values: [0, 1, 2] }]);
		const typed = await run(['data', 'tests', 'infert.json', INFERT_CSV, '--type', 'spontaneous=categorical'], files);
		expect(typed.out).not.toContain('Notice:');
		expect(typed.out).toMatch(/spontaneous: categorical, 3 levels \(reference 0\)/);
		// R: glm(case ~ factor(spontaneous), binomial) — the per-level odds ratios of the table.
		R.infert.level_ors_spontaneous.levels.forEach((level: string, i: number) => expect(typed.out).toMatch(new RegExp(`${level} vs 0\\s+${formatNumber(R.infert.level_ors_spontaneous.or[i]).replace('.', '\\.')}`)));
	});
});

describe('causeway data estimates: crude rows, standardized estimates and the confounder check', () => {
	it('text: crude on all rows and on the same rows, the standardized risk difference of R’s g-computation, the MH odds ratio flagged for effect modification', async () => {
		const r = await run(['data', 'estimates', 'ucb.json', UCB_CSV], files);
		expect(r.code).toBe(0);
		expect(r.out).toMatch(/Crude \(no adjustment\)\s+0\.543 \(0\.479 to 0\.616\), n = 4,526\n/);
		expect(r.out).toMatch(new RegExp(`crude on the same rows ${formatNumber(R.ucb.gcomp.crude_or).replace('.', '\\.')}`));
		expect(r.out).toContain(`risk difference ${formatNumber(R.ucb.gcomp.rd * 100)} percentage points (95 % CI ${formatNumber(R.ucb.gcomp.rd_ci[0] * 100)} to ${formatNumber(R.ucb.gcomp.rd_ci[1] * 100)})`);
		expect(r.out).toContain('is non-collapsibility');
		expect(r.out).toContain(`Mantel–Haenszel OR ${formatNumber(R.ucb.mh.estimate)} (95 % CI ${formatCi(R.ucb.mh.ci)}, Robins–Breslow–Greenland) over the 6 levels of dept, n = 4,526  [EFFECT MODIFICATION?]`);
		// statsmodels' StratifiedTable.test_equal_odds(adjust=True) (tests/fixtures/stats/breslow-day.json).
		const bd = fixture('breslow-day.json').ucb.tarone;
		expect(r.out).toContain(`Breslow–Day–Tarone X² = ${formatNumber(bd.statistic)}, 5 df, p = ${formatNumber(bd.p, 2)}: the odds ratio differs across the strata`);
		expect(r.out).toContain('dept (column dept: categorical, 6 levels (reference A)) — confounder · common cause');
		expect(r.out).toContain('kinds: dept categorical, 6 levels (reference A)');
	});

	it('--json: confounders, category codes, columns and the standardized estimates, equal to R', async () => {
		const r = await run(['data', 'estimates', 'ucb.json', UCB_CSV, '--json'], files);
		const json = JSON.parse(r.out);
		expect(Object.keys(json)).toEqual(['mapping', 'estimates', 'estimatesMessage', 'confounders', 'categoryCodes', 'columns', 'format', 'rowCount', 'notes']);
		const dept = json.confounders.candidates.find((c: { id: string }) => c.id === 'dept');
		expectClose(dept.stratified.oddsRatio, R.ucb.mh.estimate, 1e-10);
		expectAllClose(dept.stratified.ci, R.ucb.mh.ci, 1e-10);
		expect(dept.withOutcome.table.counts).toEqual(R.ucb.chisq_dept.counts);
		const planned = json.estimates.rows.find((x: { roles: string[] }) => x.roles.includes('planned'));
		expectClose(planned.standardized.riskDifference.estimate, R.ucb.gcomp.rd, 1e-6);
		expectClose(planned.standardized.riskRatio.estimate, R.ucb.gcomp.rr, 1e-6);
		expectClose(planned.standardized.marginalOddsRatio.estimate, R.ucb.gcomp.marginal_or, 1e-6);
		expectClose(planned.crudeSameRows, R.ucb.gcomp.crude_or, 1e-6);
		expect(json.format).toEqual({ delimiter: ',', decimalComma: false, header: true });
	});

	it('mediators and descendants are listed as not candidates, with the reason', async () => {
		const r = await run(['data', 'estimates', 'static/demo/cycling-hypertension.causeway.json', 'static/demo/cycling-hypertension.csv']);
		expect(r.out).toContain('fitness (column fitness: continuous) — mediator; not a candidate: a mediator');
		expect(r.out).toContain('app_panel (column app_panel: binary (reference 0)) — collider · descendant of outcome · descendant of exposure; not a candidate: caused by the outcome');
		expect(r.out).toContain('diet (column diet: continuous) — confounder · collider: adjust together with age and income');
		expect(r.out).toContain('Within fifths of age some confounding by it remains');
	});
});

describe('causeway data code', () => {
	it('writes R for the planned set, the language taken from -o; --json gives the set and the code', async () => {
		const r = await run(['data', 'code', 'ucb.json', UCB_CSV, '-o', 'analysis.R'], files);
		expect(r.code).toBe(0);
		const code = r.written['analysis.R'];
		expect(code).toContain('d[["dept"]] <- relevel(factor(d[["dept"]]), ref = "A")');
		expect(code).toContain('fit_adjusted <- glm(admitted ~ female + dept, family = binomial, data = d)');
		const json = JSON.parse((await run(['data', 'code', 'ucb.json', UCB_CSV, '--language', 'python', '--json'], files)).out);
		expect(json.set).toEqual({ roles: ['minimal', 'optimal', 'planned'], adjustedFor: ['dept'], sufficient: true });
		expect(json.code).toContain("C(dept, Treatment(reference='A'))");
	});

	it('--set crude and --adjust choose the set; bad choices are one line and exit 2', async () => {
		const crude = await run(['data', 'code', 'ucb.json', UCB_CSV, '--language', 'sas', '--set', 'crude'], files);
		expect(crude.out).toContain('model admitted(event="1") = female / clodds=wald;');
		const adjusted = await run(['data', 'code', 'ucb.json', UCB_CSV, '--language', 'stata', '--adjust', ''], files);
		expect(adjusted.out).toContain('NOT sufficient');
		for (const [args, message] of [
			[['--language', 'fortran'], '--language must be one of r, stata, sas, python, not "fortran"'],
			[[], 'data code needs --language (r, stata, sas, python)'],
			[['--language', 'r', '--set', 'minimal:3'], 'No minimal set 3 (there is 1) to write code for'],
			[['--language', 'r', '--set', 'best'], '--set must be planned, optimal, crude, minimal or minimal:N, not "best"']
		] as const) {
			const bad = await run(['data', 'code', 'ucb.json', UCB_CSV, ...args], files);
			expect(bad.code).toBe(2);
			expect(bad.err).toBe(`causeway: ${message}\n`);
		}
	});
});
