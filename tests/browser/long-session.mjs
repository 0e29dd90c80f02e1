// A seeded random session on a phone-sized page (taps on whatever labelled widget is on screen,
// screen changes, unit and theme switches, keypad and keyboard entry, thumb scrolls), replayable
// from its seed. At the end: no console error, no page error, no wasm trap (the page still draws
// and shows no problem), and the app's heap in use within 10 % of what it was after the first 100
// interactions (both read in the same state: Day theme, Here screen; the font atlas on the heap
// follows the theme).
//   ctest browser_session: 150 steps, seed 1 (every test run)
//   ./firn.sh soak:        2,000 steps, a random seed (printed)
// Env: FIRN_SITE (built site); FIRN_SESSION_STEPS (default 300); FIRN_SESSION_SEED (default:
// random, printed); FIRN_SCREENSHOTS (the last screen is saved there).
import assert from 'node:assert/strict';
import {readFileSync} from 'node:fs';
import {cpus, loadavg} from 'node:os';
import {join} from 'node:path';
import {test} from 'node:test';

import {launchBrowser, pause, requiredEnv, screenshotDir, waitForApp} from './browser.mjs';
import {serveSite} from '../../web/serve.mjs';

const site = requiredEnv('FIRN_SITE', 'the built site folder (build/web/site)');
const STEPS = Number(process.env.FIRN_SESSION_STEPS ?? 300);
const SEED = Number(process.env.FIRN_SESSION_SEED ?? Math.floor(Math.random() * 2 ** 31));
const BASELINE_STEP = 100;
const HEAP_TOLERANCE = 0.10;  // issue 7: heap at the end within 10 % of after the first 100
assert.ok(STEPS > BASELINE_STEP, `FIRN_SESSION_STEPS must be over ${BASELINE_STEP} (the heap baseline)`);

