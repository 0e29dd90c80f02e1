// Prints the number of distinct RGB colours in a PNG (8-bit RGBA or RGB, non-interlaced),
// decoded with node's zlib: enough to tell a blank frame from a drawn one.
import { readFileSync } from 'node:fs';
import { inflateSync } from 'node:zlib';

const data = readFileSync(process.argv[2]);
let offset = 8, width = 0, height = 0, channels = 4;
const idat = [];
while (offset < data.length) {
  const length = data.readUInt32BE(offset);
  const type = data.toString('ascii', offset + 4, offset + 8);
  const body = data.subarray(offset + 8, offset + 8 + length);
  if (type === 'IHDR') {
    width = body.readUInt32BE(0); height = body.readUInt32BE(4);
    channels = body[9] === 6 ? 4 : 3;
  } else if (type === 'IDAT') idat.push(body);
  offset += 12 + length;
}
const raw = inflateSync(Buffer.concat(idat));
const stride = width * channels;
const previous = new Uint8Array(stride), current = new Uint8Array(stride);
const colours = new Set();
for (let y = 0; y < height; y++) {
  const filter = raw[y * (stride + 1)];
  const line = raw.subarray(y * (stride + 1) + 1, (y + 1) * (stride + 1));
  for (let i = 0; i < stride; i++) {
    const a = i >= channels ? current[i - channels] : 0, b = previous[i];
    const c = i >= channels ? previous[i - channels] : 0;
    let v = line[i];
    if (filter === 1) v += a;
    else if (filter === 2) v += b;
    else if (filter === 3) v += (a + b) >> 1;
    else if (filter === 4) { const p = a + b - c, pa = Math.abs(p - a), pb = Math.abs(p - b), pc = Math.abs(p - c);
      v += pa <= pb && pa <= pc ? a : pb <= pc ? b : c; }
    current[i] = v & 255;
  }
  for (let x = 0; x < width; x += 1) colours.add((current[x * channels] << 16) | (current[x * channels + 1] << 8) | current[x * channels + 2]);
  previous.set(current);
}
console.log(colours.size);
