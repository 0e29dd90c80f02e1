// `firn bag`: exit codes, JSON keys and values vs published sources, bad-input messages.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { firn, firnResult as firnJson } from './run_firn.mjs';

test('Taber 1990 worked example: 4243 m, 2 psi ≈ 2560 m (West 1996 model, ±30 m)', () => {
  // Taber RL, protocols for the use of a portable hyperbaric chamber (1990).
  const r = firnJson('bag', '--altitude', '4243m');
  assert.equal(r.code, 0);
  assert.equal(r.json.model, 'west');
  assert.ok(Math.abs(r.json.equivalent_altitude_m - 2560) <= 30, `${r.json.equivalent_altitude_m}`);
  // Inside = ambient + 2 psi (= 137.9 hPa, domain units).
  assert.ok(Math.abs(r.json.inside_pressure_hpa - r.json.ambient_pressure_hpa - 137.9) <= 0.15);
  assert.ok(Math.abs(r.json.descent_equivalent_m - (4243 - r.json.equivalent_altitude_m)) <= 1);
  assert.equal(r.json.co2_pct, undefined, 'no CO2 without a flush');
});

test('ISA model option: same bag, ISA inverted both ways', () => {
  // USSA 1976 Table I (geometric altitude): 4000 m → 616.60 hPa; 3000 m → 701.21 hPa.
  const r = firnJson('bag', '--altitude', '4000m', '--model', 'isa');
  assert.equal(r.code, 0);
  assert.ok(Math.abs(r.json.ambient_pressure_hpa - 616.6) <= 0.1);
  assert.ok(Math.abs(r.json.inside_pressure_hpa - (616.6 + 137.9)) <= 0.2);
  // 754.5 hPa is more than the 701.21 hPa of 3000 m, so the bag is below 3000 m in ISA...
  assert.ok(r.json.equivalent_altitude_m < 3000);
  // ...and it is exactly what `firn altitude` gives for that pressure with the same model.
  const back = firnJson('altitude', '--pressure', `${r.json.inside_pressure_hpa}hPa`,
    '--model', 'isa').json;
  assert.ok(Math.abs(back.altitude_m - r.json.equivalent_altitude_m) <= 2);
});

test('gas-balance study: 52 L/min fresh air keeps CO2 < 1 % and O2 > 20 %', () => {
  // Published gas-balance study of a portable chamber (fresh air 52 L/min, 90 min).
  for (const alt of ['0m', '4500m']) {
    const r = firnJson('bag', '--altitude', alt, '--flush', '52');
    assert.equal(r.code, 0);
    assert.ok(r.json.co2_pct < 1, `co2 ${r.json.co2_pct}`);
    assert.ok(r.json.o2_pct > 20, `o2 ${r.json.o2_pct}`);
    assert.ok(Math.abs(r.json.time_constant_min - 480 / 52) <= 0.05);
    assert.ok(r.json.min_flush_lpm < 52);
  }
});

test('more flush gives less CO2; oxygen feed raises O2 and PiO2', () => {
  const low = firnJson('bag', '--altitude', '5000m', '--flush', '20').json;
  const high = firnJson('bag', '--altitude', '5000m', '--flush', '80').json;
  assert.ok(high.co2_pct < low.co2_pct);
  const fed = firnJson('bag', '--altitude', '5000m', '--flush', '20', '--o2-feed', '2').json;
  assert.ok(fed.o2_pct > low.o2_pct);
  assert.ok(fed.pio2_mmhg > low.pio2_mmhg);
  const pump = firnJson('bag', '--altitude', '5000m', '--flush', '40', '--stroke-volume', '1').json;
  assert.ok(pump.strokes_per_min > 40, 'strokes of outside air shrink inside the bag');
});

test('PiO2 inside = 0.2095 × (P − 47 mmHg) without a flush', () => {
  const r = firnJson('bag', '--altitude', '4000m').json;
  assert.ok(Math.abs(r.pio2_mmhg - 0.2095 * (r.inside_pressure_mmhg - 47)) <= 0.1);
});

test('bad input: exit 2, range and unit on stderr, {"error"} with --json', () => {
  const gauge = firn('bag', '--altitude', '4000m', '--gauge', '300mbar');
  assert.equal(gauge.code, 2);
  assert.match(gauge.stderr, /between 0 and 250 mbar/);
  assert.equal(gauge.stderr.trim().split('\n').length, 1);
  const j = firnJson('bag', '--altitude', '4000m', '--flush', '1');
  assert.equal(j.code, 2);
  assert.match(j.json.error, /between 5 and 300 L\/min/);
  const high = firn('bag', '--altitude', '9500m');
  assert.equal(high.code, 2);
  assert.match(high.stderr, /between 0 and 9000 m/);
  const missing = firn('bag');
  assert.equal(missing.code, 2);
  assert.match(missing.stderr, /--altitude is required/);
  const nan = firn('bag', '--altitude', '4000m', '--flush', 'nan');
  assert.equal(nan.code, 2);
});
