/**
 * The protocol report as a document model: sections of plain-text blocks that the Markdown
 * and HTML writers render (each escaping for its own language). It states the question, the
 * figure, the variables with their roles, the assumptions in words (every arrow, and the
 * absent arrows the adjustment depends on), the minimal sets, the planned set with its verdict
 * and reasons, an editable draft paragraph, the data checks and estimates when given, the
 * cautions, and the software version and date. Pure: the same input gives the same report.
 */
import type { Diagram } from '../graph/diagram';
import { validateDiagram } from '../graph/validate';
import { adjustmentSets, checkAdjustment, variableRoles } from '../causal';
import type { AdjustmentCheck, AdjustmentSets, Role, VariableRoles } from '../causal';
import { countText, MISSING, ROLE_NAME } from '../wording';
import { BADGE_MEANING, labelLookup, listNames, optimalSetSentence, pathText, problemText, setText, unmeasuredQuestionNote, verdictSentence, type LabelOf } from '../wording';
import { criticalAbsentArrows, withPlannedReasons, type AbsentArrowReport } from '../causal';
import type { ReportDataResults } from './report-data';
import { codeBlocks, dataBlocks } from './report-data-blocks';
import { writeSvg } from './svg';
import { SOFTWARE_NAME, SOFTWARE_VERSION } from './version';
import { arrowNoteBlocks, reproducibilityBlocks, settingsColumn } from './report-study';

export type Block =
	| { kind: 'paragraph'; text: string }
	| { kind: 'list'; items: string[] }
	| { kind: 'table'; head: string[]; rows: string[][]; numeric?: boolean[]; caption?: string }
	| { kind: 'code'; language: string; tag: string; text: string }
	| { kind: 'figure'; svg: string; caption: string }
	| { kind: 'subheading'; text: string }
	| { kind: 'verdict'; valid: boolean; text: string }
	| { kind: 'draft'; text: string; hint: string };

export interface ReportSection {
	id: string;
	heading: string;
	blocks: Block[];
}

export interface ReportModel {
	title: string;
	/** "Causeway 0.1.0 · 2026-12-02" */
	meta: string;
	sections: ReportSection[];
}

/** The engine results the report needs (the app passes its own; the CLI computes them). */
export interface ReportAnalysis {
	sets: AdjustmentSets | null;
	check: AdjustmentCheck | null;
	roles: readonly VariableRoles[];
}

export interface ReportInput {
	diagram: Diagram;
	/** Computed from the diagram when left out. */
	analysis?: ReportAnalysis;
	/** The team's edited draft paragraph; the generated draft when null or empty. */
	draft?: string | null;
	data?: ReportDataResults | null;
	/** Date printed in the report (default now). */
	date?: Date;
	/** Black-and-white figure. */
	mono?: boolean;
	/** How many absent arrows to describe (default 10). */
	maxAbsentArrows?: number;
}

/** The engine results for a diagram, or nulls when it has no usable question yet. */
export function reportAnalysis(d: Diagram): ReportAnalysis {
	const issues = validateDiagram(d, { needQuestion: true });
	if (issues.length > 0) return { sets: null, check: null, roles: [] };
	return { sets: adjustmentSets(d), check: checkAdjustment(d), roles: variableRoles(d) };
}

export const CAUTIONS: readonly string[] = [
	'A diagram encodes assumptions; results are only as good as those assumptions. Every arrow left out is a claim that no direct effect exists.',
	"This tool supports, and does not replace, review by qualified epidemiologists or statisticians, and defers to the study's ethics approvals, reporting guidelines and local regulations.",
	'Data never leave the machine: the analysis runs in the browser (or on the command line) where the report was made.'
];

export const METHODS =
	'Methods: d-separation (Pearl 1988); the adjustment criterion (Shpitser, VanderWeele & Robins 2010) and the listing of minimal sufficient adjustment sets (van der Zander, Liśkiewicz & Textor 2019); the efficiency-optimal set (Henckel, Perković & Maathuis 2022).';

