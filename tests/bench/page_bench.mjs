// Page figures for tests/bench/compare.sh: Firn's page against the bare ImGui example, in
// headless Chromium (the browser tests' flags and helpers, tests/browser/browser.mjs). Prints
// figures only; nothing is asserted.
//   time to first frame: median of N cold loads (a new empty profile each, so no HTTP cache and
//     no service worker), from navigation start to the end of the first main-loop iteration; both
//     pages at 1280×720 (the example's window size), and Firn alone on a phone (dpr 3);
//   idle: frames drawn in S seconds without input, after 3 s of settling;
//   interaction: main-thread time per frame while the mouse moves and clicks (median, p95).
// Both pages are timed the same way: an init script wraps the `Module` object the page hands to
// Emscripten and sets Module.preMainLoop/postMainLoop, which Emscripten's main loop calls around
// every frame (Browser.mainLoop.runIter). Firn's own window.firnFramesDrawn is read as a check.
// Usage: node page_bench.mjs --firn SITE --bare SITE [--loads 5] [--idle 10] [--json OUT]
import {writeFileSync} from 'node:fs';
import {loadavg} from 'node:os';

import {launch, pause} from '../browser/browser.mjs';
import {serveSite} from '../../web/serve.mjs';

const options = {firn: '', bare: '', loads: 5, idle: 10, json: ''};
const argv = process.argv.slice(2);
for (let i = 0; i < argv.length; i += 2) {
  const key = argv[i].replace(/^--/, '');
  if (!(key in options)) throw new Error(`unknown option ${argv[i]}`);
  options[key] = typeof options[key] === 'number' ? Number(argv[i + 1]) : argv[i + 1];
}
if (!options.firn || !options.bare) {
  console.error('usage: node page_bench.mjs --firn SITE --bare SITE [--loads 5] [--idle 10]');
  process.exit(2);
}

const VIEWPORT = {width: 1280, height: 720};  // the bare example's own window size
// Firn's own target: a phone. The bare example ignores the pixel ratio, so this is Firn alone.
const PHONE = {viewport: {width: 390, height: 844}, deviceScaleFactor: 3, hasTouch: true};
const NAV = ['Here', 'Casualty', 'Curve', 'Bag', 'Oxygen', 'AMS', 'Teaching', 'Settings', 'Team'];

// Runs in the page before any of its scripts.
function frameHooks() {
  const bench = {frames: 0, firstFrameAt: null, runtimeReadyAt: null, recording: false, frameMs: []};
  window.benchFrames = bench;
  let module;
  let frameStart = 0;
  const before = () => { frameStart = performance.now(); };
  const after = () => {
    const end = performance.now();
    bench.frames += 1;
    if (bench.firstFrameAt === null) bench.firstFrameAt = end;
    if (bench.recording) bench.frameMs.push(end - frameStart);
  };
  Object.defineProperty(window, 'Module', {
    configurable: true,
    get() { return module; },
    set(value) {
      module = value;
      if (value && typeof value === 'object') {
        value.preMainLoop = before;
        value.postMainLoop = after;
        // Emscripten calls this once the wasm is instantiated, right before main().
        const own = value.onRuntimeInitialized;
        value.onRuntimeInitialized = function () {
          bench.runtimeReadyAt = performance.now();
          if (own) own.apply(this, arguments);
        };
      }
    }
  });
}

const median = (values) => quantile(values, 0.5);
function quantile(values, q) {
  if (values.length === 0) return NaN;
  const sorted = [...values].sort((a, b) => a - b);
  const at = (sorted.length - 1) * q;
  const low = Math.floor(at);
  return sorted[low] + (sorted[Math.min(low + 1, sorted.length - 1)] - sorted[low]) * (at - low);
}
const fixed = (value, digits = 1) => (Number.isFinite(value) ? value.toFixed(digits) : '-');
const ratio = (a, b) => (Number.isFinite(a) && Number.isFinite(b) && b > 0 ? (a / b).toFixed(2) : '-');

async function openPage(url, device = {viewport: VIEWPORT}) {
  const session = await launch(device);
  await session.page.addInitScript(frameHooks);
  const failed = [];  // HTTP errors other than Chromium's own favicon.ico probe
  session.page.on('response', (response) => {
    if (response.status() >= 400 && !response.url().endsWith('/favicon.ico')) failed.push(response.url());
  });
  const navigated = Date.now();
  await session.page.goto(url);
  await session.page.waitForFunction(() => window.benchFrames?.firstFrameAt !== null || window.firnProblem,
                                     null, {timeout: 120000});
  const problem = await session.page.evaluate(() => window.firnProblem);
  if (problem) throw new Error(`${url}: the page reported a problem: ${problem}`);
  return {...session, navigated, failed};
}

