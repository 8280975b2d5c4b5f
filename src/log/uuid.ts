/**
 * Record ids: random (version 4) UUIDs, RFC 9562 section 5.4. The random bytes come from outside
 * (the shell passes crypto.getRandomValues) so the core stays pure and tests can feed known bytes.
 */
import { LogError } from './errors';

/** Fills the array with random bytes and returns it, like crypto.getRandomValues. */
export type RandomSource = (bytes: Uint8Array) => Uint8Array;

const UUID_PATTERN = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

function randomBytes(random: RandomSource, count: number): Uint8Array {
  const bytes = random(new Uint8Array(count));
  if (!(bytes instanceof Uint8Array) || bytes.length < count) {
    throw new LogError({ code: 'random-source-invalid', field: 'random', value: bytes instanceof Uint8Array ? bytes.length : typeof bytes, allowed: `a source that fills ${count} random bytes`, message: `the random source must fill ${count} random bytes` });
  }
  return bytes;
}

const hex = (bytes: Uint8Array) => Array.from(bytes, (b) => b.toString(16).padStart(2, '0')).join('');

export function uuidV4(random: RandomSource): string {
  const b = randomBytes(random, 16);
  // RFC 9562 5.4: version 0b0100 in the high nibble of octet 6, variant 0b10 in the top bits of octet 8.
  b[6] = (b[6]! & 0x0f) | 0x40;
  b[8] = (b[8]! & 0x3f) | 0x80;
  const h = hex(b);
  return `${h.slice(0, 8)}-${h.slice(8, 12)}-${h.slice(12, 16)}-${h.slice(16, 20)}-${h.slice(20)}`;
}

/** True for any RFC 9562 UUID in its text form (ids made elsewhere are accepted whatever their version). */
export function isUuid(value: unknown): value is string {
  return typeof value === 'string' && UUID_PATTERN.test(value);
}

const RECORD_ID_PATTERN = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;

/**
 * A record id as stored: a UUID in lower case. RFC 9562 (section 4) makes the hex digits case-insensitive on
 * input, but the store looks ids up as text, so "ABC…" and "abc…" would be two records: lower case is the one
 * form kept, and ids made elsewhere are lowered where they come in (createRecord) or refused (the gate).
 */
export function isRecordId(value: unknown): value is string {
  return typeof value === 'string' && RECORD_ID_PATTERN.test(value);
}

/**
 * A device id: 64 random bits as 16 hex digits. It names the phone in clock stamps (hlc.ts allows only
 * letters, digits, _ . :, so no hyphens) and in every record it writes.
 */
export function randomDeviceId(random: RandomSource): string {
  return hex(randomBytes(random, 8));
}
