/**
 * A tiny bar chart as a PNG, drawn pixel by pixel and encoded with zlib (PNG spec, W3C/ISO
 * 15948), so the Family digest carries an inline image that every mail client shows — no
 * canvas library, no network.
 */
import { deflateSync } from 'node:zlib';

const CRC_TABLE = (() => {
  const t = new Uint32Array(256);
  for (let n = 0; n < 256; n++) {
    let c = n;
    for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
    t[n] = c >>> 0;
  }
  return t;
})();

/** CRC-32 as PNG chunks use it (ISO 3309 polynomial). */
export function crc32(buf: Uint8Array): number {
  let c = 0xffffffff;
  for (const b of buf) c = CRC_TABLE[(c ^ b) & 0xff]! ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
}

function chunk(type: string, data: Buffer): Buffer {
  const len = Buffer.alloc(4);
  len.writeUInt32BE(data.length);
  const typed = Buffer.concat([Buffer.from(type, 'ascii'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(typed));
  return Buffer.concat([len, typed, crc]);
}

type Rgb = [number, number, number];
const CHALK: Rgb = [0xf7, 0xf5, 0xf0];
const NAVY: Rgb = [0x1b, 0x2a, 0x41];
const AMBER: Rgb = [0xf0, 0xa2, 0x02];

/**
 * Bars for `values` (0..1, null = no data) left to right, the last one highlighted in amber,
 * on a chalk background with a navy baseline. Returns the PNG bytes.
 */
export function barChartPng(values: readonly (number | null)[], width = 320, height = 120): Buffer {
  const px = Buffer.alloc(width * height * 3);
  const set = (x: number, y: number, c: Rgb) => {
    const i = (y * width + x) * 3;
    px[i] = c[0];
    px[i + 1] = c[1];
    px[i + 2] = c[2];
  };
  for (let y = 0; y < height; y++) for (let x = 0; x < width; x++) set(x, y, CHALK);
  const base = height - 10;
  for (let x = 8; x < width - 8; x++) set(x, base, NAVY);
  const n = Math.max(1, values.length);
  const slot = (width - 16) / n;
  values.forEach((v, i) => {
    if (v === null) return;
    const h = Math.round(Math.max(0, Math.min(1, v)) * (base - 10));
    const x0 = Math.round(8 + i * slot + slot * 0.2);
    const x1 = Math.round(8 + (i + 1) * slot - slot * 0.2);
    const colour = i === values.length - 1 ? AMBER : NAVY;
    for (let x = x0; x < x1; x++) for (let y = base - h; y < base; y++) set(x, y, colour);
  });
  // Filter byte 0 (None) before each scanline.
  const raw = Buffer.alloc((width * 3 + 1) * height);
  for (let y = 0; y < height; y++) px.copy(raw, y * (width * 3 + 1) + 1, y * width * 3, (y + 1) * width * 3);
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr[8] = 8; // bit depth
  ihdr[9] = 2; // colour type: truecolour
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', ihdr),
    chunk('IDAT', deflateSync(raw)),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}
