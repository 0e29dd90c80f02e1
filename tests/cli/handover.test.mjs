// CLI: `firn handover`, the handover summary of a casualty record file (docs/incident-record.md).
// Expected figures are read off the fictional demo record (assets/demo-record.json) by hand.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { mkdtempSync, writeFileSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, dirname } from 'node:path';
import { fileURLToPath } from 'node:url';
import { firnJson, firnError, firn } from './run_firn.mjs';

const demo = join(dirname(fileURLToPath(import.meta.url)), '../../assets/demo-record.json');
const dir = mkdtempSync(join(tmpdir(), 'firn-handover-'));
const recordFile = (entries) => {
  const path = join(dir, `r${Math.random().toString(36).slice(2)}.json`);
  writeFileSync(path, JSON.stringify({ firn_record: 1, incident: 'test', casualty: 'C1', entries }));
  return path;
};

test('the demo record: course, oxygen, bag, criteria', () => {
  const h = firnJson(['handover', '--record', demo]);
  assert.equal(h.entries, 15);
  assert.equal(h.first_spo2_pct, 68);
  assert.equal(h.latest_spo2_pct, 90);
  assert.equal(h.lowest_spo2_pct, 68);
  assert.deepEqual(h.first_spo2.breathing, { on: 'air', flow_lpm: 0 });
  assert.deepEqual(h.oxygen_given.map((p) => [p.on, p.flow_lpm, p.from.slice(11), p.to && p.to.slice(11)]),
    [['mask', 6, '13:50', '15:12'], ['non-rebreather', 12, '15:12', '16:50'], ['mask', 5, '17:55', null]]);
  assert.equal(h.bag_sessions.length, 1);
  assert.equal(h.bag_sessions[0].duration_min, 60);
  assert.equal(h.bag_sessions[0].gauge_mbar, 138);  // 2 psi = 137.9 mbar (NIST SP 811)
  assert.deepEqual(h.criteria_met, ['ams', 'hape']);
  assert.equal(h.current_altitude_m, 4600);
  assert.equal(h.highest_altitude_m, 5450);
  assert.match(h.summary_text, /SpO2 first 68 % on air at 13:40, 5,200 m/);
  assert.match(h.summary_text, /Descent is the definitive treatment/);
});

test('US units: feet and psi gauge', () => {
  const h = firnJson(['handover', '--record', demo, '--units', 'us']);
  assert.match(h.summary_text, /17,060 ft/);  // 5200 m / 0.3048
  assert.match(h.summary_text, /2 psi gauge/);
});

test('the text form prints the summary, the HTML form one printable page', () => {
  const { code, stdout } = firn('handover', '--record', demo);
  assert.equal(code, 0);
  assert.match(stdout, /HANDOVER — Casualty 1 \(demo\)/);
  const out = join(dir, 'handover.html');
  const h = firnJson(['handover', '--record', demo, '--html', out, '--page', 'a5']);
  assert.equal(h.html, out);
  const html = readFileSync(out, 'utf8');
  assert.match(html, /@page\{size:A5/);
  assert.ok(!html.includes('<script'));
  assert.match(html, /Follow your local protocols and medical direction\./);
});

test('bad record files and options name the problem', () => {
  assert.match(firnError(['handover']), /--record is required/);
  assert.match(firnError(['handover', '--record', join(dir, 'missing.json')]), /cannot read record/);
  assert.match(firnError(['handover', '--record', demo, '--units', 'imperial']), /units must be metric or us/);
  assert.match(firnError(['handover', '--record', demo, '--page', 'letter']), /a4 or a5/);
  const bad = recordFile([{ time: '2026-07-14T25:00', kind: 'observation', spo2: '120%' }]);
  const message = firnError(['handover', '--record', bad]);
  assert.match(message, /entries\[0\]\.time: time must be a date and clock time like 2026-12-02T14:05/);
  assert.match(message, /entries\[0\]\.spo2: "120%" is outside 30 to 100 %/);
});
