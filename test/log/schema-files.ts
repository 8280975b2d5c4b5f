// Writes the published JSON Schema from the schema in src/log/schema.ts.
// Used by test/log/schema-generate.ts (which writes the files) and by the schema test (which checks they are fresh).
import Ajv2020 from 'ajv/dist/2020';
import { LOG_FORMAT_VERSION, LOG_SCHEMA } from '../../src/log/schema';

/** The current format's schema, written from src/log/schema.ts. */
export const SCHEMA_FILE = `public/schema/plummet-log-${LOG_FORMAT_VERSION}.schema.json`;
/** Format 1's schema: frozen, kept published for readers of old files; nothing writes it any more. */
export const SCHEMA_FILE_V1 = 'public/schema/plummet-log-1.schema.json';
/** Format 2's schema: frozen likewise since format 3. */
export const SCHEMA_FILE_V2 = 'public/schema/plummet-log-2.schema.json';
/** Format 3's schema: frozen likewise since format 4. */
export const SCHEMA_FILE_V3 = 'public/schema/plummet-log-3.schema.json';

/** ajv, the reference validator the tests compare the app's own checker with. */
export function makeAjv(source: boolean): Ajv2020 {
  return new Ajv2020({
    strict: true,
    allErrors: false,
    // No ajv runtime helpers are needed by the generated code with these settings (checked by a test).
    code: source ? { source: true, esm: true, lines: true } : {},
  });
}

export function schemaFileText(): string {
  return `${JSON.stringify(LOG_SCHEMA, null, 2)}\n`;
}
