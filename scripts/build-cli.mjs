// Bundles the `causeway` command (src/cli/main.ts) into dist-cli/ with esbuild, so `npx causeway`
// starts fast and needs no TypeScript loader at run time. Code splitting: every command loaded
// by a dynamic import (main.ts) gets its own chunk, so start-up reads only the entry chunk and
// the command's own code. The metafile (dist-cli/meta.json) says which source went where; the
// tests read it to check that no canvas library (cytoscape) reaches the command line.
import { build } from 'esbuild';
import { existsSync, rmSync, writeFileSync } from 'node:fs';

if (!existsSync('src/cli/main.ts')) process.exit(0);
rmSync('dist-cli', { recursive: true, force: true });
const result = await build({
	entryPoints: { causeway: 'src/cli/main.ts' },
	outdir: 'dist-cli',
	outExtension: { '.js': '.mjs' },
	chunkNames: 'chunks/[name]-[hash]',
	bundle: true,
	splitting: true,
	platform: 'node',
	format: 'esm',
	target: 'node20',
	sourcemap: false,
	metafile: true,
	logLevel: 'warning',
	// Prefer packages' ES-module builds: jsonc-parser's UMD build loads its parts with a
	// run-time require that a bundle cannot follow.
	mainFields: ['module', 'main'],
	// The same build-time replacements as the app (vite.config.ts): no `eval` feature test.
	alias: { '@stdlib/assert-has-generator-support': './src/lib/stats/shims/has-generator-support.cjs' },
	banner: { js: "import { createRequire as __cwCreateRequire } from 'node:module'; const require = __cwCreateRequire(import.meta.url);" }
});
writeFileSync('dist-cli/meta.json', JSON.stringify(result.metafile));
