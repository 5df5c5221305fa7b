// Bundles the `causeway` command (src/cli/main.ts) into dist-cli/causeway.mjs with esbuild,
// so `npx causeway` starts fast and needs no TypeScript loader at run time.
import { build } from 'esbuild';
import { existsSync } from 'node:fs';

if (!existsSync('src/cli/main.ts')) process.exit(0);
await build({
	entryPoints: ['src/cli/main.ts'],
	outfile: 'dist-cli/causeway.mjs',
	bundle: true,
	platform: 'node',
	format: 'esm',
	target: 'node20',
	sourcemap: false,
	logLevel: 'warning',
	// Prefer packages' ES-module builds: jsonc-parser's UMD build loads its parts with a
	// run-time require that a bundle cannot follow.
	mainFields: ['module', 'main'],
	// The same build-time replacements as the app (vite.config.ts): no `eval` feature test.
	alias: { '@stdlib/assert-has-generator-support': './src/lib/stats/shims/has-generator-support.cjs' },
	banner: { js: "import { createRequire as __cwCreateRequire } from 'node:module'; const require = __cwCreateRequire(import.meta.url);" }
});
