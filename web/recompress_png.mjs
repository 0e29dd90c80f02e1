// Recompression of the page icons that rsvg-convert writes (docs/BENCHMARKS.md). Two candidates:
// the same pixels stored unfiltered at zlib level 9 (lossless), and an 8-bit palette image: the
// icon's flat colours and up to 256 of its anti-aliased edge blends, each pixel mapped to the
// nearest entry. The palette one is kept only if no pixel's composited (premultiplied) channel
// moves by more than MAX_PALETTE_ERROR of 255 — at edges only, invisible at icon size. The
// smallest candidate wins; each is decoded again and compared with the pixels it promises.
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
const CHANNELS = {0: 1, 2: 3, 3: 1, 4: 2, 6: 4};  // colour type → bytes per pixel at 8 bits
const PALETTE = 3;
const MAX_PALETTE_ERROR = 4;  // of 255, per premultiplied channel: edge pixels only (flats exact)

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

// The pixels of an 8-bit, non-interlaced PNG as rows of its own samples (palette images: RGBA),
// or null for any other kind.
function pixels(png) {
  const list = chunks(png);
  const header = list[0].data;
  const [width, height, depth, colour, interlace] =
    [header.readUInt32BE(0), header.readUInt32BE(4), header[8], header[9], header[12]];
  const bpp = CHANNELS[colour];
  if (depth !== 8 || !bpp || interlace !== 0) return null;
  const stride = width * bpp;
  const filtered = zlib.inflateSync(Buffer.concat(list.filter((c) => c.type === 'IDAT').map((c) => c.data)));
  let rows = Buffer.alloc(height * stride);
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
  if (colour === PALETTE) {
    const plte = list.find((c) => c.type === 'PLTE').data;
    const trns = list.find((c) => c.type === 'tRNS')?.data ?? Buffer.alloc(0);
    const rgba = Buffer.alloc(width * height * 4);
    rows.forEach((index, i) => {
      plte.copy(rgba, i * 4, index * 3, index * 3 + 3);
      rgba[i * 4 + 3] = index < trns.length ? trns[index] : 255;
    });
    return {rows: rgba, stride: width * 4, width, height, bpp: 4, header};
  }
  return {rows, stride, width, height, bpp, header};
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

// Rows of `stride` bytes → zlib stream of unfiltered rows (filter byte 0): flat colours compress
// best this way (docs/BENCHMARKS.md).
function idat(rows, stride, height) {
  const unfiltered = Buffer.alloc(height * (stride + 1));
  for (let y = 0; y < height; ++y) rows.copy(unfiltered, y * (stride + 1) + 1, y * stride, (y + 1) * stride);
  return zlib.deflateSync(unfiltered, {level: 9, memLevel: 9});
}

function png(header, extra, rows, stride, height) {
  return Buffer.concat([SIGNATURE, chunk('IHDR', header), ...extra.map((c) => chunk(c.type, c.data)),
                        chunk('IDAT', idat(rows, stride, height)), chunk('IEND', Buffer.alloc(0))]);
}

// The image as RGBA, whatever its channels.
function rgba(image) {
  const out = Buffer.alloc(image.width * image.height * 4);
  for (let i = 0; i < image.width * image.height; ++i) {
    const px = image.rows.subarray(i * image.bpp, (i + 1) * image.bpp);
    const grey = image.bpp <= 2;
    out[i * 4] = px[0];
    out[i * 4 + 1] = grey ? px[0] : px[1];
    out[i * 4 + 2] = grey ? px[0] : px[2];
    out[i * 4 + 3] = image.bpp === 2 ? px[1] : image.bpp === 4 ? px[3] : 255;
  }
  return out;
}

// At most 256 colours, chosen farthest-first: the icon's flat colours come in first (the most
// frequent colour seeds the palette), then, one at a time, whichever colour of the image is
// farthest from every entry so far, so the largest change any pixel suffers is as small as the
// 256 entries allow. Distance: the largest channel difference as composited (premultiplied; at
// alpha 3 the colour hardly shows).
function quantise(pixelsRgba) {
  const counts = new Map();
  for (let i = 0; i < pixelsRgba.length; i += 4) {
    const key = pixelsRgba.readUInt32BE(i);
    counts.set(key, (counts.get(key) ?? 0) + 1);
  }
  const keys = [...counts.keys()].sort((a, b) => counts.get(b) - counts.get(a));
  const colours = keys.map((key) => [key >>> 24, (key >>> 16) & 255, (key >>> 8) & 255, key & 255]);
  const distance = (p, c) => Math.max(Math.abs(p[3] - c[3]),
    ...[0, 1, 2].map((j) => Math.abs(p[j] * p[3] - c[j] * c[3]) / 255));
  const palette = [];
  const error = colours.map(() => Infinity);
  const owner = colours.map(() => 0);
  let farthest = 0;
  while (palette.length < 256 && error[farthest] > 0) {
    palette.push(colours[farthest]);
    colours.forEach((c, k) => {
      const d = distance(colours[farthest], c);
      if (d < error[k]) { error[k] = d; owner[k] = palette.length - 1; }
    });
    farthest = error.reduce((best, e, k) => (e > error[best] ? k : best), 0);
  }
  const entry = new Map(keys.map((key, k) => [key, owner[k]]));
  const indices = Buffer.alloc(pixelsRgba.length / 4);
  for (let i = 0; i < indices.length; ++i) indices[i] = entry.get(pixelsRgba.readUInt32BE(i * 4));
  return {palette, indices, worst: Math.round(Math.max(...error))};
}

function paletteCandidate(image) {
  const original = rgba(image);
  const {palette, indices, worst} = quantise(original);
  if (worst > MAX_PALETTE_ERROR) return {worst};
  const header = Buffer.from(image.header);
  header[9] = PALETTE;
  const plte = Buffer.from(palette.flatMap((p) => p.slice(0, 3)));
  let lastAlpha = palette.length;
  while (lastAlpha > 0 && palette[lastAlpha - 1][3] === 255) --lastAlpha;
  const extra = [{type: 'PLTE', data: plte}];
  if (lastAlpha > 0) extra.push({type: 'tRNS', data: Buffer.from(palette.slice(0, lastAlpha).map((p) => p[3]))});
  const file = png(header, extra, indices, image.width, image.height);
  const expected = Buffer.from(indices.reduce((out, k) => (out.push(...palette[k]), out), []));
  return {file, expected, worst};
}

const original = readFileSync(input);
const image = pixels(original);
if (!image) {
  copyFileSync(input, output);
  process.exit(0);
}
const ancillary = chunks(original).filter((c) => !['IHDR', 'IDAT', 'IEND', 'PLTE', 'tRNS'].includes(c.type));
const lossless = png(image.header, ancillary, image.rows, image.stride, image.height);
const again = pixels(lossless);
if (!again || !again.rows.equals(image.rows)) throw new Error(`${input}: recompressed pixels differ`);
const candidates = [original, lossless];
const quantised = paletteCandidate(image);
if (quantised.file) {
  const decoded = pixels(quantised.file);
  if (!decoded.rows.equals(quantised.expected)) throw new Error(`${input}: palette pixels differ`);
  candidates.push(quantised.file);
}
const smallest = candidates.reduce((a, b) => (b.length < a.length ? b : a));
console.log(`${output}: ${original.length} → ${smallest.length} bytes` +
            ` (palette: largest channel change ${quantised.worst}/255${quantised.file ? '' : ', not used'})`);
writeFileSync(output, smallest);
