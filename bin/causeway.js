#!/usr/bin/env node
// Entry point of the `causeway` command. The command itself is bundled from src/cli by
// scripts/build-cli.mjs (run by `npm install` through the "prepare" script).
import { existsSync } from 'node:fs';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { dirname, join } from 'node:path';

const bundle = join(dirname(fileURLToPath(import.meta.url)), '..', 'dist-cli', 'causeway.mjs');
if (!existsSync(bundle)) {
	process.stderr.write('causeway: the command is not built yet; run `npm install` (or `npm run build:cli`) in the project folder\n');
	process.exit(2);
}
// Standard output and error are written synchronously by the bundle's processIo (no stream
// objects, so nothing is loaded for them at start-up and a closed pipe or a full disk is one
// line on stderr and exit status 2, never a stack trace).
const { main, processIo } = await import(pathToFileURL(bundle).href);
process.exitCode = await main(process.argv.slice(2), processIo());
