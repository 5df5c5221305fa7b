/**
 * The parts of the protocol report that make it reproducible from the study's files: each
 * variable's data settings (variables table), the reasons given for the arrows (assumptions),
 * and, with data, how each variable met the data file and the commands that reproduce every
 * figure from the saved diagram file and the data file. Pure; blocks for report.ts.
 */
import type { Diagram } from '../graph/diagram';
import { dataSettingsText, listNames, MISSING, type LabelOf } from '../wording';
import type { ReportDataResults } from './report-data';
import type { Block } from './report';

/** The variables table's extra column: each variable's data settings, when any variable has some. */
export function settingsColumn(d: Diagram): { head: string; cell: (id: string) => string } | null {
	if (!d.variables.some((v) => v.data)) return null;
	return { head: 'Data settings', cell: (id) => {
		const v = d.variables.find((x) => x.id === id);
		return v?.data ? dataSettingsText(v.data) : 'matched by name';
	} };
}

/** The reasons written for the arrows, as a table (nothing when no arrow has a note). */
export function arrowNoteBlocks(d: Diagram, label: LabelOf): Block[] {
	const noted = d.arrows.filter((a) => a.note !== undefined && a.note.trim() !== '');
	if (noted.length === 0) return [];
	return [
		{ kind: 'subheading', text: 'Why the arrows are assumed' },
		{ kind: 'table', head: ['Arrow', 'Reason given'], rows: noted.map((a) => [`${label(a.from)} → ${label(a.to)}`, a.note as string]) }
	];
}

/** How the variables met the data, and the commands that reproduce the figures. */
export function reproducibilityBlocks(data: ReportDataResults, label: LabelOf): Block[] {
	const blocks: Block[] = [];
	if (data.columns?.length) {
		blocks.push({
			kind: 'table',
			head: ['Variable', 'Column', 'Analysed as', 'Reference level'],
			rows: data.columns.map((c) => [label(c.variable), c.column, `${c.kind} (${c.chosen ? 'chosen' : 'detected'})`, c.reference ?? MISSING])
		});
		const missing = [...new Set(data.notes?.filter((n) => n.startsWith('No column for')) ?? [])];
		if (missing.length === 0) blocks.push({ kind: 'paragraph', text: `Every measured variable has a column (${listNames(data.columns.map((c) => label(c.variable)))}).` });
	}
	if (data.reproduce) {
		blocks.push({
			kind: 'paragraph',
			text: `To reproduce every figure of this section, save the diagram as ${data.reproduce.diagramFile} (it carries the data settings above) and run, in a folder that holds it and ${data.reproduce.dataFile}:`
		});
		blocks.push({ kind: 'code', language: 'Shell', tag: 'sh', text: data.reproduce.commands.join('\n') });
	}
	return blocks;
}