/** In the report's variable table, an unrelated variable is said to be unrelated to the question. */
const ROLE_WORD: Record<Role, string> = { ...ROLE_NAME, unrelated: 'unrelated to the question' };

/** The date as YYYY-MM-DD in the local time zone (the day the user made the report). */
export const isoDate = (date: Date) =>
	`${date.getFullYear()}-${String(date.getMonth() + 1).padStart(2, '0')}-${String(date.getDate()).padStart(2, '0')}`;

export { formatNumber, formatP } from './report-data-blocks';

const rolesOf = (id: string, roles: readonly VariableRoles[]) => roles.find((r) => r.id === id)?.roles ?? [];

function withRole(d: Diagram, roles: readonly VariableRoles[], role: Role): string[] {
	return d.variables.filter((v) => rolesOf(v.id, roles).includes(role)).map((v) => v.id);
}

/** The generated draft paragraph for an analysis plan; a team edits it before use. */
export function draftParagraph(d: Diagram, a: ReportAnalysis, absent: AbsentArrowReport | null): string {
	const label = labelLookup(d);
	const names = (ids: readonly string[]) => listNames(ids.map(label));
	if (!a.sets || !a.check) {
		return 'Choose an exposure and an outcome in the diagram to generate a draft of this paragraph.';
	}
	const { sets, check } = a;
	const out: string[] = [];
	out.push(
		`We will estimate the total effect of ${names(sets.exposures)} on ${names(sets.outcomes)}. Our assumptions about the causal structure are stated in a directed acyclic graph (Figure 1; ${countText(d.variables.length, 'variable')}, ${countText(d.arrows.length, 'arrow')}), drawn before the data were analysed.`
	);
	if (!sets.identifiable) {
		out.push('Under these assumptions no set of measured variables is sufficient to control confounding, so the effect cannot be identified by covariate adjustment; we will consider other designs or sensitivity analyses.');
	} else {
		const n = sets.sets.length;
		const listed = sets.sets.map((s) => setText(s, label)).join('; ');
		out.push(
			`By the adjustment criterion (Shpitser, VanderWeele & Robins 2010), ${n === 1 ? 'the minimal sufficient adjustment set is' : `the ${n}${sets.truncated ? ' or more' : ''} minimal sufficient adjustment sets are`} ${listed}.`
		);
	}
	const planned = check.adjusted;
	if (check.valid) {
		out.push(
			planned.length === 0
				? 'We will not adjust for any covariate: under the diagram no non-causal path is open.'
				: `We will adjust for ${names(planned)}, which is sufficient under the diagram: it blocks every non-causal path between exposure and outcome and includes no mediator or consequence of the outcome.`
		);
	} else {
		out.push(`The planned adjustment for ${planned.length ? names(planned) : 'no covariate'} is not sufficient under the diagram and should be revised before the analysis.`);
	}
	const avoid: string[] = [];
	// Each variable is named once, under its first reason.
	const mediators = withRole(d, a.roles, 'mediator');
	const colliders = withRole(d, a.roles, 'collider').filter((id) => !mediators.includes(id) && (!planned.includes(id) || !check.valid));
	const descendants = withRole(d, a.roles, 'descendant-of-outcome').filter((id) => !mediators.includes(id) && !colliders.includes(id));
	if (mediators.length) avoid.push(`${names(mediators)} (${mediators.length === 1 ? 'a mediator' : 'mediators'})`);
	if (colliders.length) avoid.push(`${names(colliders)} (${colliders.length === 1 ? 'a collider' : 'colliders'})`);
	if (descendants.length) avoid.push(`${names(descendants)} (caused by the outcome)`);
	if (avoid.length) out.push(`We will not adjust for ${listNames(avoid)}, because adjusting for them could bias the estimate of the total effect.`);
	const unmeasured = d.variables.filter((v) => !v.measured).map((v) => v.id);
	if (unmeasured.length) out.push(`${names(unmeasured)} ${unmeasured.length === 1 ? 'is' : 'are'} not measured and cannot be adjusted for.`);
	const key = absent?.items.slice(0, 3) ?? [];
	if (key.length) {
		out.push(
			`The adjustment rests in particular on the assumption that there is no direct effect of ${listNames(key.map((k) => `${label(k.from)} on ${label(k.to)}`))}; we will discuss the plausibility of these assumptions and assess them in sensitivity analyses.`
		);
	}
	return out.join(' ');
}

