// Issue 16 in the browser at phone size (390×844, touch): the casualty record kept over an
// incident. Five observations through the keypad (one value by "Same as last"), oxygen set, a bag
// session started and ended; the trend charts' test items hold what was entered; the handover
// on screen is the one `firn handover --record` writes from the record the page stored; a reload
// keeps every entry; a corrupt stored record is kept as a backup, byte for byte, and said. Then
// the reassessment timer: no frames while no timer is on screen (a minute boundary passes), one
// wake when its minute changes while one is, none while the page is hidden.
//
// The page's clock: an init script makes Date.now() (what the app's std::time reads) return a
// time the test sets in localStorage — fixed for the record (whole minutes apart, as a medic's
// watch), or shifted so a minute boundary is seconds away for the timer. Playwright's own clock
// is not used: it also fakes requestAnimationFrame, the very frames counted here.
// Env: FIRN_SITE (built site), FIRN_BIN (native firn), FIRN_SCREENSHOTS (output folder, optional).
import assert from 'node:assert/strict';
import {execFileSync} from 'node:child_process';
import {mkdtempSync, readFileSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {join} from 'node:path';
import {after, before, describe, test} from 'node:test';

import {openPhone as openPhoneAt, pause, PHONE_DPR, requiredEnv, screenshotDir, siteAndBrowser, waitForApp} from './browser.mjs';

const site = requiredEnv('FIRN_SITE', 'the built site folder (build/web/site)');
const firn = requiredEnv('FIRN_BIN', 'the native firn executable (handover comparison)');
const shots = screenshotDir();
const PHONE = {viewport: {width: 390, height: 844}, deviceScaleFactor: PHONE_DPR, isMobile: true, hasTouch: true};
const RECORD_KEY = 'firn.incident.json';
const BACKUP_KEY = 'firn.incident.json.bad';
const SETTLE_FRAMES = 4;  // glfw::kSettleFrames: what one wake draws

// Runs in the page before its scripts: Date.now() reads the test's clock from localStorage.
function clockHook() {
  const realNow = Date.now.bind(Date);
  window.firnRealNow = realNow;
  Date.now = () => {
    const fixed = localStorage.getItem('firnTestClockMs');
    if (fixed !== null) return Number(fixed);
    return realNow() + Number(localStorage.getItem('firnTestClockShiftMs') ?? 0);
  };
}

const run = siteAndBrowser(site);

const openPhone = () => openPhoneAt(run.browser, run.server.url, PHONE, {initScript: clockHook});

// Taps an item anywhere on the (long) Record screen: scrolled into view first.
async function tapIn(phone, label) {
  await phone.centre(label);
  await phone.tap(label);
}

async function enter(phone, field, value) {
  await phone.centre(field);
  await phone.enter(field, String(value));
  await phone.waitText(field, (t) => t.startsWith(`${value} `));
}

async function labelled(phone, test, what) {
  const found = (await phone.items()).find((i) => test(i.label));
  assert.ok(found, `no ${what} on screen`);
  return found.label;
}

async function handoverShown(phone) {
  const found = (await phone.items()).find((i) => i.label.startsWith('Message') && i.text.startsWith('HANDOVER'));
  assert.ok(found, 'no handover text on screen');
  return found.text;
}

const stored = (phone, key) => phone.page.evaluate((k) => localStorage.getItem(k), key);

describe(`Record screen, phone 390×844 dpr ${PHONE_DPR}, touch`, () => {
  // 2026-07-14 09:30 in the browser's time zone (the record has none).
  const START = new Date(2026, 6, 14, 9, 30).getTime();
  const MINUTE = 60000;
  let phone;
  let saved;  // the record text the page stored after the five observations
  let trend;  // and its SpO2 chart's test item
  const at = (minutes) => phone.page.evaluate((ms) => localStorage.setItem('firnTestClockMs', String(ms)),
                                              START + minutes * MINUTE);

  before(async () => {
    phone = await openPhone();
    await at(0);
  });
  after(async () => { await phone?.page.context().close(); });

  async function observe(minutes, {spo2, heart, breathing, sameHeart = false}) {
    await at(minutes);
    if (spo2 !== undefined) await enter(phone, 'SpO2', spo2);
    if (heart !== undefined) await enter(phone, 'Heart rate', heart);
    if (sameHeart) {
      const same = await labelled(phone, (l) => l.startsWith('Same as last:') && l.endsWith('##record-hr'),
                                  'heart rate "Same as last" button');
      await tapIn(phone, same);
      await phone.waitText('Heart rate', (t) => t === same.replace('Same as last: ', '').replace('##record-hr', ''));
    }
    if (breathing !== undefined) await enter(phone, 'Breathing rate', breathing);
    await tapIn(phone, 'Save observation');
    await phone.waitText('SpO2', (t) => /tap to enter/.test(t));  // the form starts empty again
  }

  test('five observations, oxygen and a bag session through the keypad', async () => {
    await phone.enter('Altitude', '4500');
    await phone.waitText('Altitude', (t) => t === '4500 m');
    await phone.screen('Record');
    await observe(0, {spo2: 78, heart: 118, breathing: 28});
    await at(2);
    await tapIn(phone, 'Mask');
    await phone.waitText('Mask', (t) => t === 'selected');
    await tapIn(phone, await labelled(phone, (l) => l.startsWith('Oxygen set: mask'), '"Oxygen set" button'));
    await observe(10, {spo2: 84, heart: 112});
    await at(12);
    await tapIn(phone, 'Bag session start');
    await observe(20, {spo2: 86, sameHeart: true});
    await at(32);
    await tapIn(phone, 'Bag session end');
    await observe(40, {spo2: 88, heart: 104});
    await observe(50, {spo2: 91, heart: 100, breathing: 22});
    await phone.item('Bag session start');  // the session is closed: start is offered again

    // The charts' items say what they draw (minutes since the first entry, as entered).
    const spo2 = (await phone.item('SpO2 trend')).text;
    trend = spo2;
    assert.match(spo2, /^5 SpO2 points: 0 min 78 % air \| 10 min 84 % O2 \| 20 min 86 % O2 \| 40 min 88 % O2 \| 50 min 91 % O2;/);
    // 4,500 m lies inside the field data the band is calibrated to, 3,000–5,000 m
    // (docs/expected-spo2.md: Botella de Maglia 2005, Tannheimer 2002): nothing extrapolated.
    const band = spo2.match(/band on air: (\d+) stretches, (\d+) extrapolated$/);
    assert.ok(band, spo2);
    assert.ok(Number(band[1]) >= 1, `no expected band drawn: ${spo2}`);
    assert.equal(Number(band[2]), 0, spo2);
    assert.equal((await phone.item('Rates trend')).text,
                 'heart rate: 0 min 118 /min | 10 min 112 /min | 20 min 112 /min | 40 min 104 /min | 50 min 100 /min; ' +
                 'breathing rate: 0 min 28 /min | 50 min 22 /min');
    await phone.centre('SpO2 trend');
    await phone.page.screenshot({path: join(shots, 'record-phone-trend.png')});

    // The handover on screen: first and latest SpO2 and the oxygen, in plain words ...
    const shown = await handoverShown(phone);
    const hhmm = (minutes) => new Date(START + minutes * MINUTE).toTimeString().slice(0, 5);
    assert.match(shown, new RegExp(`SpO2 first 78 % on air at ${hhmm(0)}, 4.500 m`));
    assert.match(shown, new RegExp(`SpO2 latest 91 % on mask 5(\\.0)? L/min at ${hhmm(50)}`));
    assert.match(shown, new RegExp(`Oxygen: mask 5(\\.0)? L/min ${hhmm(2)}–now\\.`));
    assert.match(shown, new RegExp(`Hyperbaric bag: ${hhmm(12)}–${hhmm(32)} \\(20 min\\)`));
    assert.match(shown, /8 entries/);

    // The screen to look at, day and night (FIRN_PHONE_DPR=3 for a phone's sharpness).
    await phone.screen('Settings');
    await phone.tap('Night');
    await phone.waitText('Night', (t) => t === 'selected');
    await phone.screen('Record');
    await phone.centre('SpO2 trend');
    await phone.page.screenshot({path: join(shots, 'record-phone-trend-night.png')});
    await phone.screen('Settings');
    await phone.tap('Day');
    await phone.waitText('Day', (t) => t === 'selected');
    await phone.screen('Record');

    // ... and the same text the CLI writes from the record the page stored.
    saved = await stored(phone, RECORD_KEY);
    assert.ok(saved, `nothing stored under ${RECORD_KEY}`);
    const dir = mkdtempSync(join(tmpdir(), 'firn-record-'));
    try {
      const file = join(dir, 'incident.json');
      writeFileSync(file, saved);
      const cli = JSON.parse(execFileSync(firn, ['handover', '--record', file, '--json'], {encoding: 'utf8'}));
      assert.equal(cli.entries, 8);
      assert.equal(cli.first_spo2_pct, 78);
      assert.equal(cli.latest_spo2_pct, 91);
      assert.equal(cli.oxygen_given.length, 1);
      assert.equal(cli.oxygen_given[0].flow_lpm, 5);
      assert.equal(cli.bag_sessions.length, 1);
      assert.equal(cli.bag_sessions[0].duration_min, 20);
      assert.equal(shown, cli.summary_text, 'the page and `firn handover` disagree');
    } finally {
      rmSync(dir, {recursive: true, force: true});
    }
  });

  test('a reload keeps every entry', async () => {
    assert.ok(saved, 'needs the record of the test before');
    const trend = (await phone.item('SpO2 trend')).text;
    const handover = await handoverShown(phone);
    await phone.page.reload();
    await waitForApp(phone.page);
    if ((await phone.find('Record'))?.text !== 'selected') await phone.screen('Record');
    assert.equal(await stored(phone, RECORD_KEY), saved);
    assert.equal((await phone.item('SpO2 trend')).text, trend);
    assert.equal(await handoverShown(phone), handover);
  });

  test('a corrupt stored record: kept as a backup, said on screen, a new record starts', async () => {
    assert.ok(saved, 'needs the record of the test before');
    const corrupt = saved.slice(0, Math.floor(saved.length / 2));  // a write cut off halfway
    await phone.page.evaluate(([k, text]) => localStorage.setItem(k, text), [RECORD_KEY, corrupt]);
    await phone.page.reload();
    await waitForApp(phone.page);
    if ((await phone.find('Record'))?.text !== 'selected') await phone.screen('Record');
    const said = await phone.waitText('Verdict', (t) => t.startsWith('DANGER'));
    assert.match(said, /could not be read/);
    assert.match(said, /incident\.json\.bad/);
    assert.equal(await stored(phone, BACKUP_KEY), corrupt, 'the backup is not the stored text');
    assert.equal(await phone.find('SpO2 trend'), undefined, 'entries shown from an unreadable record');
    await phone.page.screenshot({path: join(shots, 'record-phone-corrupt.png')});
    // The next entry writes a new record; the backup stays as it was.
    await observe(60, {spo2: 90});
    assert.equal(await stored(phone, BACKUP_KEY), corrupt);
    assert.match(await stored(phone, RECORD_KEY), /"spo2": ?"90 ?%"/);
    assert.match((await phone.item('SpO2 trend')).text, /^1 SpO2 points: 0 min 90 % air;/);
  });

  test('export hands over the stored file; an imported record becomes the incident', async () => {
    assert.ok(saved && trend, 'needs the record of the first test');
    const current = await stored(phone, RECORD_KEY);
    await phone.centre('Export record');
    const [download] = await Promise.all([phone.page.waitForEvent('download', {timeout: 5000}),
                                          phone.tap('Export record')]);
    assert.equal(download.suggestedFilename(), 'firn-incident-record.json');
    assert.equal(readFileSync(await download.path(), 'utf8'), current);
    await phone.centre('Import record');
    const [chooser] = await Promise.all([phone.page.waitForEvent('filechooser', {timeout: 5000}),
                                         phone.tap('Import record')]);
    await chooser.setFiles({name: 'incident.json', mimeType: 'application/json', buffer: Buffer.from(saved)});
    await phone.page.waitForFunction((k) => localStorage.getItem(k) !== null && localStorage.getItem(k).includes('"91'),
                                     RECORD_KEY, {timeout: 5000});
    assert.equal(await stored(phone, RECORD_KEY), saved);
    assert.equal(await stored(phone, 'firn.incident-archive-1.json'), current, 'the incident before was not archived');
    // Stored during a frame that drew the chart before it took the file: the next frame shows it.
    await phone.waitText('SpO2 trend', (t) => t.startsWith('5 SpO2 points'));
    assert.equal((await phone.item('SpO2 trend')).text, trend);
    const said = (await phone.items()).find((i) => i.label.startsWith('Message') && /imported: 8 entries/.test(i.text));
    assert.ok(said, 'no message saying what was imported');
  });
});

describe('Record timers wake the page only when their minute changes, and only while visible', () => {
  let phone;
  before(async () => { phone = await openPhone(); });
  after(async () => { await phone?.page.context().close(); });

  const frames = () => phone.page.evaluate(() => window.firnFramesDrawn ?? 0);
  // Moves the page's clock forward (by under a minute) so that its next minute begins `seconds`
  // from now.
  const minuteIn = (seconds) => phone.page.evaluate((s) => {
    const shift = Number(localStorage.getItem('firnTestClockShiftMs') ?? 0);
    const now = window.firnRealNow() + shift;
    const ahead = (((60 - s) * 1000 - (now % 60000)) % 60000 + 60000) % 60000;
    localStorage.setItem('firnTestClockShiftMs', String(shift + ahead));
  }, seconds);
  const minutesLeft = (text) => Number(text.match(/Next SpO2 check in (\d+) min/)?.[1]);
  // Frames drawn over `ms` (the page must have settled before: SETTLE_FRAMES after input).
  async function framesOver(ms) {
    const start = await frames();
    await pause(ms);
    return (await frames()) - start;
  }
  const setVisibility = (state) => phone.page.evaluate((s) => {
    Object.defineProperty(document, 'visibilityState', {configurable: true, get: () => s});
    document.dispatchEvent(new Event('visibilitychange'));
  }, state);

  test('no timer on screen: no frames, even as a minute passes', async () => {
    await phone.screen('Record');
    await minuteIn(3);
    await pause(1000);  // settle frames run out
    assert.equal(await phone.find('Verdict'), undefined, 'a timer on an empty record');
    assert.equal(await framesOver(4000), 0, 'frames drawn with no timer on screen');
  });

  test('the SpO2 check timer: one wake when its minute changes, asleep in between', async () => {
    await phone.centre('SpO2');
    await phone.enter('SpO2', '80');
    await phone.waitText('SpO2', (t) => t === '80 %');
    await minuteIn(20);  // before the save: its last frame schedules the wake (slack for a busy machine)
    await tapIn(phone, 'Save observation');
    assert.match(await phone.waitText('Verdict', (t) => /Next SpO2 check/.test(t)), /in 15 min/);
    await pause(1200);
    // Quiet until the minute changes: watched for 2 s, or up to a second before the change.
    const left = await phone.page.evaluate(() => 60000 - (Date.now() % 60000));
    assert.ok(left > 1500, `the page's minute changes in ${left} ms: too slow to watch the quiet`);
    assert.equal(await framesOver(Math.min(2000, left - 1000)), 0, 'frames drawn while the minute has not changed');
    const before = await frames();
    await phone.page.waitForFunction((n) => window.firnFramesDrawn > n, before, {timeout: 30000});
    await phone.waitText('Verdict', (t) => /in 14 min/.test(t));
    await pause(1200);
    const woke = (await frames()) - before;
    assert.ok(woke <= SETTLE_FRAMES + 1, `${woke} frames for one wake`);
    assert.equal(await framesOver(2500), 0, 'frames drawn after the wake (next one a minute away)');
    console.log(`timer wake: ${woke} frames, then none`);
  });

  test('a hidden page is never woken by the timer', async () => {
    await minuteIn(5);
    await setVisibility('hidden');  // its event wakes the loop: the last frame schedules the timer
    await pause(1200);
    const shown = (await phone.item('Verdict')).text;
    assert.equal(await framesOver(7000), 0, 'frames drawn while hidden as the minute changed');
    assert.equal((await phone.item('Verdict')).text, shown);
    await setVisibility('visible');
    const woken = await phone.waitText('Verdict', (t) => t !== shown);
    assert.equal(minutesLeft(woken), minutesLeft(shown) - 1, `hidden: "${shown}", visible again: "${woken}"`);
  });
});
