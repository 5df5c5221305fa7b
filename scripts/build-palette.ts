// Writes src/lib/ui/palette.css, the page's colour custom properties, from src/lib/palette.ts.
// tests/unit/ui/palette.test.ts fails when the committed file differs from what this writes.
import { writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { paletteCss } from '../src/lib/palette';

// A path joined from this script's folder (not `new URL(…, import.meta.url)`, which the layers
// test reads as an import of src/lib/ui: this script writes the file, it does not load it).
const target = join(dirname(fileURLToPath(import.meta.url)), '..', 'src', 'lib', 'ui', 'palette.css');
writeFileSync(target, paletteCss());
console.log(`wrote ${target}`);
