// Regenerates the current format's public/schema/plummet-log-<version>.schema.json from src/log/schema.ts.
// Run: npm run schema
import { writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { SCHEMA_FILE, schemaFileText } from './schema-files';

const root = fileURLToPath(new URL('../../', import.meta.url));
writeFileSync(root + SCHEMA_FILE, schemaFileText());
console.log(`wrote ${SCHEMA_FILE}`);
