// The app's Content-Security-Policy and security headers (scripts/security-headers.mjs): what each copy allows.
import { describe, expect, it } from 'vitest';
import { contentSecurityPolicy, pageContentSecurityPolicy, PERMISSIONS_POLICY, securityHeaders } from '../scripts/security-headers.mjs';

const directives = (policy: string) => new Map(policy.split('; ').map((d) => [d.split(' ')[0]!, d.split(' ').slice(1)] as const));

describe('the Content-Security-Policy', () => {
  it('allows no inline script, no eval and no inline style anywhere', () => {
    for (const policy of [pageContentSecurityPolicy(), contentSecurityPolicy({ frameAncestors: true, reportUri: '/r' })]) {
      expect(policy).not.toMatch(/unsafe-inline|unsafe-eval|unsafe-hashes|strict-dynamic|data:|(^| )\*(;| |$)/);
      const d = directives(policy);
      expect(d.get('default-src')).toEqual(["'none'"]);
      expect(d.get('script-src')).toEqual(["'self'", 'blob:']);
      expect(d.get('style-src')).toEqual(["'self'"]);
      expect(d.get('object-src')).toEqual(["'none'"]);
      expect(d.get('base-uri')).toEqual(["'none'"]);
    }
  });

  it('in the page, leaves out what a <meta> policy ignores (frame-ancestors, report-uri)', () => {
    expect(pageContentSecurityPolicy()).not.toMatch(/frame-ancestors|report-uri|sandbox/);
  });

  it('in the page, lets the app reach any https folder unless the build names the folders', () => {
    expect(directives(pageContentSecurityPolicy()).get('connect-src')).toEqual(["'self'", 'https:', 'http://localhost:*', 'http://127.0.0.1:*', 'http://*.localhost:*']);
    expect(directives(pageContentSecurityPolicy(['https://files.example.org'])).get('connect-src')).toEqual(["'self'", 'https://files.example.org']);
  });

  it('from a server, connects to itself and the folders it names only, and forbids framing', () => {
    const csp = securityHeaders({ connectSrc: ['https://files.example.org'] })['content-security-policy']!;
    expect(directives(csp).get('connect-src')).toEqual(["'self'", 'https://files.example.org']);
    expect(directives(csp).get('frame-ancestors')).toEqual(["'none'"]);
    expect(directives(securityHeaders()['content-security-policy']!).get('connect-src')).toEqual(["'self'"]);
  });
});

describe('the permissions policy', () => {
  it('allows the microphone, the position, the share sheet and the screen wake lock to the app itself, and denies the camera', () => {
    const features = new Map(PERMISSIONS_POLICY.split(', ').map((f) => f.split('=') as [string, string]));
    expect(features.get('microphone')).toBe('(self)');
    expect(features.get('geolocation')).toBe('(self)');
    expect(features.get('web-share')).toBe('(self)');
    expect(features.get('screen-wake-lock')).toBe('(self)');
    expect(features.get('camera')).toBe('()');
    expect([...features.values()].filter((v) => v !== '()')).toHaveLength(4);
  });
});
