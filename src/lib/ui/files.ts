/** Browser file plumbing: saving text as a download and reading a chosen or dropped file. */

/** Offers `text` as a file download (a blob: URL, so nothing leaves the machine). */
export function downloadText(name: string, text: string, type: string): void {
	const url = URL.createObjectURL(new Blob([text], { type }));
	const a = document.createElement('a');
	a.href = url;
	a.download = name;
	a.rel = 'noopener';
	document.body.append(a);
	a.click();
	a.remove();
	setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

/** A file name from the diagram title: "Cycling and BP" → "cycling-and-bp". */
export function fileStem(title: string): string {
	const stem = title
		.normalize('NFKC')
		.toLowerCase()
		.split(/[^\p{L}\p{N}]+/u)
		.filter(Boolean)
		.join('-')
		.slice(0, 60);
	return stem || 'diagram';
}

/** Files larger than this are refused before reading: a diagram file is a few hundred kB at most. */
export const MAX_FILE_BYTES = 5 * 1024 * 1024;

export async function readFileText(file: File): Promise<string> {
	if (file.size > MAX_FILE_BYTES) throw new Error(`${file.name}: the file is ${(file.size / 1048576).toFixed(1)} MB; a diagram file is at most 5 MB`);
	return await file.text();
}
