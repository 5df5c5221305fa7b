/**
 * Canvas colours against WCAG 2.1 success criterion 1.4.3 (contrast minimum 4.5:1 for text),
 * with relative luminance and contrast ratio as defined in WCAG 2.1 ("relative luminance",
 * "contrast ratio" in the glossary, https://www.w3.org/TR/WCAG21/).
 */
import { describe, expect, it } from 'vitest';
import { palette } from '../../../src/lib/palette';
import { contrast } from '../wcag-contrast';

describe('canvas label contrast (WCAG 2.1 AA, 4.5:1)', () => {
	it('matches the published examples of the formula', () => {
		// Black on white is 21:1 and a colour on itself 1:1 (WCAG 2.1 glossary, contrast ratio range).
		expect(contrast('#000000', '#ffffff')).toBeCloseTo(21, 5);
		expect(contrast('#777777', '#777777')).toBe(1);
	});

	it.each([
		['name on a plain variable', palette.text, palette.surface],
		['name on the exposure fill', palette.text, palette.exposure],
		['name on the outcome fill', palette.text, palette.outcome],
		['grey name of an unmeasured variable', palette.unmeasured, palette.surface],
		['unmeasured exposure', palette.unmeasuredOnFill, palette.exposure],
		['unmeasured outcome', palette.unmeasuredOnFill, palette.outcome],
		['the canvas background behind an unmeasured name', palette.unmeasured, '#fbfbf8']
	])('%s', (_what, fg, bg) => {
		expect(contrast(fg, bg)).toBeGreaterThanOrEqual(4.5);
	});
});
