/** Types of scripts/audit-gate.mjs for the tests. */
export function judgeAudit(stdout: string): { verdict: 'pass' | 'fail' | 'unreachable'; lines: string[] };
