import { readFileSync } from 'node:fs';
import { expect, it } from 'vitest';

it('the schema served at /causeway.diagram.schema.json is the one the reader uses', () => {
	expect(readFileSync('static/causeway.diagram.schema.json', 'utf8')).toBe(readFileSync('src/lib/graph/diagram.schema.json', 'utf8'));
});
