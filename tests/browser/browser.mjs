// Shared helpers for the browser tests: Debian's Chromium in headless mode through
// playwright-core (WebGL2 via SwiftShader), a fresh profile per launch, and ImGui widgets found
// by label through window.firnTestItems (framebuffer pixels; divided by devicePixelRatio here).
import assert from 'node:assert/strict';
import {mkdirSync, mkdtempSync, rmSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join} from 'node:path';
import {after, before} from 'node:test';
import {chromium} from 'playwright-core';

import {serveSite} from '../../web/serve.mjs';

export const CHROMIUM = process.env.FIRN_CHROMIUM ?? '/usr/bin/chromium';

export function requiredEnv(name, what) {
  const value = process.env[name];
  assert.ok(value, `set ${name} to ${what}`);
  return value;
}

export function screenshotDir() {
  const dir = process.env.FIRN_SCREENSHOTS ?? join(process.cwd(), 'tests/browser/out');
  mkdirSync(dir, {recursive: true});
  return dir;
}

// WebGL2 through SwiftShader; see DEVELOPERS.md (never --disable-software-rasterizer). The three
// background switches keep a headless page's timers and frames at full rate; playwright-core
// passes them too (chromiumSwitches), named here so they stay if its defaults change. The one
// place for Chromium switches: every launch in tests/ and tests/bench/ uses this list.
export const CHROMIUM_ARGS = ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
                              '--disable-background-networking', '--disable-component-update',
                              '--disable-sync', '--use-gl=angle', '--use-angle=swiftshader',
                              '--enable-unsafe-swiftshader', '--disable-renderer-backgrounding',
                              '--disable-background-timer-throttling',
                              '--disable-backgrounding-occluded-windows'];

// The phone's device scale in the functional passes: 1 by default, where a software-rendered
// frame costs a ninth of dpr 3's (the layout in CSS px is the same). FIRN_PHONE_DPR=3 for the
// look of a real phone (screenshots to look at); the HiDPI and touch tests always use 3.
export const PHONE_DPR = Number(process.env.FIRN_PHONE_DPR ?? 1);

// A persistent context in a new empty profile folder, removed by close().
export async function launch({viewport = {width: 420, height: 860}, deviceScaleFactor = 1,
                              hasTouch = false} = {}) {
  const profile = mkdtempSync(join(tmpdir(), 'firn-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM,
    headless: true,
    viewport, deviceScaleFactor, hasTouch,
    args: CHROMIUM_ARGS
  });
  const page = context.pages()[0] ?? await context.newPage();
  const messages = [];
  page.on('console', (message) => messages.push(`${message.type()}: ${message.text()}`));
  page.on('pageerror', (error) => messages.push(`pageerror: ${error.message}`));
  return {
    context, page, messages,
    async close() {
      await context.close();
      rmSync(profile, {recursive: true, force: true});
    }
  };
}

// Waits until the app has drawn at least one frame with test items, or fails with the page's
// own problem message.
// One browser for several device contexts (phone, laptop): each newContext() has its own empty
// storage, so one launch serves every viewport of a test file.
export async function launchBrowser() {
  return chromium.launch({executablePath: CHROMIUM, headless: true, args: CHROMIUM_ARGS});
}

export async function waitForApp(page, timeout = 60000) {
  await page.waitForFunction(
    () => window.firnProblem || (window.firnStarted && window.firnFramesDrawn > 0 &&
                                 Array.isArray(window.firnTestItems) && window.firnTestItems.length > 0),
    null, {timeout});
  const problem = await page.evaluate(() => window.firnProblem &&
    document.getElementById('problem').textContent);
  assert.equal(problem, undefined, `the page reported a problem: ${problem}`);
}

export async function items(page) {
  return page.evaluate(() => window.firnTestItems ?? []);
}

