/**
 * Escaping user text (labels, notes, titles) for each output language, so that a label such
 * as `<img src=x onerror=alert(1)>` or `50% & more_{x}` is shown as written and never read as
 * markup. Hand-written: each is a fixed table of a few characters, smaller than any library
 * call site, and each is checked in tests by the language's own parser or compiler
 * (an XML parser, an HTML5 parser, a CommonMark parser, pdflatex).
 */

const XML: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/**
 * Text for XML/HTML content and attribute values (quotes included, so either quoting works).
 * Characters XML 1.0 forbids (C0 controls other than tab, line feed and carriage return,
 * lone surrogates, U+FFFE/U+FFFF) are replaced by U+FFFD so the file stays well-formed.
 * O(length).
 */
export function escapeXml(text: string): string {
	return text
		.replace(/[&<>"']/g, (c) => XML[c])
		.replace(/[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/g, '\uFFFD');
}

const LATEX: Record<string, string> = {
	'\\': '\\textbackslash{}',
	'{': '\\{',
	'}': '\\}',
	$: '\\$',
	'&': '\\&',
	'#': '\\#',
	'^': '\\textasciicircum{}',
	_: '\\_',
	'%': '\\%',
	'~': '\\textasciitilde{}',
	'<': '\\textless{}',
	'>': '\\textgreater{}',
	'|': '\\textbar{}'
};

/**
 * Text for a LaTeX document (pdflatex, default OT1 font encoding): the ten special characters
 * and `<`, `>`, `|`, which OT1 would draw as other glyphs (a straight quote stays as is and is
 * drawn as a closing quote). Line breaks become spaces; the caller breaks
 * lines itself. Non-ASCII letters are kept (UTF-8 input is LaTeX's default since 2018).
 * O(length).
 */
export function escapeLatex(text: string): string {
	return text.replace(/[\r\n\t]+/g, ' ').replace(/[\\{}$&#^_%~<>|]/g, (c) => LATEX[c]);
}

/**
 * Text for Markdown (CommonMark and GitHub tables), placed inside a line (after "- ", in a
 * table cell or a sentence). Inline markup characters are backslash-escaped, as CommonMark
 * §2.4 allows for any ASCII punctuation, so `<tag>` stays text, `|` does not split a table
 * cell, `*` and `_` start no emphasis and `&lt;` is not decoded. A leading block marker
 * (`#`, `>`, `+`, `-`, `=`, "1." or "1)") is escaped too, because text after "- " starts a
 * line of its own inside a list item. Line breaks become spaces. O(length).
 */
export function escapeMarkdown(text: string): string {
	return escapeMarkdownInline(text).replace(/^(\s*)([#>+=-])/, '$1\\$2').replace(/^(\s*\d+)([.)])/, '$1\\$2');
}

/** escapeMarkdown without the leading block-marker rule: for table cells, which hold inline text only. */
export function escapeMarkdownInline(text: string): string {
	return text.replace(/[\r\n]+/g, ' ').replace(/[\\`*_[\]<>|~&]/g, (c) => `\\${c}`);
}
