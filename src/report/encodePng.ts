import { crc32, deflateSync } from 'node:zlib';

const SIGNATURE = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);

function chunk(type: string, data: Uint8Array): Buffer {
  const out = Buffer.alloc(12 + data.length);
  out.writeUInt32BE(data.length, 0);
  out.write(type, 4, 'latin1');
  out.set(data, 8);
  out.writeUInt32BE(crc32(out.subarray(4, 8 + data.length)), 8 + data.length);
  return out;
}

function ihdr(width: number, height: number, colorType: 2 | 3): Buffer {
  const h = Buffer.alloc(13);
  h.writeUInt32BE(width, 0);
  h.writeUInt32BE(height, 4);
  h[8] = 8; // bit depth
  h[9] = colorType;
  // compression 0 (deflate), filter method 0, no interlace: bytes 10–12 stay 0.
  return chunk('IHDR', h);
}

/**
 * Encode a palette image as PNG (ISO/IEC 15948, PNG 2nd ed.: IHDR, PLTE, IDAT, IEND; CRC-32 over
 * type and data). `pixels[k]` indexes `palette` (RGB triples), row-major, top row first.
 * When at most 256 palette entries are used the file is 8-bit indexed (colour type 3, filter 0
 * "None" per row, the filter the PNG spec recommends for palette images), else 8-bit RGB (type 2)
 * with filter 1 "Sub". Unused entries are dropped, the rest keep their order, so the output is a
 * pure function of the input. pdfkit embeds either kind without decoding (Flate with the PNG
 * predictor, or an Indexed colour space), and the pixels shown are the same either way.
 * Cost: O(pixels) plus one deflate of 1 (indexed) or 3 (RGB) bytes a pixel.
 * @example encodePng(1, 1, Uint16Array.of(0), Uint8Array.of(255, 0, 0)) // → a 1×1 red PNG
 */
export function encodePng(width: number, height: number, pixels: Uint16Array, palette: Uint8Array, deflateLevel = 6): Buffer {
  const n = palette.length / 3;
  const remap = new Int32Array(n).fill(-1);
  for (let k = 0; k < pixels.length; k++) remap[pixels[k]] = 0;
  let used = 0;
  for (let c = 0; c < n; c++) if (remap[c] === 0) remap[c] = used++;
  let raw: Uint8Array;
  const parts: Buffer[] = [SIGNATURE];
  if (used <= 256) {
    const plte = new Uint8Array(3 * used);
    for (let c = 0; c < n; c++) if (remap[c] >= 0) plte.set(palette.subarray(3 * c, 3 * c + 3), 3 * remap[c]);
    const stride = width + 1;
    raw = new Uint8Array(height * stride);
    for (let j = 0; j < height; j++) {
      const row = j * stride + 1;
      const src = j * width;
      for (let i = 0; i < width; i++) raw[row + i] = remap[pixels[src + i]];
    }
    parts.push(ihdr(width, height, 3), chunk('PLTE', plte));
  } else {
    const stride = 3 * width + 1;
    raw = new Uint8Array(height * stride);
    for (let j = 0; j < height; j++) {
      const row = j * stride;
      raw[row] = 1;
      let pr = 0;
      let pg = 0;
      let pb = 0;
      for (let i = 0; i < width; i++) {
        const c = 3 * pixels[j * width + i];
        const r = palette[c];
        const g = palette[c + 1];
        const b = palette[c + 2];
        const o = row + 1 + 3 * i;
        // Sub filter: each byte minus the same channel of the pixel to its left, modulo 256.
        raw[o] = (r - pr) & 255;
        raw[o + 1] = (g - pg) & 255;
        raw[o + 2] = (b - pb) & 255;
        pr = r;
        pg = g;
        pb = b;
      }
    }
    parts.push(ihdr(width, height, 2));
  }
  parts.push(chunk('IDAT', deflateSync(raw, { level: deflateLevel })), chunk('IEND', new Uint8Array(0)));
  return Buffer.concat(parts);
}
