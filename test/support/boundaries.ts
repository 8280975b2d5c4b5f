// The import rule of the source tree, as data and a checker, so the architecture test and its own
// self-check use the same code.
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative, sep } from 'node:path';

/** Which parts each pure part may never import, and which globals it may never touch. */
export const PURE_PARTS = ['physics', 'log', 'analysis'] as const;
export const FORBIDDEN_PARTS = ['store', 'sync', 'ui', 'widgets', 'timing', 'cli', 'analysis'];
export const FORBIDDEN_PACKAGES = /^(idb|preact|lit|workbox-[a-z-]+|@preact\/.*|node:.*|fs|path|os|crypto|http|https)(\/|$)/;
export const FORBIDDEN_GLOBALS = [
  'window',
  'document',
  'navigator',
  'indexedDB',
  'localStorage',
  'sessionStorage',
  'fetch',
  'XMLHttpRequest',
  'process',
  'require',
  'Date.now',
  'performance',
];

export interface Violation {
  file: string;
  line: number;
  text: string;
  rule: string;
}

function stripComments(source: string): string {
  // Keep line numbers: replace comment characters with spaces, string contents are left as they are.
  return source
    .replace(/\/\*[\s\S]*?\*\//g, (m) => m.replace(/[^\n]/g, ' '))
    .replace(/(^|[^:'"`\\])\/\/.*$/gm, (_m, p: string) => p);
}

export function checkSource(file: string, source: string, part: string): Violation[] {
  const out: Violation[] = [];
  const code = stripComments(source);
  const lines = code.split('\n');
  lines.forEach((text, i) => {
    const specs = [...text.matchAll(/(?:from\s+|import\s*\(\s*|^\s*import\s+)['"]([^'"]+)['"]/g)].map((m) => m[1]!);
    for (const spec of specs) {
      if (spec.startsWith('.')) {
        const target = spec.split('/').filter((p) => p !== '.' && p !== '..')[0];
        const climbs = spec.startsWith('..');
        if (climbs && target && FORBIDDEN_PARTS.includes(target)) {
          out.push({ file, line: i + 1, text: text.trim(), rule: `${part}/ may not import from ${target}/` });
        }
        if (climbs && target && target !== part && (part === 'physics' || part === 'log') && (target === 'physics' || target === 'log')) {
          out.push({ file, line: i + 1, text: text.trim(), rule: `${part}/ imports nothing from ${target}/` });
        }
      } else if (FORBIDDEN_PACKAGES.test(spec)) {
        out.push({ file, line: i + 1, text: text.trim(), rule: `${part}/ may not import the package "${spec}"` });
      }
    }
    const withoutStrings = text.replace(/(['"`])(?:\\.|(?!\1).)*\1/g, '""');
    for (const g of FORBIDDEN_GLOBALS) {
      const pattern = new RegExp(`(^|[^.\\w$])${g.replace('.', '\\.')}\\b`);
      if (pattern.test(withoutStrings)) {
        out.push({ file, line: i + 1, text: text.trim(), rule: `${part}/ may not use the platform global "${g}"` });
      }
    }
  });
  return out;
}

function walk(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const p = join(dir, name);
    return statSync(p).isDirectory() ? walk(p) : /\.(ts|tsx|js|mjs)$/.test(name) ? [p] : [];
  });
}

export function checkTree(srcDir: string): Violation[] {
  return PURE_PARTS.flatMap((part) =>
    walk(join(srcDir, part)).flatMap((file) =>
      checkSource(relative(srcDir, file).split(sep).join('/'), readFileSync(file, 'utf8'), part),
    ),
  );
}
