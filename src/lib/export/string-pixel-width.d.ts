// string-pixel-width 1.11 ships no type declarations; this covers the call the exports use.
declare module 'string-pixel-width' {
	interface Settings {
		font?: string;
		size?: number;
		bold?: boolean;
		italic?: boolean;
	}
	export default function getWidth(text: string, settings?: Settings): number;
}
