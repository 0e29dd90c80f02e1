// The team profile in the page: kept in localStorage across reloads; garbage in storage is kept
// as a backup, the demo profile is loaded and the user is told why; export (download) and
// re-import (file picker) give back the same profile; a bad file changes nothing and says what
// is wrong; "Print pocket card" opens the card, styled (the page CSP lets its inline <style>
// through) and carrying the team name and the cautions. A copy of the site with the old CSP
// (style-src 'self') shows the style check can fail.
// Env: FIRN_SITE (built site folder), FIRN_BIN (native firn, for `firn profile --demo`),
// FIRN_SCREENSHOTS (output folder).
import assert from 'node:assert/strict';
import {execFileSync} from 'node:child_process';
import {copyFileSync, mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync} from 'node:fs';
import {tmpdir} from 'node:os';
import {dirname, join} from 'node:path';
import {after, before, test} from 'node:test';
import {fileURLToPath} from 'node:url';

import {click, item, items, launch, pause, requiredEnv, screenshotDir, waitForApp,
        waitForText} from './browser.mjs';
import {serveSite} from '../../web/serve.mjs';

const site = requiredEnv('FIRN_SITE', 'the built site folder (build/web/site)');
const firn = requiredEnv('FIRN_BIN', 'the native firn executable');
const here = dirname(fileURLToPath(import.meta.url));
const PROFILE_KEY = 'firn.team-profile.json';
const BACKUP_KEY = 'firn.team-profile.json.bad';
const demo = JSON.parse(execFileSync(firn, ['profile', '--demo'], {encoding: 'utf8'}));
const cleanup = [];

let server;
let browser;
before(async () => {
  server = await serveSite(site);
  cleanup.push(() => server.close());
  browser = await launch({viewport: {width: 420, height: 860}, deviceScaleFactor: 1});
  cleanup.push(() => browser.close());
  await browser.page.goto(server.url);
  await waitForApp(browser.page);
});
after(async () => { for (const step of cleanup.reverse()) await step(); });

const stored = (page, key) => page.evaluate((k) => window.localStorage.getItem(k), key);

async function openTeam(page) {
  await click(page, 'Team');
  await waitForText(page, 'Team name', (t) => t.length > 0);
}

async function shot(page, name) {
  const file = join(screenshotDir(), name);
  await page.screenshot({path: file});
  console.log(`screenshot: ${file}`);
}

async function importFile(page, name, text) {
  const [chooser] = await Promise.all([page.waitForEvent('filechooser', {timeout: 5000}),
                                       click(page, 'Import profile')]);
  await chooser.setFiles({name, mimeType: 'application/json', buffer: Buffer.from(text)});
}

test('first start: the demo profile, marked DEMO DATA, nothing saved yet', async () => {
  const {page} = browser;
  await openTeam(page);
  assert.equal((await item(page, 'Team name')).text, demo.team_name);
  assert.equal((await item(page, 'Demo')).text, 'DEMO DATA');
  assert.equal(await stored(page, PROFILE_KEY), null);
  await shot(page, 'web-team-phone.png');
});

