/**
 * A small namespace-aware XML reader (Namespaces in XML 1.0), enough for WebDAV answers: elements, attributes,
 * text, CDATA, comments and processing instructions, the five predefined entities and character references.
 * DOMParser is not there in Node or in a service worker, hence this. A DOCTYPE is refused: a multistatus never
 * needs one, and refusing it rules out entity-expansion tricks.
 */
import { PlummetError, type PlummetErrorOptions } from '../errors';

export interface XmlElement {
  /** The namespace URI, or null for an element in no namespace. */
  ns: string | null;
  local: string;
  attributes: Record<string, string>;
  children: (XmlElement | string)[];
}

/** Stable codes: 'xml-syntax' for text that is not XML, the others for XML this reader refuses or cannot resolve. */
export type XmlErrorCode = 'xml-syntax' | 'xml-entity' | 'xml-namespace' | 'xml-doctype' | 'xml-structure';

/** `field` is the place in the text ("character 120"); `value` what was found there; `allowed` what may stand there. */
export class XmlError extends PlummetError<XmlErrorCode> {
  readonly offset: number;
  constructor(options: Omit<PlummetErrorOptions<XmlErrorCode>, 'field'> & { offset: number; message: string; allowed: string }) {
    super({ ...options, field: `character ${options.offset}`, message: `${options.message} (at character ${options.offset}; allowed: ${options.allowed})` });
    this.name = 'XmlError';
    this.offset = options.offset;
  }
}

const NAME = /[A-Za-z_:\u00c0-\uffff][A-Za-z0-9_.:\-\u00b7\u00c0-\uffff]*/y;
const ENTITIES: Record<string, string> = { lt: '<', gt: '>', amp: '&', quot: '"', apos: "'" };

function decode(text: string, offset: number): string {
  return text.replace(/&(#x[0-9a-fA-F]+|#[0-9]+|[A-Za-z]+);|&/g, (whole, body: string | undefined) => {
    if (body === undefined) throw new XmlError({ code: 'xml-entity', offset, value: '&', allowed: '&amp; for an ampersand in text', message: 'a bare "&" in text' });
    if (body.startsWith('#x')) return String.fromCodePoint(parseInt(body.slice(2), 16));
    if (body.startsWith('#')) return String.fromCodePoint(parseInt(body.slice(1), 10));
    const named = ENTITIES[body];
    if (named === undefined) throw new XmlError({ code: 'xml-entity', offset, value: whole, allowed: '&lt; &gt; &amp; &quot; &apos; or a character reference', message: `unknown entity ${whole}` });
    return named;
  });
}

interface Open {
  element: XmlElement;
  qname: string;
  scope: Map<string, string | null>;
}

