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
// A reader that stops early (`causeway claims d.json | head`) closes the pipe: that is not an
// error of ours, so end quietly as other Unix tools do instead of printing a stack trace.
process.stdout.on('error', (err) => {
	if (err && err.code === 'EPIPE') process.exit(process.exitCode ?? 0);
	throw err;
});
const { main } = await import(pathToFileURL(bundle).href);
process.exitCode = await main(process.argv.slice(2), {
	stdout: (s) => process.stdout.write(s),
	stderr: (s) => process.stderr.write(s),
	readFile: undefined
});
