/**
 * The protocol report as Markdown (CommonMark with GitHub pipe tables), for pasting into a
 * protocol or converting with a tool such as pandoc. All user text is escaped (escapeMarkdown).
 * The figure is embedded as an SVG data URI, so the file stands alone; `figureFile` links to a
 * separate SVG file instead. O(size of the report).
 */
import { bytesToBase64 } from './base64';
import { escapeMarkdown, escapeMarkdownInline } from './escape';
import type { Block, ReportModel } from './report';

export interface MarkdownOptions {
	/** Link the figure to this (relative) file name instead of embedding it. */
	figureFile?: string;
}

const cell = (text: string) => escapeMarkdownInline(text) || ' ';

function blockMd(b: Block, opts: MarkdownOptions): string {
	switch (b.kind) {
		case 'paragraph':
			return escapeMarkdown(b.text);
		case 'subheading':
			return `### ${escapeMarkdown(b.text)}`;
		case 'list':
			return b.items.map((i) => `- ${escapeMarkdown(i)}`).join('\n');
		case 'verdict':
			return `**${b.valid ? 'Sufficient.' : 'Not sufficient.'}** ${escapeMarkdown(b.text)}`;
		case 'draft':
			return `*${escapeMarkdown(b.hint)}*\n\n${b.text
				.split(/\n\s*\n/)
				.map((p) => p.split('\n').map((line) => `> ${escapeMarkdown(line)}`).join('\n'))
				.join('\n>\n')}`;
		case 'figure': {
			const target = opts.figureFile ? encodeURI(opts.figureFile) : `data:image/svg+xml;base64,${bytesToBase64(new TextEncoder().encode(b.svg))}`;
			return `![${escapeMarkdown(b.caption)}](${target})\n\n*${escapeMarkdown(b.caption)}*`;
		}
		case 'code': {
			// A fence longer than any run of backticks in the text (CommonMark §4.5).
			const fence = '`'.repeat(Math.max(3, ...[...b.text.matchAll(/`+/g)].map((m) => m[0].length + 1)));
			return `${fence}sh\n${b.text}\n${fence}`;
		}
		case 'table': {
			if (b.head.every((h) => h === '')) return b.rows.map((r) => `- **${escapeMarkdown(r[0])}:** ${escapeMarkdown(r.slice(1).join(' '))}`).join('\n');
			const align = b.head.map((_, i) => (b.numeric?.[i] ? '---:' : '---'));
			return [`| ${b.head.map(cell).join(' | ')} |`, `| ${align.join(' | ')} |`, ...b.rows.map((r) => `| ${r.map(cell).join(' | ')} |`)].join('\n');
		}
	}
}

export function reportMarkdown(model: ReportModel, opts: MarkdownOptions = {}): string {
	const parts = [`# ${escapeMarkdown(model.title)}`, `*Causal diagram and adjustment plan. ${escapeMarkdown(model.meta)}*`];
	model.sections.forEach((s, i) => {
		parts.push(`## ${i + 1}. ${escapeMarkdown(s.heading)}`);
		for (const b of s.blocks) parts.push(blockMd(b, opts));
	});
	return parts.join('\n\n') + '\n';
}
