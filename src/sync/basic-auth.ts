/** HTTP Basic authentication, RFC 7617: "Basic " + base64(UTF-8(user-id ":" password)) (§2, §2.1 charset UTF-8). */
import { SyncError } from './errors';

const CONTROL = /[\u0000-\u001f\u007f]/;

export function basicAuthorization(username: string, password: string): string {
  if (username.includes(':')) {
    throw new SyncError('sync-username-invalid', username, 'the user name may not contain ":" (RFC 7617 §2)');
  }
  if (CONTROL.test(username)) throw new SyncError('sync-username-invalid', username, 'the user name may not contain control characters (RFC 7617 §2)');
  if (CONTROL.test(password)) throw new SyncError('sync-password-invalid', '(hidden)', 'the password may not contain control characters (RFC 7617 §2)');
  const bytes = new TextEncoder().encode(`${username}:${password}`);
  let binary = '';
  for (const b of bytes) binary += String.fromCharCode(b);
  return `Basic ${btoa(binary)}`;
}
