// `firn cylinder`: exit codes, JSON keys and values vs published sources, bad-input messages.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { firn, firnResult as firnJson } from './run_firn.mjs';

test('US field rule for an E cylinder: (2000 − 200) × 0.28 / 10 = 50.4 min, shown as 50', () => {
  // Factor method, common practice in EMS references (E factor 0.28, 200 psi residual).
  // Durations are whole minutes rounded DOWN (issue 11, CLI contract).
  const r = firnJson('cylinder', '--size', 'E', '--pressure', '2000psi', '--flow', '10');
  assert.equal(r.code, 0);
  assert.equal(r.json.duration_field_rule_min, 50);
  assert.ok(r.json.contents_l > 0 && r.json.duration_min > 0);
  for (const [size, factor] of [['D', 0.16], ['M', 1.56], ['H', 3.14]]) {
    // D: 1500 × 0.16 / 6 = 40 exactly; M: 390 exactly; H: 785 exactly; at 7 L/min they are not.
    const s = firnJson('cylinder', '--size', size, '--pressure', '1700psi', '--flow', '7').json;
    assert.equal(s.duration_field_rule_min, Math.floor((1700 - 200) * factor / 7));
    assert.ok(Number.isInteger(s.duration_min));
  }
  // The lower figure leads: the rule (50) is below the real-gas estimate with the assumed 4.6 L.
  assert.ok(r.json.duration_min > 50);
  assert.equal(r.json.duration_lead_min, 50);
  assert.equal(r.json.duration_lead_basis, 'field_rule');
});

test('letter-size capacity is named as an assumption; the team may give its own', () => {
  const assumed = firnJson('cylinder', '--size', 'E', '--pressure', '2000psi', '--flow', '10').json;
  assert.equal(assumed.water_capacity_assumed, true);
  assert.match(assumed.water_capacity_assumption, /4\.6 L assumed.*vary by maker/);
  // A maker's smaller E (3.6 L): the real-gas estimate is now the lower and leads.
  const own = firnJson('cylinder', '--size', 'E', '--water-capacity', '3.6', '--pressure', '2000psi',
    '--flow', '10').json;
  assert.equal(own.water_capacity_assumed, false);
  assert.equal(own.water_capacity_l, 3.6);
  assert.equal(own.duration_field_rule_min, 50);
  assert.ok(own.duration_min < 50);
  assert.equal(own.duration_lead_basis, 'real_gas');
  assert.equal(own.duration_lead_min, own.duration_min);
});

test('one default reserve (20 bar), below it a plain instruction', () => {
  const r = firnJson('cylinder', '--water-capacity', '2', '--pressure', '200bar', '--flow', '4').json;
  assert.equal(r.reserve_bar, 20);
  assert.equal(r.reserve_psi, 290);
  const low = firnJson('cylinder', '--water-capacity', '2', '--pressure', '15bar', '--flow', '4');
  assert.equal(low.code, 0);
  assert.equal(low.json.below_reserve, true);
  assert.equal(low.json.duration_min, 0);
  const table = firn('cylinder', '--water-capacity', '2', '--pressure', '15bar', '--flow', '4');
  assert.match(table.stdout, /Below the reserve: change the cylinder now/);
});

test('gauge units only (bar, psi, kPa, MPa) and flows with their unit', () => {
  // 20 MPa = 200 bar = 20000 kPa (SI Brochure 2019).
  const mpa = firnJson('cylinder', '--water-capacity', '10', '--pressure', '20MPa', '--flow', '2L/min').json;
  const kpa = firnJson('cylinder', '--water-capacity', '10', '--pressure', '20000kPa', '--flow', '2').json;
  assert.equal(mpa.pressure_bar, 200);
  assert.deepEqual(mpa, kpa);
  const psig = firnJson('cylinder', '--size', 'E', '--pressure', '2000psig', '--flow', '10').json;
  assert.equal(psig.duration_field_rule_min, 50);
  const air = firn('cylinder', '--water-capacity', '10', '--pressure', '200000hPa', '--flow', '2');
  assert.equal(air.code, 2);
  assert.match(air.stderr, /a gauge reads in bar, psi \(gauge\), kPa or MPa/);
  const absolute = firn('cylinder', '--water-capacity', '10', '--pressure', '2900psia', '--flow', '2');
  assert.equal(absolute.code, 2);
  assert.match(absolute.stderr, /psia is absolute/);
});

test('temperature: a cold figure that claims more gas is called out; above 300 K extrapolated', () => {
  // Issue 11: 10 L at 200 bar, 2128 L at 15 °C, 2633 L (+24 %) at −20 °C with the same gauge.
  const base = ['--water-capacity', '10', '--pressure', '200bar', '--flow', '6'];
  const cold = firnJson('cylinder', ...base, '--temperature', '-20C').json;
  assert.ok(Math.abs(cold.cold_gain_pct - 24) <= 1);
  assert.match(cold.temperature_cautions[0], /24 % more oxygen.*enter the warmer one/);
  assert.equal(cold.extrapolated, false);
  const mild = firnJson('cylinder', ...base).json;
  assert.deepEqual(mild.temperature_cautions, []);
  // The oxygen EOS is published to 300 K (Stewart, Jacobsen & Wagner 1991).
  const hot = firnJson('cylinder', ...base, '--temperature', '35C').json;
  assert.equal(hot.extrapolated, true);
  assert.match(hot.temperature_cautions[0], /extrapolated/);
  const table = firn('cylinder', ...base);
  assert.match(table.stdout, /when unsure, enter the warmer one/);
});

