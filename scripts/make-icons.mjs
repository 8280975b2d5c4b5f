// Draws Plummet's icon (a ball falling, three streaks of its fall trailing above it, over a ground mark: our own
// drawing, and nothing in it narrows to a point, so it does not read as a map pin) without any image library:
// the same geometry is written as SVG and rasterised here into PNGs with 4×4 supersampling.
// Run `node scripts/make-icons.mjs` after changing the drawing; the outputs are committed in public/icons/.
import { writeFileSync } from 'node:fs';
import { deflateSync } from 'node:zlib';

const BG = [11, 61, 46];      // deep green
const FG = [247, 245, 238];   // off-white
const ACCENT = [242, 169, 0]; // amber

// Geometry in a 512 unit square. `inset` shrinks the drawing toward the centre (maskable safe zone).
function shapes(inset) {
  const s = (v) => 256 + (v - 256) * inset;
  const streak = (x, top, bottom) => ({ kind: 'rect', x0: s(x - 11), x1: s(x + 11), y0: s(top), y1: s(bottom), rx: 11 * inset, color: FG });
  return [
    streak(196, 150, 262), // the fall's streaks, longest in the middle
    streak(256, 72, 250),
    streak(316, 150, 262),
    { kind: 'ball', cx: s(256), cy: s(336), r: 76 * inset, color: ACCENT },
    { kind: 'rect', x0: s(140), x1: s(372), y0: s(436), y1: s(456), rx: 10 * inset, color: FG }, // ground
  ];
}

function inside(shape, x, y) {
  if (shape.kind === 'ball') return (x - shape.cx) ** 2 + (y - shape.cy) ** 2 <= shape.r * shape.r;
  if (x < shape.x0 || x > shape.x1 || y < shape.y0 || y > shape.y1) return false;
  // Rounded ends: outside the corner circles is outside the shape.
  const r = shape.rx ?? 0;
  const cx = Math.min(Math.max(x, shape.x0 + r), shape.x1 - r);
  const cy = Math.min(Math.max(y, shape.y0 + r), shape.y1 - r);
  return (x - cx) ** 2 + (y - cy) ** 2 <= r * r;
}

function svg(inset, rounded) {
  const hex = (c) => '#' + c.map((v) => v.toString(16).padStart(2, '0')).join('');
  const parts = shapes(inset).map((sh) =>
    sh.kind === 'ball'
      ? `  <circle cx="${sh.cx}" cy="${sh.cy}" r="${sh.r}" fill="${hex(sh.color)}"/>`
      : `  <rect x="${sh.x0}" y="${sh.y0}" width="${sh.x1 - sh.x0}" height="${sh.y1 - sh.y0}" rx="${sh.rx ?? 0}" fill="${hex(sh.color)}"/>`,
  );
  return `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 512 512" role="img" aria-label="Plummet">
  <rect width="512" height="512" ${rounded ? 'rx="96"' : ''} fill="${hex(BG)}"/>
${parts.join('\n')}
</svg>
`;
}

function raster(size, inset) {
  const sh = shapes(inset);
  const n = 4;
  const rows = [];
  for (let py = 0; py < size; py++) {
    const row = Buffer.alloc(1 + size * 3);
    for (let px = 0; px < size; px++) {
      const acc = [0, 0, 0];
      for (let sy = 0; sy < n; sy++) {
        for (let sx = 0; sx < n; sx++) {
          const x = ((px + (sx + 0.5) / n) * 512) / size;
          const y = ((py + (sy + 0.5) / n) * 512) / size;
          let c = BG;
          for (const shape of sh) if (inside(shape, x, y)) c = shape.color;
          acc[0] += c[0]; acc[1] += c[1]; acc[2] += c[2];
        }
      }
      for (let k = 0; k < 3; k++) row[1 + px * 3 + k] = Math.round(acc[k] / (n * n));
    }
    rows.push(row);
  }
  return png(size, Buffer.concat(rows));
}

function crc32(buf) {
  let c = ~0;
  for (const b of buf) {
    c ^= b;
    for (let k = 0; k < 8; k++) c = (c >>> 1) ^ (0xedb88320 & -(c & 1));
  }
  return ~c >>> 0;
}

function chunk(type, data) {
  const len = Buffer.alloc(4);
  len.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, 'ascii'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(body));
  return Buffer.concat([len, body, crc]);
}

function png(size, raw) {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(size, 0);
  ihdr.writeUInt32BE(size, 4);
  ihdr[8] = 8; // bit depth
  ihdr[9] = 2; // truecolour RGB
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', ihdr),
    chunk('IDAT', deflateSync(raw, { level: 9 })),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}

const out = new URL('../public/icons/', import.meta.url);
writeFileSync(new URL('icon.svg', out), svg(1, true));
writeFileSync(new URL('icon-192.png', out), raster(192, 1));
writeFileSync(new URL('icon-512.png', out), raster(512, 1));
// Maskable: the drawing kept inside the central 80 % safe zone, background to the edges.
writeFileSync(new URL('icon-maskable-512.png', out), raster(512, 0.72));
writeFileSync(new URL('apple-touch-icon-180.png', out), raster(180, 0.85));
console.log('icons written to public/icons/');
