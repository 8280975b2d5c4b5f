// docs/office-folder.md's example of the app's own server (set-up 2) is rendered from nginx-config.ts, with the
// security headers of scripts/security-headers.mjs; the same-origin example, which nginx runs in the tests,
// carries the same lines for the app.
import { describe, expect, it } from 'vitest';
import { readFile } from 'node:fs/promises';
import { fileURLToPath } from 'node:url';
import { documentedAppHost, documentedExample, nginxAppHost, nginxSiteConfig } from './nginx-config';

const DOC = fileURLToPath(new URL('../../docs/office-folder.md', import.meta.url));

function block(text: string, name: string): string {
  const marker = `<!-- example: ${name} -->\n\`\`\`nginx\n`;
  const start = text.indexOf(marker);
  if (start < 0) throw new Error(`no example marked "${name}" in docs/office-folder.md`);
  return text.slice(start + marker.length, text.indexOf('```', start + marker.length));
}

describe('the app server of docs/office-folder.md', () => {
  it('is shown exactly as generated, allowing the folder’s origin only', async () => {
    const text = await readFile(DOC, 'utf8');
    expect(block(text, 'app-host')).toBe(nginxAppHost(documentedAppHost()));
    expect(block(text, 'app-host')).toContain("connect-src 'self' https://files.example.org; frame-ancestors 'none'\" always;");
  });

  it('sends the policies with the page and the service worker, nosniff everywhere, and sandboxes the folder’s answers', () => {
    const sameOrigin = nginxSiteConfig(documentedExample('same-origin'));
    expect(sameOrigin.match(/add_header Content-Security-Policy "default-src 'none'; script-src 'self' blob:;[^"]*connect-src 'self'; frame-ancestors 'none'" always;/g)).toHaveLength(1);
    expect(sameOrigin.match(/add_header X-Content-Type-Options "nosniff" always;/g)).toHaveLength(3);
    expect(sameOrigin.match(/add_header Permissions-Policy "microphone=\(self\), geolocation=\(self\)/g)).toHaveLength(1);
    for (const setup of ['same-origin', 'cors'] as const) {
      expect(nginxSiteConfig(documentedExample(setup))).toContain(`add_header Content-Security-Policy "default-src 'none'; sandbox; frame-ancestors 'none'" always;`);
      expect(nginxSiteConfig(documentedExample(setup))).toContain('    types { }\n        default_type application/octet-stream;\n');
    }
  });
});
