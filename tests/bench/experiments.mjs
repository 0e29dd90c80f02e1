// Size experiments for tests/bench/compare.sh, in the benchmark's own build folders: Firn's page
// and the baseline relinked with candidate link flags (relink.sh; the baseline gets the same
// flags, so the ratio stays like for like), each Firn variant checked to start in headless
// Chromium; and a leaner subset of the bold font (pyftsubset, no build). Prints figures.
// Usage: node experiments.mjs FIRN_WEB_BUILD BARE_BUILD
import {execFileSync} from 'node:child_process';
import {existsSync, mkdirSync, readdirSync, readFileSync, statSync} from 'node:fs';
import {dirname, join, resolve} from 'node:path';
import {fileURLToPath} from 'node:url';

import {launch, pause} from '../browser/browser.mjs';
import {serveSite} from '../../web/serve.mjs';

const here = dirname(fileURLToPath(import.meta.url));
const root = resolve(here, '../..');
const [webBuild, bareBuild] = process.argv.slice(2).map((p) => resolve(p));
const out = join(root, 'build/bench-experiments');
const kb = (bytes) => (bytes / 1000).toFixed(1);
const gzipSize = (file) => execFileSync('gzip', ['-9c', file], {maxBuffer: 1 << 28}).length;
const siteGzip = (site) => readdirSync(site).reduce((sum, name) => sum + gzipSize(join(site, name)), 0);

// The closure compiler Debian's emscripten 3.1.6 works with, pinned, from npm, in build/.
function closureCompiler() {
  const tools = join(root, 'build/bench-tools');
  const bin = join(tools, 'node_modules/.bin/google-closure-compiler');
  if (!existsSync(bin)) {
    try {
      mkdirSync(tools, {recursive: true});
      execFileSync('npm', ['install', '--prefix', tools, '--no-audit', '--no-fund', '--no-save',
                           '--loglevel=error', 'google-closure-compiler@20220104.0.0'], {stdio: 'ignore'});
    } catch {
      return null;
    }
  }
  return existsSync(bin) ? bin : null;
}

function relink(build, target, name, flags, env = {}) {
  const dir = join(out, name);
  execFileSync(join(here, 'relink.sh'), [build, target, dir, ...flags],
               {stdio: ['ignore', 'ignore', 'pipe'], env: {...process.env, ...env}});
  return {js: join(dir, `${target}.js`), wasm: join(dir, `${target}.wasm`)};
}

// Firn's site with the variant's firn.js/wasm, assembled as the build does (make_site.mjs).
function firnSite(name, files) {
  const site = join(out, name, 'site');
  const built = join(webBuild, 'site');
  const icons = readdirSync(built).filter((f) => /^icon.*\.(png|svg)$/.test(f)).map((f) => join(built, f));
  execFileSync('node', [join(root, 'web/make_site.mjs'), '--out', site, '--version', 'experiment',
                        join(root, 'web/shell'), files.js, files.wasm, ...icons], {stdio: 'ignore'});
  return site;
}

// Does the page start: a first frame with test items, a screen change by label, no console error.
async function starts(site) {
  const server = await serveSite(site);
  const session = await launch({viewport: {width: 1280, height: 720}});
  try {
    await session.page.goto(server.url);
    await session.page.waitForFunction(() => window.firnProblem ||
      (window.firnFramesDrawn > 0 && (window.firnTestItems ?? []).length > 0), null, {timeout: 30000});
    const target = await session.page.evaluate(() =>
      (window.firnTestItems ?? []).find((i) => i.label === 'Settings'));
    if (!target) return 'no "Settings" item: the page-facing names did not survive';
    await session.page.mouse.move(target.x + target.w / 2, target.y + target.h / 2);
    await session.page.mouse.down();
    await pause(80);
    await session.page.mouse.up();
    await pause(500);
    const shown = await session.page.evaluate(() =>
      (window.firnTestItems ?? []).find((i) => i.label === 'Settings')?.text);
    const errors = session.messages.filter((m) => /^(error|pageerror)/.test(m) &&
                                                  !m.includes('Failed to load resource'));
    if (shown !== 'selected') return `tap on "Settings" did not select it (${shown})`;
    return errors.length ? `console error: ${errors[0].slice(0, 120)}` : 'yes';
  } catch (error) {
    return `no: ${String(error.message).split('\n')[0].slice(0, 120)}`;
  } finally {
    await session.close();
    await server.close();
  }
}

const firnTotal = siteGzip(join(webBuild, 'site'));
const bareTotal = siteGzip(join(bareBuild, 'site'));
const firnFiles = {js: join(webBuild, 'site/firn.js'), wasm: join(webBuild, 'site/firn.wasm')};
const bareFiles = {js: join(bareBuild, 'site/bare.js'), wasm: join(bareBuild, 'site/bare.wasm')};
const reference = {firn: {js: gzipSize(firnFiles.js), wasm: gzipSize(firnFiles.wasm)},
                   bare: {js: gzipSize(bareFiles.js), wasm: gzipSize(bareFiles.wasm)}};