export function parseXml(input: string): XmlElement {
  const text = input.charCodeAt(0) === 0xfeff ? input.slice(1) : input;
  let i = 0;
  let root: XmlElement | null = null;
  const stack: Open[] = [];
  const topScope = new Map<string, string | null>([
    ['xml', 'http://www.w3.org/XML/1998/namespace'],
    ['', null],
  ]);

  const readName = (): string => {
    NAME.lastIndex = i;
    const m = NAME.exec(text);
    if (!m) throw new XmlError({ code: 'xml-syntax', offset: i, value: text.slice(i, i + 10), allowed: 'an element or attribute name', message: 'a name was expected' });
    i += m[0].length;
    return m[0];
  };
  const skipSpace = () => {
    while (i < text.length && /\s/.test(text[i]!)) i++;
  };
  const resolve = (qname: string, scope: Map<string, string | null>, offset: number): [string | null, string] => {
    const colon = qname.indexOf(':');
    const prefix = colon < 0 ? '' : qname.slice(0, colon);
    const local = colon < 0 ? qname : qname.slice(colon + 1);
    if (!scope.has(prefix)) throw new XmlError({ code: 'xml-namespace', offset, value: prefix, allowed: 'a namespace prefix declared with xmlns', message: `namespace prefix "${prefix}" is not declared` });
    return [scope.get(prefix)!, local];
  };

  while (i < text.length) {
    const lt = text.indexOf('<', i);
    if (lt < 0 || lt > i) {
      const end = lt < 0 ? text.length : lt;
      const chunk = text.slice(i, end);
      if (stack.length > 0) stack[stack.length - 1]!.element.children.push(decode(chunk, i));
      else if (chunk.trim() !== '') throw new XmlError({ code: 'xml-structure', offset: i, value: chunk.trim().slice(0, 40), allowed: 'only white space outside the root element', message: 'text outside the root element' });
      i = end;
      continue;
    }
    if (text.startsWith('<?', i)) {
      const end = text.indexOf('?>', i);
      if (end < 0) throw new XmlError({ code: 'xml-syntax', offset: i, value: text.slice(i, i + 40), allowed: 'a processing instruction closed by "?>"', message: 'an unclosed processing instruction' });
      i = end + 2;
    } else if (text.startsWith('<!--', i)) {
      const end = text.indexOf('-->', i);
      if (end < 0) throw new XmlError({ code: 'xml-syntax', offset: i, value: text.slice(i, i + 40), allowed: 'a comment closed by "-->"', message: 'an unclosed comment' });
      i = end + 3;
    } else if (text.startsWith('<![CDATA[', i)) {
      const end = text.indexOf(']]>', i);
      if (end < 0 || stack.length === 0) throw new XmlError({ code: 'xml-structure', offset: i, value: text.slice(i, i + 40), allowed: 'a CDATA section closed by "]]>" inside an element', message: 'a CDATA section outside an element' });
      stack[stack.length - 1]!.element.children.push(text.slice(i + 9, end));
      i = end + 3;
    } else if (text.startsWith('<!', i)) {
      throw new XmlError({ code: 'xml-doctype', offset: i, value: text.slice(i, i + 40), allowed: 'no DOCTYPE or other declaration', message: 'a DOCTYPE or declaration, which a WebDAV answer has no use for' });
    } else if (text.startsWith('</', i)) {
      const at = i;
      i += 2;
      const qname = readName();
      skipSpace();
      if (text[i] !== '>') throw new XmlError({ code: 'xml-syntax', offset: i, value: text[i] ?? '(end)', allowed: '">"', message: `">" expected to close </${qname}` });
      i++;
      const open = stack.pop();
      if (!open || open.qname !== qname) throw new XmlError({ code: 'xml-structure', offset: at, value: qname, allowed: `</${open?.qname ?? '(nothing)'}>`, message: `</${qname}> does not close <${open?.qname ?? '(nothing)'}>` });
    } else {
      const at = i;
      i++;
      const qname = readName();
      const raw: [string, string][] = [];
      for (;;) {
        skipSpace();
        if (text[i] === '>' || text.startsWith('/>', i)) break;
        if (i >= text.length) throw new XmlError({ code: 'xml-syntax', offset: at, value: qname, allowed: 'an element closed by ">" or "/>"', message: `<${qname} is not closed` });
        const name = readName();
        skipSpace();
        if (text[i] !== '=') throw new XmlError({ code: 'xml-syntax', offset: i, value: text[i] ?? '(end)', allowed: '"="', message: `"=" expected after attribute ${name}` });
        i++;
        skipSpace();
        const quote = text[i];
        if (quote !== '"' && quote !== "'") throw new XmlError({ code: 'xml-syntax', offset: i, value: text[i] ?? '(end)', allowed: 'a value in "double" or \'single\' quotes', message: `a quoted value expected for attribute ${name}` });
        const end = text.indexOf(quote, i + 1);
        if (end < 0) throw new XmlError({ code: 'xml-syntax', offset: i, value: text.slice(i, i + 40), allowed: 'a value closed by its quote', message: `the value of attribute ${name} is not closed` });
        raw.push([name, decode(text.slice(i + 1, end), i)]);
        i = end + 1;
      }
      const parentScope = stack.length > 0 ? stack[stack.length - 1]!.scope : topScope;
      let scope = parentScope;
      const attributes: Record<string, string> = {};
      for (const [name, value] of raw) {
        if (name === 'xmlns' || name.startsWith('xmlns:')) {
          if (scope === parentScope) scope = new Map(parentScope);
          scope.set(name === 'xmlns' ? '' : name.slice(6), value === '' ? null : value);
        } else attributes[name] = value;
      }
      const [ns, local] = resolve(qname, scope, at);
      const element: XmlElement = { ns, local, attributes, children: [] };
      if (stack.length > 0) stack[stack.length - 1]!.element.children.push(element);
      else if (root) throw new XmlError({ code: 'xml-structure', offset: at, value: qname, allowed: 'one root element', message: 'a second root element' });
      else root = element;
      if (text.startsWith('/>', i)) i += 2;
      else {
        i++;
        stack.push({ element, qname, scope });
      }
    }
  }
  if (stack.length > 0) throw new XmlError({ code: 'xml-structure', offset: text.length, value: stack[stack.length - 1]!.qname, allowed: 'every element closed', message: `<${stack[stack.length - 1]!.qname}> is not closed` });
  if (!root) throw new XmlError({ code: 'xml-structure', offset: 0, value: text.slice(0, 40), allowed: 'one root element', message: 'no root element' });
  return root;
}

/** Child elements with this namespace and local name. */
export function childrenNamed(element: XmlElement, ns: string | null, local: string): XmlElement[] {
  return element.children.filter((c): c is XmlElement => typeof c !== 'string' && c.ns === ns && c.local === local);
}

/** All text inside an element, nested elements included. */
export function textOf(element: XmlElement): string {
  return element.children.map((c) => (typeof c === 'string' ? c : textOf(c))).join('');
}
