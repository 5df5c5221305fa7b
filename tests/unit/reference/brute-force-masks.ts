/**
 * The brute-force oracle's sets as bitmasks over the variables (so at most 30 variables) and
 * paths as signatures (their non-colliders and, per collider, its descendants), so that many
 * conditioning sets are judged against one path list. Part of the oracle in brute-force.ts.
 */
import type { CompiledDag } from '../../../src/lib/graph/compiled';
import { descendantsOf, isColliderAt } from './brute-force-paths';

// ---------------------------------------------------------------------------------------
// Paths as bitmask signatures, to judge many conditioning sets against one path list.

/** What decides whether a path is open: its non-colliders and, per collider, De(collider). */
interface PathSignature {
	nonColliders: number;
	colliderDescendants: number[];
}

export function maskOf(vs: Iterable<number>): number {
	let m = 0;
	for (const v of vs) m |= 1 << v;
	return m;
}

export function membersOf(mask: number): number[] {
	const out: number[] = [];
	for (let v = 0; mask >>> v !== 0; v++) if (mask & (1 << v)) out.push(v);
	return out;
}

function signatureOf(g: CompiledDag, path: readonly number[], descendantMask: readonly number[]): PathSignature {
	let nonColliders = 0;
	const colliderDescendants: number[] = [];
	for (let i = 1; i + 1 < path.length; i++) {
		if (isColliderAt(g, path, i)) colliderDescendants.push(descendantMask[path[i]]);
		else nonColliders |= 1 << path[i];
	}
	return { nonColliders, colliderDescendants };
}

/** Distinct signatures of the given paths (many paths share one). */
export function signaturesOf(g: CompiledDag, paths: readonly number[][]): PathSignature[] {
	if (g.n > 30) throw new Error('bitmask oracle: at most 30 variables');
	const descendantMask = Array.from({ length: g.n }, (_, v) => maskOf(descendantsOf(g, v)));
	const byKey = new Map<string, PathSignature>();
	for (const p of paths) {
		const s = signatureOf(g, p, descendantMask);
		const key = `${s.nonColliders}|${[...s.colliderDescendants].sort((a, b) => a - b).join(',')}`;
		if (!byKey.has(key)) byKey.set(key, s);
	}
	return [...byKey.values()];
}

function signatureOpen(s: PathSignature, z: number): boolean {
	if ((s.nonColliders & z) !== 0) return false;
	for (const d of s.colliderDescendants) if ((d & z) === 0) return false;
	return true;
}

export function anyOpen(signatures: readonly PathSignature[], z: number): boolean {
	for (const s of signatures) if (signatureOpen(s, z)) return true;
	return false;
}

/** Calls f on every subset (as a mask) of `mask`, the empty set included. */
export function forEachSubmask(mask: number, f: (sub: number) => void): void {
	let sub = mask;
	for (;;) {
		f(sub);
		if (sub === 0) return;
		sub = (sub - 1) & mask;
	}
}

/** Every set in `valid` (masks) that has no proper subset in `valid`. */
export function minimalMasks(candidates: number, isValid: (z: number) => boolean): number[] {
	const valid = new Set<number>();
	forEachSubmask(candidates, (z) => {
		if (isValid(z)) valid.add(z);
	});
	const minimal: number[] = [];
	for (const z of valid) {
		let hasValidProperSubset = false;
		forEachSubmask(z, (sub) => {
			if (sub !== z && valid.has(sub)) hasValidProperSubset = true;
		});
		if (!hasValidProperSubset) minimal.push(z);
	}
	return minimal;
}
