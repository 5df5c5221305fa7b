/**
 * `npm run bench`: prints figures and ratios measured in one run, and writes them to
 * bench/RESULTS.md with a description of the machine. Timings are never pass/fail.
 */
import { cpus, totalmem, platform, release } from 'node:os';
import { writeFileSync } from 'node:fs';
import { runEngineBenchmarks } from './engine';

const machine = `${cpus().length} × ${cpus()[0]?.model ?? 'unknown CPU'}, ${(totalmem() / 2 ** 30).toFixed(0)} GiB, ${platform()} ${release()}, Node ${process.version}`;
const started = new Date().toISOString();
const sections = [`# Benchmark results\n\nMachine: ${machine}\nRun: ${started}\n`, runEngineBenchmarks()];
const text = sections.join('\n');
console.log(text);
if (!process.argv.includes('--no-write')) writeFileSync('bench/RESULTS.md', text);
