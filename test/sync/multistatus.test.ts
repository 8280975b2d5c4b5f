import { describe, expect, it } from 'vitest';
import { parseMultistatus } from '../../src/sync/multistatus';
import { parseXml, textOf } from '../../src/sync/xml';
import { SyncError } from '../../src/sync/errors';

// RFC 4918 §9.1.5, "Example - Using 'allprop' to Retrieve All Properties" (the response body; the RFC's own
// text, with its supportedlock blocks shortened).
const RFC4918_ALLPROP = `<?xml version="1.0" encoding="utf-8" ?>
<D:multistatus xmlns:D="DAV:">
  <D:response>
    <D:href>/container/</D:href>
    <D:propstat>
      <D:prop xmlns:R="http://ns.example.com/boxschema/">
        <R:bigbox><R:BoxType>Box type A</R:BoxType></R:bigbox>
        <R:author><R:Name>Hadrian</R:Name></R:author>
        <D:creationdate>1997-12-01T17:42:21-08:00</D:creationdate>
        <D:displayname>Example collection</D:displayname>
        <D:resourcetype><D:collection/></D:resourcetype>
        <D:supportedlock/>
      </D:prop>
      <D:status>HTTP/1.1 200 OK</D:status>
    </D:propstat>
  </D:response>
  <D:response>
    <D:href>/container/front.html</D:href>
    <D:propstat>
      <D:prop xmlns:R="http://ns.example.com/boxschema/">
        <R:bigbox><R:BoxType>Box type B</R:BoxType></R:bigbox>
        <D:creationdate>1997-12-01T18:27:21-08:00</D:creationdate>
        <D:displayname>Example HTML resource</D:displayname>
        <D:getcontentlength>4525</D:getcontentlength>
        <D:getcontenttype>text/html</D:getcontenttype>
        <D:getetag>"zzyzx"</D:getetag>
        <D:getlastmodified>Mon, 12 Jan 1998 09:25:56 GMT</D:getlastmodified>
        <D:resourcetype/>
        <D:supportedlock/>
      </D:prop>
      <D:status>HTTP/1.1 200 OK</D:status>
    </D:propstat>
  </D:response>
</D:multistatus>`;

// RFC 4918 §9.1.3, "Example - Retrieving Named Properties": one propstat with 200, one with 403.
const RFC4918_NAMED = `<?xml version="1.0" encoding="utf-8" ?>
<D:multistatus xmlns:D="DAV:">
  <D:response xmlns:R="http://ns.example.com/boxschema/">
    <D:href>http://www.example.com/file</D:href>
    <D:propstat>
      <D:prop>
        <R:bigbox><R:BoxType>Box type A</R:BoxType></R:bigbox>
        <R:author><R:Name>J.J. Johnson</R:Name></R:author>
      </D:prop>
      <D:status>HTTP/1.1 200 OK</D:status>
    </D:propstat>
    <D:propstat>
      <D:prop><R:DingALing/><R:Random/></D:prop>
      <D:status>HTTP/1.1 403 Forbidden</D:status>
      <D:responsedescription> The user does not have access to the DingALing property. </D:responsedescription>
    </D:propstat>
  </D:response>
  <D:responsedescription> There has been an access violation error. </D:responsedescription>
</D:multistatus>`;

