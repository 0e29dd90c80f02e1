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
  // West 1996 solved by hand for 375.03 Torr: 5.8816 km (with the corrected 6.63268).
  assert.ok(Math.abs(out.altitude_m - 5882) < 1, `${out.altitude_m}`);
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

// Issue 11 §6: latitude and month (NRLMSISE-00), QNH caveat, station reading vs altitude.
test('--latitude 60 --month 1/7 at 5 km: NRLMSISE-00 383.6 / 406.4 Torr (Picone 2002, via python3-fluids)', () => {
  const winter = firnJson(['pressure', '--altitude', '5000m', '--latitude', '60', '--month', '1']);
  assert.ok(Math.abs(winter.pressure_mmhg - 383.6) <= 0.15, `${winter.pressure_mmhg}`);
  assert.equal(winter.latitude_deg, 60);
  assert.equal(winter.month, 1);
  assert.equal(winter.method, 'latitude-month (NRLMSISE-00)');
  assert.equal(winter.pressure_source, 'latitude-month (NRLMSISE-00)');
  const summer = firnJson(['pressure', '--altitude', '5000m', '--latitude', '60', '--month', '7']);
  assert.ok(Math.abs(summer.pressure_mmhg - 406.4) <= 0.15, `${summer.pressure_mmhg}`);
  // West JB 1996 (J Appl Physiol 81:1850): 387 winter / 406 summer at 60°N, 5 km: within 1 %.
  assert.ok(Math.abs(winter.pressure_mmhg / 387 - 1) < 0.01);
  // The low-latitude models stay beside it.
  assert.ok(winter.west_pressure_hpa > winter.pressure_hpa + 30);
  // Southern hemisphere: July is winter at 60°S (NRLMSISE-00: 378.2 Torr).
  const south = firnJson(['pressure', '--altitude', '5000m', '--latitude', '-60', '--month', '7']);
  assert.ok(Math.abs(south.pressure_mmhg - 378.2) <= 0.15, `${south.pressure_mmhg}`);
});

test('altitude from pressure by latitude and month inverts the pressure', () => {
  const out = firnJson(['altitude', '--pressure', '383.63mmHg', '--latitude', '60', '--month', '1']);
  assert.ok(Math.abs(out.altitude_m - 5000) < 2, `${out.altitude_m}`);
  assert.equal(out.pressure_source, 'latitude-month (NRLMSISE-00)');
});

test('latitude and month: both or neither, in range, not with measured pressures', () => {
  assert.match(firnError(['pressure', '--altitude', '5000m', '--latitude', '60']), /--latitude needs --month/);
  assert.match(firnError(['pressure', '--altitude', '5000m', '--month', '1']), /--month needs --latitude/);
  assert.match(firnError(['pressure', '--altitude', '5000m', '--latitude', '91', '--month', '1']),
    /between -90 and 90/);
  assert.match(firnError(['pressure', '--altitude', '5000m', '--latitude', '60', '--month', '13']),
    /between 1 and 12/);
  assert.match(firnError(['pressure', '--altitude', '5000m', '--latitude', '60', '--month', '2.5']),
    /whole number/);
  assert.match(firnError(['pressure', '--altitude', '9500m', '--latitude', '60', '--month', '1']),
    /between 0 and 9000 m/);
  assert.match(firnError(['pressure', '--altitude', '5000m', '--qnh', '1013hPa', '--latitude', '60', '--month', '1']),
    /not with --qnh/);
});

test('QNH with a temperature carries the standard-atmosphere caveat and the standard-lapse figure', () => {
  const out = firnJson(['pressure', '--altitude', '4000m', '--qnh', '1013.25hPa', '--temperature', '-25C',
    '--temperature-at', 'station']);
  // ICAO Doc 8168: QNH is reduced with the standard atmosphere; standard lapse = ISA at 4000 m
  // when QNH is 1013.25 (616.60 hPa, USSA 1976 Table I at geometric 4000 m).
  assert.ok(Math.abs(out.standard_lapse_pressure_hpa - 616.60) <= 0.01, `${out.standard_lapse_pressure_hpa}`);
  // 4000 m, −25 °C at the station: the two differ by ~16 hPa (hypsometric equation).
  assert.ok(out.standard_lapse_pressure_hpa - out.pressure_hpa > 10);
  assert.match(out.qnh_note, /not a true sea-level pressure/);
  assert.ok(out.pressure_hpa < out.standard_lapse_pressure_hpa);
  const table = runFirn(['pressure', '--altitude', '4000m', '--qnh', '1013.25hPa', '--temperature', '-25C']);
  assert.match(table.stdout, /standard-atmosphere reduction/);
});

test('station reading with an altitude is cross-checked', () => {
  // Issue 11 §6: above 950 hPa at over 1,500 m is probably a sea-level figure.
  const qnh = firnJson(['pressure', '--station', '1013hPa', '--altitude', '3000m']);
  assert.equal(qnh.station_check, 'sea_level_figure');
  assert.equal(qnh.method, 'station');
  assert.equal(qnh.pressure_hpa, 1013);
  assert.match(qnh.station_check_message, /probably a sea-level figure/);
  // ISA at 3000 m, 701.21 hPa (USSA 1976 Table I): consistent.
  const ok = firnJson(['pressure', '--station', '701.21hPa', '--altitude', '3000m', '--model', 'isa']);
  assert.equal(ok.station_check, 'consistent');
  assert.ok(Math.abs(ok.pressure_altitude_m - 3000) < 1);
  // ISA's 5000 m pressure typed at 3000 m: no latitude or month gives that.
  const wrong = firnJson(['pressure', '--station', '540.5hPa', '--altitude', '3000m']);
  assert.equal(wrong.station_check, 'mismatch');
  assert.ok(wrong.expected_low_hpa > 540.5);
  // Without an altitude: the reading and its pressure altitude, no check.
  const alone = firnJson(['pressure', '--station', '616hPa']);
  assert.equal(alone.station_check, undefined);
  // West 1996 solved by hand for 462.0 Torr: 4.23 km.
  assert.ok(Math.abs(alone.pressure_altitude_m - 4230) < 5, `${alone.pressure_altitude_m}`);
  assert.match(firnError(['pressure', '--station', '700hPa', '--qnh', '1013hPa']), /not both/);
});
