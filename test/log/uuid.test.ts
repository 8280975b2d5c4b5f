import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { randomUUID, webcrypto } from 'node:crypto';
import { isUuid, randomDeviceId, uuidV4 } from '../../src/log/uuid';

const fromBytes = (bytes: number[]) => (target: Uint8Array) => {
  target.set(bytes.slice(0, target.length));
  return target;
};

describe('uuidV4', () => {
  it('builds the RFC 9562 appendix A.3 example from its random bits', () => {
    // RFC 9562, A.3 "Example of a UUIDv4 Value": 919108f7-52d1-4320-9bac-f847db4148a8.
    // The version and variant positions are fed with other bits to show they are overwritten.
    const bytes = [0x91, 0x91, 0x08, 0xf7, 0x52, 0xd1, 0x03, 0x20, 0x1b, 0xac, 0xf8, 0x47, 0xdb, 0x41, 0x48, 0xa8];
    expect(uuidV4(fromBytes(bytes))).toBe('919108f7-52d1-4320-9bac-f847db4148a8');
  });

  it('always sets version 4 and the RFC variant whatever the random bytes are', () => {
    fc.assert(
      fc.property(fc.uint8Array({ minLength: 16, maxLength: 16 }), (bytes) => {
        const id = uuidV4(fromBytes([...bytes]));
        expect(id).toMatch(/^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/);
      }),
    );
  });

  it('gives ids that never repeat with the platform random source', () => {
    const random = (b: Uint8Array) => webcrypto.getRandomValues(b);
    const ids = new Set(Array.from({ length: 2000 }, () => uuidV4(random)));
    expect(ids.size).toBe(2000);
  });

  it('refuses a random source that returns fewer than 16 bytes', () => {
    expect(() => uuidV4(() => new Uint8Array(4))).toThrow(/16 random bytes/);
  });
});

describe('isUuid', () => {
  it("accepts Node's own randomUUID output", () => {
    for (let i = 0; i < 50; i++) expect(isUuid(randomUUID())).toBe(true);
  });

  it('refuses text that only looks a little like an id', () => {
    for (const text of ['', 'abc', '919108f7-52d1-4320-9bac-f847db4148a', '919108f7_52d1_4320_9bac_f847db4148a8', 42]) {
      expect(isUuid(text)).toBe(false);
    }
  });
});

describe('randomDeviceId', () => {
  it('is usable as the device part of a clock stamp and differs between devices', () => {
    const random = (b: Uint8Array) => webcrypto.getRandomValues(b);
    const a = randomDeviceId(random);
    const b = randomDeviceId(random);
    expect(a).toMatch(/^[0-9a-f]{16}$/);
    expect(a).not.toBe(b);
  });
});
