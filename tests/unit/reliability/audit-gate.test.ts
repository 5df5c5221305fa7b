/**
 * The CI gate on npm audit (scripts/audit-gate.mjs), on reports in the shape npm 10 prints
 * with `npm audit --json` (auditReportVersion 2), and on the registry's refusal our CI gets.
 */
import { describe, expect, it } from 'vitest';
import { judgeAudit as judge } from '../../../scripts/audit-gate.mjs';

const report = (vulnerabilities: Record<string, unknown>, counts: Record<string, number>) =>
	JSON.stringify({ auditReportVersion: 2, vulnerabilities, metadata: { vulnerabilities: { info: 0, low: 0, moderate: 0, high: 0, critical: 0, ...counts, total: 0 }, dependencies: { prod: 40 } } });

describe('npm audit gate', () => {
	it('passes a clean report and gives the counts', () => {
		const r = judge(report({}, { low: 2 }));
		expect(r.verdict).toBe('pass');
		expect(r.lines[0]).toContain('0 critical, 0 high, 0 moderate, 2 low');
	});

	it('passes moderate advisories (the gate is on high and critical)', () => {
		expect(judge(report({ x: { name: 'x', severity: 'moderate', via: [{ title: 'ReDoS', url: 'https://example.invalid/1', severity: 'moderate' }], range: '<2' } }, { moderate: 1 })).verdict).toBe('pass');
	});

	it('fails on a high or critical advisory and names the package, the advisory and the path', () => {
		const r = judge(
			report(
				{
					lib: { name: 'lib', severity: 'critical', via: [{ title: 'Prototype pollution', url: 'https://example.invalid/2', severity: 'critical' }], range: '<=1.2.3', fixAvailable: true },
					app: { name: 'app', severity: 'high', via: ['lib'], range: '1.x' }
				},
				{ critical: 1, high: 1 }
			)
		);
		expect(r.verdict).toBe('fail');
		expect(r.lines.join('\n')).toContain('critical: lib <=1.2.3 — Prototype pollution https://example.invalid/2 [fix available]');
		expect(r.lines.join('\n')).toContain('high: app 1.x (through lib)');
	});

	it('calls the registry refusing the advisory endpoint unreachable, not clean', () => {
		const refusal = JSON.stringify({ message: '405 Method Not Allowed - POST https://registry.npmjs.org/-/npm/v1/security/advisories/bulk', statusCode: 405, error: { summary: '', detail: '' } });
		const r = judge(refusal);
		expect(r.verdict).toBe('unreachable');
		expect(r.lines[0]).toContain('405 Method Not Allowed');
		expect(judge('').verdict).toBe('unreachable');
		expect(judge('npm ERR! network ETIMEDOUT').verdict).toBe('unreachable');
	});
});
