// Lossless recompression of the page icons that rsvg-convert writes: the same pixels, with the
// image data stored unfiltered at zlib level 9, which suits flat-colour icons (the three icons
// 41 KB → 30 KB; PNG does not gzip further, so this is transfer size; docs/BENCHMARKS.md). The
// result is decoded again and compared pixel for pixel; the smaller of the two files is kept.
// Handles 8-bit, non-interlaced greyscale/RGB/RGBA (what rsvg-convert writes); copies any other.
// Usage: node recompress_png.mjs IN.png OUT.png
import {copyFileSync, readFileSync, writeFileSync} from 'node:fs';
import zlib from 'node:zlib';

const [input, output] = process.argv.slice(2);
if (!input || !output) {
  console.error('usage: node recompress_png.mjs IN.png OUT.png');
  process.exit(2);
}
const SIGNATURE = Buffer.from([137, 80, 78, 71, 13, 10, 26, 10]);
const CHANNELS = {0: 1, 2: 3, 4: 2, 6: 4};  // colour type → bytes per pixel at 8 bits

function chunks(png) {
  if (!png.subarray(0, 8).equals(SIGNATURE)) throw new Error('not a PNG');
  const list = [];
  for (let at = 8; at < png.length;) {
    const length = png.readUInt32BE(at);
    list.push({type: png.toString('latin1', at + 4, at + 8), data: png.subarray(at + 8, at + 8 + length)});
    at += 12 + length;
  }
  return list;
}

// The raw pixel rows of an 8-bit, non-interlaced PNG, or null for any other kind.
function pixels(png) {
  const list = chunks(png);
  const header = list[0].data;
  const [width, height, depth, colour, interlace] =
    [header.readUInt32BE(0), header.readUInt32BE(4), header[8], header[9], header[12]];
  const bpp = CHANNELS[colour];
  if (depth !== 8 || !bpp || interlace !== 0) return null;
  const stride = width * bpp;
  const filtered = zlib.inflateSync(Buffer.concat(list.filter((c) => c.type === 'IDAT').map((c) => c.data)));
  const rows = Buffer.alloc(height * stride);
  for (let y = 0; y < height; ++y) {
    const filter = filtered[y * (stride + 1)];
    const line = filtered.subarray(y * (stride + 1) + 1, (y + 1) * (stride + 1));
    const row = rows.subarray(y * stride, (y + 1) * stride);
    const above = y > 0 ? rows.subarray((y - 1) * stride, y * stride) : Buffer.alloc(stride);
    for (let x = 0; x < stride; ++x) {
      const a = x >= bpp ? row[x - bpp] : 0;
      const b = above[x];
      const c = x >= bpp ? above[x - bpp] : 0;
      let predictor = 0;
      if (filter === 1) predictor = a;
      else if (filter === 2) predictor = b;
      else if (filter === 3) predictor = (a + b) >> 1;
      else if (filter === 4) {
        const pa = Math.abs(b - c), pb = Math.abs(a - c), pc = Math.abs(a + b - 2 * c);
        predictor = pa <= pb && pa <= pc ? a : pb <= pc ? b : c;
      }
      row[x] = (line[x] + predictor) & 255;
    }
  }
  return {rows, stride, height};
}

const crcTable = Array.from({length: 256}, (_, n) => {
  let c = n;
  for (let k = 0; k < 8; ++k) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
  return c >>> 0;
});
function chunk(type, data) {
  const body = Buffer.concat([Buffer.from(type, 'latin1'), data]);
  let crc = 0xffffffff;
  for (const byte of body) crc = crcTable[(crc ^ byte) & 255] ^ (crc >>> 8);
  const framed = Buffer.alloc(body.length + 8);
  framed.writeUInt32BE(data.length, 0);
  body.copy(framed, 4);
  framed.writeUInt32BE((crc ^ 0xffffffff) >>> 0, body.length + 4);
  return framed;
}

const original = readFileSync(input);
const image = pixels(original);
if (!image) {
  copyFileSync(input, output);
  process.exit(0);
}
const unfiltered = Buffer.alloc(image.height * (image.stride + 1));  // filter byte 0 per row
for (let y = 0; y < image.height; ++y) {
  image.rows.copy(unfiltered, y * (image.stride + 1) + 1, y * image.stride, (y + 1) * image.stride);
}
const idat = zlib.deflateSync(unfiltered, {level: 9, memLevel: 9});
const kept = chunks(original).filter((c) => c.type !== 'IDAT' && c.type !== 'IEND');
const candidate = Buffer.concat([SIGNATURE, ...kept.map((c) => chunk(c.type, c.data)),
                                 chunk('IDAT', idat), chunk('IEND', Buffer.alloc(0))]);
const again = pixels(candidate);
if (!again || !again.rows.equals(image.rows)) throw new Error(`${input}: recompressed pixels differ`);
writeFileSync(output, candidate.length < original.length ? candidate : original);
