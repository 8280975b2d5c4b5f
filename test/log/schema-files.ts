// Writes the published JSON Schema and the ahead-of-time validator from the schema in src/log/schema.ts.
// Used by test/log/schema-generate.ts (which writes the files) and by the schema test (which checks they are fresh).
import Ajv2020 from 'ajv/dist/2020';
import standaloneCode from 'ajv/dist/standalone';
import { LOG_SCHEMA } from '../../src/log/schema';

export const SCHEMA_FILE = 'public/schema/plummet-log-1.schema.json';
export const VALIDATOR_FILE = 'src/log/schema-validator.ts';

/** An ajv set up the way the standalone validator is generated; the tests also compile with it to compare. */
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

export function validatorFileText(): string {
  const ajv = makeAjv(true);
  const validate = ajv.compile(LOG_SCHEMA);
  const code = standaloneCode(ajv, validate);
  return [
    '// @ts-nocheck',
    '/* eslint-disable */',
    '// Generated from src/log/schema.ts by ajv standalone code (npx tsx test/log/schema-generate.ts). Do not edit.',
    code,
    '',
  ].join('\n');
}
