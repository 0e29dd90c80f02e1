// Assembles the static site: copies the page shell and the compiled files into one folder and
// writes firn-build.json (every file with its size and SHA-256, and one build hash over all of
// them). If the shell has a service worker template (sw.js), the file list and build hash are
// written into it, so every build with different content yields a different service worker and
// a differently named cache.
// Usage: node make_site.mjs --out DIR [--label TEXT] [--version X.Y.Z] INPUT...
//   INPUT: a file, or a folder whose files are all copied.
import {createHash} from 'node:crypto';
import {copyFileSync, mkdirSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync}
  from 'node:fs';
import {basename, join} from 'node:path';

const args = process.argv.slice(2);
const options = {out: '', label: '', version: ''};
const inputs = [];
for (let i = 0; i < args.length; ++i) {
  const flag = args[i].match(/^--(out|label|version)$/);
  if (flag) options[flag[1]] = args[++i] ?? '';
  else inputs.push(args[i]);
}
if (!options.out || inputs.length === 0) {
  console.error('usage: node make_site.mjs --out DIR [--label TEXT] [--version X.Y.Z] INPUT...');
  process.exit(2);
}

const SERVICE_WORKER = 'sw.js';
const BUILD_MANIFEST = 'firn-build.json';

// Start clean: a file left over from an older build must never be served or precached.
rmSync(options.out, {recursive: true, force: true});
mkdirSync(options.out, {recursive: true});
const copied = new Set();
function copy(source) {
  const name = basename(source);
  if (copied.has(name)) throw new Error(`two inputs are both called ${name}`);
  copied.add(name);
  copyFileSync(source, join(options.out, name));
}
for (const input of inputs) {
  if (statSync(input).isDirectory()) {
    for (const name of readdirSync(input).sort()) {
      if (statSync(join(input, name)).isFile()) copy(join(input, name));
    }
  } else {
    copy(input);
  }
}

// An index.html from an assembled site (the update test re-assembles one) loses its old tags.
const INDEX = 'index.html';
const indexPath = join(options.out, INDEX);
if (copied.has(INDEX)) {
  writeFileSync(indexPath, readFileSync(indexPath, 'utf8')
    .replace(/<meta name="firn-(build|wasm-bytes)" content="[^"]*">\n/g, '')
    .replace(/\?build=[0-9a-f]+"/g, '"'));
}

const sha256 = (bytes) => createHash('sha256').update(bytes).digest('hex');
const hashFiles = () => [...copied].filter((name) => name !== SERVICE_WORKER).sort().map((name) => {
  const bytes = readFileSync(join(options.out, name));
  return {path: name, size: bytes.length, sha256: sha256(bytes)};
});
// The build hash covers every file as built (firn-build.json describes the others and has no
// hash of its own in its entry).
const buildHash = sha256(hashFiles().map((f) => `${f.path}\0${f.sha256}\n`).join('')).slice(0, 16);

// The page names its build, and asks for each of its files with ?build=<hash>: the service
// worker refuses a tagged request for another build, so a page can never run a mix of two
// versions, even when a new version takes over while this one is starting.
if (copied.has(INDEX)) {
  let page = readFileSync(indexPath, 'utf8');
  if (!page.includes('<title>')) throw new Error(`${INDEX} has no <title>`);
  page = page.replace('<title>', `<meta name="firn-build" content="${buildHash}">\n<title>`);
  // firn.wasm's size, for the first start's progress line (firn-shell.js).
  if (copied.has('firn.wasm')) {
    const bytes = statSync(join(options.out, 'firn.wasm')).size;
    page = page.replace('<title>', `<meta name="firn-wasm-bytes" content="${bytes}">\n<title>`);
  }
  page = page.replace(/\b(src|href)="([^"/:?#]+)"/g, (whole, attribute, file) =>
    copied.has(file) ? `${attribute}="${file}?build=${buildHash}"` : whole);
  writeFileSync(indexPath, page);
}
const files = hashFiles();
const manifest = {
  version: options.version, label: options.label, build: buildHash,
  files: [...files, {path: BUILD_MANIFEST, size: 0, sha256: ''}]
};
writeFileSync(join(options.out, BUILD_MANIFEST), JSON.stringify(manifest, null, 1) + '\n');

if (copied.has(SERVICE_WORKER)) {
  const workerPath = join(options.out, SERVICE_WORKER);
  const template = readFileSync(workerPath, 'utf8');
  const marker = /\/\*FIRN_BUILD\*\/[^\n]*/;
  if (!marker.test(template)) throw new Error(`${SERVICE_WORKER} has no /*FIRN_BUILD*/ line`);
  const precache = files.map(({path, sha256: hash}) => ({path, sha256: hash}));
  precache.push({path: BUILD_MANIFEST, sha256: sha256(readFileSync(join(options.out, BUILD_MANIFEST)))});
  writeFileSync(workerPath, template.replace(marker,
    `/*FIRN_BUILD*/ const BUILD = ${JSON.stringify({build: buildHash, version: options.version,
      label: options.label, files: precache})};`));
}
const total = files.reduce((sum, f) => sum + f.size, 0);
console.log(`site: ${files.length + 1} files, ${total} bytes, build ${buildHash} in ${options.out}`);
