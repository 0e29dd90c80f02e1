// CLI: `firn profile`, `firn plan` and `firn card` read the team profile file
// (docs/team-profile.md). Figures are cross-checked against the single-purpose commands, and the
// plan's oxygen need against plain schedule arithmetic (flow × time).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { runFirn, firnJson, firnError } from './run_firn.mjs';

const work = fs.mkdtempSync(path.join(os.tmpdir(), 'firn-profile-'));
const demoText = runFirn(['profile', '--demo']).stdout;
const demo = JSON.parse(demoText);
const writeProfile = (name, object) => {
  const file = path.join(work, name);
  fs.writeFileSync(file, typeof object === 'string' ? object : JSON.stringify(object, null, 2));
  return file;
};
const demoFile = writeProfile('demo.json', demoText);
const clone = () => JSON.parse(demoText);

test('profile --demo prints the shipped demo profile, marked as demo data', () => {
  const shipped = fs.readFileSync(new URL('../../assets/demo-profile.json', import.meta.url), 'utf8');
  assert.equal(demoText, shipped);
  assert.equal(demo.demo, true);
  assert.equal(demo.schema_version, 2);
  assert.deepEqual(firnJson(['profile', '--demo']), demo);
  const checked = firnJson(['profile', '--check', demoFile]);
  assert.equal(checked.ok, true);
  assert.equal(checked.demo, true);
  assert.equal(checked.card_rows, 19);
});

