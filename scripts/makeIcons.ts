// Writes the add-in's icons (assets/icon-N.png): a teal rounded square with a white "p" bar
// motif, our own, drawn pixel by pixel and PNG-encoded with zlib.
import { writeFileSync } from 'fs';
import { deflateSync } from 'zlib';

function crc32(buf: Buffer): number {
  let c = ~0;
  for (const b of buf) { c ^= b; for (let k = 0; k < 8; k++) c = (c >>> 1) ^ (0xedb88320 & -(c & 1)); }
  return ~c >>> 0;
}
function chunk(type: string, data: Buffer): Buffer {
  const len = Buffer.alloc(4); len.writeUInt32BE(data.length);
  const td = Buffer.concat([Buffer.from(type), data]);
  const crc = Buffer.alloc(4); crc.writeUInt32BE(crc32(td));
  return Buffer.concat([len, td, crc]);
}
function png(size: number): Buffer {
  const raw = Buffer.alloc(size * (size * 4 + 1));
  for (let y = 0; y < size; y++) {
    raw[y * (size * 4 + 1)] = 0;
    for (let x = 0; x < size; x++) {
      const u = x / size, v = y / size;
      const r = 0.18, inside = Math.min(u, 1 - u) > 0 && Math.min(v, 1 - v) > 0 &&
        !((u < r || u > 1 - r) && (v < r || v > 1 - r) && Math.hypot(Math.min(Math.abs(u - r), Math.abs(u - 1 + r)), Math.min(Math.abs(v - r), Math.abs(v - 1 + r))) > r);
      const bar = (u > 0.3 && u < 0.42 && v > 0.22 && v < 0.82) || (Math.hypot(u - 0.5, v - 0.4) < 0.2 && Math.hypot(u - 0.5, v - 0.4) > 0.09 && u > 0.36);
      const o = y * (size * 4 + 1) + 1 + x * 4;
      const [R, G, B, A] = !inside ? [0, 0, 0, 0] : bar ? [255, 255, 255, 255] : [14, 116, 120, 255];
      raw[o] = R; raw[o + 1] = G; raw[o + 2] = B; raw[o + 3] = A;
    }
  }
  const ihdr = Buffer.alloc(13); ihdr.writeUInt32BE(size, 0); ihdr.writeUInt32BE(size, 4); ihdr[8] = 8; ihdr[9] = 6;
  return Buffer.concat([Buffer.from([137, 80, 78, 71, 13, 10, 26, 10]), chunk('IHDR', ihdr), chunk('IDAT', deflateSync(raw)), chunk('IEND', Buffer.alloc(0))]);
}
// the ribbon sizes the manifest lists (16, 32 and 80 required; 20, 24, 40, 48, 64 supported) and 64 for the high-resolution icon
for (const size of [16, 20, 24, 32, 40, 48, 64, 80]) writeFileSync(`assets/icon-${size}.png`, png(size));
