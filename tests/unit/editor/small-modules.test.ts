import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { idFollowsLabel, slugify, uniqueId } from '../../../src/lib/editor/ids';
import { firstInReadingOrder, nearestInDirection } from '../../../src/lib/editor/navigation';
import { freeSpot, isFree } from '../../../src/lib/editor/placement';
import { ASIDE_KEY, asideCopies, AUTOSAVE_KEY, createAutosaver, discardAsideCopies, firstVisit, MAX_ASIDE, restoreDiagram, saveDiagram, type StorageLike } from '../../../src/lib/editor/autosave';
import { emptyDiagram } from '../../../src/lib/graph/diagram';
import { writeDiagramJson } from '../../../src/lib/graph/native-json';
import { parseDiagramJson } from '../../../src/lib/graph/native-json';
import { pruneSelection } from '../../../src/lib/editor/selection';

const demo = parseDiagramJson(readFileSync('static/demo/cycling-hypertension.causeway.json', 'utf8'));

class MemoryStorage implements StorageLike {
	map = new Map<string, string>();
	getItem(k: string) {
		return this.map.get(k) ?? null;
	}
	setItem(k: string, v: string) {
		this.map.set(k, v);
	}
	removeItem(k: string) {
		this.map.delete(k);
	}
}

describe('ids', () => {
	it('derives readable ids from labels in any script', () => {
		expect(slugify('Household income')).toBe('household_income');
		expect(slugify('Body-mass index (BMI)')).toBe('body_mass_index_bmi');
		expect(slugify('Âge')).toBe('âge');
		expect(slugify('??')).toBe('variable');
		expect(uniqueId('age', new Set(['age', 'age_2']))).toBe('age_3');
		expect(idFollowsLabel('age_3', 'Age')).toBe(true);
		expect(idFollowsLabel('bp', 'Blood pressure')).toBe(false);
	});
});

describe('navigation', () => {
	const items = [
		{ id: 'centre', x: 0, y: 0 },
		{ id: 'right-near-off', x: 100, y: 90 },
		{ id: 'right-far-ahead', x: 160, y: 0 },
		{ id: 'up', x: 10, y: -100 }
	];
	it('prefers the variable straight ahead over a nearer one off to the side', () => {
		expect(nearestInDirection(items, 'centre', 'right')).toBe('right-far-ahead');
		expect(nearestInDirection(items, 'centre', 'up')).toBe('up');
		expect(nearestInDirection(items, 'centre', 'left')).toBeNull();
		expect(firstInReadingOrder(items)).toBe('up');
	});
});

describe('placement', () => {
	it('never places a new variable on top of the demo diagram’s variables', () => {
		for (const v of demo.variables) {
			const p = freeSpot({ x: v.x ?? 0, y: v.y ?? 0 }, demo.variables);
			expect(isFree(p, demo.variables)).toBe(true);
		}
	});
});

describe('autosave', () => {
	it('round-trips the diagram through storage in the native format', () => {
		const s = new MemoryStorage();
		expect(restoreDiagram(s)).toEqual({ kind: 'none' });
		expect(saveDiagram(s, demo)).toEqual({ ok: true });
		expect(JSON.parse(s.getItem(AUTOSAVE_KEY)!).format).toBe('causeway.diagram');
		const r = restoreDiagram(s);
		expect(r.kind === 'saved' && r.diagram).toEqual(demo);
	});

	it('keeps an unreadable stored text aside, with the reason, instead of dropping it', () => {
		const s = new MemoryStorage();
		// What an editor without length checks once saved: a name past the reader's limit.
		const text = writeDiagramJson({ ...demo, variables: [{ ...demo.variables[0], label: 'x'.repeat(1001) }, ...demo.variables.slice(1)] });
		s.setItem(AUTOSAVE_KEY, text);
		const r = restoreDiagram(s);
		expect(r.kind).toBe('unreadable');
		expect(r.kind === 'unreadable' && r.keptAside).toBe(true);
		expect(r.kind === 'unreadable' && r.message).toMatch(/^The diagram saved in this browser could not be read \(The label of Variable 1 \("age"\) is too long: 1,001 characters/);
		expect(s.getItem(AUTOSAVE_KEY)).toBeNull();
		const [copy] = asideCopies(s);
		expect(copy.text).toBe(text);
		expect(copy.reason).toMatch(/too long/);
		// The next start has nothing to restore, and an empty diagram's autosave touches nothing kept aside.
		expect(restoreDiagram(s)).toEqual({ kind: 'none' });
		createAutosaver(s, 10).schedule(emptyDiagram(), false);
		expect(asideCopies(s)).toHaveLength(1);
		discardAsideCopies(s);
		expect(s.getItem(ASIDE_KEY)).toBeNull();
	});

	it('keeps at most the last few unreadable copies', () => {
		const s = new MemoryStorage();
		for (let i = 0; i < MAX_ASIDE + 2; i++) {
			s.setItem(AUTOSAVE_KEY, `{"broken": ${i}`);
			restoreDiagram(s);
		}
		const copies = asideCopies(s);
		expect(copies).toHaveLength(MAX_ASIDE);
		expect(copies.at(-1)!.text).toBe(`{"broken": ${MAX_ASIDE + 1}`);
	});

	it('leaves the text in place when storage cannot keep it aside', () => {
		const s = new MemoryStorage();
		s.setItem(AUTOSAVE_KEY, '{');
		s.setItem = () => {
			throw new Error('QuotaExceededError');
		};
		const r = restoreDiagram(s);
		expect(r.kind === 'unreadable' && r.keptAside).toBe(false);
		expect(s.getItem(AUTOSAVE_KEY)).toBe('{');
	});

	it('never replaces a stored diagram by an empty one the user did not make', () => {
		const s = new MemoryStorage();
		saveDiagram(s, demo);
		const saver = createAutosaver(s, 10_000);
		saver.schedule(emptyDiagram(), false);
		saver.flush();
		expect(JSON.parse(s.getItem(AUTOSAVE_KEY)!).variables).toHaveLength(13);
		// New (or deleting everything) is the user's own edit: it is saved.
		saver.schedule(emptyDiagram(), true);
		saver.flush();
		expect(JSON.parse(s.getItem(AUTOSAVE_KEY)!).variables).toHaveLength(0);
	});

	it('saves the first edit at once, then only the latest of a burst, on flush', () => {
		const s = new MemoryStorage();
		const saver = createAutosaver(s, 10_000);
		saver.schedule({ ...demo, title: 'one' });
		expect(JSON.parse(s.getItem(AUTOSAVE_KEY)!).title).toBe('one');
		saver.schedule({ ...demo, title: 'two' });
		saver.schedule({ ...demo, title: 'three' });
		expect(JSON.parse(s.getItem(AUTOSAVE_KEY)!).title).toBe('one');
		saver.flush();
		expect(JSON.parse(s.getItem(AUTOSAVE_KEY)!).title).toBe('three');
	});

	it('knows the first visit', () => {
		const s = new MemoryStorage();
		expect(firstVisit(s)).toBe(true);
		expect(firstVisit(s)).toBe(false);
	});
});

describe('selection', () => {
	it('drops what no longer exists', () => {
		const s = pruneSelection({ variables: ['age', 'gone'], arrows: [{ from: 'age', to: 'cycling' }, { from: 'x', to: 'y' }] }, demo);
		expect(s).toEqual({ variables: ['age'], arrows: [{ from: 'age', to: 'cycling' }] });
	});
});
