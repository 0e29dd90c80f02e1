// The pocket card printed: Debian's headless Chromium renders the card HTML to PDF; poppler-utils
// (pdfinfo, pdftotext, pdftoppm) check page count and size for each format, the printed figures
// against the CLI, and write PNGs of pages to look at. Missing tools FAIL this test: a card that
// was never printed is not a tested card.
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
const mmToPt = (mm) => (mm * 72) / 25.4;

// Expected sheet sizes: A6 105 × 148 mm (ISO 216); ID-1 card 85.6 × 53.98 mm (ISO/IEC 7810),
// printed as 85.6 × 54 mm. Chromium rounds page sizes to whole CSS pixels: allow 1 pt.
for (const [size, widthMm, heightMm] of [['a6', 105, 148], ['wallet', 85.6, 54]]) {
  test(`card ${size}: page count, page size, printed figures, PNG`, () => {
    const html = path.join(work, `card-${size}.html`);
    const pdf = path.join(work, `card-${size}.pdf`);
    const made = firnJson(['card', '--profile', demoFile, '--out', html, '--size', size, '--date', '2025-01-31']);
    printToPdf(html, pdf);

    const info = run('pdfinfo', [pdf]);
    const pages = Number(/Pages:\s+(\d+)/.exec(info)[1]);
    // One PDF page per card section: nothing overflowed onto an extra page.
    assert.equal(pages, made.pages, `PDF has ${pages} pages, card has ${made.pages} sections`);
    const [, w, h] = /Page size:\s+([\d.]+) x ([\d.]+) pts/.exec(info);
    assert.ok(Math.abs(Number(w) - mmToPt(widthMm)) < 1, `width ${w} pt, expected ${mmToPt(widthMm)}`);
    assert.ok(Math.abs(Number(h) - mmToPt(heightMm)) < 1, `height ${h} pt, expected ${mmToPt(heightMm)}`);

    const text = run('pdftotext', ['-layout', pdf, '-']);
    const pageTexts = text.split('\f');
    for (let i = 1; i <= pages; ++i) {
      assert.match(pageTexts[i - 1], new RegExp(`page ${i}/${pages}`), `footer of page ${i} not on page ${i}`);
    }
    const flat = text.replace(/\s+/g, ' ');  // headings may wrap
    assert.match(flat, /DEMO DATA/);
    assert.match(flat, /DEMO Skarnvald Valley Mountain Rescue/);
    assert.match(flat, /2025-01-31/);
    assert.match(flat, new RegExp(`Firn ${runFirn(['--version']).stdout.trim().split(' ')[1].replace(/\./g, '\\.')}`));
    assert.match(flat, /Descent is the definitive treatment for serious altitude illness/);
    assert.match(flat, /Follow your local protocols and medical direction/);

    // Figures printed on the card equal the CLI's (rounded as the card rounds them).
    const line = (first) => text.split('\n').map((l) => l.trim().split(/\s+/)).find((c) => c[0] === first);
    const row4000 = line('4000');
    const p = firnJson(['pressure', '--altitude', '4000m']);
    const oxy = firnJson(['oxygenation', '--altitude', '4000m']);
    assert.deepEqual(row4000.slice(0, 5), ['4000', `${Math.round(p.west_pressure_hpa)}`,
      `${Math.round(p.isa_pressure_hpa)}`, `${Math.round(oxy.pio2_mmhg)}`,
      `${Math.round(oxy.spo2_expected_low_pct)}–${Math.round(oxy.spo2_expected_high_pct)}`]);
    const bagRow = text.split('\n').map((l) => l.trim().split(/\s+/)).filter((c) => c[0] === '4250')[1];
    const bag = firnJson(['bag', '--altitude', '4250m', '--gauge', '2psi']);
    assert.equal(bagRow[1], `${Math.round(bag.inside_pressure_hpa)}`);
    assert.ok(Math.abs(Number(bagRow[2]) - bag.equivalent_altitude_m) <= 5);
    const cyl = firnJson(['cylinder', '--water-capacity', '2', '--pressure', '200bar', '--flow', '2', '--reserve', '20bar']);
    const cylRow = text.split('\n').find((l) => /2 L alloy ×4/.test(l)).trim().split(/\s+/);
    const printed = Number(cylRow[cylRow.indexOf('bar') + 1]);
    assert.ok(printed <= cyl.duration_min + 0.5 && printed >= cyl.duration_min - 1,
      `card prints ${printed} min, firn cylinder ${cyl.duration_min} min`);

    // A picture of the table pages, to look at (the test only checks they were written).
    run('pdftoppm', ['-r', '110', '-png', '-f', '3', '-l', '3', pdf, path.join(pngDir, `card-${size}`)]);
    const pngs = fs.readdirSync(pngDir).filter((f) => f.startsWith(`card-${size}`) && f.endsWith('.png'));
    assert.ok(pngs.length >= 1, 'no PNG written');
  });
}