test('garbage in storage: kept as backup, demo loaded, the message names the problem',
     async () => {
  const {page} = browser;
  const garbage = '{"schema_version": 2, "team_name": "Half wri';  // a write cut short
  await page.evaluate(([k, v]) => window.localStorage.setItem(k, v), [PROFILE_KEY, garbage]);
  await page.reload();
  await waitForApp(page);
  assert.equal(await stored(page, BACKUP_KEY), garbage, 'the unreadable text is kept');
  const warning = (await items(page)).find((i) => i.label === 'Warning')?.text ?? '';
  // parse_profile's own message for truncated JSON (docs/team-profile.md "Problems").
  assert.match(warning, /team profile could not be read/);
  assert.match(warning, /not valid JSON/);
  assert.match(warning, /team-profile\.json\.bad/);
  await openTeam(page);
  assert.equal((await item(page, 'Team name')).text, demo.team_name, 'defaults (demo) loaded');
  assert.equal((await item(page, 'Demo')).text, 'DEMO DATA');
  assert.match((await item(page, 'Kept')).text, /kept as team-profile\.json\.bad/);
  await shot(page, 'web-team-corrupt-storage.png');

  // A profile that is valid JSON but out of range is refused the same way, naming the field.
  const outOfRange = structuredClone(demo);
  outOfRange.cylinders[0].fill_pressure = '450bar';
  await page.evaluate(([k, v]) => window.localStorage.setItem(k, v),
                      [PROFILE_KEY, JSON.stringify(outOfRange)]);
  await page.reload();
  await waitForApp(page);
  const second = (await items(page)).find((i) => i.label === 'Warning')?.text ?? '';
  assert.match(second, /cylinders\[0\]\.fill_pressure: 450 bar is outside 50…300 bar/);
  assert.equal(JSON.parse(await stored(page, BACKUP_KEY)).cylinders[0].fill_pressure, '450bar');
  await click(page, 'Dismiss');
});

test('load demo → export (download) → edited file re-imported (picker) → survives reload',
     async () => {
  const {page} = browser;
  await openTeam(page);
  await click(page, 'Load demo profile');
  await page.waitForFunction((k) => window.localStorage.getItem(k) !== null, PROFILE_KEY,
                             {timeout: 3000});
  assert.equal(JSON.parse(await stored(page, PROFILE_KEY)).team_name, demo.team_name);

  const [download] = await Promise.all([page.waitForEvent('download', {timeout: 5000}),
                                        click(page, 'Export profile')]);
  assert.equal(download.suggestedFilename(), 'firn-team-profile.json');
  const exported = readFileSync(await download.path(), 'utf8');
  const parsed = JSON.parse(exported);
  assert.equal(parsed.schema_version, 2);
  assert.equal(parsed.team_name, demo.team_name);
  assert.deepEqual(parsed.cylinders, demo.cylinders);
  assert.deepEqual(parsed.flows, demo.flows);

  // Our own team now: "demo" is optional and written only when true, so it is dropped.
  const {demo: wasDemo, ...ours} = parsed;
  assert.equal(wasDemo, true, 'the exported demo profile is still marked demo');
  const edited = {...ours, team_name: 'Round Trip Test Team'};
  await importFile(page, 'edited.json', JSON.stringify(edited));
  await waitForText(page, 'Team name', (t) => t === 'Round Trip Test Team');
  assert.equal((await items(page)).some((i) => i.label === 'Demo'), false, 'not demo any more');
  const kept = JSON.parse(await stored(page, PROFILE_KEY));
  assert.deepEqual(kept, edited, 'what is stored is what was imported');

  // Exporting again gives the imported file back unchanged.
  const [again] = await Promise.all([page.waitForEvent('download', {timeout: 5000}),
                                     click(page, 'Export profile')]);
  assert.deepEqual(JSON.parse(readFileSync(await again.path(), 'utf8')), edited);

  await page.reload();
  await waitForApp(page);
  await openTeam(page);
  assert.equal((await item(page, 'Team name')).text, 'Round Trip Test Team');
});

test('a bad file is refused whole: field, value and range named; nothing changes', async () => {
  const {page} = browser;
  await openTeam(page);
  const before = await stored(page, PROFILE_KEY);
  const bad = JSON.parse(before);
  bad.team_name = 'Must Not Appear';
  bad.reserve_pressure = '20';  // unit missing
  bad.bag.co2_limit = '9%';
  await importFile(page, 'bad.json', JSON.stringify(bad));
  const message = await waitForText(page, 'Team message', (t) => /not imported/.test(t));
  // Every problem, each with its field path (docs/team-profile.md "Problems").
  assert.match(message, /reserve_pressure: reserve pressure needs a gauge unit: .*bar/);
  assert.match(message, /bag\.co2_limit: 9 % is outside 0\.2…3 %/);
  assert.equal((await item(page, 'Team name')).text, 'Round Trip Test Team');
  assert.equal(await stored(page, PROFILE_KEY), before, 'storage untouched');
  await shot(page, 'web-team-bad-import.png');
});

