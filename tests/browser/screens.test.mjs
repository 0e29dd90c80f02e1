// Every screen of the page, driven like a medic would: at a phone viewport (390×844 CSS px,
// device scale PHONE_DPR, touch — taps through page.touchscreen) and a laptop viewport (1366×768,
// mouse). Numbers go in through the in-app keypad ("Key 4", "Key OK"… found by label in
// window.firnTestItems), results are read back from the same items and compared with the CLI
// (`firn … --json`, same core, other front end) within the shown rounding. Units and themes are
// switched, every tapped target is checked to be ≥ 48 CSS px tall, screenshots are saved (the
// folder is printed) and idle frames over 5 s are measured and must be 0.
// Env: FIRN_SITE (built site), FIRN_BIN (native firn), FIRN_SCREENSHOTS (output folder).
// One browser for both devices; one page per device, reused by every step.
import assert from 'node:assert/strict';
import {execFileSync} from 'node:child_process';
import {after, before, describe, test} from 'node:test';

import {PHONE_DPR, launchBrowser, pause, requiredEnv, screenshotDir, waitForApp} from './browser.mjs';
import {Driver} from './driver.mjs';
import {serveSite} from '../../web/serve.mjs';

const site = requiredEnv('FIRN_SITE', 'the built site folder (build/web/site)');
const firnBin = requiredEnv('FIRN_BIN', 'the native firn executable (for the CLI comparison)');
const shots = screenshotDir();
const FEET_PER_METRE = 1 / 0.3048;  // international foot, exactly 0.3048 m (1959 agreement)
const PSI_PER_BAR = 1e5 / 6894.757;  // 1 psi = 6894.757 Pa (NIST SP 811, appendix B)

const firn = (...args) => JSON.parse(execFileSync(firnBin, [...args, '--json'], {encoding: 'utf8'}));

let server;
let browser;
const started = Date.now();
before(async () => {
  server = await serveSite(site);
  browser = await launchBrowser();
  console.log(`screenshots: ${shots}`);
});
after(async () => {
  await browser?.close();
  await server?.close();
  console.log(`screens.test.mjs ran ${((Date.now() - started) / 1000).toFixed(1)} s`);
});

// "609.5 hPa" → {value: 609.5, decimals: 1}; "−4 points" reads as -4.
function number(text, index = 0) {
  const found = [...String(text).replace(/\u2212/g, '-').matchAll(/-?\d+(?:\.(\d+))?/g)][index];
  assert.ok(found, `no number #${index} in ${JSON.stringify(text)}`);
  return {value: Number(found[0]), decimals: found[1]?.length ?? 0};
}

// |shown − cli| within half a unit of the shown last digit plus the CLI's own rounding.
function assertNear(shownText, cliValue, {index = 0, cliDecimals = 1, what = ''} = {}) {
  const shown = number(shownText, index);
  assert.equal(typeof cliValue, 'number', `CLI gave no number for ${what}`);
  const tolerance = 0.5 * 10 ** -shown.decimals + 0.5 * 10 ** -cliDecimals + 1e-9;
  assert.ok(Math.abs(shown.value - cliValue) <= tolerance,
            `${what}: page shows ${JSON.stringify(shownText)}, CLI says ${cliValue} (±${tolerance})`);
}

// "1 h 16 min" → 76
function minutesShown(text) {
  const match = text.match(/^(?:(\d+) h )?(\d+) min$/);
  assert.ok(match, `duration shown as ${JSON.stringify(text)}`);
  return Number(match[1] ?? 0) * 60 + Number(match[2]);
}

const DEVICES = [
  {name: 'phone', touch: true, altitude: 4321, spo2: 72, cylinderBar: 150, celsius: -5,
   context: {viewport: {width: 390, height: 844}, deviceScaleFactor: PHONE_DPR, isMobile: true,
             hasTouch: true}},
  {name: 'laptop', touch: false, altitude: 3650, spo2: 86, cylinderBar: 180, celsius: 12,
   context: {viewport: {width: 1366, height: 768}, deviceScaleFactor: 1}},
];

