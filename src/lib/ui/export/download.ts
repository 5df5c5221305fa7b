/** Offering bytes or text as a file download, and opening a document in a new tab (blob: URLs, nothing leaves the machine). */

export function downloadBlob(name: string, blob: Blob): void {
	const url = URL.createObjectURL(blob);
	const a = document.createElement('a');
	a.href = url;
	a.download = name;
	a.rel = 'noopener';
	document.body.append(a);
	a.click();
	a.remove();
	setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

/** Opens an HTML document in a new tab to read or print; false when the browser blocked it. */
export function openHtmlTab(html: string): boolean {
	const url = URL.createObjectURL(new Blob([html], { type: 'text/html' }));
	const tab = window.open(url, '_blank');
	setTimeout(() => URL.revokeObjectURL(url), 60_000);
	return tab !== null;
}