// One cold load: first frame, wasm download end, and (first load only) the idle count.
async function coldLoad(url, {idleSeconds = 0, device} = {}) {
  const session = await openPage(url, device);
  try {
    const timing = await session.page.evaluate(() => {
      const resources = performance.getEntriesByType('resource');
      const wasm = resources.find((e) => /\/(firn|bare)\.wasm(\?|$)/.test(e.name));
      const glue = resources.find((e) => /\/(firn|bare)\.js(\?|$)/.test(e.name));
      return {firstFrame: window.benchFrames.firstFrameAt, glueStart: glue?.startTime ?? NaN,
              wasmEnd: wasm?.responseEnd ?? NaN, runtimeReady: window.benchFrames.runtimeReadyAt ?? NaN};
    });
    if (idleSeconds > 0) {
      await pause(3000);  // settle: Firn draws a few frames after start, then pauses its loop
      const count = () => session.page.evaluate(() => ({hook: window.benchFrames.frames,
                                                        firn: window.firnFramesDrawn ?? null}));
      const start = await count();
      await pause(idleSeconds * 1000);
      const end = await count();
      timing.idleFrames = end.hook - start.hook;
      timing.idleFirnFrames = end.firn === null ? null : end.firn - start.firn;
    }
    timing.problems = [...session.failed.map((url) => `HTTP error for ${url}`),
                       ...session.messages.filter((m) => /^(error|pageerror)/.test(m) &&
                                                         !m.includes('Failed to load resource'))];
    return timing;
  } finally {
    await session.close();
  }
}

// The same pointer path on both pages: a zig-zag over the whole viewport, one move per 16 ms,
// a click (held 60 ms: ImGui 1.86 loses a press and release within one frame) every 40 moves.
async function pointerSweep(page, moves = 240) {
  for (let i = 0; i < moves; ++i) {
    const row = Math.floor(i / 24);
    const column = row % 2 === 0 ? i % 24 : 23 - (i % 24);
    await page.mouse.move(40 + column * (VIEWPORT.width - 80) / 23, 40 + row * (VIEWPORT.height - 80) / 9);
    await pause(16);
    if (i % 40 === 39) {
      await page.mouse.down();
      await pause(60);
      await page.mouse.up();
      await pause(16);
    }
  }
}

// Firn only: a tap on every navigation item (a screen change each), by label.
async function visitScreens(page) {
  const visited = [];
  for (const label of NAV) {
    const target = await page.evaluate((wanted) =>
      (window.firnTestItems ?? []).find((i) => i.label === wanted), label);
    if (!target) continue;
    await page.mouse.move(target.x + target.w / 2, target.y + target.h / 2);
    await pause(60);
    await page.mouse.down();
    await pause(60);
    await page.mouse.up();
    await pause(250);
    visited.push(label);
  }
  return visited;
}

// Records frame times and Chrome's own main-thread counters around `drive`.
async function interaction(url, drive) {
  const session = await openPage(url);
  try {
    await pause(3000);
    const cdp = await session.page.context().newCDPSession(session.page);
    await cdp.send('Performance.enable');
    const metrics = async () => Object.fromEntries(
      (await cdp.send('Performance.getMetrics')).metrics.map((m) => [m.name, m.value]));
    const start = await metrics();
    await session.page.evaluate(() => { window.benchFrames.recording = true; });
    const extra = await drive(session.page);
    await pause(500);
    const frameMs = await session.page.evaluate(() => {
      window.benchFrames.recording = false;
      return window.benchFrames.frameMs;
    });
    const end = await metrics();
    const frames = frameMs.length;
    return {frames, median: median(frameMs), p95: quantile(frameMs, 0.95),
            max: Math.max(...frameMs), extra,
            taskPerFrame: (end.TaskDuration - start.TaskDuration) * 1000 / frames,
            scriptPerFrame: (end.ScriptDuration - start.ScriptDuration) * 1000 / frames,
            seconds: end.Timestamp - start.Timestamp,
            taskSeconds: end.TaskDuration - start.TaskDuration};
  } finally {
    await session.close();
  }
}

