// A phone held sideways (844×390 CSS px, touch): the navigation bar is one row and leaves the
// screen to the figures (issue 12: the two-row bar took a third of a landscape phone), every
// screen is reachable, and day and night screenshots are written for a look.
// Env: FIRN_SITE (built site folder), FIRN_SCREENSHOTS (output folder).
import assert from 'node:assert/strict';
import {readFileSync} from 'node:fs';
import {join} from 'node:path';
import {after, before, test} from 'node:test';

import {click, items, launch, requiredEnv, screenshotDir, waitForApp,
        waitForText} from './browser.mjs';
import {serveSite} from '../../web/serve.mjs';

const site = requiredEnv('FIRN_SITE', 'the built site folder (build/web/site)');
const VIEWPORT = {width: 844, height: 390};
// The bar's labels from their one table (kScreenNames in core/ui/app_state.hpp).
const SCREENS = [...readFileSync(new URL('../../core/ui/app_state.hpp', import.meta.url), 'utf8')
  .matchAll(/\{Screen::\w+, "[a-z]+", "([^"]+)"\}/g)].map((m) => m[1]);

let server;
let browser;
before(async () => {
  assert.ok(SCREENS.length >= 11, `screen labels read from app_state.hpp: ${SCREENS}`);
  server = await serveSite(site);
  browser = await launch({viewport: VIEWPORT, deviceScaleFactor: 1, hasTouch: true});
  await browser.page.goto(server.url);
  await waitForApp(browser.page);
});
after(async () => {
  await browser?.close();
  await server?.close();
});

async function navItems() {
  const all = await items(browser.page);
  return SCREENS.map((label) => {
    const found = all.find((i) => i.label === label);
    assert.ok(found, `the bar has "${label}"`);
    return found;
  });
}

// Scrolls the page (mouse wheel) until the item is inside the window above the bar.
async function bringIntoView(label) {
  for (let i = 0; i < 20; ++i) {
    const found = (await items(browser.page)).find((it) => it.label === label);
    if (found && found.y >= 0 && found.y + found.h <= VIEWPORT.height * 0.75) return;
    await browser.page.mouse.move(VIEWPORT.width / 2, VIEWPORT.height / 3);
    await browser.page.mouse.wheel(0, found && found.y < 0 ? -120 : 120);
    await new Promise((done) => setTimeout(done, 150));
  }
  assert.fail(`"${label}" never came into view`);
}

async function setTheme(label) {
  await goTo('Settings');
  await bringIntoView(label);
  await click(browser.page, label);
  await waitForText(browser.page, label, (t) => t === 'selected');
}

async function goTo(label) {
  await click(browser.page, label);
  await waitForText(browser.page, label, (t) => t === 'selected');
}

test('landscape phone: the bar is one row, at most a fifth of the height', async () => {
  const bar = await navItems();
  const top = Math.min(...bar.map((i) => i.y));
  assert.ok(bar.every((i) => Math.abs(i.y - top) < 1), `one row: ${bar.map((i) => i.y)}`);
  const bottom = Math.max(...bar.map((i) => i.y + i.h));
  assert.ok(bottom <= VIEWPORT.height + 1, 'the bar is on screen');
  assert.ok(VIEWPORT.height - top <= VIEWPORT.height / 5,
            `the bar takes ${VIEWPORT.height - top} of ${VIEWPORT.height} px`);
  // Touch targets stay at least 44 CSS px high (common practice for touch; WCAG 2.1 SC 2.5.5).
  assert.ok(bar.every((i) => i.h >= 44), `bar buttons ${bar.map((i) => i.h)} px high`);
});

test('landscape phone: every screen is reachable; day and night screenshots', async () => {
  for (const label of SCREENS) {
    await goTo(label);
    const file = join(screenshotDir(), `landscape-${label.toLowerCase()}.png`);
    await browser.page.screenshot({path: file});
  }
  // The "works offline now" notice (first visit) would cover the top of the page.
  const notice = browser.page.locator('#offline-note button');
  if (await notice.count() > 0 && await notice.first().isVisible()) await notice.first().click();
  await setTheme('Night');
  for (const label of ['Here', 'Casualty', 'Oxygen']) {
    await goTo(label);
    const png = await browser.page.screenshot({path: join(screenshotDir(), `landscape-${label.toLowerCase()}-night.png`)});
    // A theme change rebuilds the font atlas and its texture. A canvas left blank by a lost
    // texture compresses to a few KB (seen while changing the upload); a drawn screen is 40 KB+.
    assert.ok(png.length > 15000, `${label} at night: a ${png.length}-byte screenshot is a blank canvas`);
  }
  await setTheme('Day');
  console.log(`landscape screenshots in ${screenshotDir()}`);
});