describe('reading a PROPFIND multistatus (RFC 4918)', () => {
  it('reads the resources of the allprop example of RFC 4918 §9.1.5', () => {
    const list = parseMultistatus(RFC4918_ALLPROP, 'http://www.example.com/container/');
    expect(list).toEqual([
      { url: 'http://www.example.com/container/', name: 'container', collection: true, etag: null, lastModified: null, contentLength: null },
      {
        url: 'http://www.example.com/container/front.html',
        name: 'front.html',
        collection: false,
        etag: '"zzyzx"',
        lastModified: 'Mon, 12 Jan 1998 09:25:56 GMT',
        contentLength: 4525,
      },
    ]);
  });

  it('uses only properties of a propstat with status 200 (RFC 4918 §9.1.3, §9.1.2)', () => {
    const [file] = parseMultistatus(RFC4918_NAMED, 'http://www.example.com/');
    expect(file).toMatchObject({ url: 'http://www.example.com/file', name: 'file', etag: null });
  });

  it('reads the default-namespace form (xmlns="DAV:") as in RFC 4918 §9.1.4', () => {
    const xml = `<?xml version="1.0"?><multistatus xmlns="DAV:"><response><href>/dav/a%20b.json</href>
      <propstat><prop><getcontentlength>7</getcontentlength><resourcetype/></prop><status>HTTP/1.1 200 OK</status></propstat>
      </response></multistatus>`;
    expect(parseMultistatus(xml, 'http://127.0.0.1:8080/dav/')).toEqual([
      { url: 'http://127.0.0.1:8080/dav/a%20b.json', name: 'a b.json', collection: false, etag: null, lastModified: null, contentLength: 7 },
    ]);
  });

  it("reads Apache mod_dav's form: DAV: bound to a second prefix on each response", () => {
    const xml = `<?xml version="1.0" encoding="utf-8"?>
<D:multistatus xmlns:D="DAV:"><D:response xmlns:lp2="http://apache.org/dav/props/" xmlns:lp1="DAV:">
<D:href>/dav/x.json</D:href><D:propstat><D:prop><lp1:resourcetype/><lp1:getcontentlength>7</lp1:getcontentlength>
<lp1:getlastmodified>Tue, 01 Dec 2026 22:49:21 GMT</lp1:getlastmodified><lp1:getetag>W/"7-6619a56535a18"</lp1:getetag>
<lp2:executable>F</lp2:executable></D:prop><D:status>HTTP/1.1 200 OK</D:status></D:propstat></D:response></D:multistatus>`;
    expect(parseMultistatus(xml, 'http://127.0.0.1/dav/')[0]).toMatchObject({ name: 'x.json', etag: 'W/"7-6619a56535a18"', contentLength: 7 });
  });

  it('ignores elements of the same local name in another namespace', () => {
    const xml = `<D:multistatus xmlns:D="DAV:" xmlns:X="urn:x"><X:response><D:href>/x</D:href></X:response></D:multistatus>`;
    expect(parseMultistatus(xml, 'http://h/')).toEqual([]);
  });

  it('refuses an answer that is not well-formed XML or not a multistatus, as a bad response', () => {
    for (const xml of ['<D:multistatus xmlns:D="DAV:"><D:response>', '<html><body>Login</body></html>', 'not xml']) {
      try {
        parseMultistatus(xml, 'http://h/');
        expect.unreachable(xml);
      } catch (error) {
        expect((error as SyncError).code).toBe('sync-bad-response');
      }
    }
  });
});

describe('the XML reader', () => {
  it('decodes the predefined entities, character references and CDATA', () => {
    const root = parseXml('<a>&lt;&amp;&gt;&quot;&apos; &#233;&#x20AC;<![CDATA[<raw>&amp;]]><!-- no --></a>');
    expect(textOf(root)).toBe('<&>"\' é€<raw>&amp;');
  });

  it('scopes namespace declarations to the element that makes them', () => {
    const root = parseXml('<a xmlns="urn:one"><b xmlns="urn:two"/><c/></a>');
    expect((root.children as { ns: string }[]).map((c) => c.ns)).toEqual(['urn:two', 'urn:one']);
  });

  it('refuses an undeclared prefix, a mismatched end tag and a DOCTYPE', () => {
    expect(() => parseXml('<p:a/>')).toThrow(/not declared/);
    expect(() => parseXml('<a></b>')).toThrow(/does not close/);
    expect(() => parseXml('<!DOCTYPE a [<!ENTITY x "y">]><a>&x;</a>')).toThrow(/DOCTYPE/);
  });
});
