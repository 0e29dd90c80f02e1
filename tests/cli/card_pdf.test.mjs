// The cards printed: Debian's headless Chromium renders the card HTML to PDF; poppler-utils
// (pdfinfo, pdftotext, pdftoppm) check the page count a laminated card allows (A6: one sheet,
// 2 sides; wallet: at most two double-sided cards, 4 sides; the A4 team reference sheet: 2
// pages), the page size, the smallest printed text, the printed figures against the CLI, and
// write a PNG of every page to look at. Missing tools FAIL this test: a card that was never
// printed is not a tested card.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { firnJson, runFirn } from './run_firn.mjs';

const CHROMIUM = process.env.FIRN_CHROMIUM || '/usr/bin/chromium';
const work = fs.mkdtempSync(path.join(os.tmpdir(), 'firn-card-pdf-'));
const pngDir = process.env.FIRN_SCREENSHOTS ? path.join(process.env.FIRN_SCREENSHOTS, 'card') : work;
fs.mkdirSync(pngDir, { recursive: true });

function run(cmd, args, options = {}) {
  const r = spawnSync(cmd, args, { encoding: 'utf8', timeout: 120000, ...options });
  assert.ok(!r.error, `${cmd} could not run: ${r.error}`);
  assert.equal(r.status, 0, `${cmd} ${args.join(' ')} failed (${r.status}): ${r.stderr}`);
  return r.stdout;
}

test('printing tools are installed (chromium, pdfinfo, pdftotext, pdftoppm)', () => {
  assert.ok(fs.existsSync(CHROMIUM), `${CHROMIUM} missing: install Debian's chromium`);
  for (const tool of ['pdfinfo', 'pdftotext', 'pdftoppm']) {
    const r = spawnSync(tool, ['-v'], { encoding: 'utf8' });
    assert.ok(!r.error, `${tool} missing: install poppler-utils`);
  }
});

function printToPdf(html, pdf) {
  const profileDir = fs.mkdtempSync(path.join(work, 'chromium-user-'));  // new, empty each run
  run(CHROMIUM, ['--headless', '--no-sandbox', '--disable-gpu', '--no-first-run',
    '--disable-background-networking', '--disable-component-update', '--disable-sync',
    `--user-data-dir=${profileDir}`, '--no-pdf-header-footer', `--print-to-pdf=${pdf}`,
    `file://${html}`]);
  assert.ok(fs.existsSync(pdf), 'chromium wrote no PDF');
}

const demoFile = path.join(work, 'demo.json');
fs.writeFileSync(demoFile, runFirn(['profile', '--demo']).stdout);
const demo = JSON.parse(fs.readFileSync(demoFile, 'utf8'));

// The largest profile the schema allows (docs/team-profile.md): 40 card rows, 8 cylinder types
// with 24-character labels, 8 flows, 6 notes of 90 characters, a 60-character team name.
const largestFile = path.join(work, 'largest.json');
fs.writeFileSync(largestFile, JSON.stringify({
  ...demo,
  team_name: 'DEMO ' + 'W'.repeat(55),
  card: { altitude_from: '0m', altitude_to: '7800m', altitude_step: '200m',
    notes: [0, 1, 2, 3, 4, 5].map((i) => 'N'.repeat(89) + i) },
  cylinders: [0, 1, 2, 3, 4, 5, 6, 7].map((i) => ({
    label: 'C'.repeat(23) + i, water_capacity: `${2 + i}L`, fill_pressure: '300bar', count: 99 })),
  flows: ['0.25L/min', '1.5L/min', '2.5L/min', '4L/min', '6L/min', '12.5L/min', '15L/min', '25L/min'],
  evacuation: undefined,
}));
assert.equal(firnJson(['profile', '--check', largestFile]).card_rows, 40);

const mmToPt = (mm) => (mm * 72) / 25.4;

function printCard(profile, size, name) {
  const html = path.join(work, `${name}.html`);
  const pdf = path.join(work, `${name}.pdf`);
  const made = firnJson(['card', '--profile', profile, '--out', html, '--size', size, '--date', '2025-01-31']);
  printToPdf(html, pdf);
  const info = run('pdfinfo', [pdf]);
  const pages = Number(/Pages:\s+(\d+)/.exec(info)[1]);
  return { made, pdf, info, pages };
}

