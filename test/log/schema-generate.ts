// Regenerates public/schema/plummet-log-1.schema.json and src/log/schema-validator.ts from src/log/schema.ts.
// Run: npx tsx test/log/schema-generate.ts
import { writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { SCHEMA_FILE, VALIDATOR_FILE, schemaFileText, validatorFileText } from './schema-files';

const root = fileURLToPath(new URL('../../', import.meta.url));
writeFileSync(root + SCHEMA_FILE, schemaFileText());
writeFileSync(root + VALIDATOR_FILE, validatorFileText());
console.log(`wrote ${SCHEMA_FILE} and ${VALIDATOR_FILE}`);
