// CLI: `firn route` reads a route file (docs/route-plan.md) against a team profile. Figures are
// cross-checked against the single-purpose commands (`pressure`, `oxygenation`, `cylinder`) and
// plain flow × time arithmetic; bad route files name each mistake with its path and valid range.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { runFirn, firnJson, firnError } from './run_firn.mjs';

const work = fs.mkdtempSync(path.join(os.tmpdir(), 'firn-route-'));
const demoRoute = new URL('../../assets/demo-route.json', import.meta.url).pathname;
const demoText = fs.readFileSync(demoRoute, 'utf8');
const clone = () => JSON.parse(demoText);
const writeRoute = (name, object) => {
  const file = path.join(work, name);
  fs.writeFileSync(file, typeof object === 'string' ? object : JSON.stringify(object, null, 2));
  return file;
};
const profileFile = writeRoute('profile.json', runFirn(['profile', '--demo']).stdout);

test('route --demo prints the shipped demo route, marked as demo data', () => {
  assert.equal(runFirn(['route', '--demo']).stdout, demoText);
  assert.deepEqual(firnJson(['route', '--demo']), JSON.parse(demoText));
});

test('route: the demo carry-out, leg by leg, against the single-purpose commands', () => {
  const r = firnJson(['route', '--file', demoRoute, '--profile', profileFile]);
  assert.equal(r.demo, true);
  assert.equal(r.legs.length, 6);
  assert.equal(r.highest_altitude_m, 4950);
  assert.equal(r.route_min, 60 + 120 + 60 + 90 + 45 + 25);
  for (const leg of r.legs) {
    // Pressure at the leg's highest point, the same West 1996 figure `firn pressure` gives.
    const p = firnJson(['pressure', '--altitude', `${leg.highest_altitude_m}m`, '--model', 'west']);
    assert.equal(leg.pressure_hpa, Math.round(p.pressure_hpa), `leg ${leg.leg}`);
    assert.equal(leg.highest_altitude_m, Math.max(leg.start_altitude_m, leg.end_altitude_m));
    if (leg.kind === 'bag') {
      assert.equal(leg.flow_lpm, 2);  // the oxygen fed into the bag
      assert.equal(leg.needed_flow_lpm, null);
      assert.ok(leg.bag_inside_pressure_hpa > leg.pressure_hpa);
    } else {
      // The lowest flow for 90 % by `firn oxygenation`, rounded up to the team's 2/4/6 L/min.
      const o = firnJson(['oxygenation', '--altitude', `${leg.highest_altitude_m}m`,
        '--device', 'cannula', '--flow', '2', '--target', '90']);
      const step = [2, 4, 6].find((s) => s >= o.lowest_flow_lpm);
      assert.equal(leg.flow_lpm, step, `leg ${leg.leg}`);
      assert.ok(leg.spo2_predicted_pct >= 90);
    }
    // Oxygen used: flow × time, rounded up.
    assert.equal(leg.oxygen_used_l, Math.ceil(leg.flow_lpm * leg.duration_min - 1e-9));
  }
  // The col leg and the leg down from it are both counted at the col.
  assert.equal(r.legs[0].pressure_hpa, r.legs[1].pressure_hpa);
  assert.ok(r.legs[0].pressure_hpa < r.legs[3].pressure_hpa);
  assert.equal(r.margin_min, 30);
  assert.equal(r.enough, true);
  assert.match(r.verdict, /^enough, \d+ min spare beyond the 30 min margin$/);
  assert.equal(r.shortfall_min, 0);
  assert.ok(r.spare_min > 0);
  assert.ok(r.max_sustainable_flow_lpm >= Math.max(...r.legs.map((l) => l.flow_lpm)));
  assert.ok(r.cautions.some((c) => c.includes('Highest point of the route: 4950 m')));
  assert.ok(r.cautions.some((c) => /flight cruises at 4300 m, 450 m above/.test(c)));
  assert.ok(!r.cautions.some((c) => /below the healthy band/.test(c)), '72 % at 4700 m is within');
  assert.match(r.estimate, /healthy-lowlander estimate.*titrate to the oximeter/);
  const table = runFirn(['route', '--file', demoRoute]);
  assert.equal(table.status ?? table.code, 0);
  assert.match(table.stdout, /Decision support only/);
  assert.match(table.stdout, /DEMO team profile/);
});

test('route: a casualty below the healthy band gets no "enough" from healthy-lowlander flows', () => {
  const route = clone();
  route.casualty.spo2_on_air = '62%';  // at 4700 m: below the acute band (`firn oxygenation`)
  const o = firnJson(['oxygenation', '--altitude', '4700m', '--spo2', '62']);
  assert.ok(o.spo2_expected_low_pct > 62);
  const r = firnJson(['route', '--file', writeRoute('below.json', route)]);
  assert.equal(r.enough, false);
  assert.match(r.verdict, /^no verdict: this casualty needs more than the healthy-lowlander flows; .* supports a steady \d+ L\/min$/);
  assert.match(r.cautions[0], /Measured 62 % on air at 4700 m is below the healthy band/);
});