// The bar's labels from their one table (kScreenNames in core/ui/app_state.hpp).
const NAV = [...readFileSync(new URL('../../core/ui/app_state.hpp', import.meta.url), 'utf8')
  .matchAll(/\{Screen::\w+, "[a-z]+", "([^"]+)"\}/g)].map((m) => m[1]);
if (NAV.length < 11) throw new Error(`screen labels not found in app_state.hpp: ${NAV}`);
const UNITS = ['m', 'ft', 'hPa', 'mmHg', 'kPa', 'inHg', 'bar', 'psi', '°C', '°F'];
const THEMES = ['Day', 'Night', 'Projector'];
// These leave the canvas (print dialogue, download, file picker): covered by profile.test.mjs
// and route.test.mjs.
const LEAVES_THE_PAGE = new Set(['Print pocket card', 'Import profile', 'Export profile',
                                 'Load a route file', 'Save as a route file']);
const KEYS = ['0', '1', '2', '3', '4', '5', '6', '7', '8', '9', '.', '-', 'Backspace', 'Enter',
              'Escape', 'Tab'];

// mulberry32: a small seeded generator, enough to pick actions reproducibly.
function generator(seed) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

// A headless Chromium now and then falls into a state where the page runs ~2 s per step with the
// CPU idle (docs/measurements.md). Such a run fails at once with a message instead of crawling
// until a timeout: a step over STEP_LIMIT_MS, or any STALL_WINDOW steps over STALL_WINDOW_MS
// (50 steps take 6–7 s on a quiet machine, ~15 s with both cores busy compiling).
// The stall this catches leaves the CPU idle; on a machine busy with other work (load average
// over the core count) the limits stretch by load / cores, so contention is not called a stall.
const STEP_LIMIT_MS = 10000;
const STALL_WINDOW = 50;
const STALL_WINDOW_MS = 30000;
const SLOW_STEP_MS = 3000;    // steps slower than this are listed at the end
const slowdown = () => Math.max(1, loadavg()[0] / cpus().length);

const stalled = (what) => new Error(
  `${what} (seed ${SEED}): the headless browser stalled; see "Build and test times" in ` +
  'docs/measurements.md. Replay with FIRN_SESSION_SEED.');

// What a stalled page looks like from inside, for the failure message: is it hidden or
// unfocused, and how often do animation frames and 10 ms timers run in one second?
async function diagnosis(page) {
  const probe = page.evaluate(() => new Promise((done) => {
    let frames = 0, timers = 0;
    const start = performance.now();
    const frame = () => { ++frames; if (performance.now() - start < 1000) requestAnimationFrame(frame); };
    const timer = () => { ++timers; if (performance.now() - start < 1000) setTimeout(timer, 10); };
    requestAnimationFrame(frame);
    setTimeout(timer, 10);
    setTimeout(() => done({visibility: document.visibilityState, focus: document.hasFocus(),
                           framesPerSecond: frames, timersPerSecond: timers,
                           appFrames: window.firnFramesDrawn}), 1000);
  }));
  const limit = new Promise((done) => setTimeout(() => done('no answer in 5 s'), 5000));
  return JSON.stringify(await Promise.race([probe, limit]).catch((error) => error.message));
}

// The action, or a failure once it has taken `ms`.
async function within(ms, promise, what) {
  let timer;
  const limit = new Promise((_, fail) => { timer = setTimeout(() => fail(stalled(what)), ms); });
  try {
    return await Promise.race([promise, limit]);
  } finally {
    clearTimeout(timer);
  }
}

test(`browser session: ${STEPS} random interactions, no error, heap level`, async () => {
  await runSession();
});

async function runSession() {
  const random = generator(SEED);
  const pick = (list) => list[Math.floor(random() * list.length)];
  console.log(`seed ${SEED} (replay: FIRN_SESSION_SEED=${SEED})`);

  const server = await serveSite(site);
  const browser = await launchBrowser();
  const viewport = {width: 390, height: 844};
  const context = await browser.newContext({viewport, deviceScaleFactor: 1, hasTouch: true,
                                            isMobile: true});
  const page = await context.newPage();
  // A document the app opens (team reference sheet, handover) is a new window, and while it is
  // open headless Chromium gives the app's page about one animation frame a second (measured:
  // 2 frames in 2 s against 120, timers unchanged, the page "visible" and focused): every step
  // then waits on frames. This was the long-session stall (docs/measurements.md). Close it.
  context.on('page', (opened) => { if (opened !== page) opened.close().catch(() => {}); });
  const errors = [];
  page.on('console', (message) => {
    if (message.type() === 'error') errors.push(`console: ${message.text()}`);
  });
  page.on('pageerror', (error) => errors.push(`pageerror: ${error.message}`));

  try {
    await page.goto(server.url);
    await waitForApp(page);

    const frames = () => page.evaluate(() => window.firnFramesDrawn || 0);
    // Every touch wakes the paused loop; two more frames let ImGui take press and release.
    const settle = async (before) => {
      await page.waitForFunction((n) => (window.firnFramesDrawn || 0) >= n, before + 2,
                                 {timeout: 10000});
    };
    // One round trip: a labelled item fully on screen (by label, or the r-th of them), and the
    // frame count to wait past.
    const findOnScreen = (label, r) => page.evaluate(([wanted, pickAt, width, height, leaving]) => {
      const shown = (window.firnTestItems ?? []).filter((i) =>
        i.w > 0 && i.h > 0 && i.x >= 0 && i.y >= 0 && i.x + i.w <= width && i.y + i.h <= height &&
        !leaving.includes(i.label));
      const target = wanted !== null ? shown.find((i) => i.label === wanted)
                                     : shown[Math.floor(pickAt * shown.length)];
      return {target, frames: window.firnFramesDrawn || 0};
    }, [label, r, viewport.width, viewport.height, [...LEAVES_THE_PAGE]]);
    // Touches are made in the page as DOM TouchEvents on the canvas, the events the page shell
    // turns into ImGui input. Through CDP (Input.dispatchTouchEvent, what touchscreen.tap uses),
    // a headless Chromium now and then fell into a state where every touch waited 2 s for its
    // ack with the renderer idle (strace of a stuck run): 2,000 steps then overran the ctest
    // timeout. Real browser taps are covered by the `browser` layer.
    const touch = (type, x, y) => page.evaluate(([kind, cx, cy]) => {
      const canvas = document.getElementById('canvas');
      const point = new Touch({identifier: 1, target: canvas, clientX: cx, clientY: cy,
                               screenX: cx, screenY: cy});
      const down = kind !== 'touchend';
      canvas.dispatchEvent(new TouchEvent(kind, {
        bubbles: true, cancelable: true, composed: true, touches: down ? [point] : [],
        targetTouches: down ? [point] : [], changedTouches: [point]}));
    }, [type, x, y]);
    const tapFound = async ({target, frames: before}) => {
      if (!target) return false;
      const x = target.x + target.w / 2, y = target.y + target.h / 2;
      await touch('touchstart', x, y);
      await touch('touchend', x, y);
      await settle(before);
      return true;
    };
    const tapLabel = async (label) => tapFound(await findOnScreen(label, 0));
    const goTo = async (screen) => { await tapLabel(screen); };
    // A tapped option shows "selected" a frame or two after the frames `settle` waits for.
    const selectedSoon = async (label) => {
      try {
        await page.waitForFunction((wanted) => (window.firnTestItems ?? [])
          .find((i) => i.label === wanted)?.text === 'selected', label, {timeout: 2000});
        return true;
      } catch {
        return false;
      }
    };

    // The state both heap readings are taken in: Day theme, the Here screen, settled. The
    // font atlas lives on the heap and its size follows the theme, so only like is compared
    // with like.
    const canonicalHeap = async () => {
      const selected = (label) => page.evaluate((wanted) =>
        (window.firnTestItems ?? []).find((i) => i.label === wanted)?.text === 'selected', label);
      let day = false;
      for (let attempt = 0; attempt < 5; ++attempt) {
        if (await page.evaluate(() => window.firnWantsText)) {  // the keypad covers the bar
          const before = await frames();
          await page.keyboard.down('Escape');
          await pause(40);
          await page.keyboard.up('Escape');
          await settle(before);
        }
        await goTo('Settings');
        await selectedSoon('Settings');
        if (!(await selected('Day'))) await tapLabel('Day');
        day = await selectedSoon('Day');
        await goTo('Here');
        if (day && (await selectedSoon('Here')) && !(await page.evaluate(() => window.firnWantsText))) break;
      }
      if (!day || !(await selected('Here'))) {
        const file = join(screenshotDir(), 'web-long-session-stuck.png');
        await page.screenshot({path: file});
        const labels = await page.evaluate(() => (window.firnTestItems ?? []).map((i) => i.label));
        assert.fail(`could not get back to Day theme + Here screen (seed ${SEED}); ` +
                    `screenshot ${file}; items: ${labels.join(', ')}`);
      }
      await pause(300);
      return page.evaluate(() => ({
        inUse: Module._firn_heap_in_use(), memory: Module.HEAP8.length,
        js: performance.memory ? performance.memory.usedJSHeapSize : null
      }));
    };

    const counts = {};
    const actions = {
      // Whatever labelled widget is fully on screen, as a curious thumb would.
      async tapAnything() { await tapFound(await findOnScreen(null, random())); },
      async changeScreen() { await goTo(pick(NAV)); },
      async switchUnit() {
        await goTo('Settings');
        await tapLabel(pick(UNITS));
      },
      async switchTheme() {
        await goTo('Settings');
        await tapLabel(pick(THEMES));
      },
      async pressKey() {
        const before = await frames();
        const key = pick(KEYS);
        await page.keyboard.down(key);
        await pause(40);  // ImGui 1.86 loses a key that goes down and up inside one frame
        await page.keyboard.up(key);
        await settle(before);
      },
      async scroll() {
        const x = 40 + random() * (viewport.width - 80);
        const y = 200 + random() * 400;
        const dy = (random() - 0.5) * 600;
        const before = await frames();
        await touch('touchstart', x, y);
        for (let k = 1; k <= 4; ++k) {
          await pause(30);
          await touch('touchmove', x, y - (dy * k) / 4);
        }
        await touch('touchend', x, y - dy);
        await settle(before);
      }
    };
    const weighted = [['tapAnything', 55], ['changeScreen', 14], ['switchUnit', 8],
                      ['switchTheme', 5], ['pressKey', 12], ['scroll', 6]];
    const total = weighted.reduce((sum, [, w]) => sum + w, 0);
    const chooseAction = () => {
      let r = random() * total;
      for (const [name, weight] of weighted) if ((r -= weight) < 0) return name;
      return weighted[0][0];
    };

    let baseline = null;
    const started = Date.now();
    let windowStarted = started;
    const slowSteps = [];
    for (let step = 1; step <= STEPS; ++step) {
      const name = chooseAction();
      counts[name] = (counts[name] ?? 0) + 1;
      const stepStarted = Date.now();
      try {
        const limit = Math.round(STEP_LIMIT_MS * slowdown());
        await within(limit, actions[name](), `took over ${limit} ms`);
      } catch (error) {
        throw new Error(`step ${step} (${name}, seed ${SEED}): ${error.message}; page: ` +
                        `${await diagnosis(page)}`);
      }
      assert.deepEqual(errors, [], `errors by step ${step} (seed ${SEED})`);
      const stepMs = Date.now() - stepStarted;
      if (stepMs > SLOW_STEP_MS) slowSteps.push(`${step} ${name} ${stepMs} ms`);
      if (process.env.FIRN_SESSION_TRACE) console.log(`${step} ${name} ${Date.now() - started}`);
      if (step % STALL_WINDOW === 0) {
        const windowMs = Date.now() - windowStarted;
        const limit = Math.round(STALL_WINDOW_MS * slowdown());
        if (windowMs > limit) {
          throw stalled(`steps ${step - STALL_WINDOW + 1}–${step} took ${windowMs} ms ` +
                        `(limit ${limit} ms at load ${loadavg()[0].toFixed(1)}); ` +
                        `page: ${await diagnosis(page)}`);
        }
        windowStarted = Date.now();
      }
      if (step === BASELINE_STEP) {
        baseline = await within(4 * STEP_LIMIT_MS, canonicalHeap(), 'the first heap reading');
        windowStarted = Date.now();
      }
      if (step % 500 === 0) {
        console.log(`step ${step}: ${((Date.now() - started) / 1000).toFixed(0)} s`);
      }
    }

    // Still alive: no problem shown, and a tap still draws frames.
    const problem = await page.evaluate(() => window.firnProblem ?? null);
    assert.equal(problem, null, 'the page shows a problem');
    const before = await frames();
    await goTo('Here');
    assert.ok((await frames()) > before, 'the app still draws after the session');
    assert.deepEqual(errors, [], 'console or page errors');

    const end = await within(4 * STEP_LIMIT_MS, canonicalHeap(), 'the last heap reading');
    const drift = (end.inUse - baseline.inUse) / baseline.inUse;
    console.log(`actions: ${JSON.stringify(counts)}; ${((Date.now() - started) / 1000).toFixed(0)} s`);
    if (slowSteps.length > 0) {
      console.log(`steps over ${SLOW_STEP_MS} ms (${slowSteps.length}): ${slowSteps.slice(0, 20).join('; ')}`);
    }
    console.log(`heap in use after ${BASELINE_STEP}: ${baseline.inUse} B; after ${STEPS}: ` +
                `${end.inUse} B (${(drift * 100).toFixed(2)} %); wasm memory ${baseline.memory} → ` +
                `${end.memory} B; JS heap ${baseline.js} → ${end.js} B`);
    const file = join(screenshotDir(), 'web-long-session-end.png');
    await page.screenshot({path: file});
    console.log(`screenshot: ${file}`);
    assert.ok(Math.abs(drift) <= HEAP_TOLERANCE,
              `heap in use moved ${(drift * 100).toFixed(1)} % (limit ${HEAP_TOLERANCE * 100} %)`);
  } finally {
    await browser.close();
    await server.close();
  }
}