// The smallest text on the page: pdftotext -bbox gives each word's box, whose height is the
// font's ascent + descent (DejaVu Sans: 1.164 em). 8 pt text is 9.3 pt high; 7.5 pt would be 8.7.
function smallestWordHeight(pdf) {
  const xhtml = run('pdftotext', ['-bbox', pdf, '-']);
  let smallest = Infinity;
  for (const m of xhtml.matchAll(/yMin="([\d.]+)" xMax="[\d.]+" yMax="([\d.]+)">([^<]*)</g)) {
    if (m[3].trim()) smallest = Math.min(smallest, Number(m[2]) - Number(m[1]));
  }
  return smallest;
}

function writePngs(pdf, name) {
  run('pdftoppm', ['-r', '150', '-png', pdf, path.join(pngDir, name)]);
  return fs.readdirSync(pngDir).filter((f) => f.startsWith(`${name}-`) && f.endsWith('.png'));
}

// Expected sheet sizes: A6 105 × 148 mm, A4 210 × 297 mm (ISO 216); ID-1 card 85.6 × 53.98 mm
// (ISO/IEC 7810), printed as 85.6 × 54 mm. Chromium rounds page sizes to whole CSS pixels: 1 pt.
const sizes = [['a6', 105, 148, 2], ['wallet', 85.6, 54, 4], ['reference', 210, 297, 2]];

