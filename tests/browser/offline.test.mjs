// Offline page: the service worker precaches the build, an offline reload still computes,
// the site works under a sub-path, and a new build (B) downloads in the background, is
// announced, and takes over completely on the next reload (no old file, old cache gone).
// Every request stays on the page's own origin and the CSP reports no violation.
// Env: FIRN_SITE (built site), FIRN_BIN (native firn), optional FIRN_SITE_B (a second build,
// e.g. configured with -DFIRN_BUILD_LABEL=B; without it the test derives B from FIRN_SITE).
import assert from 'node:assert/strict';
import {execFileSync} from 'node:child_process';
import {copyFileSync, mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {dirname, join} from 'node:path';
import {after, test} from 'node:test';
import {fileURLToPath} from 'node:url';
import {gzipSync} from 'node:zlib';

import {click, launch, pause, press, requiredEnv, screenshotDir, type, waitForApp,
        waitForText} from './browser.mjs';
import {serveSite} from '../../web/serve.mjs';

const site = requiredEnv('FIRN_SITE', 'the built site folder (build/web/site)');
const firn = requiredEnv('FIRN_BIN', 'the native firn executable');
const here = dirname(fileURLToPath(import.meta.url));
const PRESSURE_LABEL = 'Barometric pressure (West 1996)';
const cleanup = [];
after(async () => { for (const step of cleanup.reverse()) await step(); });

const readManifest = (dir) => JSON.parse(readFileSync(join(dir, 'firn-build.json'), 'utf8'));

// Build B: the given second build, or A with a marker in index.html and firn.js, reassembled by
// the same make_site.mjs (so its manifest, hash and service worker are B's own).
function siteB() {
  if (process.env.FIRN_SITE_B) return {dir: process.env.FIRN_SITE_B, marker: null};
  const input = mkdtempSync(join(tmpdir(), 'firn-site-b-in-'));
  const output = mkdtempSync(join(tmpdir(), 'firn-site-b-'));
  cleanup.push(() => rmSync(input, {recursive: true, force: true}));
  cleanup.push(() => rmSync(output, {recursive: true, force: true}));
  for (const name of readdirSync(site)) {
    if (name !== 'firn-build.json') copyFileSync(join(site, name), join(input, name));
  }
  const marker = 'firn-update-test-build-b';
  const index = readFileSync(join(input, 'index.html'), 'utf8');
  writeFileSync(join(input, 'index.html'),
                index.replace('<title>', `<meta name="${marker}" content="B">\n<title>`));
  writeFileSync(join(input, 'firn.js'), readFileSync(join(input, 'firn.js'), 'utf8') +
                `\n// ${marker}\n`);
  const a = readManifest(site);
  execFileSync(process.execPath, [join(here, '../../web/make_site.mjs'), '--out', output,
                                  '--label', 'B', '--version', a.version, input]);
  return {dir: output, marker};
}

// Records every request the browser makes (page and service worker) and every CSP violation.
async function watchContext(context) {
  const requests = [];
  const violations = [];
  context.on('request', (request) => requests.push(request.url()));
  await context.exposeBinding('firnReportCspViolation', (_source, text) => violations.push(text));
  await context.addInitScript(() => {
    document.addEventListener('securitypolicyviolation', (event) => {
      window.firnReportCspViolation(`${event.violatedDirective} blocked ${event.blockedURI}`);
    });
  });
  return {requests, violations};
}

function assertSameOrigin(requests, origin) {
  const foreign = requests.filter((url) => {
    const parsed = new URL(url);
    return parsed.protocol !== 'blob:' && parsed.protocol !== 'data:' && parsed.origin !== origin;
  });
  assert.deepEqual(foreign, [], 'requests to other origins');
}

async function waitForOfflineReady(page) {
  await page.waitForFunction(() => window.firnOffline && (window.firnOffline.state === 'ready' ||
                             window.firnOffline.state === 'failed'), null, {timeout: 60000});
  const state = await page.evaluate(() => window.firnOffline);
  assert.equal(state.state, 'ready', `service worker: ${JSON.stringify(state)}`);
}

async function typeAltitudeAndRead(page, metres) {
  await click(page, 'Altitude');
  await page.keyboard.down('Control');
  await press(page, 'a');
  await page.keyboard.up('Control');
  await press(page, 'Backspace');
  await type(page, String(metres));
  await press(page, 'Enter');
  await waitForText(page, 'Altitude', (t) => t.replace(/\D/g, '').startsWith(String(metres)));
  return waitForText(page, PRESSURE_LABEL, (t) => /hPa$/.test(t));
}

function cliHectopascals(metres) {
  const out = JSON.parse(execFileSync(firn, ['pressure', '--altitude', `${metres}m`, '--json'],
                                      {encoding: 'utf8'}));
  return out.pressure_hpa;
}

test('precache: every file of the build, sizes raw and gzip', () => {
  const manifest = readManifest(site);
  let raw = 0;
  let gzip = 0;
  for (const file of manifest.files) {
    const bytes = readFileSync(join(site, file.path));
    if (file.sha256) assert.equal(file.size, bytes.length, file.path);
    raw += bytes.length;
    gzip += gzipSync(bytes, {level: 9}).length;
  }
  const onDisk = readdirSync(site).filter((name) => name !== 'sw.js').sort();
  assert.deepEqual(manifest.files.map((f) => f.path).sort(), onDisk,
                   'the precache list is exactly the files of the site (sw.js aside)');
  console.log(`precache: ${manifest.files.length} files, ${raw} bytes raw, ${gzip} bytes gzip -9` +
              ` (build ${manifest.build})`);
});

test('under a sub-path: loads online, then an offline reload still computes', async () => {
  const mount = '/teams/north-ridge/firn/';
  const server = await serveSite(site, {mount});
  const browser = await launch();
  cleanup.push(() => server.close());
  cleanup.push(() => browser.close());
  const {page, context} = browser;
  const watched = await watchContext(context);
  await page.goto(server.url);
  await waitForApp(page);
  await waitForOfflineReady(page);
  const registration = await page.evaluate(async () => {
    const r = await navigator.serviceWorker.getRegistration();
    const manifestLink = document.querySelector('link[rel=manifest]').href;
    const manifest = await (await fetch(manifestLink)).json();
    return {scope: r.scope, startUrl: new URL(manifest.start_url, manifestLink).href,
            manifestScope: new URL(manifest.scope, manifestLink).href,
            display: manifest.display, persisted: window.firnOffline.persisted};
  });
  assert.equal(registration.scope, server.url);
  assert.equal(registration.startUrl, server.url);
  assert.equal(registration.manifestScope, server.url);
  assert.equal(registration.display, 'standalone');
  console.log(`storage.persist() granted: ${registration.persisted}`);

  // Cut the network twice over: the browser is offline and the server is gone.
  await context.setOffline(true);
  await server.close();
  await page.reload();
  await waitForApp(page);
  const controlled = await page.evaluate(() => !!navigator.serviceWorker.controller);
  assert.equal(controlled, true, 'the offline page is served by the service worker');
  const shown = await typeAltitudeAndRead(page, 5500);
  const value = Number(shown.replace(/\s*hPa$/, ''));
  assert.ok(Math.abs(value - cliHectopascals(5500)) <= 0.056, `offline page ${shown}`);
  const file = join(screenshotDir(), 'web-offline-5500m.png');
  await page.screenshot({path: file});
  console.log(`screenshot: ${file}`);

  assertSameOrigin(watched.requests, server.origin);
  assert.deepEqual(watched.violations, [], 'CSP violations');
});

test('update A→B: downloads in the background, tells the user, next reload is all B',
     async () => {
  const b = siteB();
  const manifestA = readManifest(site);
  const manifestB = readManifest(b.dir);
  assert.notEqual(manifestA.build, manifestB.build, 'B must differ from A');
  const server = await serveSite(site);
  const browser = await launch();
  cleanup.push(() => server.close());
  cleanup.push(() => browser.close());
  const {page, context} = browser;
  const watched = await watchContext(context);

  await page.goto(server.url);
  await waitForApp(page);
  await waitForOfflineReady(page);
  await page.reload();  // now controlled by A's worker
  await waitForApp(page);
  assert.equal(await page.evaluate(() => !!navigator.serviceWorker.controller), true);

  server.setRoot(b.dir);  // the host now has B
  await page.reload();    // runs A from the cache; the browser finds B's worker
  await waitForApp(page);
  await page.waitForFunction(() => window.firnOffline.updateReady === true, null, {timeout: 60000});
  const notice = await page.evaluate(() => {
    const box = document.getElementById('offline-note');
    return {hidden: box.hidden, text: box.textContent};
  });
  assert.equal(notice.hidden, false);
  assert.match(notice.text, /newer version of Firn/);
  assert.match(notice.text, /next time you open or reload/);
  if (b.marker) {
    assert.equal(await page.evaluate((m) => !!document.querySelector(`meta[name="${m}"]`), b.marker),
                 false, 'still running A until the reload');
  }
  const file = join(screenshotDir(), 'web-update-ready.png');
  await page.screenshot({path: file});
  console.log(`screenshot: ${file}`);
  // B is in charge now, but the page that is running is A and keeps computing ("Later" closes
  // the notice, which covers the top of the screen).
  await page.click('#offline-note button:text("Later")');
  assert.equal(await page.evaluate(() => document.getElementById('offline-note').hidden), true);
  const shown = await typeAltitudeAndRead(page, 4200);
  assert.ok(Math.abs(Number(shown.replace(/\s*hPa$/, '')) - cliHectopascals(4200)) <= 0.056, shown);

  // B took over as soon as it was saved; the next reload runs B from B's cache. The page's
  // own build (a meta tag make_site.mjs writes into index.html) must be B's, not merely the
  // worker's.
  await page.reload();
  await waitForApp(page);
  assert.equal(await page.evaluate(() => window.firnOffline.pageBuild), manifestB.build,
               'the reloaded page is B');
  const check = await page.evaluate(async ([marker, buildA]) => {
    const hex = (buffer) => Array.from(new Uint8Array(buffer),
                                       (x) => x.toString(16).padStart(2, '0')).join('');
    const manifest = await (await fetch('firn-build.json')).json();
    const hashes = {};
    for (const file of manifest.files) {
      if (!file.sha256) continue;
      hashes[file.path] = hex(await crypto.subtle.digest('SHA-256',
                                                         await (await fetch(file.path)).arrayBuffer()));
    }
    // A file asked for by an A page is refused by B's worker: no page can mix the two.
    const stale = await fetch(`firn.wasm?build=${buildA}`);
    return {build: manifest.build, hashes, caches: await caches.keys(), staleStatus: stale.status,
            marker: marker ? !!document.querySelector(`meta[name="${marker}"]`) : null};
  }, [b.marker, manifestA.build]);
  assert.equal(check.staleStatus, 409, 'a request tagged with build A is refused');
  assert.equal(check.build, manifestB.build);
  for (const file of manifestB.files.filter((f) => f.sha256)) {
    assert.equal(check.hashes[file.path], file.sha256, `${file.path} is B's`);
  }
  if (b.marker) assert.equal(check.marker, true, 'the page itself is B');
  assert.deepEqual(check.caches.filter((name) => name.startsWith('firn:')),
                   [`firn:/:${manifestB.build}`], 'only B\'s cache is left');
  console.log(`update: ${manifestA.build} → ${manifestB.build}; caches now ${check.caches.join(', ')}`);

  assertSameOrigin(watched.requests, server.origin);
  assert.deepEqual(watched.violations, [], 'CSP violations');
  await pause(10);
});
