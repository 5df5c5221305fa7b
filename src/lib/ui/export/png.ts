/**
 * PNG from the exported SVG figure, in the browser: the SVG is loaded as an image and drawn
 * onto a canvas at the chosen scale (no library: the browser's own SVG renderer is the best
 * rasteriser available here, and the text is drawn with the fonts the SVG names).
 */
import { palette } from '../../palette';

/** Largest canvas side Chromium, Firefox and Safari all accept. */
export const MAX_CANVAS_SIDE = 16_384;

export function svgSize(svg: string): { width: number; height: number } {
	const m = /<svg\b[^>]*?\bwidth="([\d.]+)"[^>]*?\bheight="([\d.]+)"/.exec(svg);
	if (!m) throw new Error('the figure has no width and height');
	return { width: Number(m[1]), height: Number(m[2]) };
}

/** The figure as PNG bytes at `scale` × its CSS-pixel size, on a white background. */
export async function svgToPng(svg: string, scale: number): Promise<Blob> {
	const { width, height } = svgSize(svg);
	const w = Math.round(width * scale);
	const h = Math.round(height * scale);
	if (w > MAX_CANVAS_SIDE || h > MAX_CANVAS_SIDE) {
		throw new Error(`at ${scale}× the picture would be ${w} × ${h} pixels; browsers draw at most ${MAX_CANVAS_SIDE} per side — choose a smaller scale`);
	}
	const url = URL.createObjectURL(new Blob([svg], { type: 'image/svg+xml' }));
	try {
		const img = new Image(width, height);
		img.src = url;
		await img.decode();
		const canvas = document.createElement('canvas');
		canvas.width = w;
		canvas.height = h;
		const ctx = canvas.getContext('2d');
		if (!ctx) throw new Error('this browser gave no canvas to draw on');
		ctx.fillStyle = palette.surface;
		ctx.fillRect(0, 0, w, h);
		ctx.drawImage(img, 0, 0, w, h);
		return await new Promise<Blob>((resolve, reject) => canvas.toBlob((b) => (b ? resolve(b) : reject(new Error('the browser could not encode the PNG'))), 'image/png'));
	} finally {
		URL.revokeObjectURL(url);
	}
}