for (const [size, widthMm, heightMm, expectedPages] of sizes) {
  test(`card ${size}: ${expectedPages} pages, page size, text ≥ 8 pt, figures equal the CLI's, PNGs`, () => {
    const { made, pdf, info, pages } = printCard(demoFile, size, `card-${size}`);
    // Nothing overflowed onto an extra page, and the card is what a team can laminate.
    assert.equal(pages, made.pages, `PDF has ${pages} pages, card has ${made.pages} sections`);
    assert.equal(pages, expectedPages);
    const [, w, h] = /Page size:\s+([\d.]+) x ([\d.]+) pts/.exec(info);
    assert.ok(Math.abs(Number(w) - mmToPt(widthMm)) < 1, `width ${w} pt, expected ${mmToPt(widthMm)}`);
    assert.ok(Math.abs(Number(h) - mmToPt(heightMm)) < 1, `height ${h} pt, expected ${mmToPt(heightMm)}`);
    assert.ok(smallestWordHeight(pdf) >= 9.0, `smallest text ${smallestWordHeight(pdf)} pt high: below 8 pt`);

    const text = run('pdftotext', ['-layout', pdf, '-']);
    const pageTexts = text.split('\f');
    for (let i = 1; i <= pages; ++i) {
      assert.match(pageTexts[i - 1], new RegExp(`${i}/${pages}`), `footer of page ${i} not on page ${i}`);
      // A wallet card carries the cautions on its back (sides 2 and 4); every other page has them.
      if (size !== 'wallet' || i % 2 === 0) {
        assert.match(pageTexts[i - 1].replace(/\s+/g, ' '), /[Dd]ecision support only/, `page ${i}: no caution line`);
      }
    }
    const flat = text.replace(/\s+/g, ' ');  // headings may wrap
    assert.match(flat, /DEMO/);
    assert.match(flat, /2025-01-31/);
    assert.match(flat, new RegExp(`Firn ${runFirn(['--version']).stdout.trim().split(' ')[1].replace(/\./g, '\\.')}`));
    const last = pageTexts[pages - 1].replace(/\s+/g, ' ');
    assert.match(last, /Descent is the definitive treatment for serious altitude illness/);
    assert.match(last, /Follow your local protocols and medical direction/);
    assert.doesNotMatch(flat, /psi/, 'a metric card prints no psi');
    if (size !== 'wallet') assert.match(flat, /Acute: hours to 2 days at this altitude/);

    // Figures printed on the card equal the CLI's (rounded as the card rounds them).
    const rows = text.split('\n').map((l) => l.trim().split(/\s+/));
    const oxy = firnJson(['oxygenation', '--altitude', '4000m']);
    const acc = firnJson(['oxygenation', '--altitude', '4000m', '--acclimatised']);
    const band = (o) => `${Math.round(o.spo2_expected_low_pct)}–${Math.round(o.spo2_expected_high_pct)}`;
    // (The wallet prints the table in two blocks: the 4000 m row may start mid-line.)
    const row4000 = rows.map((c) => c.slice(c.indexOf('4000'))).find((c) => c[0] === '4000' && c.length >= 3);
    assert.ok(row4000, 'no 4000 m row');
    assert.ok(row4000.includes(band(oxy)) && row4000.includes(band(acc)), `4000 m row ${row4000}`);
    if (size !== 'wallet') {
      const p = firnJson(['pressure', '--altitude', '4000m']);
      assert.deepEqual(row4000.slice(0, 3), ['4000', `${Math.round(p.west_pressure_hpa)}`,
        size === 'reference' ? `${Math.round(p.isa_pressure_hpa)}` : `${Math.round(oxy.pio2_mmhg)}`]);
    }
    const cyl = firnJson(['cylinder', '--water-capacity', '2', '--pressure', '200bar', '--flow', '2', '--reserve', '20bar']);
    const cylRow = text.split('\n').find((l) => /2 L alloy ×4/.test(l)).trim().split(/\s+/);
    const printed = Number(cylRow[cylRow.indexOf('200') + 1]);
    assert.ok(printed <= cyl.duration_min && printed >= cyl.duration_min - 1,
      `card prints ${printed} min, firn cylinder ${cyl.duration_min} min (the card rounds down)`);
    // The card prints the flush the bag's verdict needs (rounded up) and the limiting equivalent
    // altitude at that flush: the same as `firn bag` given that flush.
    const needed = firnJson(['bag', '--altitude', '4500m', '--gauge', '2psi']);
    const flush = `${Math.ceil(needed.required_flush_lpm - 0.05)}`;
    const bag = firnJson(['bag', '--altitude', '4500m', '--gauge', '2psi', '--flush', flush]);
    assert.equal(bag.verdict, 'ok');
    // The bag table may be printed in two blocks side by side: find "4500 <equiv> <flush> <strokes>".
    const bagCells = rows.map((c) => {
      // (The reference sheet has the inside pressure between altitude and equivalent altitude.)
      const i = c.findIndex((x, k) => x === '4500' && (c[k + 2] === flush || c[k + 3] === flush));
      return i < 0 ? null : c.slice(i, c[i + 2] === flush ? i + 4 : i + 5);
    }).find((c) => c);
    assert.ok(bagCells, 'no 4500 m bag row');
    const equiv = Number(bagCells[bagCells.indexOf(flush) - 1]);
    // Rounded up to 10 m on the card, to 1 m by the CLI: the card never claims more descent.
    assert.ok(equiv - bag.equivalent_altitude_m >= 0 && equiv - bag.equivalent_altitude_m < 10,
              `bag row ${bagCells}`);

    const pngs = writePngs(pdf, `card-${size}`);
    assert.equal(pngs.length, pages, 'one PNG per page');
  });
}

// The wallet and the reference sheet of the largest profile do not fit yet (known limitation,
// docs/team-profile.md): only the A6 card is held to it.
for (const [size, , , expectedPages] of sizes.filter(([s]) => s === 'a6')) {
  test(`card ${size} of the largest profile the schema allows still prints on ${expectedPages} pages`, () => {
    const { made, pdf, pages } = printCard(largestFile, size, `largest-${size}`);
    assert.equal(pages, made.pages, `PDF has ${pages} pages, card has ${made.pages} sections`);
    assert.equal(pages, expectedPages);
    assert.ok(smallestWordHeight(pdf) >= 9.0, 'smallest text below 8 pt');
    const text = run('pdftotext', ['-layout', pdf, '-']).split('\f');
    // Nothing cut off at the foot: every page still ends with its footer.
    for (let i = 1; i <= pages; ++i) assert.match(text[i - 1], new RegExp(`${i}/${pages}`));
    assert.match(text[0], /7800/, 'the highest altitude row is on side 1');
    writePngs(pdf, `largest-${size}`);
  });
}
