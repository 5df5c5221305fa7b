/**
 * Every colour of the app and its exports, named by what it means. The page reads them as CSS
 * custom properties (`var(--colour-open-path)`, generated into src/lib/ui/palette.css by
 * `npm run build:palette`; a unit test fails when that file is stale); SVG, PNG and the HTML
 * report take the literal values from here, since an exported file cannot read the page's CSS.
 *
 * The hues that carry meaning are the colour-blind-safe set of Okabe & Ito (2008, "Color
 * Universal Design"): they stay apart under the common colour-vision deficiencies.
 * Text colours meet WCAG AA (4.5:1) on the surfaces they are used on (tests/e2e/a11y.e2e.ts).
 *
 * Letter case is kept as the exports have always written it (#E69F00 in SVG figures).
 */

// ——— Base hues (Okabe & Ito 2008) ———
const orange = '#E69F00';
const reddishPurple = '#CC79A7';
const blue = '#0072b2';
const vermillion = '#d55e00';
const bluishGreen = '#009e73';
const skyBlue = '#56b4e9';
const grey767676 = '#767676';
const grey6b6b6b = '#6b6b6b';

export const palette = {
	// ——— The diagram's own code: roles and paths, on the canvas, in lists and in exports ———
	exposure: orange,
	outcome: reddishPurple,
	/** A causal path from exposure to outcome. */
	causalPath: blue,
	/** An open non-causal path (it carries association that is not the effect). */
	openPath: vermillion,
	/** A path the planned set (or a collider) blocks. */
	blockedPath: grey767676,
	/** A sufficient set, a finding in its favour. */
	valid: bluishGreen,
	/** Selected variables and arrows; the selected row of a check list. */
	selection: skyBlue,
	/** Border and name of an unmeasured variable. */
	unmeasured: '#575757',
	/** Name of an unmeasured exposure or outcome on its fill: darker, to keep 4.5:1 there. */
	unmeasuredOnFill: '#262626',
	/** An unmeasured variable's name in the small review sketches. */
	sketchUnmeasured: '#5a5a5a',
	/** Arrows of the diagram. */
	arrow: '#3b3b3b',
	/** Pure black, for the monochrome figure. */
	monoInk: '#000000',

	// ——— A second diagram compared with this one ———
	added: blue,
	removed: vermillion,
	reversed: bluishGreen,

	// ——— Text ———
	text: '#1a1a1a',
	/** Captions and secondary lines inside tables. */
	textSoft: '#333333',
	/** Notes and explanations under a heading. */
	muted: '#3d3d3d',
	/** "Nothing yet" lines and hints. */
	hint: '#4a4a4a',
	/** Disabled controls, plain arrows in sketches, the blocked-path mark in lists. */
	faded: grey6b6b6b,
	/** The brand, section numbers, favourable data findings: the accent dark enough for text. */
	accentText: '#005a8c',
	/** A failed load of a section's code. */
	errorText: '#a4001d',

	// ——— Accent: focus, pressed and informational ———
	accent: blue,
	/** Background of a pressed toggle button. */
	pressed: '#dcedf8',
	/** Background of a pinned (lit) list item. */
	litPressed: '#e3f1fb',
	/** Background of a hovered list item. */
	litHover: '#f2f8fc',
	/** Background of the selected row of a check list and of a favourable badge. */
	selectedRow: '#e8f3fa',
	/** Informational panels: progress, notes, the sufficient verdict in the report. */
	info: '#eef5fa',
	infoSoft: '#f3f8fb',
	infoBorder: '#c8d8e4',
	infoBorderSoft: '#b5c9d6',
	/** Box of a box plot. */
	chartFill: '#d6e8f4',
	/** The dashed frame where a data file is dropped. */
	dropBorder: '#99aabb',

	// ——— Warnings, refusals and findings against the plan ———
	warning: vermillion,
	warningSurface: '#fdf1ea',
	warningSurfaceSoft: '#fdf6f1',
	/** A limit passed, a column that cannot be used. */
	warningText: '#a04000',
	/** A problem stated in the review tools. */
	problemText: '#a14400',
	/** Data that speak against an arrow or a claim; an estimate's flag. */
	againstText: '#8a3a00',
	/** Notices of the data tools (codes, warnings, left-out rows). */
	noticeText: '#7a3400',
	noticeTextDeep: '#5a2600',
	/** The badge of a claim the data contradict. */
	contradicted: '#b34700',
	/** The mark beside a caution: the exposure's orange, which reads as "look here". */
	cautionMark: '#e69f00',
	validSurface: '#ebf7f3',
	/** A weak finding (some support, not enough). */
	weakText: '#5a4a00',
	weakBorder: '#8a7a30',
	weakSurface: '#fbf6dc',

	// ——— Surfaces ———
	surface: '#ffffff',
	/** The canvas behind the diagram (and, translucent, the veil over what is not lit). */
	canvas: '#fbfbf8',
	/** A note's tooltip on the canvas. */
	noteSurface: '#fffdf4',
	/** The report's page behind its sheet. */
	page: '#f4f4f0',
	/** Buttons and code blocks. */
	control: '#f7f7f4',
	controlHover: '#e9eef2',
	/** Keyboard keys. */
	key: '#fafafa',
	/** Section headings and the folded column. */
	sunken: '#f1f1ec',
	sunkenHover: '#e7e7e0',
	/** The report's draft text. */
	draft: '#fbfbf7',
	/** Detail rows that unfold inside a table. */
	detailRow: '#f7f9fa',

	// ——— Lines and borders, darkest first ———
	/** Dialogs and the "planned" tag. */
	frame: '#555555',
	menuBorder: '#5c5c5c',
	/** Borders of buttons and inputs; axes of small charts. */
	controlBorder: grey767676,
	axis: grey767676,
	/** Floating notices, messages and panels. */
	border: '#8a8a8a',
	/** List buttons and keyboard keys. */
	itemBorder: '#9a9a9a',
	disabledBorder: '#b5b5b5',
	menuKeyBorder: '#bbbbbb',
	/** Between the toolbar, the canvas and the column. */
	rule: '#c8c8c0',
	/** Under section headings. */
	ruleSoft: '#d6d6d0',
	/** Table lines of the report. */
	tableRule: '#dcdcd6',
	menuRule: '#dddddd',
	/** Grid lines of charts; sub-headings. */
	gridLine: '#e2e2dc',
	/** Between list items. */
	listRule: '#e4e4df',
	/** Between table rows. */
	rowRule: '#e6e6e0'
} as const;

export type PaletteName = keyof typeof palette;

/** The custom property of a colour: `openPath` → `--colour-open-path`. */
export function cssVariable(name: PaletteName): string {
	return `--colour-${name.replace(/[A-Z]/g, (c) => `-${c.toLowerCase()}`)}`;
}

/** The text of src/lib/ui/palette.css (values lower-cased: CSS ignores their case). */
export function paletteCss(): string {
	const lines = (Object.keys(palette) as PaletteName[]).map((name) => `\t${cssVariable(name)}: ${palette[name].toLowerCase()};`);
	return `/* Generated from src/lib/palette.ts by \`npm run build:palette\`: edit that file, not this one. */\n:root {\n${lines.join('\n')}\n}\n`;
}