// The item under `label`, with its rectangle in CSS pixels.
export async function item(page, label) {
  const found = await page.evaluate((wanted) => {
    const entry = (window.firnTestItems ?? []).find((i) => i.label === wanted);
    if (!entry) return null;
    const ratio = window.devicePixelRatio || 1;
    return {...entry, x: entry.x / ratio, y: entry.y / ratio, w: entry.w / ratio, h: entry.h / ratio};
  }, label);
  assert.ok(found, `no item labelled "${label}" in window.firnTestItems`);
  return found;
}

export const pause = (ms) => new Promise((done) => setTimeout(done, ms));

export async function click(page, label) {
  const target = await item(page, label);
  await page.mouse.move(target.x + target.w / 2, target.y + target.h / 2);
  await pause(60);
  await page.mouse.down();
  await pause(60);  // ImGui 1.86 loses a press and release inside one frame
  await page.mouse.up();
  await pause(120);
}

// Presses each key for ~50 ms: ImGui 1.86 has no event queue and loses a down+up in one frame.
export async function press(page, key, holdMs = 50) {
  await page.keyboard.down(key);
  await pause(holdMs);
  await page.keyboard.up(key);
  await pause(holdMs);
}

export async function type(page, text) {
  for (const character of text) await press(page, character);
}

// Waits until the item's shown text satisfies `predicate`; returns the text.
export async function waitForText(page, label, predicate, timeout = 5000) {
  const end = Date.now() + timeout;
  let last;
  while (Date.now() < end) {
    last = (await page.evaluate((wanted) =>
      (window.firnTestItems ?? []).find((i) => i.label === wanted)?.text, label));
    if (last !== undefined && predicate(last)) return last;
    await pause(50);
  }
  assert.fail(`"${label}" still shows ${JSON.stringify(last)} after ${timeout} ms`);
}

// A page's widgets by label (window.firnTestItems, framebuffer pixels → CSS px here): looked up,
// waited for, and the frames the page draws counted. Phone and Driver (driver.mjs) build on it.
export class LabelledPage {
  constructor(page, name = 'page') { Object.assign(this, {page, name}); }

  async items() {
    return this.page.evaluate(() => {
      const ratio = window.devicePixelRatio || 1;
      return (window.firnTestItems ?? []).map((i) => ({...i, x: i.x / ratio, y: i.y / ratio,
                                                        w: i.w / ratio, h: i.h / ratio}));
    });
  }
  async find(label) { return (await this.items()).find((i) => i.label === label); }
  async item(label, timeout = 3000) {
    const end = Date.now() + timeout;
    for (;;) {
      const found = await this.find(label);
      if (found) return found;
      if (Date.now() > end) {
        assert.fail(`${this.name}: no item "${label}"; items: ${(await this.items()).map((i) => i.label).join(', ')}`);
      }
      await pause(50);
    }
  }
  async text(label) { return (await this.item(label)).text; }
  async waitText(label, predicate, timeout = 4000) {
    const end = Date.now() + timeout;
    let last;
    while (Date.now() < end) {
      last = (await this.find(label))?.text;
      if (last !== undefined && predicate(last)) return last;
      await pause(50);
    }
    assert.fail(`${this.name}: "${label}" shows ${JSON.stringify(last)} after ${timeout} ms`);
  }
  // Waits until `count` more frames have been drawn (or the page went idle without them).
  async framesPass(count, timeout = 3000) {
    const frames = () => this.page.evaluate(() => window.firnFramesDrawn ?? 0);
    const start = await frames();
    const end = Date.now() + timeout;
    while ((await frames()) < start + count && Date.now() < end) await pause(20);
  }
  // The content area ends at the navigation bar (always on screen, at the bottom).
  async navBottom() {
    const nav = (await this.items()).filter((i) => i.label === 'Here' || i.label === 'Settings');
    assert.ok(nav.length > 0, `${this.name}: no navigation bar`);
    return Math.min(...nav.map((i) => i.y));
  }
}