const firnServer = await serveSite(options.firn);
const bareServer = await serveSite(options.bare);
const result = {loadavgStart: loadavg(), loads: {firn: [], bare: [], 'firn phone': []}};
try {
  console.log(`viewport ${VIEWPORT.width}×${VIEWPORT.height} CSS px, device scale 1, mouse; ` +
              `load average ${loadavg().map((l) => l.toFixed(2)).join(' ')}`);
  // Alternating loads share any change in machine load evenly between the two pages.
  for (let n = 0; n < options.loads; ++n) {
    for (const [name, server] of [['firn', firnServer], ['bare', bareServer]]) {
      result.loads[name].push(await coldLoad(server.url, {idleSeconds: n === 0 ? options.idle : 0}));
    }
    result.loads['firn phone'].push(await coldLoad(firnServer.url, {device: PHONE}));
  }
  const row = (name) => {
    const loads = result.loads[name];
    const of = (key) => median(loads.map((l) => l[key]));
    return {first: of('firstFrame'), glue: of('glueStart'), wasm: of('wasmEnd'), ready: of('runtimeReady'),
            all: loads.map((l) => fixed(l.firstFrame, 0)),
            idle: loads[0].idleFrames, idleFirn: loads[0].idleFirnFrames};
  };
  const firn = row('firn');
  const bare = row('bare');
  const phone = row('firn phone');
  console.log(`\n== time to first frame, ${options.loads} cold loads each (ms from navigation start)`);
  console.log('page                   first frame  per load (ms)                  medians: glue .js asked  .wasm fetched  main starts');
  for (const [name, r] of [['firn', firn], ['bare', bare], ['firn, phone 390×844 dpr 3', phone]]) {
    console.log(`${name.padEnd(25)} ${fixed(r.first, 0).padStart(8)}  ${r.all.join(' ').padEnd(30)} ` +
                `${fixed(r.glue, 0).padStart(23)} ${fixed(r.wasm, 0).padStart(14)} ${fixed(r.ready, 0).padStart(12)}`);
  }
  console.log(`ratio firn/bare (median first frame): ${ratio(firn.first, bare.first)}`);
  for (const name of ['firn', 'bare', 'firn phone']) {
    const problems = result.loads[name].flatMap((l) => l.problems);
    console.log(`${name}: console errors over its cold loads: ${problems.length}` +
                (problems.length ? ` (first: ${problems[0].slice(0, 160)})` : ''));
  }

  console.log(`\n== frames drawn in ${options.idle} s without input (after 3 s settling, first cold load)`);
  console.log(`firn   ${firn.idle} (window.firnFramesDrawn says ${firn.idleFirn})`);
  console.log(`bare   ${bare.idle}`);

  console.log('\n== main-thread time per frame while interacting');
  console.log('frame ms: performance.now() around each main-loop iteration (input, ImGui frame, WebGL ' +
              'calls; 0.1 ms timer). task/script ms per frame: CDP Performance.getMetrics TaskDuration/' +
              'ScriptDuration over the drive ÷ frames; with software GL the task time is mostly the wait ' +
              'for SwiftShader to finish each frame (the compositor reads the canvas back)');
  console.log('drive                          frames  median ms  p95 ms  max ms  task ms/frame  script ms/frame');
  const show = (label, r) => console.log(
    `${label.padEnd(30)} ${String(r.frames).padStart(6)} ${fixed(r.median, 2).padStart(10)} ` +
    `${fixed(r.p95, 2).padStart(7)} ${fixed(r.max, 1).padStart(7)} ${fixed(r.taskPerFrame, 2).padStart(14)} ` +
    `${fixed(r.scriptPerFrame, 2).padStart(16)}   (${fixed(r.seconds, 1)} s wall, ${fixed(r.taskSeconds, 1)} s tasks)`);
  result.interaction = {
    firnSweep: await interaction(firnServer.url, (page) => pointerSweep(page)),
    bareSweep: await interaction(bareServer.url, (page) => pointerSweep(page)),
    firnScreens: await interaction(firnServer.url, (page) => visitScreens(page))
  };
  show('firn: pointer sweep + 6 clicks', result.interaction.firnSweep);
  show('bare: pointer sweep + 6 clicks', result.interaction.bareSweep);
  show(`firn: ${result.interaction.firnScreens.extra.length} screen changes`, result.interaction.firnScreens);
  console.log(`ratio firn/bare (sweep median): ${ratio(result.interaction.firnSweep.median,
                                                       result.interaction.bareSweep.median)}`);
  result.summary = {firn, bare};
  result.loadavgEnd = loadavg();
  console.log(`\nload average at the end ${loadavg().map((l) => l.toFixed(2)).join(' ')}`);
  if (options.json) writeFileSync(options.json, JSON.stringify(result, null, 1));
} finally {
  await firnServer.close();
  await bareServer.close();
}
