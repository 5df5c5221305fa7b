#!/usr/bin/env node
// CI gate on npm's advisory database: runs `npm audit --omit=dev --json` and
//   - fails (exit 1) when a production dependency has a high or critical advisory, listing them;
//   - passes (exit 0) when there are none, giving the counts of lower severities;
//   - passes with a clear WARNING when the advisory endpoint cannot be reached (our CI's
//     registry answers it with 405 Method Not Allowed), so an outage does not block every build
//     but nobody mistakes it for a clean audit. AUDIT_GATE_STRICT=1 makes that case fail too.
// `judgeAudit` is exported for tests/unit/reliability/audit-gate.test.ts.
import { spawnSync } from 'node:child_process';
import { pathToFileURL } from 'node:url';

const BLOCKING = ['high', 'critical'];

/**
 * Reads npm audit's JSON output (npm 7+, auditReportVersion 2).
 * @param {string} stdout
 * @returns {{ verdict: 'pass' | 'fail' | 'unreachable', lines: string[] }}
 */
export function judgeAudit(stdout) {
	let report;
	try {
		report = JSON.parse(stdout);
	} catch {
		return { verdict: 'unreachable', lines: [`npm audit gave no report${stdout.trim() ? ` (${stdout.trim().split('\n')[0].slice(0, 160)})` : ''}`] };
	}
	const counts = report?.metadata?.vulnerabilities;
	if (!counts || typeof counts !== 'object') {
		const why = report?.message ?? report?.error?.summary ?? report?.error?.code ?? 'no vulnerability counts in the report';
		return { verdict: 'unreachable', lines: [`npm audit could not get advisories: ${String(why).split('\n')[0]}`] };
	}
	const blocking = Object.values(report.vulnerabilities ?? {}).filter((v) => BLOCKING.includes(v?.severity));
	const summary = ['critical', 'high', 'moderate', 'low', 'info'].map((s) => `${counts[s] ?? 0} ${s}`).join(', ');
	if (blocking.length === 0 && BLOCKING.every((s) => !counts[s])) {
		return { verdict: 'pass', lines: [`npm audit: no high or critical advisories in production dependencies (${summary})`] };
	}
	const lines = [`npm audit: high or critical advisories in production dependencies (${summary}):`];
	for (const v of blocking) {
		const advisories = (v.via ?? []).filter((x) => typeof x === 'object').map((x) => `${x.title ?? 'advisory'}${x.url ? ` ${x.url}` : ''}`);
		const through = (v.via ?? []).filter((x) => typeof x === 'string');
		lines.push(`  ${v.severity}: ${v.name} ${v.range ?? ''}${advisories.length ? ` — ${advisories.join('; ')}` : ''}${through.length ? ` (through ${through.join(', ')})` : ''}${v.fixAvailable ? ' [fix available]' : ''}`);
	}
	return { verdict: 'fail', lines };
}

function main() {
	const npm = process.platform === 'win32' ? 'npm.cmd' : 'npm';
	const run = spawnSync(npm, ['audit', '--omit=dev', '--json'], { encoding: 'utf8', timeout: 120_000, maxBuffer: 64 * 1024 * 1024 });
	const { verdict, lines } = run.error ? { verdict: 'unreachable', lines: [`npm audit did not run: ${run.error.message}`] } : judgeAudit(run.stdout ?? '');
	if (verdict === 'unreachable') {
		const strict = process.env.AUDIT_GATE_STRICT === '1';
		console.warn(`WARNING: ${lines.join(' ')}`);
		console.warn(`WARNING: production dependencies were NOT checked for advisories${strict ? ' (AUDIT_GATE_STRICT=1: failing)' : '; run `npm audit --omit=dev` where the registry answers'}.`);
		process.exit(strict ? 1 : 0);
	}
	for (const line of lines) (verdict === 'fail' ? console.error : console.log)(line);
	process.exit(verdict === 'fail' ? 1 : 0);
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) main();