/** The arrows grouped by cause, in diagram order: "Age directly affects Income and Hypertension." O(n + m). */
function arrowSentences(d: Diagram, label: LabelOf): string[] {
	const effects = new Map<string, string[]>();
	for (const a of d.arrows) {
		const list = effects.get(a.from) ?? [];
		list.push(a.to);
		effects.set(a.from, list);
	}
	return d.variables.filter((v) => effects.has(v.id)).map((v) => `${v.label} directly affects ${listNames(effects.get(v.id)!.map(label))}.`);
}

function absentSentence(item: AbsentArrowReport['items'][number], d: Diagram, a: ReportAnalysis, label: LabelOf): string {
	const consequences: string[] = [];
	const withArrow = { ...d, arrows: [...d.arrows, { from: item.from, to: item.to }] };
	if (item.breaksPlanned) {
		const why = item.plannedProblems[0];
		const reason = !why
			? ''
			: why.kind === 'open-path'
				? ` (a non-causal path would open: ${pathText(why.path, withArrow, label)})`
				: ` (${problemText(why, withArrow, label).replace(/\.$/, '').replace(' is ', ' would be ')})`;
		consequences.push(`the planned set would no longer be sufficient${reason}`);
	}
	// Sets other than the planned one (which is already covered above).
	const plannedKey = [...d.adjusted].sort().join('\u0000');
	const others = (a.sets?.sets ?? []).filter((s) => s.join('\u0000') !== plannedKey);
	const broken = item.breaksSets.filter((s) => s.join('\u0000') !== plannedKey);
	if (broken.length) {
		consequences.push(
			broken.length === others.length
				? `${others.length === 1 ? `the other minimal set ${setText(broken[0], label)} would fail too` : `all ${others.length} other minimal sets would fail`}`
				: `${broken.length} of the ${others.length} other minimal sets would fail (${broken.map((s) => setText(s, label)).join('; ')})`
		);
	} else if (!item.breaksPlanned) consequences.push('a minimal set would fail');
	return `No arrow from ${label(item.from)} to ${label(item.to)}. If ${label(item.from)} affected ${label(item.to)} directly, ${listNames(consequences)}.`;
}

/** The figure's legend in words, for the caption (only what the figure shows). */
function figureKey(d: Diagram, a: ReportAnalysis, mono: boolean): string {
	const keys: string[] = [];
	if (d.exposures.length) keys.push(mono ? 'exposure: bold name' : 'exposure: orange fill');
	if (d.outcomes.length) keys.push(mono ? 'outcome: bold name' : 'outcome: reddish-purple fill');
	if (d.variables.some((v) => !v.measured)) keys.push('unmeasured: dashed outline, italic name');
	if (d.adjusted.length) keys.push('adjusted for (planned set): double square box');
	const used = new Set(a.roles.flatMap((r) => r.roles.map((x) => x as string)));
	const meanings = BADGE_MEANING.filter(([badge]) => used.has(badge === 'descendant of outcome' ? 'descendant-of-outcome' : badge));
	const badgeText = meanings.length ? ` Words under a name give its role: ${meanings.map(([b, m]) => `${b}, ${m}`).join('; ')}.` : '';
	return `Key: ${keys.join('; ')}.${badgeText}`;
}