test('a measured ambient pressure instead of an altitude', () => {
  // West 1996 at 5000 m gives ~558.6 hPa; the same pressure measured gives the same figures.
  const byAltitude = firnJson('cylinder', '--size', 'E', '--pressure', '2000psi', '--flow', '10',
    '--altitude', '5000m').json;
  const measured = firnJson('cylinder', '--size', 'E', '--pressure', '2000psi', '--flow', '10',
    '--ambient-pressure', `${byAltitude.ambient_pressure_hpa}hPa`).json;
  assert.equal(measured.ambient_pressure_source, 'measured');
  assert.equal(byAltitude.ambient_pressure_source, 'altitude');
  assert.equal(measured.contents_l, byAltitude.contents_l);
  assert.equal(measured.rotameter_actual_lpm, byAltitude.rotameter_actual_lpm);
  const both = firn('cylinder', '--size', 'E', '--pressure', '2000psi', '--flow', '10',
    '--altitude', '5000m', '--ambient-pressure', '560hPa');
  assert.equal(both.code, 2);
  const low = firn('cylinder', '--size', 'E', '--pressure', '2000psi', '--flow', '10',
    '--ambient-pressure', '100hPa');
  assert.equal(low.code, 2);
  assert.match(low.stderr, /between 150 and 1100 hPa/);
});

test('real-gas contents vs the Schmidt & Wagner Z table (10 L, 200 bar abs, 15 °C)', () => {
  // Z(200 bar, 15 °C) = 0.9311, Z(1 atm, 15 °C) = 0.9992: Schmidt & Wagner (1985) as given in
  // Stewart, Jacobsen & Wagner, J Phys Chem Ref Data 1991;20:917.
  const gaugeBar = 200 - 1.01325;
  const r = firnJson('cylinder', '--water-capacity', '10', '--pressure', `${gaugeBar}bar`,
    '--flow', '15', '--reserve', '0bar');
  assert.equal(r.code, 0);
  const expected = 10 * (200 / 1.01325) * 0.9992 / 0.9311;
  assert.ok(Math.abs(r.json.contents_l - expected) <= 2, `${r.json.contents_l} vs ${expected}`);
  // Whole minutes rounded down: within a minute below (contents ±2 L is ±0.14 min at 15 L/min).
  // A 0 bar gauge reserve still holds 10 L at 1 atm: usable = contents − 10 L.
  assert.ok(Number.isInteger(r.json.duration_min));
  const lag = (expected - 10) / 15 - r.json.duration_min;
  assert.ok(lag >= -0.14 && lag < 1.14, `${r.json.duration_min} min vs ${expected / 15}`);
  // Metric rule (common practice): 10 L × 200 bar ≈ 2000 L; the real gas holds ~7 % more.
  assert.ok(r.json.contents_l > r.json.ideal_contents_l * 1.06);
  assert.equal(r.json.duration_field_rule_min, undefined);
});

test('colder cylinder at the same gauge holds more; contents rise with pressure', () => {
  const base = ['--water-capacity', '10', '--flow', '6'];
  const cold = firnJson('cylinder', ...base, '--pressure', '200bar', '--temperature', '-20C').json;
  const warm = firnJson('cylinder', ...base, '--pressure', '200bar', '--temperature', '30C').json;
  assert.ok(cold.contents_l > warm.contents_l);
  const half = firnJson('cylinder', ...base, '--pressure', '100bar').json;
  const full = firnJson('cylinder', ...base, '--pressure', '200bar').json;
  assert.ok(full.contents_l > half.contents_l);
});

test('altitude: rotameter density correction and fixed-orifice note', () => {
  // Rotameter density correction (manufacturers' technical notes): actual ≈ indicated ×
  // sqrt(P_cal/P_ambient). West 1996 at 5000 m: 419 Torr = 558.6 hPa.
  const r = firnJson('cylinder', '--size', 'E', '--pressure', '2000psi', '--flow', '10',
    '--altitude', '5000m');
  assert.equal(r.code, 0);
  const expected = 10 * Math.sqrt(1013.25 / r.json.ambient_pressure_hpa);
  assert.ok(Math.abs(r.json.ambient_pressure_hpa - 558.6) <= 1.5);
  assert.ok(Math.abs(r.json.rotameter_actual_lpm - expected) <= 0.06);
  assert.ok(r.json.fixed_orifice_free_gas_lpm < 10);
  assert.equal(r.json.flow_notes.length, 2);
});

test('bad input: exit 2, range and unit on stderr, {"error"} with --json', () => {
  const flow = firn('cylinder', '--size', 'E', '--pressure', '2000psi', '--flow', '50');
  assert.equal(flow.code, 2);
  assert.match(flow.stderr, /between 0.1 and 30 L\/min/);
  assert.equal(flow.stderr.trim().split('\n').length, 1);
  const p = firnJson('cylinder', '--water-capacity', '10', '--pressure', '500bar', '--flow', '5');
  assert.equal(p.code, 2);
  assert.match(p.json.error, /between 0 and 350 bar/);
  const size = firn('cylinder', '--size', 'Q', '--pressure', '2000psi', '--flow', '5');
  assert.equal(size.code, 2);
  assert.match(size.stderr, /D, E, M or H/);
  const unitless = firn('cylinder', '--size', 'E', '--pressure', '2000', '--flow', '5');
  assert.equal(unitless.code, 2);
  const neither = firn('cylinder', '--pressure', '200bar', '--flow', '5');
  assert.equal(neither.code, 2);
  assert.match(neither.stderr, /--water-capacity/);
  const cold = firn('cylinder', '--water-capacity', '10', '--pressure', '200bar', '--flow', '5',
    '--temperature', '-60C');
  assert.equal(cold.code, 2);
  assert.match(cold.stderr, /between -40 and 60 °C/);
});
