/// <reference path="./string-pixel-width.d.ts" />
/**
 * Text widths for exported figures, from published Arial advance widths (the tables of the
 * string-pixel-width package). The same numbers in the app and the CLI make the exported SVG
 * identical wherever it is made, unlike a browser canvas measurement, which depends on the
 * fonts installed. Figures name Arial first, then the metric-compatible Liberation Sans and
 * Nimbus Sans, so the boxes fit the text wherever one of them is installed. O(length).
 */
import getWidth from 'string-pixel-width';

export type TextWidth = (text: string, px: number, style?: { bold?: boolean; italic?: boolean }) => number;

/** Width in pixels of one line of text in Arial at `px` pixels. */
export const arialWidth: TextWidth = (text, px, style = {}) => getWidth(text, { font: 'arial', size: px, bold: style.bold, italic: style.italic });

/** The font stack written into exported figures: metric-compatible faces first, then generic fallback. */
export const FIGURE_FONT_STACK = "Arial, 'Liberation Sans', 'Nimbus Sans', Helvetica, sans-serif";
