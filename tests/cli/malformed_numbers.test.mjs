// CLI: numbers shaped like a thousands-separator habit or with two decimal marks are refused
// (issue 12: "5.200" was read as 5.2 m and sea-level physiology shown). The rule lives in
// core/model/units.cpp (parse_number, ambiguous_grouping) and is shared with the app's keypad.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { firnError, firnJson } from './run_firn.mjs';

test('--altitude 5.200m is refused: 5,200 m or 5.2 m?', () => {
  const message = firnError(['pressure', '--altitude', '5.200m']);
  assert.match(message, /Did you mean 5200 m or 5\.2 m\?/);
  assert.match(message, /without a thousands separator/);
  assert.match(firnError(['oxygenation', '--altitude', '5,200m']), /Did you mean 5200 m/);
});

test('a pressure shaped like 1.013hPa is refused; 29.921inHg is plainly a decimal', () => {
  assert.match(firnError(['altitude', '--pressure', '1.013hPa']), /Did you mean 1013 hPa or 1\.013 hPa\?/);
  // 29,921 inHg would be over a thousand bar: no one means that, so the decimal stands.
  const out = firnJson(['altitude', '--pressure', '29.921inHg', '--model', 'isa']);
  assert.ok(Math.abs(out.altitude_m) < 20, `${out.altitude_m}`);  // ≈ sea level (ISA 29.921 inHg)
});

test('1.2.3 is refused, never read as 1.23', () => {
  assert.match(firnError(['pressure', '--altitude', '1.2.3m']), /more than one decimal mark/);
  assert.match(firnError(['pressure', '--altitude', '1,234.5m']), /more than one decimal mark/);
});

test('plain numbers still read: 5200m, 5.2m, 0.500m, 5.200km', () => {
  assert.equal(firnJson(['pressure', '--altitude', '5200m']).altitude_m, 5200);
  assert.ok(Math.abs(firnJson(['pressure', '--altitude', '5.2m']).altitude_m - 5.2) < 1e-9);
  assert.ok(Math.abs(firnJson(['pressure', '--altitude', '5.200km']).altitude_m - 5200) < 1e-9);
});
