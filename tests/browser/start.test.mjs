// A start that cannot work says so in words (issue 5: "a clear message, not a blank canvas"):
// a browser without WebGL 2, and a calculator (firn.wasm) that does not arrive. Each case runs
// in a fresh profile on a first visit, so no service worker can hide the failure.
// Env: FIRN_SITE (built site folder), FIRN_SCREENSHOTS (output folder).
import assert from 'node:assert/strict';
import {join} from 'node:path';
import {test} from 'node:test';

import {launch, requiredEnv, screenshotDir, waitForApp} from './browser.mjs';
import {serveSite} from '../../web/serve.mjs';

const site = requiredEnv('FIRN_SITE', 'the built site folder (build/web/site)');

async function problemShown(page) {
  await page.waitForFunction(() => window.firnProblem !== undefined, null, {timeout: 30000});
  return page.evaluate(() => {
    const box = document.getElementById('problem');
    return {kind: window.firnProblem, hidden: box.hidden, text: box.textContent,
            canvasHidden: document.getElementById('canvas').hidden,
            loadingHidden: document.getElementById('loading').hidden};
  });
}

async function withPage(setUp, check) {
  const server = await serveSite(site);
  const browser = await launch();
  try {
    await setUp(browser);
    await browser.page.goto(server.url);
    await check(browser.page);
  } finally {
    await browser.close();
    await server.close();
  }
}

test('no WebGL 2: the page says the browser cannot draw Firn and what to try', async () => {
  await withPage(async ({context}) => {
    // A browser (or a policy) that offers no WebGL 2 context at all.
    await context.addInitScript(() => {
      const original = HTMLCanvasElement.prototype.getContext;
      HTMLCanvasElement.prototype.getContext = function (kind, ...rest) {
        return kind === 'webgl2' ? null : original.call(this, kind, ...rest);
      };
    });
  }, async (page) => {
    const shown = await problemShown(page);
    assert.equal(shown.kind, 'webgl');
    assert.equal(shown.hidden, false, 'the message is visible');
    assert.equal(shown.canvasHidden, true, 'no blank canvas left on screen');
    assert.equal(shown.loadingHidden, true, '"starting" is gone');
    assert.match(shown.text, /cannot draw Firn/);
    assert.match(shown.text, /WebGL 2/);
    assert.match(shown.text, /pocket card|command-line/, 'it names a fallback');
    const file = join(screenshotDir(), 'web-start-no-webgl2.png');
    await page.screenshot({path: file});
    console.log(`screenshot: ${file}`);
  });
});

test('the calculator does not arrive: the page says it could not load and what to try',
     async () => {
  await withPage(async ({context}) => {
    // First visit, so the request reaches the network, where it fails.
    await context.route(/firn\.wasm/, (route) => route.abort('connectionfailed'));
  }, async (page) => {
    const shown = await problemShown(page);
    assert.equal(shown.kind, 'wasm');
    assert.equal(shown.hidden, false, 'the message is visible');
    assert.equal(shown.canvasHidden, true, 'no blank canvas left on screen');
    assert.match(shown.text, /could not load/);
    assert.match(shown.text, /connect once and reload/);
    const file = join(screenshotDir(), 'web-start-no-wasm.png');
    await page.screenshot({path: file});
    console.log(`screenshot: ${file}`);
  });
});

test('first start on a slow link: what Firn is, and the calculator\'s download moving', async () => {
  // Issue 12: ~15 s of "starting…" with no sign of life on slow 3G. 750 KB at 200 KB/s.
  await withPage(async ({context, page}) => {
    await context.addInitScript(() => {
      window.firnProgressSeen = [];
      new MutationObserver(() => {
        const line = document.getElementById('loading-progress');
        if (line && !window.firnProgressSeen.includes(line.textContent)) {
          window.firnProgressSeen.push(line.textContent);
        }
      }).observe(document, {subtree: true, childList: true, characterData: true});
    });
    const cdp = await context.newCDPSession(page);
    await cdp.send('Network.enable');
    await cdp.send('Network.emulateNetworkConditions', {
      offline: false, latency: 150, downloadThroughput: 200 * 1024, uploadThroughput: 50 * 1024});
  }, async (page) => {
    await page.waitForFunction(() => /of/.test(document.getElementById('loading-progress').textContent),
                               null, {timeout: 30000});
    const about = await page.evaluate(() => document.getElementById('loading').textContent);
    assert.match(about, /altitude and oxygen field calculator/, 'the page says what Firn is');
    assert.match(about, /works offline/);
    const file = join(screenshotDir(), 'web-start-slow-link.png');
    await page.screenshot({path: file});
    console.log(`screenshot: ${file}`);
    await waitForApp(page, 120000);
    const seen = await page.evaluate(() => window.firnProgressSeen);
    const total = await page.evaluate(() =>
      Math.round(Number(document.querySelector('meta[name="firn-wasm-bytes"]').content) / 1024));
    assert.ok(total > 100, `firn.wasm's size is on the page (${total} KB)`);
    const counts = seen.map((t) => t.match(/^Loading the calculator: ([\d,]+) of ([\d,]+) KB$/))
                       .filter(Boolean);
    assert.ok(counts.length >= 3, `the count moved: ${JSON.stringify(seen)}`);
    const number = (text) => Number(text.replace(/,/g, ''));
    for (const c of counts) assert.equal(number(c[2]), total, 'against the whole calculator');
    const loaded = counts.map((c) => number(c[1]));
    assert.deepEqual(loaded, [...loaded].sort((a, b) => a - b), 'never backwards');
    assert.equal(loaded.at(-1), total, 'it reached the whole size');
    assert.equal(await page.evaluate(() => document.getElementById('loading').hidden), true);
  });
});
