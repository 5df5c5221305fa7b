/**
 * Base64 (RFC 4648 §4) and base64url (§5, no padding) of bytes, with the platform's btoa/atob
 * (browsers, workers and Node ≥ 16 alike; no node: import). Hand-written around them because
 * Uint8Array.prototype.toBase64 is not yet in every browser we support. O(length).
 */

export function bytesToBase64(bytes: Uint8Array): string {
	let binary = '';
	const CHUNK = 0x8000; // String.fromCharCode takes its arguments on the stack: keep calls small.
	for (let i = 0; i < bytes.length; i += CHUNK) binary += String.fromCharCode(...bytes.subarray(i, i + CHUNK));
	return btoa(binary);
}

export function bytesToBase64Url(bytes: Uint8Array): string {
	return bytesToBase64(bytes).replace(/\+/g, '-').replace(/\//g, '_').replace(/=+$/, '');
}

/** Decodes base64url (padding optional); throws a plain Error naming the first bad character. */
export function base64UrlToBytes(text: string): Uint8Array {
	const bad = text.search(/[^A-Za-z0-9_-]/);
	if (bad >= 0) throw new Error(`character ${bad + 1} ("${text[bad]}") is not part of the link's code`);
	if (text.length % 4 === 1) throw new Error('the code has a wrong length: the link may have been cut off');
	const binary = atob(text.replace(/-/g, '+').replace(/_/g, '/') + '='.repeat((4 - (text.length % 4)) % 4));
	const out = new Uint8Array(binary.length);
	for (let i = 0; i < binary.length; i++) out[i] = binary.charCodeAt(i);
	return out;
}
