// `firn bag`: exit codes, JSON keys and values vs published sources, bad-input messages.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { firn, firnResult as firnJson } from './run_firn.mjs';

test('Taber 1990 worked example: 4243 m, 2 psi ≈ 2560 m (West 1996 model, ±30 m)', () => {
  // Taber RL, protocols for the use of a portable hyperbaric chamber (1990).
  const r = firnJson('bag', '--altitude', '4243m');
  assert.equal(r.code, 0);
  assert.equal(r.json.model, 'west');
  assert.ok(Math.abs(r.json.pressure_equivalent_altitude_m - 2560) <= 30,
    `${r.json.pressure_equivalent_altitude_m}`);
  // No flush: the gas inside is unknown, so the pressure figure is the limiting one and the
  // verdict asks for a flush.
  assert.equal(r.json.equivalent_altitude_m, r.json.pressure_equivalent_altitude_m);
  assert.equal(r.json.oxygen_equivalent_altitude_m, null);
  assert.equal(r.json.limited_by, 'pressure');
  assert.equal(r.json.verdict, 'flush_more');
  assert.equal(r.json.fire_risk, false);
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
  assert.match(gauge.stderr, /between 0 and 250 hPa/);
  assert.equal(gauge.stderr.trim().split('\n').length, 1);
  const j = firnJson('bag', '--altitude', '4000m', '--flush', '1');
  assert.equal(j.code, 2);
  assert.match(j.json.error, /between 5 and 300 L\/min/);
  const high = firn('bag', '--altitude', '9500m');
  assert.equal(high.code, 2);
  assert.match(high.stderr, /between 0 and 9000 m/);
  const missing = firn('bag');
  assert.equal(missing.code, 2);
  assert.match(missing.stderr, /--altitude or --pressure is required/);
  const nan = firn('bag', '--altitude', '4000m', '--flush', 'nan');
  assert.equal(nan.code, 2);
});

// West 1996 by hand (West JB, J Appl Physiol 1996;81:1850): PB = exp(6.63268 − 0.1112 h −
// 0.00149 h²) mmHg, h in km; inverted by the quadratic formula.
const westMmhg = (m) => Math.exp(6.63268 - 0.1112 * m / 1000 - 0.00149 * (m / 1000) ** 2);
const westAltitude = (mmhg) => {
  const c = Math.log(mmhg) - 6.63268;
  return 1000 * (-0.1112 + Math.sqrt(0.1112 ** 2 - 4 * 0.00149 * c)) / (2 * 0.00149);
};
// Where dry ambient air gives this PiO2: 0.2095 × (PB − 47) = PiO2.
const oxygenAltitude = (pio2) => westAltitude(pio2 / 0.2095 + 47);

test('4000 m, flush 5 L/min: O2 14.1 %, CO2 5.8 %, PiO2 75 vs 90 mmHg → flush more, no descent', () => {
  // Hand steps in tests/unit/test_hyperbaric_bag.cpp (resting VCO2 0.20, VO2 0.25 L/min STPD).
  const r = firnJson('bag', '--altitude', '4000m', '--flush', '5').json;
  assert.ok(Math.abs(r.o2_pct - 14.10) <= 0.01, `o2 ${r.o2_pct}`);
  assert.ok(Math.abs(r.co2_pct - 5.76) <= 0.01, `co2 ${r.co2_pct}`);
  assert.ok(Math.abs(r.pio2_mmhg - 75.0) <= 0.1 && Math.abs(r.pio2_ambient_mmhg - 89.7) <= 0.1);
  assert.equal(r.verdict, 'flush_more');
  assert.equal(r.descent_equivalent_m, null);
  assert.equal(r.limited_by, 'oxygen');
  assert.ok(r.oxygen_equivalent_altitude_m > 4000);
  assert.ok(Math.abs(r.oxygen_equivalent_altitude_m - oxygenAltitude(r.pio2_mmhg)) <= 5);
  assert.equal(r.equivalent_altitude_m, r.oxygen_equivalent_altitude_m);
  assert.equal(r.verdict_text, 'Flush more: at least 30 L/min');
  assert.match(r.reason, /CO2 inside 5\.8 %.*PiO2 75 vs 90 mmHg/);
  // With a pump: strokes of outside air, each taking 1.5 × PB/P_inside litres inside.
  const p = firnJson('bag', '--altitude', '4000m', '--flush', '5', '--stroke-volume', '1.5').json;
  const strokes = p.required_flush_lpm / (1.5 * p.ambient_pressure_hpa / p.inside_pressure_hpa);
  assert.ok(Math.abs(p.required_strokes_per_min - strokes) <= 0.1);
  assert.equal(p.verdict_text, `Flush more: at least 30 L/min, or ${Math.ceil(p.required_strokes_per_min)} strokes/min`);
});

