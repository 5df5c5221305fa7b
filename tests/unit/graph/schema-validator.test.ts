import { readFileSync } from 'node:fs';
import { expect, it } from 'vitest';
import { generateValidatorSource } from '../../../scripts/build-schema-validator.mjs';

it('the checked-in schema validator is generated from the current diagram.schema.json', () => {
	const schema = JSON.parse(readFileSync('src/lib/graph/diagram.schema.json', 'utf8'));
	const expected = generateValidatorSource(schema as object);
	// Out of date? Run `npm run build:schema`.
	expect(readFileSync('src/lib/graph/diagram-schema-validate.js', 'utf8')).toBe(expected);
});

it('the generated validator needs no eval: no Function constructor and no require', () => {
	const source = readFileSync('src/lib/graph/diagram-schema-validate.js', 'utf8');
	expect(source).not.toMatch(/new Function|\beval\(|\brequire\(/);
});