// A phone page driven by real touches (CDP Input.dispatchTouchEvent, as on a phone; the page
// shell turns them into mouse events), with items in CSS px. `cdp`: page.context().newCDPSession.
export class Phone extends LabelledPage {
  constructor(page, cdp) {
    super(page, 'phone');
    Object.assign(this, {cdp, dragMs: []});
  }

  // A thumb drag from (x, y) by dy CSS px (and dx sideways): `steps` moves, `stepMs` apart (0:
  // a flick whose moves all land within one frame).
  async drag(x, y, dy, {steps = 8, stepMs = 40, dx = 0} = {}) {
    const began = Date.now();
    const at = (k) => [{x: x + (dx * k) / steps, y: y + (dy * k) / steps}];
    await this.cdp.send('Input.dispatchTouchEvent', {type: 'touchStart', touchPoints: at(0)});
    for (let k = 1; k <= steps; ++k) {
      if (stepMs) await pause(stepMs);
      await this.cdp.send('Input.dispatchTouchEvent', {type: 'touchMove', touchPoints: at(k)});
    }
    await this.cdp.send('Input.dispatchTouchEvent', {type: 'touchEnd', touchPoints: []});
    await this.framesPass(3);
    await pause(100);
    this.dragMs.push(Date.now() - began);
  }

  async tap(label) {
    const target = await this.item(label);
    await this.page.touchscreen.tap(target.x + target.w / 2, target.y + target.h / 2);
    await this.framesPass(2);
    await pause(80);
  }

  // Scrolls (by dragging from the column's left edge) until `label` is well inside the content
  // area, away from its edges; stops when a drag no longer moves it (the end of the page).
  async centre(label) {
    let target = await this.item(label);
    // The Oxygen screen with its plan runs to ~7 screen heights at 390×844: 12 drags reach its end.
    for (let attempt = 0; attempt < 12; ++attempt) {
      const bottom = await this.navBottom();
      const middle = target.y + target.h / 2;
      if (middle > bottom * 0.2 && middle < bottom * 0.8) return target;
      const offset = middle - bottom / 2;
      const dy = -Math.sign(offset) * Math.min(Math.abs(offset), bottom * 0.4);
      // Maybe over a control: a drag never fires one (that is what these tests check). A quick
      // drag (4 moves, 16 ms apart): the slow, many-move drag is touch.test.mjs's own subject.
      await this.drag(14, dy < 0 ? bottom * 0.8 : bottom * 0.2, dy, {steps: 4, stepMs: 16});
      const moved = await this.item(label);
      if (Math.abs(moved.y - target.y) < 1) return moved;
      target = moved;
    }
    return target;
  }

  async screen(name) {
    await this.tap(name);
    await this.waitText(name, (t) => t === 'selected');
  }

  async enter(field, keys) {
    await this.tap(field);
    await this.item('Keypad value');
    for (const c of keys) await this.tap(`Key ${c}`);
    await this.tap('Key OK');
  }
}

// A new phone-sized context (its own empty storage) on `url`, started, driven by touch.
// `initScript` runs in the page before its own scripts (record.test.mjs: the page's clock).
export async function openPhone(browser, url, options, {initScript} = {}) {
  const context = await browser.newContext(options);
  if (initScript) await context.addInitScript(initScript);
  const page = await context.newPage();
  await page.goto(url);
  await waitForApp(page);
  return new Phone(page, await context.newCDPSession(page));
}

// One static server for the site and one Chromium per test file, started before its tests and
// closed after them (then `cleanup`, if given). Read .server and .browser inside the tests.
export function siteAndBrowser(site, {cleanup} = {}) {
  const shared = {server: null, browser: null};
  before(async () => {
    shared.server = await serveSite(site);
    shared.browser = await launchBrowser();
  });
  after(async () => {
    await shared.browser?.close();
    await shared.server?.close();
    cleanup?.();
  });
  return shared;
}
