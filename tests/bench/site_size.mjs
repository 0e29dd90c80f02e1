// One site's first-visit transfer: every file (the service worker precaches them all), raw and
// `gzip -9`, and the total — the quick figure to read after each size change (a second or so,
// no browser, no baseline build; compare.sh gives the full comparison). Prints figures only.
// Usage: node tests/bench/site_size.mjs [SITE]   (default build/web/site)
import {execFileSync} from 'node:child_process';
import {readdirSync, statSync} from 'node:fs';
import {join} from 'node:path';

const site = process.argv[2] ?? 'build/web/site';
const kb = (bytes) => (bytes / 1000).toFixed(1).padStart(8);
let raw = 0;
let gzip = 0;
for (const name of readdirSync(site).sort()) {
  const file = join(site, name);
  if (!statSync(file).isFile()) continue;
  const size = statSync(file).size;
  const packed = execFileSync('gzip', ['-9c', file], {maxBuffer: 1 << 28}).length;
  raw += size;
  gzip += packed;
  console.log(`${name.padEnd(24)} ${kb(size)} KB raw ${kb(packed)} KB gzip`);
}
console.log(`${'total'.padEnd(24)} ${kb(raw)} KB raw ${kb(gzip)} KB gzip`);
