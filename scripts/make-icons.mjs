/**
 * Draws Echolot's icons and writes them as PNGs into manifest/icons/ (run: node scripts/make-icons.mjs).
 *
 * The picture: a sounding — three echo arcs spreading from a point on the left, and a diamond
 * (the lag marker of the evidence chart) where the echo returns, on a blue rounded square. Drawn
 * as signed distances with one pixel of anti-aliasing, so every size is rendered, not scaled.
 * PNG written by hand with node:zlib: 8-bit RGBA, no filter.
 */
import { writeFileSync, mkdirSync } from "node:fs";
import { deflateSync } from "node:zlib";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";

const SIZES = [16, 32, 64, 80, 128];
const BLUE = [0x00, 0x72, 0xb2];
const WHITE = [0xff, 0xff, 0xff];
const ORANGE = [0xe6, 0x9f, 0x00];

const CRC_TABLE = Array.from({ length: 256 }, (_, n) => {
  let c = n;
  for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
  return c >>> 0;
});

function crc32(bytes) {
  let c = 0xffffffff;
  for (const b of bytes) c = CRC_TABLE[(c ^ b) & 0xff] ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
}

function chunk(type, data) {
  const out = Buffer.alloc(12 + data.length);
  out.writeUInt32BE(data.length, 0);
  out.write(type, 4, "ascii");
  data.copy(out, 8);
  out.writeUInt32BE(crc32(out.subarray(4, 8 + data.length)), 8 + data.length);
  return out;
}

function png(size, rgba) {
  const header = Buffer.alloc(13);
  header.writeUInt32BE(size, 0);
  header.writeUInt32BE(size, 4);
  header[8] = 8; // bit depth
  header[9] = 6; // RGBA
  const raw = Buffer.alloc(size * (size * 4 + 1));
  for (let y = 0; y < size; y++) {
    raw[y * (size * 4 + 1)] = 0; // filter: none
    rgba.copy(raw, y * (size * 4 + 1) + 1, y * size * 4, (y + 1) * size * 4);
  }
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk("IHDR", header),
    chunk("IDAT", deflateSync(raw, { level: 9 })),
    chunk("IEND", Buffer.alloc(0)),
  ]);
}

/** Coverage of a shape from its signed distance d (negative inside), in pixels. */
const coverage = (d, pixel) => Math.min(1, Math.max(0, 0.5 - d / pixel));

function roundedSquare(x, y, half, radius) {
  const qx = Math.abs(x) - half + radius;
  const qy = Math.abs(y) - half + radius;
  return Math.hypot(Math.max(qx, 0), Math.max(qy, 0)) + Math.min(Math.max(qx, qy), 0) - radius;
}

/** An arc of radius r about (cx, cy), thickness w, within ±spread of the +x direction. */
function arc(x, y, cx, cy, r, w, spread) {
  const dx = x - cx;
  const dy = y - cy;
  const ring = Math.abs(Math.hypot(dx, dy) - r) - w / 2;
  const angle = Math.abs(Math.atan2(dy, dx));
  if (angle <= spread) return ring;
  // Beyond the arc's ends, distance to the nearer end cap (round caps).
  const ex = cx + r * Math.cos(spread);
  const ey = cy + r * Math.sin(spread) * Math.sign(dy || 1);
  return Math.hypot(x - ex, y - ey) - w / 2;
}

function diamond(x, y, cx, cy, half) {
  return (Math.abs(x - cx) + Math.abs(y - cy) - half) / Math.SQRT2;
}

function draw(size) {
  const rgba = Buffer.alloc(size * size * 4);
  const pixel = 2 / size; // the picture spans [−1, 1] in both directions
  const w = Math.max(0.11, 2.2 * pixel);
  for (let j = 0; j < size; j++) {
    for (let i = 0; i < size; i++) {
      const x = ((i + 0.5) / size) * 2 - 1;
      const y = ((j + 0.5) / size) * 2 - 1;
      const background = coverage(roundedSquare(x, y, 0.96, 0.26), pixel);
      let ink = 0;
      for (const r of [0.42, 0.78, 1.14])
        ink = Math.max(ink, coverage(arc(x, y, -0.62, 0, r, w, 0.62), pixel));
      ink *= coverage(roundedSquare(x, y, 0.82, 0.18), pixel); // keep arcs off the edge
      const mark = coverage(diamond(x, y, 0.5, 0, 0.2), pixel);
      const dot = coverage(Math.hypot(x + 0.62, y) - 0.1, pixel);
      ink = Math.max(ink, dot);
      const o = (j * size + i) * 4;
      for (let c = 0; c < 3; c++) {
        const base = BLUE[c] * (1 - ink) + WHITE[c] * ink;
        rgba[o + c] = Math.round(base * (1 - mark) + ORANGE[c] * mark);
      }
      rgba[o + 3] = Math.round(255 * background);
    }
  }
  return png(size, rgba);
}

const target = join(dirname(fileURLToPath(import.meta.url)), "..", "manifest", "icons");
mkdirSync(target, { recursive: true });
for (const size of SIZES) writeFileSync(join(target, `icon-${size}.png`), draw(size));
console.log(`wrote ${SIZES.map((s) => `icon-${s}.png`).join(", ")} to ${target}`);
