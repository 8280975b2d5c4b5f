// Draws Plummet's icon (a plumb bob on its line over a ground mark, our own drawing) without any image library:
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
  return [
    { kind: 'rect', x0: s(246), x1: s(266), y0: s(70), y1: s(250), color: FG },           // line
    { kind: 'bob', cx: s(256), top: s(230), bottom: s(400), r: 70 * inset, color: ACCENT }, // plumb bob
    { kind: 'rect', x0: s(150), x1: s(362), y0: s(428), y1: s(446), color: FG },          // ground
  ];
}

function inside(shape, x, y) {
  if (shape.kind === 'rect') return x >= shape.x0 && x <= shape.x1 && y >= shape.y0 && y <= shape.y1;
  // A bob: a circle of radius r whose lower half narrows to a point at `bottom`.
  const cy = shape.top + shape.r;
  const dx = x - shape.cx;
  if (y <= cy) return dx * dx + (y - cy) ** 2 <= shape.r * shape.r;
  if (y > shape.bottom) return false;
  const half = shape.r * (1 - (y - cy) / (shape.bottom - cy));
  return Math.abs(dx) <= half;
}

function svg(inset, rounded) {
  const sh = shapes(inset);
  const [line, bob, ground] = sh;
  const cy = bob.top + bob.r;
  const hex = (c) => '#' + c.map((v) => v.toString(16).padStart(2, '0')).join('');
  const bobPath = `M ${bob.cx - bob.r} ${cy} A ${bob.r} ${bob.r} 0 0 1 ${bob.cx + bob.r} ${cy} L ${bob.cx} ${bob.bottom} Z`;
  return `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 512 512" role="img" aria-label="Plummet">
  <rect width="512" height="512" ${rounded ? 'rx="96"' : ''} fill="${hex(BG)}"/>
  <rect x="${line.x0}" y="${line.y0}" width="${line.x1 - line.x0}" height="${line.y1 - line.y0}" fill="${hex(FG)}"/>
  <path d="${bobPath}" fill="${hex(ACCENT)}"/>
  <rect x="${ground.x0}" y="${ground.y0}" width="${ground.x1 - ground.x0}" height="${ground.y1 - ground.y0}" rx="9" fill="${hex(FG)}"/>
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