async function openCard(page) {
  await openTeam(page);
  const [card] = await Promise.all([page.context().waitForEvent('page', {timeout: 10000}),
                                    click(page, 'Print pocket card')]);
  await card.waitForLoadState('load');
  return card;
}

const cardFacts = (card) => card.evaluate(() => ({
  url: location.href,
  text: document.body.textContent,
  sheets: document.styleSheets.length,
  bodyFont: getComputedStyle(document.body).fontSize,
  pageRule: [...document.styleSheets].some((s) => [...s.cssRules].some((r) => r instanceof CSSPageRule))
}));

test('"Print pocket card" opens the styled card with the team name and the cautions',
     async () => {
  const {page} = browser;
  const card = await openCard(page);
  const facts = await cardFacts(card);
  console.log(`card: ${facts.url.slice(0, 40)}… body font ${facts.bodyFont}, ${facts.sheets} sheet(s)`);
  assert.ok(facts.url.startsWith('blob:'), facts.url);
  assert.match(facts.text, /Round Trip Test Team/);
  // Wording of core/model/cautions.hpp (the card must carry them).
  assert.match(facts.text, /decision support only/i);
  assert.match(facts.text, /Descent is the definitive treatment/);
  assert.match(facts.text, /local protocols and medical direction/);
  assert.equal(facts.sheets, 1, 'the inline <style> was applied');
  assert.ok(facts.pageRule, 'the @page rule is there for printing');
  assert.notEqual(facts.bodyFont, '16px', 'body font is the card\'s, not the browser default');
  const file = join(screenshotDir(), 'web-card-opened.png');
  await card.screenshot({path: file, fullPage: true});
  console.log(`screenshot: ${file}`);
  await card.close();
});

// The same site with the CSP it had before (style-src 'self'): the card's style is blocked.
function siteWithOldCsp() {
  const input = mkdtempSync(join(tmpdir(), 'firn-site-csp-in-'));
  const output = mkdtempSync(join(tmpdir(), 'firn-site-csp-'));
  cleanup.push(() => rmSync(input, {recursive: true, force: true}));
  cleanup.push(() => rmSync(output, {recursive: true, force: true}));
  for (const name of readdirSync(site)) {
    if (name !== 'firn-build.json') copyFileSync(join(site, name), join(input, name));
  }
  const index = readFileSync(join(input, 'index.html'), 'utf8');
  const old = index.replace("style-src 'self' 'unsafe-inline'", "style-src 'self'");
  assert.notEqual(old, index, 'index.html no longer has the style-src this test expects');
  writeFileSync(join(input, 'index.html'), old);
  const version = JSON.parse(readFileSync(join(site, 'firn-build.json'), 'utf8')).version;
  execFileSync(process.execPath, [join(here, '../../web/make_site.mjs'), '--out', output,
                                  '--version', version, input]);
  return output;
}

test('control: under the old CSP (style-src \'self\') the opened card is unstyled', async () => {
  const oldServer = await serveSite(siteWithOldCsp());
  cleanup.push(() => oldServer.close());
  const other = await launch({viewport: {width: 420, height: 860}});
  cleanup.push(() => other.close());
  await other.page.goto(oldServer.url);
  await waitForApp(other.page);
  const card = await openCard(other.page);
  const facts = await cardFacts(card);
  console.log(`old CSP card: body font ${facts.bodyFont}, ${facts.sheets} sheet(s)`);
  assert.ok(facts.text.includes(demo.team_name));  // the content is there…
  assert.equal(facts.bodyFont, '16px');        // …but the style was blocked
  await pause(10);
});
