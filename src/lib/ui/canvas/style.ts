/**
 * The canvas stylesheet: the visual language of DESIGN.md in Cytoscape terms.
 * Okabe & Ito (2008) colour-blind-safe palette; every state also has a non-colour cue
 * (dashed outline, square box, line style, text badge) so colour is never the only signal.
 */
import type { StylesheetJson } from 'cytoscape';

export const COLOURS = {
	exposure: '#E69F00',
	outcome: '#CC79A7',
	causal: '#0072B2',
	biasing: '#D55E00',
	blocked: '#767676',
	ink: '#1a1a1a',
	unmeasuredInk: '#575757',
	/** Name of an unmeasured exposure or outcome: darker, to keep 4.5:1 on the fills. */
	unmeasuredOnFill: '#262626',
	selection: '#56B4E9',
	paper: '#ffffff'
} as const;

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
			'background-color': COLOURS.paper,
			'border-width': 1.5,
			'border-color': COLOURS.ink,
			label: 'data(text)',
			'text-wrap': 'wrap',
			'text-valign': 'center',
			'text-halign': 'center',
			'font-family': FONT_FAMILY,
			'font-size': LABEL_FONT_PX,
			'line-height': LINE_HEIGHT,
			color: COLOURS.ink,
			'text-events': 'no'
		}
	},
	{ selector: 'node.exposure', style: { 'background-color': COLOURS.exposure } },
	{ selector: 'node.outcome', style: { 'background-color': COLOURS.outcome } },
	{
		selector: 'node.unmeasured',
		style: { 'border-style': 'dashed', 'border-width': 2, 'border-color': COLOURS.unmeasuredInk, color: COLOURS.unmeasuredInk }
	},
	{ selector: 'node.unmeasured.exposure, node.unmeasured.outcome', style: { color: COLOURS.unmeasuredOnFill } },
	{
		selector: 'edge',
		style: {
			width: 2,
			'curve-style': 'straight', // a DAG has no opposite or parallel arrows, so no curves are needed (and straight lines draw faster)
			'line-color': '#3b3b3b',
			'target-arrow-color': '#3b3b3b',
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
			color: COLOURS.ink,
			'text-background-color': COLOURS.paper,
			'text-background-opacity': 0.9,
			'text-background-padding': '2px',
			'text-events': 'no'
		}
	},
	{ selector: 'edge.data-supported', style: { color: '#005a8c' } },
	{ selector: 'edge.data-absent', style: { 'line-style': 'dashed', 'line-dash-pattern': [5, 4], color: '#8a3a00' } },
	{ selector: 'edge.data-untested', style: { color: COLOURS.unmeasuredInk } },
	{
		// An arrow with a note: a pencil near its start (NOTE_MARK).
		selector: 'edge.has-note',
		style: {
			'source-label': NOTE_MARK,
			'source-text-offset': 22,
			'font-family': FONT_FAMILY,
			'font-size': 13,
			color: COLOURS.ink,
			'text-background-color': COLOURS.paper,
			'text-background-opacity': 0.9,
			'text-background-padding': '1px',
			'text-events': 'no'
		}
	},
	// Selection, highlights, a refused cycle and the keyboard's arrow target are not styles:
	// canvas/overlay.ts draws them over the scene, so changing them never restyles elements.
	// Edge-drawing gesture (cytoscape-edgehandles classes).
	{ selector: '.eh-ghost-edge, edge.eh-preview', style: { 'line-color': COLOURS.causal, 'target-arrow-color': COLOURS.causal, width: 3, 'line-style': 'dashed' } },
	{ selector: 'edge.eh-preview.refused', style: { 'line-color': COLOURS.biasing, 'target-arrow-color': COLOURS.biasing, 'target-arrow-shape': 'tee' } },
	{ selector: 'node.eh-target', style: { 'underlay-color': COLOURS.causal, 'underlay-opacity': 0.35, 'underlay-padding': 10 } },
	{ selector: '.eh-ghost-edge.eh-preview-active', style: { opacity: 0 } }
];
