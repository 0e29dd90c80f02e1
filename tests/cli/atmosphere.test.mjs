// CLI: `firn pressure` and `firn altitude`.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { runFirn, firnJson, firnError } from './run_firn.mjs';

test('pressure at 3000 m, ISA: 701.21 hPa (U.S. Standard Atmosphere 1976, Table I)', () => {
  const out = firnJson(['pressure', '--altitude', '3000m', '--model', 'isa']);
  assert.equal(out.pressure_hpa, 701.21);
  assert.ok(Math.abs(out.pressure_mmhg - 525.95) < 0.1);
  assert.equal(out.model, 'isa');
  // Both models side by side.
  assert.equal(out.isa_pressure_hpa, 701.21);
  assert.ok(out.west_pressure_hpa > out.isa_pressure_hpa);
});

test('pressure at 5000 m, West 1996 is the default model: 419 Torr (West 1996 table, ±1 Torr)', () => {
  const out = firnJson(['pressure', '--altitude', '5000m']);
  assert.equal(out.model, 'west');
  assert.ok(Math.abs(out.pressure_mmhg - 419) <= 1.0, `${out.pressure_mmhg}`);
});

test('altitude units: 13120 ft is 3999 m', () => {
  const out = firnJson(['pressure', '--altitude', '13120ft', '--model', 'isa']);
  assert.ok(Math.abs(out.altitude_m - 3999.0) < 0.1);
});

test('altitude from pressure inverts the model', () => {
  const out = firnJson(['altitude', '--pressure', '500hPa', '--model', 'west']);
  assert.ok(Math.abs(out.altitude_m - 5887) < 1, `${out.altitude_m}`);
  const back = firnJson(['pressure', '--altitude', `${out.altitude_m}m`, '--model', 'west']);
  assert.ok(Math.abs(back.pressure_hpa - 500) < 0.05);
  // Everest summit, measured 253 Torr (West et al. 1983) → about 8848 m by West's model.
  const everest = firnJson(['altitude', '--pressure', '253mmHg', '--model', 'west']);
  assert.ok(Math.abs(everest.altitude_m - 8848) < 80, `${everest.altitude_m}`);
});

test('pressure from QNH and temperature', () => {
  const standard = firnJson(['pressure', '--altitude', '3000m', '--qnh', '1013.25hPa']);
  assert.equal(standard.pressure_hpa, 701.21);
  const cold = firnJson(['pressure', '--altitude', '3000m', '--qnh', '1013.25hPa', '--temperature', '-10C']);
  assert.ok(cold.pressure_hpa < standard.pressure_hpa - 5);
  const fahrenheit = firnJson(['pressure', '--altitude', '3000m', '--qnh', '29.92inHg', '--temperature', '14F']);
  assert.ok(Math.abs(fahrenheit.pressure_hpa - cold.pressure_hpa) < 0.2);
});

test('human table without --json', () => {
  const { code, stdout } = runFirn(['pressure', '--altitude', '3000m', '--model', 'isa']);
  assert.equal(code, 0);
  assert.match(stdout, /Barometric pressure\s+701\.21 hPa/);
});

test('bad input: exit 2, one line naming the range and unit', () => {
  assert.match(firnError(['pressure', '--altitude', '25000m', '--model', 'isa']),
               /between -500 and 20000 m/);
  assert.match(firnError(['pressure', '--altitude', '9500m']), /between 0 and 9000 m/);
  assert.match(firnError(['pressure', '--altitude', '3000']), /needs a unit: m, ft or km/);
  assert.match(firnError(['pressure', '--altitude', '3000yd']), /unknown unit 'yd'/);
  assert.match(firnError(['pressure', '--altitude', 'nanm']), /not a number/);
  assert.match(firnError(['pressure']), /--altitude is required/);
  assert.match(firnError(['pressure', '--altitude', '3000m', '--model', 'mars']), /use isa or west/);
  assert.match(firnError(['altitude', '--pressure', '5hPa']), /hPa/);
  assert.match(firnError(['pressure', '--altitude', '3000m', '--qnh', '500hPa']), /900 and 1100 hPa/);
  assert.match(firnError(['pressure', '--altitude', '3000m', '--bogus']), /bogus/);
  const plain = runFirn(['pressure', '--altitude', '-900m']);
  assert.equal(plain.code, 2);
  assert.equal(plain.stdout, '');
});