for (const device of DEVICES) {
  describe(`${device.name} ${device.context.viewport.width}×${device.context.viewport.height}`, () => {
    let d;
    const alt = `${device.altitude}m`;
    before(async () => {
      const context = await browser.newContext(device.context);
      const page = await context.newPage();
      d = new Driver(device.name, page, device.touch);
      await page.goto(server.url);
      await waitForApp(page);
    });
    after(async () => {
      if (d) console.log(`${device.name}: ${d.taps} taps, smallest tapped target ` +
                         `${d.smallest.toFixed(1)} CSS px tall`);
      await d?.page.context().close();
    });

    test('Here: altitude typed on the keypad; pressure and oxygen match the CLI', async () => {
      await d.screen('Here');
      // Backspace on the keypad: 4,3,2,9,← then 1 gives 4321 (phone) / 3,6,5,9,←,0 → 3650.
      const text = String(device.altitude);
      await d.enter('Altitude', text.slice(0, 3) + '9<' + text.slice(3));
      await d.waitText('Altitude', (t) => t === `${device.altitude} m`);
      const p = firn('pressure', '--altitude', alt);
      assertNear(await d.text('Barometric pressure (West 1996)'), p.pressure_hpa,
                 {cliDecimals: 2, what: 'West 1996 hPa'});
      assertNear(await d.text('ISA for comparison'), p.isa_pressure_hpa,
                 {cliDecimals: 2, what: 'ISA hPa'});
      const o = firn('oxygenation', '--altitude', alt);
      assertNear(await d.text('Inspired PO2 (PiO2)'), o.pio2_mmhg, {what: 'PiO2 mmHg'});
      assertNear(await d.text('PaCO2, expected'), o.paco2_mmhg, {what: 'PaCO2 mmHg'});
      // The middle of the cascade lies inside the ranges shown ("43–47 mmHg").
      for (const [label, middle] of [['Alveolar PO2 (PAO2), expected', o.pao2_mmhg],
                                     ['Arterial PO2 (PaO2), expected', o.arterial_po2_mmhg]]) {
        const shown = await d.text(label);
        assert.match(shown, /^\d+\u2013\d+ mmHg$/, `${label} shown as ${shown}`);
        const [low, high] = [number(shown, 0).value, number(shown, 1).value];
        assert.ok(low - 0.5 <= middle && middle <= high + 0.5, `${label} ${shown} vs CLI ${middle}`);
      }
      await d.cautionReachable('Here');
      await d.shot('here');
    });

    // The refusal and its message do not depend on the viewport or the pointer: once, on the phone.
    test('Here: out-of-range altitude is refused with a message naming range and unit',
         {skip: !device.touch}, async () => {
      const before = await d.text('Barometric pressure (West 1996)');
      await d.enter('Altitude', '12000');
      const warning = await d.waitText('Warning', (t) => /altitude/i.test(t));
      assert.match(warning, /-?500/, `message without the lower bound: ${warning}`);
      assert.match(warning, /9[\u00a0,]?000/, `message without the upper bound: ${warning}`);
      assert.match(warning, /\bm\b/, `message without the unit: ${warning}`);
      assert.equal(await d.text('Altitude'), `${device.altitude} m`);
      assert.equal(await d.text('Barometric pressure (West 1996)'), before);
      await d.shot('here-out-of-range');
      // A valid entry clears the message.
      await d.enter('Altitude', String(device.altitude));
      assert.equal(await d.find('Warning'), undefined, 'the range message stays after a valid entry');
    });

    test('Casualty: measured SpO2 against the expected band matches the CLI', async () => {
      await d.screen('Casualty');
      // Issue 12: the field starts empty and there is no verdict until a value is entered.
      assert.equal(await d.text('Measured SpO2'), 'not entered');
      assert.match(await d.text('Verdict'), /^NO VERDICT/);
      await d.enter('Measured SpO2', String(device.spo2));
      await d.waitText('Measured SpO2', (t) => t === `${device.spo2} %`);
      const o = firn('oxygenation', '--altitude', alt, '--spo2', String(device.spo2));
      const band = await d.text('Expected SpO2');
      assertNear(band, o.spo2_expected_low_pct, {index: 0, cliDecimals: 0, what: 'band low'});
      assertNear(band, o.spo2_expected_high_pct, {index: 1, cliDecimals: 0, what: 'band high'});
      assertNear(await d.text('Middle of the band'), o.spo2_expected_pct,
                 {cliDecimals: 0, what: 'band middle'});
      assertNear(await d.text('Gap to the band'), o.spo2_gap_pct, {what: 'gap'});
      // The same verdict as the CLI (casualty_spo2::assess in both).
      assert.ok((await d.text('Verdict')).includes(o.spo2_verdict),
                `CLI verdict ${o.spo2_verdict}`);
      assert.equal(await d.text('What to do'), o.spo2_action);
      if (o.oximeter_unreliable) {
        const warnings = (await d.items()).filter((i) => i.label.startsWith('Warning'));
        assert.ok(warnings.some((w) => /80 %/.test(w.text)),
                  `no oximeter warning below 80 %: ${JSON.stringify(warnings.map((w) => w.text))}`);
      }
      await d.cautionReachable('Casualty');
      await d.shot('casualty');
    });

    // Curve, Bag, AMS and Teaching compare the same core with the CLI whatever the pointer: the
    // laptop run (mouse input, the wide two-screen layout) takes their screenshots in the Themes
    // test instead (the 12-minute CI budget; each took 2–17 s at 1366×768 in software GL).
    const phoneOnly = {skip: !device.touch};

    test('Curve: PaO2 for the measured SpO2 lies on the CLI dissociation curve', phoneOnly, async () => {
      await d.screen('Curve');
      const standard = number(await d.text('Same SpO2 on the standard curve')).value;
      // The shown PaO2 is rounded to 1 mmHg: the measured SpO2 must lie between the CLI's
      // saturations half a mmHg either side (Severinghaus 1979, standard curve).
      const low = firn('curve', '--po2', `${standard - 0.5}mmHg`).so2_pct;
      const high = firn('curve', '--po2', `${standard + 0.5}mmHg`).so2_pct;
      assert.ok(low <= device.spo2 && device.spo2 <= high,
                `standard curve: ${standard} mmHg gives ${low}–${high} % on the CLI, page SpO2 ${device.spo2}`);
      const o = firn('oxygenation', '--altitude', alt);
      assertNear(await d.text('pH (expected, compensated)'), o.ph, {cliDecimals: 2, what: 'pH'});
      await d.item('Dissociation curve');
      await d.cautionReachable('Curve');
      await d.shot('curve');
    });

    test('Bag: 2 psi typed with the keypad unit toggle; verdict and equivalent altitudes match the CLI',
         phoneOnly, async () => {
      await d.screen('Bag');
      await d.enter('Bag pressure (gauge)', '2', {unit: 'psi'});
      // Shown in the Settings' pressure unit (hPa by default).
      await d.waitText('Bag pressure (gauge)', (t) => t === '138 hPa');
      // No verdict until someone says how fast the team pumps (a value nobody entered).
      assert.match(await d.text('Verdict'), /^NO VERDICT: Enter the fresh-air flush/);
      await d.enter('Fresh-air flush (inside)', '40');
      await d.waitText('Fresh-air flush (inside)', (t) => t === '40.0 L/min');
      const b = firn('bag', '--altitude', alt, '--gauge', '2psi', '--flush', '40', '--stroke-volume',
                     '3', '--co2-limit', '1');  // the demo team profile's pump and limit
      // One verdict function: the screen shows the CLI's verdict text after the tone word.
      const verdict = await d.text('Verdict');
      assert.equal(verdict, `${b.verdict === 'ok' ? 'OK' : 'DANGER'}: ${b.verdict_text}`);
      assertNear(await d.text('Pressure-equivalent altitude'), b.pressure_equivalent_altitude_m,
                 {cliDecimals: 0, what: 'pressure-equivalent altitude m'});
      assertNear(await d.text('Oxygen-equivalent altitude'), b.oxygen_equivalent_altitude_m,
                 {cliDecimals: 0, what: 'oxygen-equivalent altitude m'});
      assertNear(await d.text('CO2 inside (steady state)'), b.co2_pct, {cliDecimals: 2, what: 'CO2 %'});
      const needed = number(await d.text('Flush needed')).value;
      assert.ok(needed >= b.required_flush_lpm - 0.05 && needed - b.required_flush_lpm < 1.05,
                `flush needed: page ${needed}, CLI ${b.required_flush_lpm}`);
      await d.item('Altitude ladder');
      await d.cautionReachable('Bag');
      await d.shot('bag');
    });

    test('Oxygen: cylinder gauge and temperature typed; duration matches the CLI', async () => {
      await d.screen('Oxygen');
      await d.enter('Cylinder gauge', String(device.cylinderBar));
      await d.waitText('Cylinder gauge', (t) => t === `${device.cylinderBar} bar`);
      // The − key toggles the sign wherever it is pressed.
      await d.enter('Cylinder temperature', `${Math.abs(device.celsius)}${device.celsius < 0 ? '-' : ''}`);
      await d.waitText('Cylinder temperature', (t) => t === `${device.celsius} °C`);
      // Off oxygen the flow and the evacuation time are the planner's: empty until entered.
      assert.match(await d.text('Verdict'), /^NO VERDICT: Enter the flow/);
      await d.enter('Flow', '4');
      await d.waitText('Flow', (t) => t === '4.0 L/min');
      const c = firn('cylinder', '--water-capacity', '2', `--pressure=${device.cylinderBar}bar`,
                     '--flow', '4', '--reserve', '20bar', `--temperature=${device.celsius}C`,
                     '--altitude', alt);
      const lasts = minutesShown(await d.text('Lasts to reserve'));
      assert.ok(Math.abs(lasts - c.duration_min) <= 1, `lasts ${lasts} min, CLI ${c.duration_min} min`);
      assertNear(await d.text('Contents (free gas, real gas)'), c.contents_l,
                 {cliDecimals: 0, what: 'contents L'});
      assertNear(await d.text('Usable above reserve'), c.usable_l, {cliDecimals: 0, what: 'usable L'});
      assert.match(await d.text('Verdict'), /^NO VERDICT: Enter how many cylinders/);
      assert.equal(await d.text('Cylinders'), 'not entered');
      for (let i = 0; i < 3; ++i) await d.tap('Cylinders +');  // the first tap gives 1
      await d.waitText('Cylinders', (t) => t === '3');
      assert.match(await d.text('Verdict'), /^NO VERDICT: Enter the evacuation time/);
      await d.enter('Evacuation time', '240');
      await d.item('Evacuation timeline');
      await d.cautionReachable('Oxygen');
      await d.shot('oxygen');
    });

    test('AMS: tapped answers give the CLI Lake Louise score and category', phoneOnly, async () => {
      await d.screen('AMS');
      // Issue 12: nothing answered, nothing scored.
      assert.equal(await d.find('Lake Louise score'), undefined);
      assert.match(await d.text('Verdict'), /^NO VERDICT/);
      const answers = {Headache: 2, Gastrointestinal: 1, Fatigue: 2, Dizziness: 1};
      for (const [item, value] of Object.entries(answers)) {
        await d.tap(`${item} ${value}`);
        await d.waitText(`${item} ${value}`, (t) => t === 'selected');
      }
      const a = firn('ams', '--headache', '2', '--gi', '1', '--fatigue', '2', '--dizziness', '1');
      assert.equal(await d.text('Lake Louise score'), `${a.total} of 12`);
      assert.match(await d.text('Verdict'), new RegExp(a.category, 'i'));
      await d.cautionReachable('AMS');
      await d.shot('ams');
    });

    test('Teaching: altitude typed; cascade for acute and acclimatised matches the CLI',
         phoneOnly, async () => {
      await d.screen('Teaching');
      await d.enter('Altitude (teaching)', '6000');
      await d.waitText('Teaching altitude', (t) => t === '6000 m');
      const p = firn('pressure', '--altitude', '6000m');
      const pb = await d.text('PB (West 1996)');  // "370 mmHg = 492.8 hPa"
      assertNear(pb, p.pressure_mmhg, {index: 0, what: 'PB mmHg'});
      assertNear(pb, p.pressure_hpa, {index: 1, cliDecimals: 2, what: 'PB hPa'});
      for (const [exposure, flags] of [['acute', []], ['acclimatised', ['--acclimatised']]]) {
        const o = firn('oxygenation', '--altitude', '6000m', ...flags);
        // "PiO2 68 mmHg → PAO2 30 mmHg → PaO2 26 mmHg → SaO2 57 %"; the digits of "PiO2" etc.
        // are numbers #0, #2, #4, #6 in that text.
        const line = await d.text(`Cascade, ${exposure}`);
        assertNear(line, o.pio2_mmhg, {index: 1, what: `${exposure} PiO2`});
        assertNear(line, o.pao2_mmhg, {index: 3, what: `${exposure} PAO2`});
        assertNear(line, o.arterial_po2_mmhg, {index: 5, what: `${exposure} PaO2`});
        assertNear(line, o.spo2_expected_pct, {index: 7, cliDecimals: 0, what: `${exposure} SaO2`});
      }
      await d.item('Cascade chart');
      await d.item('Teaching curve');
      // SaO2 has its own 0–100 % chart; its summary is "SaO2 acute 57 %, acclimatised 79 %".
      const saturation = await d.text('Saturation chart');
      assertNear(saturation, firn('oxygenation', '--altitude', '6000m').spo2_expected_pct,
                 {index: 1, cliDecimals: 0, what: 'chart SaO2 acute'});
      assertNear(saturation, firn('oxygenation', '--altitude', '6000m', '--acclimatised').spo2_expected_pct,
                 {index: 2, cliDecimals: 0, what: 'chart SaO2 acclimatised'});
      await d.cautionReachable('Teaching');
      await d.shot('teaching');
    });

    // Settings on a phone are a screen of their own; on a laptop Here sits beside them.
    async function onScreen(screen, label) {
      await d.screen(screen);
      return d.text(label);
    }

    // The stored values do not depend on the viewport or the pointer: checked once, on the phone.
    test('Units: m→ft→m, hPa→mmHg→hPa, bar→psi→bar, °C→°F→°C lose nothing', {skip: !device.touch},
         async () => {
      const metres = device.altitude;
      await d.screen('Settings');
      await d.tap('ft');
      assert.equal(await onScreen('Here', 'Altitude'), `${Math.round(metres * FEET_PER_METRE)} ft`);
      await d.screen('Settings');
      await d.tap('m');
      assert.equal(await onScreen('Here', 'Altitude'), `${metres} m`);

      // Typed in feet on the keypad while showing metres; shown in feet it is exactly that.
      await d.enter('Altitude', '14000', {unit: 'ft'});
      await d.waitText('Altitude', (t) => t === `${Math.round(14000 / FEET_PER_METRE)} m`);
      await d.screen('Settings');
      await d.tap('ft');
      assert.equal(await onScreen('Here', 'Altitude'), '14000 ft');
      await d.screen('Settings');
      await d.tap('m');
      await d.screen('Here');
      await d.enter('Altitude', String(metres));

      await d.screen('Settings');
      await d.tap('mmHg');
      const p = firn('pressure', '--altitude', alt);
      assertNear(await onScreen('Here', 'Barometric pressure (West 1996)'), p.pressure_mmhg,
                 {what: 'West 1996 mmHg'});
      await d.shot('here-mmhg');
      await d.screen('Settings');
      await d.tap('hPa');
      assertNear(await onScreen('Here', 'Barometric pressure (West 1996)'), p.pressure_hpa,
                 {cliDecimals: 2, what: 'West 1996 hPa after mmHg'});

      await d.screen('Settings');
      await d.tap('psi');
      assert.equal(await onScreen('Oxygen', 'Cylinder gauge'),
                   `${Math.round(device.cylinderBar * PSI_PER_BAR)} psi`);
      await d.screen('Settings');
      await d.tap('bar');
      assert.equal(await onScreen('Oxygen', 'Cylinder gauge'), `${device.cylinderBar} bar`);

      await d.screen('Settings');
      await d.tap('°F');
      assert.equal(await onScreen('Oxygen', 'Cylinder temperature'),
                   `${Math.round(device.celsius * 9 / 5 + 32)} °F`);
      await d.screen('Settings');
      await d.tap('°C');
      assert.equal(await onScreen('Oxygen', 'Cylinder temperature'), `${device.celsius} °C`);
    });

    test('Themes: Night and Projector screenshots, back to Day', async () => {
      if (!device.touch) {
        for (const screen of ['Curve', 'Bag', 'AMS', 'Teaching']) {
          await d.screen(screen);
          await d.shot(screen.toLowerCase());
        }
      }
      await d.screen('Settings');
      await d.tap('Night');
      await d.waitText('Night', (t) => t === 'selected');
      await d.screen('Here');
      console.log(`${device.name} night: ${await d.shot('here-night')}`);
      await d.screen('Settings');
      await d.tap('Night: dim');
      await d.waitText('Night: dim', (t) => t === 'selected');
      await d.screen('Casualty');
      console.log(`${device.name} night, dimmed: ${await d.shot('casualty-night-dim')}`);
      await d.screen('Settings');
      await d.tap('Night: normal');
      await d.waitText('Night: normal', (t) => t === 'selected');
      await d.screen('Settings');
      await d.tap('Projector');
      await d.waitText('Projector', (t) => t === 'selected');
      await d.screen('Teaching');
      console.log(`${device.name} projector: ${await d.shot('teaching-projector')}`);
      if (!device.touch) {
        // Issue 12: on a 1366×768 projector image the slider and every chart show at once.
        const nav = await d.item('Here');
        for (const label of ['Teaching altitude', 'Cascade chart', 'Saturation chart', 'Teaching curve']) {
          const it = await d.item(label);
          assert.ok(it && it.y >= 0 && it.y + it.h <= nav.y,
                    `${label} (${it?.y}+${it?.h}) is above the navigation bar (${nav.y}) unscrolled`);
        }
      }
      await d.screen('Casualty');
      await d.shot('casualty-projector');
      await d.screen('Settings');
      await d.tap('Day');
      await d.waitText('Day', (t) => t === 'selected');
    });

    // Idle does not depend on the viewport: checked once, on the phone (and in app.test.mjs).
    test('Idle: no frames drawn in 5 s without input after settling', {skip: !device.touch},
         async () => {
      await d.screen('Here');
      await pause(1500);  // the settle frames after the last input run out
      const before = await d.page.evaluate(() => window.firnFramesDrawn);
      await pause(5000);
      const idle = (await d.page.evaluate(() => window.firnFramesDrawn)) - before;
      console.log(`${device.name} idle: ${idle} frames drawn in 5 s (total ${before})`);
      assert.equal(idle, 0);
    });
  });
}
