/**
 * WCAG 2.1 contrast ratio between two #rrggbb colours, with relative luminance and contrast
 * ratio as the WCAG 2.1 glossary defines them ("relative luminance", "contrast ratio",
 * https://www.w3.org/TR/WCAG21/). Success criterion 1.4.3 asks 4.5:1 for text.
 */
function luminance(hex: string): number {
	const [r, g, b] = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16) / 255);
	const lin = (c: number) => (c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4);
	return 0.2126 * lin(r) + 0.7152 * lin(g) + 0.0722 * lin(b);
}

export function contrast(a: string, b: string): number {
	const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x);
	return (hi + 0.05) / (lo + 0.05);
}