test('52 L/min (gas-balance study): ok; the oxygen inside limits the descent', () => {
  const r = firnJson('bag', '--altitude', '4000m', '--flush', '52').json;
  assert.equal(r.verdict, 'ok');
  const pIn = westMmhg(4000) + 2 * 6894.757293168 / (101325 / 760);
  assert.ok(Math.abs(r.pressure_equivalent_altitude_m - westAltitude(pIn)) <= 1);
  // pio2_mmhg is printed to 0.1 mmHg: about 3 m of altitude near 2600 m.
  assert.ok(Math.abs(r.oxygen_equivalent_altitude_m - oxygenAltitude(r.pio2_mmhg)) <= 5);
  assert.ok(r.oxygen_equivalent_altitude_m > r.pressure_equivalent_altitude_m);
  assert.equal(r.limited_by, 'oxygen');
  assert.equal(r.equivalent_altitude_m, r.oxygen_equivalent_altitude_m);
  assert.ok(Math.abs(r.descent_equivalent_m - (4000 - r.equivalent_altitude_m)) <= 1);
  assert.match(r.verdict_text, /^Descent equivalent 1387 m \(to 2613 m\): the oxygen inside limits it$/);
  assert.ok(r.required_flush_lpm <= 52);
});

test('oxygen feed: pressure limits, fire risk above 23.5 % O2 (NFPA 99 oxygen-enriched)', () => {
  const fed = firnJson('bag', '--altitude', '4500m', '--flush', '40', '--o2-feed', '4').json;
  assert.ok(fed.o2_pct > 23.5);
  assert.equal(fed.fire_risk, true);
  assert.match(fed.fire_caution, /above 23\.5 %.*NFPA 99.*mask inside the bag/);
  assert.equal(fed.limited_by, 'pressure');
  const air = firnJson('bag', '--altitude', '4500m', '--flush', '40').json;
  assert.equal(air.fire_risk, false);
  assert.equal(air.fire_caution, undefined);
});

test('--vco2, --vo2, --chamber-temperature: a shivering casualty and a warm bag need more flush', () => {
  const rest = firnJson('bag', '--altitude', '4500m').json;
  assert.equal(rest.vco2_lpm, 0.2);
  assert.equal(rest.vo2_lpm, 0.25);
  assert.equal(rest.chamber_temperature_c, 20);
  // CO2 ≈ VCO2 / flush: four times the output needs about four times the flush.
  const shiver = firnJson('bag', '--altitude', '4500m', '--vco2', '0.8', '--vo2', '1').json;
  assert.ok(Math.abs(shiver.required_flush_lpm / rest.required_flush_lpm - 4) <= 0.05);
  // Gas volume ∝ absolute temperature: 308.15 / 293.15 more at 35 °C.
  const warm = firnJson('bag', '--altitude', '4500m', '--chamber-temperature', '35C').json;
  assert.ok(Math.abs(warm.required_flush_lpm / rest.required_flush_lpm - 308.15 / 293.15) <= 0.005);
  assert.equal(firn('bag', '--altitude', '4500m', '--vo2', '3').code, 2);
});

test('--pressure: a measured ambient pressure gives the same bag as its West altitude', () => {
  const byAltitude = firnJson('bag', '--altitude', '4000m', '--flush', '40').json;
  const byPressure = firnJson('bag', '--pressure', `${byAltitude.ambient_pressure_hpa}hPa`,
    '--flush', '40').json;
  assert.ok(Math.abs(byPressure.altitude_m - 4000) <= 1);
  assert.ok(Math.abs(byPressure.oxygen_equivalent_altitude_m - byAltitude.oxygen_equivalent_altitude_m) <= 2);
  assert.equal(byPressure.verdict, byAltitude.verdict);
  const both = firn('bag', '--altitude', '4000m', '--pressure', '616hPa');
  assert.equal(both.code, 2);
  assert.match(both.stderr, /--altitude or --pressure, not both/);
  const low = firn('bag', '--pressure', '300hPa');
  assert.equal(low.code, 2);
  assert.match(low.stderr, /between 330 and 1012\.6 hPa/);
});
