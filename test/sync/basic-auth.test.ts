import { describe, expect, it } from 'vitest';
import { basicAuthorization } from '../../src/sync/basic-auth';
import { SyncError } from '../../src/sync/errors';

describe('Basic authentication (RFC 7617)', () => {
  it('encodes the example of RFC 7617 §2: Aladdin / open sesame', () => {
    expect(basicAuthorization('Aladdin', 'open sesame')).toBe('Basic QWxhZGRpbjpvcGVuIHNlc2FtZQ==');
  });

  it('encodes as UTF-8, as in the example of RFC 7617 §2.1: test / 123£', () => {
    expect(basicAuthorization('test', '123£')).toBe('Basic dGVzdDoxMjPCow==');
  });

  it('refuses a user name with a colon, which RFC 7617 §2 does not allow', () => {
    expect(() => basicAuthorization('crew:1', 'x')).toThrow(SyncError);
    try {
      basicAuthorization('crew:1', 'x');
    } catch (error) {
      expect((error as SyncError).code).toBe('sync-username-invalid');
      expect((error as SyncError).value).toBe('crew:1');
    }
  });

  it('refuses control characters and never repeats the password in the error', () => {
    try {
      basicAuthorization('crew', 'hunter2\n');
      expect.unreachable();
    } catch (error) {
      expect((error as SyncError).code).toBe('sync-password-invalid');
      expect(JSON.stringify(error) + (error as Error).message).not.toContain('hunter2');
    }
  });
});
