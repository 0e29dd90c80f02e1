// Transfer size of two static sites by file kind, raw and `gzip -9`, and their ratio. Firn's
// service worker precaches every file of its site on the first visit, so the whole folder is
// what a first visit downloads; the baseline page has no worker and loads all of its files too.
// Prints figures only. Usage: node sizes.mjs FIRN_SITE BARE_SITE [FONT.ttf ...]
//   FONT.ttf: the subset fonts embedded in Firn's wasm (listed for information, not as files).
import {execFileSync} from 'node:child_process';
import {readdirSync, statSync} from 'node:fs';
import {basename, join} from 'node:path';

const [firnSite, bareSite, ...fonts] = process.argv.slice(2);
if (!firnSite || !bareSite) {
  console.error('usage: node sizes.mjs FIRN_SITE BARE_SITE [FONT.ttf ...]');
  process.exit(2);
}

const KINDS = ['html', 'glue js', 'wasm', 'font', 'icons', 'shell/sw/manifest', 'total'];
function kindOf(name) {
  if (name.endsWith('.html')) return 'html';
  if (name.endsWith('.wasm')) return 'wasm';
  if (/^(firn|bare)\.js$/.test(name)) return 'glue js';  // Emscripten's output
  if (/\.(ttf|otf|woff2?)$/.test(name)) return 'font';
  if (/^icon.*\.(png|svg)$/.test(name)) return 'icons';
  return 'shell/sw/manifest';  // page scripts, style sheet, service worker, manifests
}

const gzipSize = (file) => execFileSync('gzip', ['-9c', file], {maxBuffer: 1 << 28}).length;

function measure(site) {
  const sums = Object.fromEntries(KINDS.map((k) => [k, {raw: 0, gzip: 0, files: []}]));
  for (const name of readdirSync(site).sort()) {
    const file = join(site, name);
    if (!statSync(file).isFile()) continue;
    const raw = statSync(file).size;
    const gzip = gzipSize(file);
    for (const kind of [kindOf(name), 'total']) {
      sums[kind].raw += raw;
      sums[kind].gzip += gzip;
      sums[kind].files.push(name);
    }
  }
  return sums;
}

const firn = measure(firnSite);
const bare = measure(bareSite);
const kb = (bytes) => (bytes / 1000).toFixed(1);
const ratio = (a, b) => (b > 0 ? (a / b).toFixed(2) : '—');
console.log('kind                 Firn raw KB  gzip KB    bare raw KB  gzip KB    gzip ratio  files (Firn | bare)');
for (const kind of KINDS) {
  const f = firn[kind];
  const b = bare[kind];
  const files = kind === 'total' ? `${f.files.length} | ${b.files.length}`
                                 : `${f.files.join(' ') || '—'} | ${b.files.join(' ') || '—'}`;
  console.log(`${kind.padEnd(20)} ${kb(f.raw).padStart(11)} ${kb(f.gzip).padStart(8)}    ` +
              `${kb(b.raw).padStart(11)} ${kb(b.gzip).padStart(8)}    ${ratio(f.gzip, b.gzip).padStart(10)}  ${files}`);
}
const noIcons = firn.total.gzip - firn.icons.gzip;
console.log(`Firn without its install icons: ${kb(noIcons)} KB gzip, ${ratio(noIcons, bare.total.gzip)} × bare`);
if (fonts.length > 0) {
  console.log('fonts inside Firn\'s wasm (subset TTF embedded at build time, counted in "wasm"):');
  for (const font of fonts) {
    console.log(`  ${basename(font).padEnd(20)} ${kb(statSync(font).size).padStart(7)} KB raw ` +
                `${kb(gzipSize(font)).padStart(7)} KB gzip`);
  }
}
// ImGui's own default font (ProggyClean, compressed + base85 in imgui_draw.cpp) is in both.
console.log('the bare example draws with ImGui\'s built-in ProggyClean font (in its wasm; no font file)');

const total = firn.total.gzip;
const budgets = [
  [`total gzip ≤ 1.3 × bare (${kb(1.3 * bare.total.gzip)} KB)`, total <= 1.3 * bare.total.gzip],
  [`total gzip ≤ 1.0 × bare (issue 17, ${kb(bare.total.gzip)} KB)`, total <= bare.total.gzip],
  ['total gzip ≤ 400 KB', total <= 400000],
];
for (const [what, met] of budgets) {
  console.log(`budget ${what}: ${met ? 'met' : 'missed'} (Firn ${kb(total)} KB, ${ratio(total, bare.total.gzip)} × bare)`);
}