test('route: a flat one-cylinder route equals `firn cylinder`', () => {
  const route = clone();
  route.legs = [{ kind: 'wait', at: '0m', duration: '60min', flow: '2L/min' }];
  route.stock = { cylinders: [{ type: '3 L composite', pressure: '200bar', temperature: '15C' }],
    margin: '0min', reserve: '20bar' };
  const r = firnJson(['route', '--file', writeRoute('flat.json', route)]);
  const c = firnJson(['cylinder', '--water-capacity', '3', '--pressure', '200bar', '--flow', '2',
    '--reserve', '20bar', '--temperature', '15C', '--altitude', '0m']);
  // Lasts duration_min in all: spare beyond 60 min rounded down, within the rounding of both.
  assert.ok(Math.abs(r.spare_min - (c.duration_min - 60)) <= 1, `${r.spare_min} vs ${c.duration_min}`);
  assert.equal(r.swaps.length, 0);
  assert.equal(r.legs[0].oxygen_used_l, 120);
});

test('route: mixed cylinders in the order given, swaps as clock times, shortfall in cylinders', () => {
  const route = clone();
  route.legs = [{ kind: 'wait', at: '3850m', duration: '8h', flow: '6L/min' }];
  route.start_time = '22:00';
  const r = firnJson(['route', '--file', writeRoute('long.json', route)]);
  assert.deepEqual(r.swaps.map((s) => [s.from, s.to]),
    [['#1 2 L alloy', '#2 2 L alloy'], ['#2 2 L alloy', '#3 3 L composite']]);
  for (const s of r.swaps) {
    const t = (22 * 60 + s.time_min) % 1440;
    assert.equal(s.clock, `${String(Math.floor(t / 60)).padStart(2, '0')}:${String(t % 60).padStart(2, '0')}`);
  }
  // 6 L/min × 510 min = 3060 L against well under 2000 L usable: short.
  assert.equal(r.enough, false);
  assert.ok(r.shortfall_min > 0);
  assert.match(r.verdict, /^short by \d+ min: \d+ more 2 L alloy cylinders? \(full\)/);
  assert.ok(r.extra_cylinders >= 1);
  assert.ok(r.reserve_reached_min < 480);
});

const badCases = [
  ['legs[0].from', (r) => { r.legs[0].from = '9500m'; }, /legs\[0\]\.from: 9500m \(9500 m\) is outside 0…9000 m/],
  ['legs[1].duration', (r) => { r.legs[1].duration = '30h'; }, /legs\[1\]\.duration: 30h \(1800 min\) is outside 1…1440 min/],
  ['legs[0].kind', (r) => { r.legs[0].kind = 'swim'; }, /legs\[0\]\.kind: "swim": use carry, walk, wait, bag or flight/],
  ['legs[4].at', (r) => { delete r.legs[4].at; }, /legs\[4\]\.at: is missing \(example: 4600m\)/],
  ['legs[2].flush', (r) => { delete r.legs[2].flush; }, /legs\[2\]\.flush: is missing/],
  ['legs[5].flow', (r) => { r.legs[5].flow = '12L/min'; }, /legs\[5\]\.flow: 12 L\/min is outside 0\.5…6 L\/min for a nasal cannula/],
  ['casualty.target_spo2', (r) => { r.casualty.target_spo2 = '70%'; }, /casualty\.target_spo2: 70% \(70 %\) is outside 80…99 %/],
  ['casualty.device', (r) => { r.casualty.device = 'tube'; }, /casualty\.device: unknown oxygen device 'tube'/],
  ['casualty.measured_at', (r) => { delete r.casualty.measured_at; }, /casualty\.measured_at: is missing/],
  ['stock.margin', (r) => { r.stock.margin = '20h'; }, /stock\.margin: 20h \(1200 min\) is outside 0…720 min/],
  ['stock.cylinders[0].type', (r) => { r.stock.cylinders[0].type = '5 L steel'; }, /stock\.cylinders\[0\]\.type: "5 L steel" is not a cylinder type/],
  ['stock.cylinders[1].pressure', (r) => { r.stock.cylinders[1].pressure = '400bar'; }, /stock\.cylinders\[1\]\.pressure: 400bar \(400 bar\) is outside 0…220 bar/],
  ['start_time', (r) => { r.start_time = '25:00'; }, /start_time: "25:00" is not a clock time 00:00…23:59/],
  ['schema_version', (r) => { r.schema_version = 7; }, /schema_version: 7 is outside 1…1 \(written by a newer Firn/],
  ['unknown field', (r) => { r.legs[0].speed = 'fast'; }, /legs\[0\]\.speed: unknown field/]
];

for (const [name, spoil, expected] of badCases) {
  test(`route: a bad route file names ${name} and its valid range (exit 2)`, () => {
    const route = clone();
    spoil(route);
    const message = firnError(['route', '--file', writeRoute(`bad-${name}.json`, route)]);
    assert.match(message, expected);
  });
}

test('route: every mistake at once, missing options, unreadable files', () => {
  const route = clone();
  route.legs[0].from = '9500m';
  route.stock.margin = '20h';
  const message = firnError(['route', '--file', writeRoute('two.json', route)]);
  assert.match(message, /legs\[0\]\.from.*; stock\.margin/);
  assert.match(firnError(['route']), /--file is required/);
  assert.match(firnError(['route', '--file', path.join(work, 'absent.json')]), /cannot read route file/);
  assert.match(firnError(['route', '--file', writeRoute('broken.json', '{"legs": [')]),
    /not valid JSON: line 1/);
  assert.match(firnError(['route', '--file', demoRoute, '--profile', writeRoute('p.json', '{}')]),
    /p\.json: schema_version: is missing/);
});
