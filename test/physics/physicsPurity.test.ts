import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

const folder = join(import.meta.dirname, '../../src/physics');
const files = readdirSync(folder).filter((f) => f.endsWith('.ts'));

/** Source without comments and string contents, so only code is searched. */
function codeOf(source: string): string {
  return source
    .replace(/\/\*[\s\S]*?\*\//g, '')
    .replace(/(^|[^:\\])\/\/.*$/gm, '$1')
    .replace(/'(?:[^'\\\n]|\\.)*'|"(?:[^"\\\n]|\\.)*"|`(?:[^`\\]|\\.)*`/g, "''");
}

describe('the physics core stays pure', () => {
  it('has files to check', () => {
    expect(files.length).toBeGreaterThan(20);
  });

  it('imports only its own files and the error base (no store, sync, ui, widgets, timing, Node or other packages)', () => {
    for (const file of files) {
      const source = readFileSync(join(folder, file), 'utf8');
      const specifiers = [...source.matchAll(/(?:import|export)[^'"]*?from\s+['"]([^'"]+)['"]/g)].map((m) => m[1]!);
      for (const specifier of specifiers) {
        expect(specifier, `${file} imports ${specifier}`).toMatch(/^(\.\/[A-Za-z]+|\.\.\/errors)$/);
      }
      expect(source, file).not.toMatch(/\bimport\s*\(/);
    }
  });

  it('uses no browser, Node or clock API', () => {
    const forbidden = /\b(window|document|indexedDB|fetch|navigator|localStorage|sessionStorage|XMLHttpRequest|WebSocket|process|require|Buffer|__dirname|setTimeout|setInterval|Date|performance|console|crypto)\b/;
    for (const file of files) {
      const code = codeOf(readFileSync(join(folder, file), 'utf8'));
      const match = code.match(forbidden);
      expect(match?.[0], `${file} uses ${match?.[0]}`).toBeUndefined();
    }
  });
});
