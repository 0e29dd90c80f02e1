// The page in headless Chromium: it starts, the Altitude field takes typed input, the pressure
// it shows matches the CLI (same core, other front end) and a published table value, and an
// idle page draws no frames.
// Env: FIRN_SITE (built site folder), FIRN_BIN (native firn), FIRN_SCREENSHOTS (output folder).
import assert from 'node:assert/strict';
import {execFileSync} from 'node:child_process';
import {join} from 'node:path';
import {after, before, test} from 'node:test';

import {click, launch, pause, press, requiredEnv, screenshotDir, type, waitForApp,
        waitForText} from './browser.mjs';
import {serveSite} from '../../web/serve.mjs';

const site = requiredEnv('FIRN_SITE', 'the built site folder (build/web/site)');
const firn = requiredEnv('FIRN_BIN', 'the native firn executable (for the CLI comparison)');
const PRESSURE_LABEL = 'Barometric pressure (West 1996)';
const HPA_PER_TORR = 1.33322;  // 1 mmHg = 133.322 Pa (BIPM SI brochure, non-SI units table)

let server;
let browser;
before(async () => {
  server = await serveSite(site);
  browser = await launch({viewport: {width: 420, height: 860}, deviceScaleFactor: 2});
  await browser.page.goto(server.url);
  await waitForApp(browser.page);
});
after(async () => {
  await browser?.close();
  await server?.close();
});

function shownHectopascals(text) {
  const match = text.match(/^(-?\d+(?:\.(\d+))?)\s*hPa$/);
  assert.ok(match, `pressure shown as "${text}", expected "<number> hPa"`);
  return {value: Number(match[1]), decimals: match[2]?.length ?? 0};
}

function typeAltitude(page, text) {
  return (async () => {
    await click(page, 'Altitude');
    await page.waitForFunction(() => window.firnWantsText === true, null, {timeout: 3000});
    // Select what is there, then replace it.
    await page.keyboard.down('Control');
    await press(page, 'a');
    await page.keyboard.up('Control');
    await press(page, 'Backspace');
    await type(page, text);
    await press(page, 'Enter');
  })();
}

test('the page is sharp on a HiDPI screen: canvas backing store = CSS size × devicePixelRatio',
     async () => {
  const sizes = await browser.page.evaluate(() => {
    const canvas = document.getElementById('canvas');
    const rect = canvas.getBoundingClientRect();
    return {width: canvas.width, height: canvas.height, cssWidth: rect.width,
            cssHeight: rect.height, ratio: window.devicePixelRatio, appRatio: window.firnPixelRatio};
  });
  assert.equal(sizes.ratio, 2);
  assert.equal(sizes.cssWidth, 420);
  assert.equal(sizes.width, 840);
  assert.equal(sizes.height, Math.round(sizes.cssHeight * 2));
  assert.equal(sizes.appRatio, 2);
});

test('typed altitude: the shown West 1996 pressure equals `firn pressure --json`', async () => {
  const {page} = browser;
  await typeAltitude(page, '4500');
  const shownAltitude = await waitForText(page, 'Altitude', (t) => /^4[\s,.]?500\b/.test(t));
  const shown = shownHectopascals(await waitForText(page, PRESSURE_LABEL, (t) => /hPa$/.test(t)));
  const cli = JSON.parse(execFileSync(firn, ['pressure', '--altitude', '4500m', '--json'],
                                      {encoding: 'utf8'}));
  const cliHpa = cli.pressure_hpa?.value ?? cli.pressure_hpa;
  assert.equal(typeof cliHpa, 'number', `CLI JSON without pressure_hpa: ${JSON.stringify(cli)}`);
  // The page rounds to its shown decimals; the CLI to 2 decimals.
  const tolerance = 0.5 * 10 ** -shown.decimals + 0.006;
  assert.ok(Math.abs(shown.value - cliHpa) <= tolerance,
            `page shows ${shown.value} hPa at ${shownAltitude}, CLI says ${cliHpa} hPa`);
  const file = join(screenshotDir(), 'web-here-4500m.png');
  await page.screenshot({path: file});
  console.log(`screenshot: ${file}`);
});

test('typed 5000 m matches West 1996 table (15° latitude, 5 km: 419 Torr)', async () => {
  // Source: West JB, "Prediction of barometric pressures at high altitudes with the use of
  // model atmospheres", J Appl Physiol 1996;81:1850–1854, table at 15° latitude. The table
  // is in whole Torr and sits 0.6–0.9 Torr below the paper's closed-form fit at 4, 5 and 6 km
  // (rounding down or fit error), so we allow 1 Torr.
  const {page} = browser;
  await typeAltitude(page, '5000');
  await waitForText(page, 'Altitude', (t) => /^5[\s,.]?000\b/.test(t));
  const shown = shownHectopascals(await waitForText(page, PRESSURE_LABEL, (t) => /hPa$/.test(t)));
  const torr = shown.value / HPA_PER_TORR;
  assert.ok(Math.abs(torr - 419) <= 1.0, `5000 m shows ${shown.value} hPa = ${torr.toFixed(2)} Torr`);
});

test('an altitude out of range is refused: the result keeps the last valid altitude',
     async () => {
  // The refusal message itself is plain text, not a test item; this checks no silent number
  // for 12 000 m (outside the field's -500…9000 m) replaces the valid result.
  const {page} = browser;
  const before = await waitForText(page, PRESSURE_LABEL, (t) => /hPa$/.test(t));
  await typeAltitude(page, '12000');
  await pause(300);
  const afterRefusal = await waitForText(page, PRESSURE_LABEL, (t) => /hPa$/.test(t));
  assert.equal(afterRefusal, before);
  const file = join(screenshotDir(), 'web-here-out-of-range.png');
  await page.screenshot({path: file});
  console.log(`screenshot: ${file}`);
});

test('idle page draws nothing: no frames in 3 s without input after settling', async () => {
  const {page} = browser;
  await page.mouse.move(5, 5);
  await pause(1000);  // settle frames run out
  const before = await page.evaluate(() => window.firnFramesDrawn);
  await pause(3000);
  const afterIdle = await page.evaluate(() => window.firnFramesDrawn);
  console.log(`idle: ${afterIdle - before} frames drawn in 3 s (total so far ${afterIdle})`);
  assert.equal(afterIdle - before, 0);
  // And input wakes it again.
  await page.mouse.move(60, 60);
  const woken = await page.waitForFunction((n) => window.firnFramesDrawn > n, afterIdle,
                                           {timeout: 3000}).then(() => true, () => false);
  assert.ok(woken, 'mouse movement should wake the main loop');
});
