/**
 * The canvas stylesheet: the visual language of DESIGN.md in Cytoscape terms.
 * Okabe & Ito (2008) colour-blind-safe palette; every state also has a non-colour cue
 * (dashed outline, square box, line style, text badge) so colour is never the only signal.
 */
import type { StylesheetJson } from 'cytoscape';
import { palette } from '../../palette';


/**
 * Marks an arrow that has a note (the reason it is assumed). Variables are not marked: most
 * carry a short description, shown on hover and selection and in the text view.
 */
export const NOTE_MARK = '✎';

export const FONT_FAMILY = 'system-ui, "DejaVu Sans", "Liberation Sans", sans-serif';
export const LABEL_FONT_PX = 14;
export const BADGE_FONT_PX = 14;
export const LINE_HEIGHT = 1.25;

export const canvasStyle: StylesheetJson = [
	{
		selector: 'node',
		style: {
			shape: 'round-rectangle',
			width: 'data(w)',
			height: 'data(h)',
			'background-color': palette.surface,
			'border-width': 1.5,
			'border-color': palette.text,
			label: 'data(text)',
			'text-wrap': 'wrap',
			'text-valign': 'center',
			'text-halign': 'center',
			'font-family': FONT_FAMILY,
			'font-size': LABEL_FONT_PX,
			'line-height': LINE_HEIGHT,
			color: palette.text,
			'text-events': 'no'
		}
	},
	{ selector: 'node.exposure', style: { 'background-color': palette.exposure } },
	{ selector: 'node.outcome', style: { 'background-color': palette.outcome } },
	{
		selector: 'node.unmeasured',
		style: { 'border-style': 'dashed', 'border-width': 2, 'border-color': palette.unmeasured, color: palette.unmeasured }
	},
	{ selector: 'node.unmeasured.exposure, node.unmeasured.outcome', style: { color: palette.unmeasuredOnFill } },
	{
		selector: 'edge',
		style: {
			width: 2,
			'curve-style': 'straight', // a DAG has no opposite or parallel arrows, so no curves are needed (and straight lines draw faster)
			'line-color': palette.arrow,
			'target-arrow-color': palette.arrow,
			'target-arrow-shape': 'triangle',
			'arrow-scale': 1.3
		}
	},
	// Data verdicts on arrows (Data section): a text tag always, a dashed line when no
	// association was found. Before the highlights, which take precedence while shown.
	{
		selector: 'edge.data-supported, edge.data-weak, edge.data-absent, edge.data-untested',
		style: {
			label: 'data(dataTag)',
			'font-family': FONT_FAMILY,
			'font-size': 11,
			color: palette.text,
			'text-background-color': palette.surface,
			'text-background-opacity': 0.9,
			'text-background-padding': '2px',
			'text-events': 'no'
		}
	},
	{ selector: 'edge.data-supported', style: { color: palette.accentText } },
	{ selector: 'edge.data-absent', style: { 'line-style': 'dashed', 'line-dash-pattern': [5, 4], color: palette.againstText } },
	{ selector: 'edge.data-untested', style: { color: palette.unmeasured } },
	{
		// An arrow with a note: a pencil near its start (NOTE_MARK).
		selector: 'edge.has-note',
		style: {
			'source-label': NOTE_MARK,
			'source-text-offset': 22,
			'font-family': FONT_FAMILY,
			'font-size': 13,
			color: palette.text,
			'text-background-color': palette.surface,
			'text-background-opacity': 0.9,
			'text-background-padding': '1px',
			'text-events': 'no'
		}
	},
	// Selection, highlights, a refused cycle and the keyboard's arrow target are not styles:
	// canvas/overlay.ts draws them over the scene, so changing them never restyles elements.
	// Edge-drawing gesture (cytoscape-edgehandles classes).
	{ selector: '.eh-ghost-edge, edge.eh-preview', style: { 'line-color': palette.causalPath, 'target-arrow-color': palette.causalPath, width: 3, 'line-style': 'dashed' } },
	{ selector: 'edge.eh-preview.refused', style: { 'line-color': palette.openPath, 'target-arrow-color': palette.openPath, 'target-arrow-shape': 'tee' } },
	{ selector: 'node.eh-target', style: { 'underlay-color': palette.causalPath, 'underlay-opacity': 0.35, 'underlay-padding': 10 } },
	{ selector: '.eh-ghost-edge.eh-preview-active', style: { opacity: 0 } }
];
