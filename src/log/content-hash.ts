/**
 * A fast fingerprint of a file's text, to tell whether a file changed without merging it again. It guards
 * against accidents, not attacks: two different texts of the same length share a fingerprint with odds of
 * about 2^-64, and then a merge would be put off until the file changes again.
 * Two independent 32-bit multiply-xorshift lanes over UTF-16 code units (the construction known as cyrb53),
 * plus the length. Pure JavaScript: crypto.subtle is missing on pages that are not a secure context.
 */
export function contentHash(text: string): string {
  let h1 = 0xdeadbeef;
  let h2 = 0x41c6ce57;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    h1 = Math.imul(h1 ^ c, 2654435761);
    h2 = Math.imul(h2 ^ c, 1597334677);
  }
  h1 = Math.imul(h1 ^ (h1 >>> 16), 2246822507) ^ Math.imul(h2 ^ (h2 >>> 13), 3266489909);
  h2 = Math.imul(h2 ^ (h2 >>> 16), 2246822507) ^ Math.imul(h1 ^ (h1 >>> 13), 3266489909);
  const hex = (n: number) => (n >>> 0).toString(16).padStart(8, '0');
  return `${hex(h2)}${hex(h1)}-${text.length}`;
}
