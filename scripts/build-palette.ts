// Writes src/lib/ui/palette.css, the page's colour custom properties, from src/lib/palette.ts.
// tests/unit/ui/palette.test.ts fails when the committed file differs from what this writes.
import { writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { paletteCss } from '../src/lib/palette';

const target = fileURLToPath(new URL('../src/lib/ui/palette.css', import.meta.url));
writeFileSync(target, paletteCss());
console.log(`wrote ${target}`);