/** Builds the report. O(absent-arrow search) + O(size of the output). */
export function buildReport(input: ReportInput): ReportModel {
	const d = input.diagram;
	const a = input.analysis ?? reportAnalysis(d);
	const label = labelLookup(d);
	const date = input.date ?? new Date();
	const title = d.title.trim() || 'Causal diagram';
	const sections: ReportSection[] = [];
	const names = (ids: readonly string[]) => (ids.length ? listNames(ids.map(label)) : 'none chosen');

	// 1. Question
	const question: Block[] = [];
	question.push({
		kind: 'table',
		head: ['', ''],
		rows: [
			['Exposure', names(d.exposures)],
			['Outcome', names(d.outcomes)],
			['Effect', a.sets ? `total effect of ${names(a.sets.exposures)} on ${names(a.sets.outcomes)}` : 'not yet defined (choose an exposure and an outcome)'],
			['Planned adjustment set', d.adjusted.length ? names(d.adjusted) : 'none (no adjustment)']
		]
	});
	sections.push({ id: 'question', heading: 'Question', blocks: question });

	// 2. Figure
	const svg = writeSvg(d, a.roles, { mono: input.mono, legend: false });
	sections.push({
		id: 'figure',
		heading: 'Causal diagram',
		blocks: [
			{
				kind: 'figure',
				svg,
				caption: `Figure 1. Assumed causal structure (directed acyclic graph): ${countText(d.variables.length, 'variable')}, ${countText(d.arrows.length, 'arrow')}. Each arrow is an assumed direct effect; a missing arrow assumes none. ${figureKey(d, a, input.mono ?? false)}`
			}
		]
	});

	// 3. Variables
	const settings = settingsColumn(d);
	sections.push({
		id: 'variables',
		heading: 'Variables',
		blocks: [
			{
				kind: 'table',
				head: ['Variable', 'Id', 'Measured', 'Role for the question', 'Adjusted for', 'Note', ...(settings ? [settings.head] : [])],
				rows: d.variables.map((v) => {
					const words = rolesOf(v.id, a.roles).map((r) => ROLE_WORD[r]);
					if (!words.length) {
						if (d.exposures.includes(v.id)) words.push('exposure');
						if (d.outcomes.includes(v.id)) words.push('outcome');
					}
					return [v.label, v.id, v.measured ? 'yes' : 'no', words.join(', ') || MISSING, d.adjusted.includes(v.id) ? 'yes' : 'no', v.note ?? '', ...(settings ? [settings.cell(v.id)] : [])];
				})
			}
		]
	});

	// 4. Assumptions
	let absent: AbsentArrowReport | null = null;
	const assumptions: Block[] = [{ kind: 'subheading', text: 'Arrows drawn' }];
	assumptions.push(
		d.arrows.length
			? { kind: 'list', items: arrowSentences(d, label) }
			: { kind: 'paragraph', text: 'The diagram has no arrows: every pair of variables is assumed to have no direct effect on each other.' }
	);
	assumptions.push(...arrowNoteBlocks(d, label));
	assumptions.push({ kind: 'subheading', text: 'Absent arrows the adjustment depends on' });
	if (a.sets && a.check && a.sets.identifiable) {
		const limit = input.maxAbsentArrows ?? 10;
		absent = withPlannedReasons(d, criticalAbsentArrows(d, a.sets, a.check.valid), limit);
		if (absent.items.length === 0) {
			assumptions.push({ kind: 'paragraph', text: 'No single added arrow would make the planned set or a minimal set insufficient.' });
		} else {
			assumptions.push({
				kind: 'paragraph',
				text: `Leaving an arrow out assumes that there is no direct effect. For ${absent.items.length === 1 ? 'this pair' : `these ${countText(absent.items.length, 'pair')}`}, that assumption carries the adjustment: adding the arrow would make the planned set or a minimal set insufficient.${absent.items.length > limit ? ` The ${limit} with the largest consequences are listed.` : ''}`
			});
			assumptions.push({ kind: 'list', items: absent.items.slice(0, limit).map((item) => absentSentence(item, d, a, label)) });
		}
		if (absent.truncated) assumptions.push({ kind: 'paragraph', text: `The search examined ${absent.checked} of ${absent.candidates} possible arrows (time budget); others may matter too.` });
	} else {
		assumptions.push({ kind: 'paragraph', text: 'Shown once an exposure and an outcome are chosen and the effect can be identified by adjustment.' });
	}
	const unmeasured = d.variables.filter((v) => !v.measured);
	if (unmeasured.length) assumptions.push({ kind: 'paragraph', text: `Not measured: ${listNames(unmeasured.map((v) => v.label))}.` });
	sections.push({ id: 'assumptions', heading: 'Assumptions', blocks: assumptions });

	// 5. Sets
	const setBlocks: Block[] = [];
	if (!a.sets) setBlocks.push({ kind: 'paragraph', text: 'Choose an exposure and an outcome to list the adjustment sets.' });
	else if (!a.sets.identifiable) setBlocks.push({ kind: 'paragraph', text: 'No set of measured variables is sufficient: under this diagram the effect cannot be identified by covariate adjustment.' });
	else {
		setBlocks.push({
			kind: 'paragraph',
			text: `Minimal sufficient adjustment sets for the total effect (each blocks every non-causal path and leaves out mediators and consequences of the outcome; no variable can be dropped from one):`
		});
		setBlocks.push({ kind: 'list', items: a.sets.sets.map((s) => setText(s, label)) });
		if (a.sets.truncated) setBlocks.push({ kind: 'paragraph', text: `The listing stopped after ${countText(a.sets.sets.length, 'set')}; more exist.` });
		const extra: string[] = [];
		if (a.sets.minimum) extra.push(`Smallest set: ${setText(a.sets.minimum, label)}.`);
		extra.push(optimalSetSentence(a.sets, (ids) => setText(ids, label), ' (Henckel, Perković & Maathuis 2022)'));
		setBlocks.push({ kind: 'paragraph', text: extra.join(' ') });
	}
	sections.push({ id: 'sets', heading: 'Adjustment sets', blocks: setBlocks });

	// 6. Planned set
	const planned: Block[] = [];
	if (a.check) {
		planned.push({ kind: 'verdict', valid: a.check.valid, text: verdictSentence(a.check, label) });
		if (a.check.problems.length) planned.push({ kind: 'list', items: a.check.problems.map((p) => problemText(p, d, label)) });
		const unmeasured = unmeasuredQuestionNote(d, label);
		if (unmeasured) planned.push({ kind: 'paragraph', text: unmeasured });
	} else planned.push({ kind: 'paragraph', text: 'No verdict yet: the diagram has no exposure and outcome, or is not a valid diagram.' });
	sections.push({ id: 'planned', heading: 'Planned adjustment and verdict', blocks: planned });

	// 7. Draft
	const generated = draftParagraph(d, a, absent);
	const draft = input.draft && input.draft.trim() ? input.draft.trim() : generated;
	sections.push({
		id: 'draft',
		heading: 'Draft text for the analysis plan',
		blocks: [{ kind: 'draft', text: draft, hint: 'A starting point for the statistical analysis plan; edit it to the study before use.' }]
	});

	// 8. Data
	if (input.data) sections.push({ id: 'data', heading: 'Data checks and estimates', blocks: dataBlocks(input.data, label) });

	// 9. Cautions and software
	sections.push({ id: 'cautions', heading: 'Cautions', blocks: [{ kind: 'list', items: [...CAUTIONS] }] });
	sections.push({
		id: 'software',
		heading: 'Software',
		blocks: [{ kind: 'paragraph', text: `Made with ${SOFTWARE_NAME} ${SOFTWARE_VERSION} on ${isoDate(date)}. ${METHODS}` }]
	});
	// 11. Appendix: the analysis code for the planned set
	if (input.data?.code?.length) sections.push({ id: 'code', heading: 'Appendix: analysis code', blocks: codeBlocks(input.data.code) });
	return { title, meta: `${SOFTWARE_NAME} ${SOFTWARE_VERSION} · ${isoDate(date)}`, sections };
}