const closure = closureCompiler();
// emmalloc is in web/flags.cmake since issue 17. Firn's site ships firn.js through terser
// (web/minify_js.cjs), so the closure row compares closure's glue with terser's.
const variants = [
  ['--closure 1', ['--closure', '1'], true],
];
console.log('link flags added to both (gzip KB)  Firn js   wasm  site total   bare js   wasm  total   ratio  Firn page starts');
const row = (label, f, b, fTotal, bTotal, verdict) => console.log(
  `${label.padEnd(35)} ${kb(f.js).padStart(7)} ${kb(f.wasm).padStart(6)} ${kb(fTotal).padStart(11)}   ` +
  `${kb(b.js).padStart(7)} ${kb(b.wasm).padStart(6)} ${kb(bTotal).padStart(6)}   ${(fTotal / bTotal).toFixed(2).padStart(5)}  ${verdict}`);
row('(as built)', reference.firn, reference.bare, firnTotal, bareTotal, 'yes (section 2)');
for (const [label, flags, needsClosure] of variants) {
  if (needsClosure && !closure) {
    console.log(`${label.padEnd(35)} skipped: google-closure-compiler@20220104.0.0 could not be installed from npm`);
    continue;
  }
  const env = needsClosure ? {EM_CLOSURE_COMPILER: closure} : {};
  const slug = label.replace(/[^a-z0-9]+/gi, '-').replace(/^-|-$/g, '');
  try {
    const firn = relink(webBuild, 'firn', `firn-${slug}`, flags, env);
    const bare = relink(bareBuild, 'bare', `bare-${slug}`, flags, env);
    const f = {js: gzipSize(firn.js), wasm: gzipSize(firn.wasm)};
    const b = {js: gzipSize(bare.js), wasm: gzipSize(bare.wasm)};
    const fTotal = firnTotal - reference.firn.js - reference.firn.wasm + f.js + f.wasm;
    const bTotal = bareTotal - reference.bare.js - reference.bare.wasm + b.js + b.wasm;
    // Closure renames properties it cannot see used elsewhere, page-facing ones included.
    const verdict = readFileSync(firn.js, 'utf8').includes('firnFramesDrawn')
      ? await starts(firnSite(`firn-${slug}`, firn))
      : 'no: window.firnFramesDrawn etc. were renamed (EM_JS code in web/web_platform.cpp)';
    row(label, f, b, fTotal, bTotal, verdict);
  } catch (error) {
    console.log(`${label.padEnd(35)} link failed: ${String(error.stderr ?? error.message).split('\n')[0].slice(0, 100)}`);
  }
}

// The baseline keeps Emscripten's file system (web/flags.cmake says why); with it dropped too,
// which stops the example at its first imgui.ini save, the ratio would be:
try {
  const bare = relink(bareBuild, 'bare', 'bare-no-filesystem', ['-sFILESYSTEM=0']);
  const bTotal = bareTotal - reference.bare.js - reference.bare.wasm + gzipSize(bare.js) + gzipSize(bare.wasm);
  console.log(`baseline also with -sFILESYSTEM=0 (not runnable): total ${kb(bTotal)} KB gzip, ` +
              `Firn as built ${(firnTotal / bTotal).toFixed(2)} × that`);
} catch (error) {
  console.log(`baseline with -sFILESYSTEM=0: link failed (${String(error.message).split('\n')[0]})`);
}

// Fonts: the subset the build makes (assets/CMakeLists.txt: its ranges and options) against a
// leaner bold face. Bold shows results and keypad values, whose digits, units and signs are all in
// Latin-1; Latin Extended-A and Greek would then fall back to "?" in large type.
const assetsCmake = readFileSync(join(root, 'assets/CMakeLists.txt'), 'utf8');
const unicodes = assetsCmake.match(/set\(FIRN_FONT_UNICODES "([^"]+)"\)/)?.[1];
const builtFonts = ['firn-regular.ttf', 'firn-bold.ttf'].map((f) => join(webBuild, 'assets/generated', f));
if (unicodes && builtFonts.every(existsSync)) {
  const options = ['--no-hinting', '--desubroutinize', '--drop-tables+=GPOS,GSUB,GDEF,kern,MATH'];
  const boldRanges = unicodes.split(',').filter((r) => !/^U\+0100|^U\+0391/.test(r)).join(',');
  const file = join(out, 'fonts', 'bold-latin1.ttf');
  mkdirSync(dirname(file), {recursive: true});
  execFileSync('pyftsubset', ['/usr/share/fonts/truetype/dejavu/DejaVuSans-Bold.ttf', `--unicodes=${boldRanges}`,
                              `--output-file=${file}`, ...options], {stdio: 'ignore'});
  console.log('\nembedded fonts (KB raw / gzip)          regular          bold     both gzip');
  const fontRow = (label, files) => {
    const sizes = files.map((f) => [statSync(f).size, gzipSize(f)]);
    console.log(`${label.padEnd(38)} ${sizes.map(([r, g]) => `${kb(r).padStart(6)} / ${kb(g).padStart(5)}`).join('  ')}` +
                `  ${kb(sizes[0][1] + sizes[1][1]).padStart(8)}`);
  };
  fontRow('as built (assets/CMakeLists.txt)', builtFonts);
  fontRow('bold without Latin Ext-A and Greek', [builtFonts[0], file]);
} else {
  console.log('\nfont experiment skipped: no FIRN_FONT_UNICODES or no subset fonts in the build');
}