test('plan: timeline, swaps, reserve and shortfall for the demo evacuation', () => {
  const plan = firnJson(['plan', '--profile', demoFile]);
  const kinds = plan.timeline.map((e) => e.event);
  assert.deepEqual(kinds, ['start', 'swap', 'swap', 'flow_change', 'reserve', 'arrival']);
  const times = plan.timeline.map((e) => e.time_min);
  assert.deepEqual([...times].sort((a, b) => a - b), times, 'timeline in time order');
  assert.equal(plan.timeline.at(-1).time_min, 360);
  assert.equal(plan.timeline[3].time_min, 60);  // 15 L/min for 1 h, then 6 L/min
  // Schedule arithmetic: 15 L/min × 60 min + 6 L/min × 300 min = 2700 L.
  assert.equal(plan.oxygen_needed_l, 2700);
  assert.equal(plan.enough, false);
  assert.equal(plan.spare_min, 0);
  assert.ok(plan.shortfall_min > 0);
  assert.equal(plan.shortfall_min, 360 - plan.supply_lasts_min);
  assert.ok(plan.extra_cylinders_needed >= 1);
  assert.equal(plan.count_in, 'full 2 L alloy');
  // The first cylinder (2 L at 190 bar, −10 °C, gauge read at 4200 m) at 15 L/min lasts its
  // usable litres / 15 — close to what `firn cylinder` gives for the same reading.
  const first = firnJson(['cylinder', '--water-capacity', '2', '--pressure', '190bar', '--flow', '15',
    '--reserve', '20bar', '--temperature', '-10C', '--altitude', '4200m']);
  assert.ok(Math.abs(plan.timeline[1].time_min - first.duration_min) <= 1,
    `swap at ${plan.timeline[1].time_min} min, cylinder command ${first.duration_min} min`);
  assert.ok(plan.assumptions.length > 0);
  // The human table lists the same events.
  const table = runFirn(['plan', '--profile', demoFile]);
  assert.equal(table.code, 0);
  assert.match(table.stdout, /Swap #1 2 L alloy/);
  assert.match(table.stdout, /Shortfall\s+\d+ min/);
});

test('plan: a short evacuation has spare oxygen, in minutes and cylinders', () => {
  const p = clone();
  p.evacuation.duration = '1h';
  p.evacuation.phases = [{ flow: '4L/min' }];
  const plan = firnJson(['plan', '--profile', writeProfile('short.json', p)]);
  assert.equal(plan.enough, true);
  assert.equal(plan.shortfall_min, 0);
  assert.equal(plan.extra_cylinders_needed, 0);
  assert.equal(plan.oxygen_needed_l, 240);  // 4 L/min × 60 min
  assert.ok(plan.spare_min > 0);
  assert.ok(plan.spare_cylinders > 0);
  assert.equal(plan.spare_min, plan.supply_lasts_min - 60);
});

test('plan: "enough" only with the safety margin; the steady flow that lasts', () => {
  // Margin: the larger of 30 min and 20 % of the evacuation (demo profile's safety_margin, the
  // default; evacuation_plan.hpp says why). Hand arithmetic on the plan's own usable litres.
  const p = clone();
  p.evacuation.duration = '2h';
  p.evacuation.phases = [{ flow: '4L/min' }];
  const plan = firnJson(['plan', '--profile', writeProfile('margin.json', p)]);
  assert.equal(plan.margin_min, 30);  // max(30, 0.2 × 120 = 24)
  assert.equal(plan.verdict, 'enough');
  assert.equal(plan.enough, true);
  assert.match(plan.verdict_text, /^Enough with the 30 min margin: /);
  const steady = plan.oxygen_usable_l / (120 + 30);
  assert.ok(plan.max_sustainable_flow_lpm <= steady && plan.max_sustainable_flow_lpm > steady - 0.11,
    `${plan.max_sustainable_flow_lpm} vs ${steady}`);
  const toArrival = plan.oxygen_usable_l / 120;
  assert.ok(plan.max_flow_to_arrival_lpm <= toArrival + 0.01 && plan.max_flow_to_arrival_lpm > toArrival - 0.11);
  // At that steady flow the plan says enough; a little more and it is below the margin.
  p.evacuation.phases = [{ flow: `${plan.max_sustainable_flow_lpm}L/min` }];
  assert.equal(firnJson(['plan', '--profile', writeProfile('steady.json', p)]).verdict, 'enough');
  p.evacuation.phases = [{ flow: `${plan.max_flow_to_arrival_lpm}L/min` }];
  const thin = firnJson(['plan', '--profile', writeProfile('thin.json', p)]);
  assert.equal(thin.verdict, 'below_margin');
  assert.equal(thin.enough, false);
  assert.equal(thin.lasts_to_arrival, true);
  assert.ok(thin.spare_min < 30);
  // The team's own margin: none at all makes the same plan "enough".
  p.safety_margin = { minimum: '0min', share: '0%' };
  assert.equal(firnJson(['plan', '--profile', writeProfile('nomargin.json', p)]).verdict, 'enough');
  // Minutes: spare and supply rounded down, shortfall up, all whole.
  const demoPlan = firnJson(['plan', '--profile', demoFile]);
  assert.equal(demoPlan.verdict, 'short');
  for (const k of ['shortfall_min', 'spare_min', 'supply_lasts_min', 'margin_min']) {
    assert.ok(Number.isInteger(demoPlan[k]), k);
  }
  for (const e of demoPlan.timeline) assert.ok(Number.isInteger(e.time_min));
});

test('plan: a US profile prints its reserve in psi (gauge); a measured pressure may replace the altitude', () => {
  const p = clone();
  p.units = 'us';
  p.reserve_pressure = '300psi';
  const plan = firnJson(['plan', '--profile', writeProfile('us.json', p)]);
  const swap = plan.timeline.find((e) => e.event === 'swap');
  assert.match(swap.text, /reserve 300 psi gauge/);
  assert.doesNotMatch(plan.assumptions.join(' '), /\bbar\b/);
  assert.equal(plan.reserve_psi, 300);
  // West 1996 at 4200 m (the demo's altitude): the same pressure measured gives the same plan.
  const atAltitude = firnJson(['pressure', '--altitude', '4200m']);
  const measured = firnJson(['plan', '--profile', demoFile, '--ambient-pressure', `${atAltitude.pressure_hpa}hPa`]);
  const fromAltitude = firnJson(['plan', '--profile', demoFile]);
  assert.equal(measured.supply_lasts_min, fromAltitude.supply_lasts_min);
  assert.deepEqual(measured.timeline.map((e) => e.time_min), fromAltitude.timeline.map((e) => e.time_min));
  assert.match(firnError(['plan', '--profile', demoFile, '--ambient-pressure', '90hPa']), /between 150 and 1100 hPa/);
});

test('plan: a profile without an evacuation section says what is missing', () => {
  const p = clone();
  delete p.evacuation;
  assert.match(firnError(['plan', '--profile', writeProfile('noplan.json', p)]), /evacuation: is missing/);
});

test('card: HTML and CSV whose figures match the single-purpose commands', () => {
  const out = path.join(work, 'card.html');
  const csvDir = path.join(work, 'csv');
  const result = firnJson(['card', '--profile', demoFile, '--out', out, '--csv', csvDir, '--date', '2025-01-31']);
  assert.equal(result.size, 'a6');
  assert.equal(result.pages, 2);  // one A6 sheet, both sides
  const html = fs.readFileSync(out, 'utf8');
  assert.match(html, /@page\{size:105mm 148mm/);
  assert.match(html, /DEMO DATA/);
  assert.match(html, /2025-01-31/);
  assert.deepEqual(result.csv.map((f) => path.basename(f)), ['altitude.csv', 'bag.csv', 'cylinders.csv', 'oxygen.csv']);
  const rows = (name) => fs.readFileSync(path.join(csvDir, name), 'utf8').trim().split('\r\n').map((l) => l.split(','));
  const air = rows('altitude.csv');
  assert.deepEqual(air[0], ['Alt m', 'PB West hPa', 'PB ISA hPa', 'PiO2 mmHg', 'SpO2 acute %', 'SpO2 acclim. %']);
  const at4000 = air.find((r) => r[0] === '4000');
  const pressure = firnJson(['pressure', '--altitude', '4000m']);
  assert.equal(Number(at4000[1]), Math.round(pressure.west_pressure_hpa));
  assert.equal(Number(at4000[2]), Math.round(pressure.isa_pressure_hpa));
  const oxy = firnJson(['oxygenation', '--altitude', '4000m']);
  assert.equal(Number(at4000[3]), Math.round(oxy.pio2_mmhg));
  assert.equal(at4000[4], `${Math.round(oxy.spo2_expected_low_pct)}–${Math.round(oxy.spo2_expected_high_pct)}`);
  const acc = firnJson(['oxygenation', '--altitude', '4000m', '--acclimatised']);
  assert.equal(at4000[5], `${Math.round(acc.spo2_expected_low_pct)}–${Math.round(acc.spo2_expected_high_pct)}`);
  const bag = rows('bag.csv').find((r) => r[0] === '4250');
  // The card's bag row: the flush the verdict needs (rounded up) and the limiting equivalent
  // altitude at that flush, as `firn bag --flush`.
  const needs = firnJson(['bag', '--altitude', '4250m', '--gauge', '2psi']);
  const flush = Math.ceil(needs.required_flush_lpm - 0.05);
  const bagCli = firnJson(['bag', '--altitude', '4250m', '--gauge', '2psi', '--flush', `${flush}`]);
  assert.equal(bagCli.verdict, 'ok');
  assert.equal(Number(bag[1]), Math.round(bagCli.inside_pressure_hpa));
  // The card rounds up to 10 m, the CLI up to 1 m (both as the verdict: less descent claimed).
  const over = Number(bag[2]) - bagCli.equivalent_altitude_m;
  assert.ok(over >= 0 && over < 10, `card ${bag[2]} m, CLI ${bagCli.equivalent_altitude_m} m`);
  assert.equal(Number(bag[2]) % 10, 0);
  assert.equal(Number(bag[3]), flush);
  const cyl = rows('cylinders.csv');
  assert.deepEqual(cyl[0], ['Cylinder', 'Gauge bar', '2 L/min', '4 L/min', '6 L/min', '10 L/min', '15 L/min']);
  for (const [row, pressure] of [[1, '200bar'], [2, '100bar']]) {
    for (const [col, flow] of [[2, 2], [6, 15]]) {
      const c = firnJson(['cylinder', '--water-capacity', '2', '--pressure', pressure, '--flow', `${flow}`, '--reserve', '20bar']);
      const card = Number(cyl[row][col]);
      assert.ok(card <= c.duration_min + 0.5 && card >= c.duration_min - 1,
        `card ${card} min vs cylinder ${c.duration_min} min (${pressure}, ${flow} L/min)`);
    }
  }
});

test('card: wallet size', () => {
  const out = path.join(work, 'wallet.html');
  const result = firnJson(['card', '--profile', demoFile, '--out', out, '--size', 'wallet']);
  assert.equal(result.size, 'wallet');
  assert.equal(result.pages, 4);  // two cards, both sides
  assert.match(fs.readFileSync(out, 'utf8'), /@page\{size:85\.6mm 54mm/);
});

test('bad files and options: exit 2 with a message saying what and where', () => {
  const bad = (name, text) => firnError(['plan', '--profile', writeProfile(name, text)]);
  assert.match(firnError(['plan', '--profile', path.join(work, 'absent.json')]), /cannot read profile/);
  assert.match(firnError(['plan']), /--profile is required/);
  assert.match(bad('syntax.json', '{\n "schema_version": 2,\n oops\n}'), /not valid JSON: line 3/);
  assert.match(bad('newer.json', { ...clone(), schema_version: 3 }), /schema_version: 3 is outside 1…2 \(written by a newer Firn/);
  const p = clone();
  p.cylinders[2].fill_pressure = '450bar';
  p.bag.gauge_pressure = '2 psy';
  p.flows[0] = -2;
  const message = bad('range.json', p);
  assert.match(message, /cylinders\[2\]\.fill_pressure: 450 bar is outside 50…300 bar/);
  assert.match(message, /bag\.gauge_pressure.*unknown unit 'psy'/);
  assert.match(message, /flows\[0\]: -2 L\/min is outside 0\.25…25 L\/min/);
  assert.match(firnError(['card', '--profile', demoFile]), /--out is required/);
  assert.match(firnError(['card', '--profile', demoFile, '--out', path.join(work, 'x.html'), '--size', 'a4']), /use a6 or wallet/);
  assert.match(firnError(['card', '--profile', demoFile, '--out', path.join(work, 'x.html'), '--date', 'today']), /YYYY-MM-DD/);
  assert.match(firnError(['card', '--profile', demoFile, '--out', path.join(work, 'no-dir', 'x.html')]), /cannot write/);
  assert.match(firnError(['profile']), /--check FILE or --demo/);
});

test('profile --check lists every problem, one per line, and exits 2', () => {
  const p = clone();
  p.reserve_pressure = 20;
  p.team_name = '';
  const file = writeProfile('two.json', p);
  const { code, stdout, stderr } = runFirn(['profile', '--check', file]);
  assert.equal(code, 2);
  assert.deepEqual(stdout.trim().split('\n'), [
    'problem: team_name: 0 characters is outside 1…60 characters',
    'problem: reserve_pressure: 20 needs its unit, written as text like "20bar"',
  ]);
  assert.match(stderr, /2 problems: team_name/);
});

test('profile --check migrates a schema 1 file', () => {
  const v1 = {
    schema_version: 1, team_name: 'Old team', altitude_unit: 'ft',
    card_altitudes: { from: 6000, to: 16000, step: 1000 }, model: 'isa',
    cylinders: [{ label: 'D', size: 'D', fill_pressure_bar: 139, count: 2 }],
    reserve_pressure_bar: 14, flows_lpm: [2, 6], bag_gauge_psi: 2, pump_stroke_l: 3, co2_limit_pct: 1,
  };
  const file = writeProfile('v1.json', v1);
  const checked = firnJson(['profile', '--check', file]);
  assert.equal(checked.ok, true);
  assert.equal(checked.migrated_from_older_schema, true);
  assert.equal(checked.card_rows, 11);
  const out = path.join(work, 'v1.html');
  firnJson(['card', '--profile', file, '--out', out, '--csv', path.join(work, 'v1csv')]);
  const air = fs.readFileSync(path.join(work, 'v1csv', 'altitude.csv'), 'utf8');
  assert.match(air, /^Alt ft,PB West mmHg,PB ISA mmHg/);
  assert.match(fs.readFileSync(out, 'utf8'), /ISA/);
});
