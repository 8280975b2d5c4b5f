import { describe, expect, it } from 'vitest';
import { fileURLToPath } from 'node:url';
import { checkSource, checkTree } from './support/boundaries';

const src = fileURLToPath(new URL('../src', import.meta.url));

describe('the pure core', () => {
  it('physics/ and log/ import nothing from store, sync, ui, widgets, timing or cli, and use no platform API', () => {
    const violations = checkTree(src);
    expect(violations.map((v) => `${v.file}:${v.line} ${v.rule}: ${v.text}`)).toEqual([]);
  });

  it('the checker catches a forbidden import, a package and a browser global', () => {
    const bad = [
      "import { openLogStore } from '../store';",
      "import { openDB } from 'idb';",
      'const x = window.innerWidth;',
      "const ok = 'window is only a word in a string';",
      '// navigator in a comment is fine',
      'const t = Date.now();',
    ].join('\n');
    const rules = checkSource('log/bad.ts', bad, 'log').map((v) => `${v.line}:${v.rule}`);
    expect(rules).toEqual([
      '1:log/ may not import from store/',
      '2:log/ may not import the package "idb"',
      '3:log/ may not use the platform global "window"',
      '6:log/ may not use the platform global "Date.now"',
    ]);
  });

  it('physics/ and log/ do not lean on each other; analysis/ may join them', () => {
    const rules = checkSource('physics/x.ts', "import type { SiteRecord } from '../log';", 'physics').map((v) => v.rule);
    expect(rules).toEqual(['physics/ imports nothing from log/']);
    expect(checkSource('log/x.ts', "import { fallTime } from '../physics';", 'log').map((v) => v.rule)).toEqual(['log/ imports nothing from physics/']);
    expect(checkSource('analysis/x.ts', "import { fallTime } from '../physics';\nimport type { DropRecord } from '../log/types';", 'analysis')).toEqual([]);
  });
});
