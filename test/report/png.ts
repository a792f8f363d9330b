/**
 * A minimal PNG reader for tests (8-bit greyscale, RGB or RGBA, non-interlaced — what Chromium
 * writes): enough to count the pixels that are not background. PNG specification (W3C, 2nd ed.),
 * chunks IHDR/IDAT/IEND, zlib-compressed scanlines with filter types 0–4.
 */
import { inflateSync } from 'node:zlib';

export interface Image {
  readonly width: number;
  readonly height: number;
  readonly channels: number;
  readonly pixels: Uint8Array;
}

function paeth(a: number, b: number, c: number): number {
  const p = a + b - c;
  const pa = Math.abs(p - a), pb = Math.abs(p - b), pc = Math.abs(p - c);
  return pa <= pb && pa <= pc ? a : pb <= pc ? b : c;
}

export function readPng(data: Buffer): Image {
  if (data.readUInt32BE(0) !== 0x89504e47) throw new Error('not a PNG');
  let offset = 8;
  let width = 0, height = 0, channels = 0;
  const idat: Buffer[] = [];
  while (offset < data.length) {
    const length = data.readUInt32BE(offset);
    const type = data.toString('latin1', offset + 4, offset + 8);
    const body = data.subarray(offset + 8, offset + 8 + length);
    if (type === 'IHDR') {
      width = body.readUInt32BE(0);
      height = body.readUInt32BE(4);
      const depth = body[8], colour = body[9], interlace = body[12];
      if (depth !== 8 || interlace !== 0) throw new Error('unsupported PNG (depth or interlace)');
      channels = colour === 0 ? 1 : colour === 2 ? 3 : colour === 6 ? 4 : colour === 4 ? 2 : 0;
      if (channels === 0) throw new Error(`unsupported PNG colour type ${String(colour)}`);
    } else if (type === 'IDAT') {
      idat.push(body);
    }
    offset += 12 + length;
  }
  const raw = inflateSync(Buffer.concat(idat));
  const stride = width * channels;
  const pixels = new Uint8Array(height * stride);
  for (let y = 0; y < height; y++) {
    const filter = raw[y * (stride + 1)] as number;
    const line = raw.subarray(y * (stride + 1) + 1, (y + 1) * (stride + 1));
    for (let x = 0; x < stride; x++) {
      const a = x >= channels ? (pixels[y * stride + x - channels] as number) : 0;
      const b = y > 0 ? (pixels[(y - 1) * stride + x] as number) : 0;
      const c = x >= channels && y > 0 ? (pixels[(y - 1) * stride + x - channels] as number) : 0;
      const v = line[x] as number;
      const out = filter === 0 ? v : filter === 1 ? v + a : filter === 2 ? v + b : filter === 3 ? v + ((a + b) >> 1) : paeth(a, b, c) + v;
      pixels[y * stride + x] = out & 0xff;
    }
  }
  return { width, height, channels, pixels };
}

/** Share of pixels that are not (near) white, and the number of distinct colours (coarse). */
export function inkStats(img: Image): { ink: number; colours: number } {
  let ink = 0;
  const colours = new Set<number>();
  for (let i = 0; i < img.width * img.height; i++) {
    const o = i * img.channels;
    const r = img.pixels[o] as number, g = img.pixels[o + (img.channels >= 3 ? 1 : 0)] as number, b = img.pixels[o + (img.channels >= 3 ? 2 : 0)] as number;
    if (r < 235 || g < 235 || b < 235) ink++;
    colours.add(((r >> 4) << 8) | ((g >> 4) << 4) | (b >> 4));
  }
  return { ink: ink / (img.width * img.height), colours: colours.size };
}
