// A password file line for Apache and nginx: "{SHA}" + base64(SHA-1(password)), a scheme both read (Apache
// httpd documentation, "Password Formats"; nginx ngx_http_auth_basic_module). Weak, but this file is for tests.
import { createHash } from 'node:crypto';

export interface Credentials {
  username: string;
  password: string;
}

export function htpasswdLine({ username, password }: Credentials): string {
  return `${username}:{SHA}${createHash('sha1').update(password, 'utf8').digest('base64')}`;
}

export function htpasswdFile(users: readonly Credentials[]): string {
  return users.map(htpasswdLine).join('\n') + '\n';
}
