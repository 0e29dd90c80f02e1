// The Route screen at phone size (390×844 CSS px, touch, dpr PHONE_DPR): a three-leg route built
// on the keypad (issue 15), its verdict, highest point, steady flow, each leg's flow and oxygen
// and the cylinder changes read from the screen and compared with `firn route --file F --json`
// (same core, other front end) for the same route written to a temp file by this test; then the
// route survives a reload, and what the page saved is itself a route file the CLI reads. The
// cylinder chart's change marks never cross a cylinder label (day and night screenshots). A route
// file loads through the browser's file picker (a bad one changes nothing) and the screen's route
// downloads as a route file.
// Env: FIRN_SITE (built site), FIRN_BIN (native firn), FIRN_SCREENSHOTS (output folder).
import assert from 'node:assert/strict';
import {execFileSync} from 'node:child_process';
import {mkdtempSync, readFileSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join} from 'node:path';
import {after, before, describe, test} from 'node:test';

import {PHONE_DPR, requiredEnv, siteAndBrowser, waitForApp} from './browser.mjs';
import {Driver} from './driver.mjs';

const site = requiredEnv('FIRN_SITE', 'the built site folder (build/web/site)');
const firnBin = requiredEnv('FIRN_BIN', 'the native firn executable (for the CLI comparison)');
const PHONE = {viewport: {width: 390, height: 844}, deviceScaleFactor: PHONE_DPR, isMobile: true,
               hasTouch: true};
const DEMO_ROUTE = new URL('../../assets/demo-route.json', import.meta.url);

// What the medic types: three legs (a carry up, a wait, a carry down) and three gauges. Chosen so
// the stock runs short (a DANGER verdict with numbers) below 5,000 m (no extrapolation).
const LEGS = [{kind: 'carry', from: 4500, to: 4800, min: 75},
              {kind: 'wait', at: 4800, min: 40},
              {kind: 'carry', from: 4800, to: 4100, min: 150}];
const GAUGES = {'#1 2 L alloy': 60, '#2 2 L alloy': 90, '#3 3 L composite': 100};  // bar
// The verdict while the stock's gauges are as a file gave them (the demo route: three cylinders).
const UNREAD = /^NO VERDICT: 3 of 3 cylinder gauges as saved, not read here/;

const work = mkdtempSync(join(tmpdir(), 'firn-route-test-'));
const firnRoute = (file) =>
  JSON.parse(execFileSync(firnBin, ['route', '--file', file, '--json'], {encoding: 'utf8'}));

// The same route as a route file, written here from the demo route (casualty, cylinder types,
// temperatures, margin, start time) and the values typed above: not from the app's own writer.
function expectedRouteFile() {
  const route = JSON.parse(readFileSync(DEMO_ROUTE, 'utf8'));
  route.name = 'Browser test route';
  route.legs = LEGS.map((l) => l.kind === 'carry'
    ? {kind: 'carry', from: `${l.from}m`, to: `${l.to}m`, duration: `${l.min}min`}
    : {kind: 'wait', at: `${l.at}m`, duration: `${l.min}min`});
  route.stock.cylinders.forEach((c, i) => {
    const label = `#${i + 1} ${c.type}`;
    if (label in GAUGES) c.pressure = `${GAUGES[label]}bar`;
  });
  const file = join(work, 'typed-route.json');
  writeFileSync(file, JSON.stringify(route, null, 2));
  return file;
}

// Every number in a shown text ("4 800 m" → [4800]; thin and no-break spaces group thousands;
// the 2 of "SpO2" is part of a word, not a number).
function numbers(text) {
  return [...String(text).replace(/(\d)[\s\u202f\u00a0,](?=\d{3}\b)/g, '$1').matchAll(/(?<![A-Za-z\d])-?\d+(?:\.\d+)?/g)]
    .map((m) => Number(m[0]));
}

const run = siteAndBrowser(site, {cleanup: () => rmSync(work, {recursive: true, force: true})});

