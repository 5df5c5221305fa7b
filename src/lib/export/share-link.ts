/**
 * Share links: the diagram (never data) in the URL fragment, as
 * `#diagram=1.<base64url of raw DEFLATE of the native JSON file>`.
 *
 * The fragment is not sent to any server when the link is opened (RFC 3986 §3.5: the browser
 * keeps it), so the diagram travels only as the user copies the link. The native JSON writer
 * keeps ids, labels, roles, positions, notes (on variables and arrows), each variable's data
 * settings (column, kind, reference level, value labels) and unknown keys, so opening the link restores
 * the diagram exactly.
 *
 * Compression: fflate (raw DEFLATE, RFC 1951) rather than lz-string or the platform's
 * CompressionStream. fflate is synchronous, so the app can show the link as the diagram
 * changes and read it during start-up without waiting on a stream; it runs the same in the
 * browser, workers, the CLI and tests; it is maintained, dependency-free and about 8 kB for the
 * two functions used. DEFLATE also compresses JSON better than lz-string's URI mode
 * (measured once on the demo diagram: 3 903 bytes of JSON give a 1 149-character fragment with
 * fflate and 1 936 characters with lz-string 1.5's compressToEncodedURIComponent; the test
 * keeps the demo's link, with its three arrow notes, under 1 400 characters). Decoding is capped at 5 MB of JSON, like opening a file, so a crafted
 * link cannot exhaust memory. O(size of the diagram).
 */
import { deflateSync, Inflate, strToU8 } from 'fflate';
import type { Diagram } from '../graph/diagram';
import { InputError } from '../graph/errors';
import { parseDiagramJson, writeDiagramJson } from '../graph/native-json';
import { firstUnopenableIssue } from '../graph/validate';
import { base64UrlToBytes, bytesToBase64Url } from './base64';

export const SHARE_PREFIX = 'diagram=1.';
/** Largest diagram a link may unpack to, in bytes of JSON (the app's file limit). */
export const MAX_SHARED_JSON_BYTES = 5 * 1024 * 1024;

/** The fragment (without "#") that carries the diagram. */
export function shareFragment(d: Diagram): string {
	const json = writeDiagramJson(d);
	return SHARE_PREFIX + bytesToBase64Url(deflateSync(strToU8(json), { level: 9 }));
}

/** A full link: the page address without its old fragment, plus the diagram's fragment. */
export function shareLink(pageUrl: string, d: Diagram): string {
	const hash = pageUrl.indexOf('#');
	return `${hash >= 0 ? pageUrl.slice(0, hash) : pageUrl}#${shareFragment(d)}`;
}

/** True when a location's fragment (with or without "#") is a share link. */
export function isShareFragment(fragment: string): boolean {
	return fragment.replace(/^#/, '').startsWith('diagram=');
}

function inflateCapped(bytes: Uint8Array): Uint8Array {
	const parts: Uint8Array[] = [];
	let total = 0;
	let done = false;
	const inflater = new Inflate((chunk, final) => {
		total += chunk.length;
		if (total > MAX_SHARED_JSON_BYTES) throw new InputError(`The shared diagram is larger than ${MAX_SHARED_JSON_BYTES / 1048576} MB unpacked; it was not opened`);
		parts.push(chunk);
		if (final) done = true;
	});
	// Small input pieces bound each output piece (DEFLATE expands at most ~1032:1).
	const STEP = 1024;
	try {
		for (let i = 0; i < bytes.length; i += STEP) inflater.push(bytes.subarray(i, i + STEP), i + STEP >= bytes.length);
		if (bytes.length === 0) inflater.push(bytes, true);
	} catch (e) {
		if (e instanceof InputError) throw e;
		throw new InputError(`The share link is damaged: its compressed data cannot be unpacked (${e instanceof Error ? e.message : String(e)}); it may have been cut off when copied`);
	}
	if (!done) throw new InputError('The share link is damaged: its compressed data end too early; it may have been cut off when copied');
	const out = new Uint8Array(total);
	let at = 0;
	for (const p of parts) {
		out.set(p, at);
		at += p.length;
	}
	return out;
}

/**
 * The diagram in a share fragment (with or without "#"), or null when the fragment is not a
 * share link. Throws InputError with a one-line message when it is one but cannot be read:
 * unknown version, characters outside base64url, damaged compression, or a diagram the native
 * reader refuses (its message names the place).
 */
export function readShareFragment(fragment: string): Diagram | null {
	const text = fragment.replace(/^#/, '');
	if (!isShareFragment(text)) return null;
	let code = text.slice(text.indexOf('=') + 1);
	try {
		code = decodeURIComponent(code);
	} catch {
		throw new InputError('The share link is damaged: it holds a broken %-escape');
	}
	const dot = code.indexOf('.');
	const version = dot < 0 ? '' : code.slice(0, dot);
	if (version !== '1') {
		throw new InputError(
			/^\d+$/.test(version)
				? `The share link was made by a newer version of Causeway (link format ${version}); this version reads format 1`
				: 'The share link is damaged: it does not start with a format number'
		);
	}
	let bytes: Uint8Array;
	try {
		bytes = base64UrlToBytes(code.slice(dot + 1));
	} catch (e) {
		throw new InputError(`The share link is damaged: ${e instanceof Error ? e.message : String(e)}`);
	}
	const json = inflateCapped(bytes);
	let jsonText: string;
	try {
		jsonText = new TextDecoder('utf-8', { fatal: true }).decode(json);
	} catch {
		throw new InputError('The share link is damaged: its diagram is not valid UTF-8 text');
	}
	let shared: Diagram;
	try {
		shared = parseDiagramJson(jsonText);
	} catch (e) {
		throw new InputError(`The share link holds a diagram that cannot be read: ${e instanceof Error ? e.message : String(e)}`);
	}
	// As for opened files: repeated ids and arrows to unlisted variables cannot be drawn.
	const unopenable = firstUnopenableIssue(shared);
	if (unopenable) throw new InputError(`The share link holds a diagram that cannot be opened: ${unopenable.message}`);
	return shared;
}
