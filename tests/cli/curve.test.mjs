// CLI: `firn curve` P50 (issue 11 §7). Definition of P50 (any physiology text): the PO2 at which
// haemoglobin is half saturated; a requested P50 must be the shifted curve's own.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { firnJson } from './run_firn.mjs';

test('--p50 30mmHg reports 30.0 and S(P50) = 50 %', () => {
  const out = firnJson(['curve', '--po2', '30mmHg', '--p50', '30mmHg']);
  assert.equal(out.p50_mmhg, 30);
  assert.ok(Math.abs(out.so2_pct - 50) < 0.05, `${out.so2_pct}`);
});

test('standard curve: P50 26.86 mmHg, the root of the Severinghaus 1979 equation at 50 %', () => {
  // P³ + 150·P = 23400 → P = 26.857 (solved by hand); the CLI prints 0.1 mmHg.
  const out = firnJson(['curve', '--po2', '40mmHg']);
  assert.ok(Math.abs(out.p50_mmhg - 26.857) <= 0.05, `${out.p50_mmhg}`);
});
