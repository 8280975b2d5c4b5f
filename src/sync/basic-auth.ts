/** HTTP Basic authentication, RFC 7617: "Basic " + base64(UTF-8(user-id ":" password)) (§2, §2.1 charset UTF-8). */
import { SyncError } from './errors';

const CONTROL = /[\u0000-\u001f\u007f]/;

export function basicAuthorization(username: string, password: string): string {
  if (username.includes(':')) {
    throw new SyncError({ code: 'sync-username-invalid', field: 'username', value: username, allowed: 'no ":" and no control characters', message: 'the user name may not contain ":" (RFC 7617 §2)' });
  }
  if (CONTROL.test(username)) throw new SyncError({ code: 'sync-username-invalid', field: 'username', value: username, allowed: 'no ":" and no control characters', message: 'the user name may not contain control characters (RFC 7617 §2)' });
  if (CONTROL.test(password)) throw new SyncError({ code: 'sync-password-invalid', field: 'password', value: '(hidden)', allowed: 'no control characters', message: 'the password may not contain control characters (RFC 7617 §2)' });
  const bytes = new TextEncoder().encode(`${username}:${password}`);
  let binary = '';
  for (const b of bytes) binary += String.fromCharCode(b);
  return `Basic ${btoa(binary)}`;
}
