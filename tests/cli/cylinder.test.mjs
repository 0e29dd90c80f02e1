// `firn cylinder`: exit codes, JSON keys and values vs published sources, bad-input messages.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { firn, firnResult as firnJson } from './run_firn.mjs';

test('US field rule for an E cylinder: (2000 − 200) × 0.28 / 10 = 50.4 min', () => {
  // Factor method, common practice in EMS references (E factor 0.28, 200 psi residual).
  const r = firnJson('cylinder', '--size', 'E', '--pressure', '2000psi', '--flow', '10');
  assert.equal(r.code, 0);
  assert.equal(r.json.duration_field_rule_min, 50);
  assert.ok(r.json.contents_l > 0 && r.json.duration_min > 0);
  for (const [size, factor] of [['D', 0.16], ['M', 1.56], ['H', 3.14]]) {
    const s = firnJson('cylinder', '--size', size, '--pressure', '1700psi', '--flow', '6').json;
    assert.equal(s.duration_field_rule_min, Math.round((1700 - 200) * factor / 6));
  }
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
  assert.ok(Math.abs(r.json.duration_min - expected / 15) <= 0.5);
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