describe('Route screen, phone 390×844', () => {
  let d;
  before(async () => {
    const context = await run.browser.newContext(PHONE);
    const page = await context.newPage();
    d = new Driver('phone', page, true);
    await page.goto(run.server.url);
    await waitForApp(page);
  });
  after(async () => {
    await d?.page.context().close();
  });

  // Read once the three-leg route is on screen; compared with the CLI, then after a reload.
  let shown;

  test('a three-leg route built on the keypad gives the CLI figures for the same route', async () => {
    await d.screen('Route');
    // It opens on the usual carry-out (docs/route-plan.md worked example), its gauges as saved
    // in the route file: figures, but no verdict until each gauge is read here.
    assert.match(await d.text('Verdict'), UNREAD);
    while (await d.find('Leg 2: for')) await d.tap('Remove the last leg');
    for (const [n, leg] of LEGS.entries()) {
      const leg_ = `Leg ${n + 1}`;
      if (n === 1) await d.tap('Wait 1 h');
      if (n === 2) await d.tap('Carry down 600 m in 2 h');
      if (leg.kind === 'carry') {
        if (n === 0) await d.enter(`${leg_}: from`, String(leg.from));
        await d.enter(`${leg_}: to`, String(leg.to));
        assert.deepEqual(numbers(await d.text(`${leg_}: from`)), [leg.from]);
        assert.deepEqual(numbers(await d.text(`${leg_}: to`)), [leg.to]);
      } else {
        // A leg added from a preset starts where the route ends.
        assert.deepEqual(numbers(await d.text(`${leg_}: at`)), [leg.at]);
      }
      await d.enter(`${leg_}: for`, String(leg.min));
      assert.deepEqual(numbers(await d.text(`${leg_}: for`)), [leg.min]);
    }
    assert.equal(await d.find('Leg 4: for'), undefined, 'more than three legs on screen');
    for (const [label, bar] of Object.entries(GAUGES)) {
      await d.enter(label, String(bar));
      assert.deepEqual(numbers(await d.text(label)), [bar]);
    }

    const cli = firnRoute(expectedRouteFile());
    shown = {verdict: await d.text('Verdict'), highest: await d.text('Highest point'),
             steady: await d.text('Steady flow the stock holds to arrival + margin'),
             legs: [], changes: []};
    for (let i = 1; i <= LEGS.length; ++i) shown.legs.push(await d.text(`Leg ${i} plan`));
    for (let i = 1; await d.find(`Change ${i}`); ++i) shown.changes.push(await d.text(`Change ${i}`));

    // The verdict: the model's own words, led by its tone (short: DANGER).
    assert.equal(cli.enough, false);
    assert.match(cli.verdict, /^short by \d+ min/);
    assert.equal(shown.verdict, `DANGER: ${cli.verdict}`);
    assert.deepEqual(numbers(shown.highest), [cli.highest_altitude_m]);
    assert.equal(numbers(shown.steady)[0], cli.max_sustainable_flow_lpm);
    assert.equal(cli.legs.length, LEGS.length);
    for (const [i, leg] of cli.legs.entries()) {
      // "Leg 1: 2.0 L/min, SpO2 from 91 %, 150 L": the screen rounds oxygen to the litre, the CLI up.
      const [n, flow, spo2, litres] = numbers(shown.legs[i]);
      assert.equal(n, i + 1);
      assert.equal(flow, leg.flow_lpm, `leg ${i + 1} flow: ${shown.legs[i]}`);
      assert.equal(spo2, leg.spo2_predicted_pct, `leg ${i + 1} SpO2: ${shown.legs[i]}`);
      assert.ok(leg.oxygen_used_l - 1 <= litres && litres <= leg.oxygen_used_l,
                `leg ${i + 1} oxygen: ${shown.legs[i]} vs CLI ${leg.oxygen_used_l} L`);
    }
    // The changes as clock times from the 07:30 start, to the cylinder the CLI names.
    assert.ok(cli.swaps.length >= 2, `expected two changes, CLI: ${JSON.stringify(cli.swaps)}`);
    assert.deepEqual(shown.changes, cli.swaps.map((s) => `${s.clock}  change to ${s.to}`));
  });

  test('no change mark crosses a cylinder label under the chart (day and night)', async () => {
    const boxes = (await d.items()).filter((i) => /^(Cylinder label|Change mark)/.test(i.label));
    const labels = boxes.filter((b) => b.label.startsWith('Cylinder label'));
    const marks = boxes.filter((b) => b.label.startsWith('Change mark'));
    assert.equal(labels.length, 3);
    assert.equal(marks.length, 2 * shown.changes.length);  // one on each bar a change joins
    for (const l of labels) {
      assert.ok(l.x >= 0 && l.x + l.w <= 390, `${l.label} runs off the phone: ${JSON.stringify(l)}`);
      for (const m of marks) {
        const apart = m.x + m.w <= l.x || m.x >= l.x + l.w || m.y + m.h <= l.y || m.y >= l.y + l.h;
        assert.ok(apart, `${m.label} ${JSON.stringify(m)} crosses ${l.label} ${JSON.stringify(l)}`);
      }
    }
    for (const theme of ['Day', 'Night', 'Day']) {  // back to Day for the next test
      await d.screen('Settings');
      await d.tap(theme);
      await d.waitText(theme, (t) => t === 'selected');
      await d.screen('Route');
      await d.reveal('Cylinders on the casualty');
      console.log(`route ${theme}: ${await d.shot(`route-cylinders-${theme.toLowerCase()}`)}`);
    }
  });

  test('the route survives a reload, and the page kept it as a route file', async () => {
    assert.ok(shown, 'the route was not built');
    await d.page.reload();
    await waitForApp(d.page);
    await d.screen('Route');
    assert.equal(await d.text('Verdict'), shown.verdict);
    assert.equal(await d.text('Highest point'), shown.highest);
    for (let i = 1; i <= LEGS.length; ++i) assert.equal(await d.text(`Leg ${i} plan`), shown.legs[i - 1]);
    assert.equal(await d.find('Leg 4: for'), undefined);
    assert.deepEqual(numbers(await d.text('Leg 3: to')), [LEGS[2].to]);
    for (const [label, bar] of Object.entries(GAUGES)) assert.deepEqual(numbers(await d.text(label)), [bar]);
    // The page's storage holds a route file: the CLI reads it and plans the same.
    const saved = await d.page.evaluate(() => window.localStorage.getItem('firn.route.json'));
    assert.ok(saved, 'nothing saved under firn.route.json');
    const file = join(work, 'saved-route.json');
    writeFileSync(file, saved);
    assert.equal(`DANGER: ${firnRoute(file).verdict}`, shown.verdict);
  });

  test('a route file loads through the file picker; the screen saves a route file', async () => {
    await d.tap('Back to the usual carry-out');
    assert.match(await d.text('Verdict'), UNREAD);
    const pick = async (name, text) => {
      await d.reveal('Load a route file');
      const [chooser] = await Promise.all([d.page.waitForEvent('filechooser', {timeout: 5000}),
                                           d.tap('Load a route file')]);
      await chooser.setFiles({name, mimeType: 'application/json', buffer: Buffer.from(text)});
    };
    // A file with a mistake changes nothing, and the mistake is named with its path and range.
    const typed = readFileSync(join(work, 'typed-route.json'), 'utf8');
    await pick('bad-route.json', typed.replace('"75min"', '"30h"'));
    const refusal = await d.waitText('Route message', (t) => /bad-route\.json was not loaded/.test(t));
    assert.match(refusal, /legs\[0\]\.duration: 30h \(1800 min\) is outside 1\u20261440 min/);
    assert.match(await d.text('Verdict'), UNREAD);

    await pick('typed-route.json', typed);
    await d.waitText('Route message', (t) => t === 'Loaded typed-route.json: Browser test route.');
    assert.match(await d.text('Verdict'), UNREAD);  // a loaded file's gauges are not read here

    await d.reveal('Save as a route file');
    const [download] = await Promise.all([d.page.waitForEvent('download', {timeout: 5000}),
                                          d.tap('Save as a route file')]);
    assert.equal(download.suggestedFilename(), 'firn-route.json');
    const file = join(work, 'downloaded-route.json');
    writeFileSync(file, readFileSync(await download.path()));
    assert.equal(`DANGER: ${firnRoute(file).verdict}`, shown.verdict);
  });
});
