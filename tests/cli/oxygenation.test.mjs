// CLI: `firn oxygenation` (cascade + expected SpO2 band) and `firn curve` (dissociation).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { runFirn, firnJson, firnError } from './run_firn.mjs';

const near = (actual, expected, tolerance, what) =>
  assert.ok(Math.abs(actual - expected) <= tolerance,
    `${what}: ${actual} not within ${tolerance} of ${expected}`);

// Botella de Maglia J et al., Med Clin (Barc) 2005;124:172, regressions (h in m).
const botellaUnacclimatised = (h) => 98.8183 - 0.0001 * h - 0.000001 * h * h;
const botellaAcclimatised = (h) => 98.2171 + 0.0012 * h - 0.0000008 * h * h;

test('oxygenation: contract keys are present and finite', () => {
  const out = firnJson(['oxygenation', '--altitude', '4000m']);
  for (const key of ['pressure_hpa', 'pio2_mmhg', 'pao2_mmhg', 'spo2_expected_low_pct',
    'spo2_expected_pct', 'spo2_expected_high_pct', 'paco2_mmhg', 'arterial_po2_mmhg', 'ph']) {
    assert.equal(typeof out[key], 'number', key);
    assert.ok(Number.isFinite(out[key]), key);
  }
  assert.equal(out.model, 'west');  // default model
  assert.equal(out.exposure, 'acute');
  assert.ok(out.spo2_expected_low_pct <= out.spo2_expected_pct);
  assert.ok(out.spo2_expected_pct <= out.spo2_expected_high_pct);
});

test('sea-level PiO2 149.2 mmHg with FiO2 0.2093 (physiology texts, domain brief)', () => {
  const out = firnJson(['oxygenation', '--pressure', '760mmHg', '--fio2', '0.2093']);
  near(out.pio2_mmhg, 149.2, 0.05, 'PiO2');
  near(out.pressure_hpa, 1013.25, 0.06, 'PB');
});

test('sea-level PAO2 101.8 mmHg, full alveolar gas equation, FiO2 0.21, PaCO2 40 (domain brief)', () => {
  const out = firnJson(['oxygenation', '--pressure', '1013.25hPa', '--fio2', '0.21']);
  assert.equal(out.paco2_mmhg, 40);
  near(out.pao2_mmhg, 101.8, 0.05, 'PAO2');
  // 7.391 with the 0.0307 solubility, shown to 2 decimals.
  near(out.ph, 7.40, 0.015, 'pH (Henderson-Hasselbalch, HCO3 24, PaCO2 40)');
  // FiO2 may also be given in percent.
  const pct = firnJson(['oxygenation', '--pressure', '1013.25hPa', '--fio2', '21%']);
  assert.equal(pct.pao2_mmhg, out.pao2_mmhg);
});

test('West 1996 PB at 5000 m is 419 Torr: PiO2 = 0.2095·(419 − 47) ≈ 77.9 mmHg', () => {
  const out = firnJson(['oxygenation', '--altitude', '5000m']);
  near(out.pressure_mmhg, 419, 1.0, 'PB');
  near(out.pio2_mmhg, 77.9, 0.3, 'PiO2');
});

test('expected SpO2, acute: Botella de Maglia 2005 unacclimatised 89.5 % at 3000 m, 82.4 % at 4000 m', () => {
  for (const h of [3000, 4000]) {
    const out = firnJson(['oxygenation', '--altitude', `${h}m`]);
    near(out.spo2_expected_pct, botellaUnacclimatised(h), 1.5, `${h} m`);
    assert.ok(out.spo2_expected_low_pct <= botellaUnacclimatised(h) + 0.5);
    assert.ok(out.spo2_expected_high_pct >= botellaUnacclimatised(h) - 0.5);
  }
});

test('expected SpO2, acclimatised: Botella 2005 regression and Tannheimer 2002 (4850 m, median 86.5 %, 77–89)', () => {
  for (const h of [4000, 5000]) {
    const out = firnJson(['oxygenation', '--altitude', `${h}m`, '--acclimatised']);
    near(out.spo2_expected_pct, botellaAcclimatised(h), 1.5, `${h} m`);
  }
  const t = firnJson(['oxygenation', '--altitude', '4850m', '--acclimatised']);
  assert.equal(t.exposure, 'acclimatised');
  near(t.spo2_expected_pct, 86.5, 1.5, 'Tannheimer median');
  assert.ok(t.spo2_expected_low_pct >= 77 && t.spo2_expected_high_pct <= 89);
  assert.ok(t.paco2_mmhg < firnJson(['oxygenation', '--altitude', '4850m']).paco2_mmhg);
});

test('ISA gives lower pressure and SpO2 than West 1996 at 5000 m (West 1996)', () => {
  const isa = firnJson(['oxygenation', '--altitude', '5000m', '--model', 'isa']);
  const west = firnJson(['oxygenation', '--altitude', '5000m']);
  assert.equal(isa.model, 'isa');
  assert.ok(isa.pressure_hpa < west.pressure_hpa);
  assert.ok(isa.spo2_expected_pct < west.spo2_expected_pct);
});

test('a measured SpO2 far below the band flags HAPE suspicion and oximeter error (WMS 2019; Luks & Swenson 2011)', () => {
  // 68 %: well below the ~79–86 % band but above the 65 % critical line (Tannheimer 2002).
  const out = firnJson(['oxygenation', '--altitude', '4000m', '--time-at-altitude', '0h', '--spo2', '68']);
  assert.equal(out.spo2_assessment, 'well-below');
  assert.equal(out.hape_suspected, true);
  assert.equal(out.oximeter_unreliable, true);
  assert.ok(out.spo2_gap_pct < -4);
  assert.ok(out.cautions.some((c) => c.includes('HAPE')));
  assert.ok(out.cautions.some((c) => c.includes('80 %')));
  const ok = firnJson(['oxygenation', '--altitude', '4000m', '--time-at-altitude', '0h', '--spo2',
    `${Math.round(out.spo2_expected_pct)}`]);
  assert.equal(ok.spo2_assessment, 'within');
  assert.equal(ok.spo2_gap_pct, 0);
  assert.equal(ok.hape_suspected, false);
});

test('no time at altitude given: the SpO2 verdict is the less reassuring of arrival and three weeks', () => {
  // Ventilatory acclimatisation raises the healthy band (Botella de Maglia 2005: acclimatised
  // climbers read higher than newcomers at the same altitude). A reading in the middle of the
  // newcomers' band at 4000 m is "within" for a newcomer; with the time unknown it must not be.
  const arrival = firnJson(['oxygenation', '--altitude', '4000m', '--time-at-altitude', '0h']);
  const weeks = firnJson(['oxygenation', '--altitude', '4000m', '--acclimatised']);
  assert.ok(weeks.spo2_expected_low_pct > arrival.spo2_expected_low_pct);
  const reading = `${arrival.spo2_expected_low_pct + 1}`;  // printed rounded to whole %
  const known = firnJson(['oxygenation', '--altitude', '4000m', '--time-at-altitude', '0h', '--spo2', reading]);
  assert.equal(known.spo2_assessment, 'within');
  assert.equal(known.spo2_band_judged_at, undefined);
  const unknown = firnJson(['oxygenation', '--altitude', '4000m', '--spo2', reading]);
  assert.equal(unknown.time_at_altitude_given, false);
  assert.equal(unknown.time_at_altitude_h, undefined);
  assert.ok(['below', 'well-below'].includes(unknown.spo2_assessment), unknown.spo2_assessment);
  assert.equal(unknown.spo2_band_judged_at, 'acclimatised');
  assert.equal(unknown.spo2_ends_differ, true);
  assert.match(unknown.spo2_verdict, /enter the time/);
  assert.ok(unknown.why.some((w) => w.includes('not entered')));
  // The figures meanwhile are a newcomer's (the least oxygen), and the text output says so.
  assert.equal(unknown.spo2_expected_pct, arrival.spo2_expected_pct);
  const text = runFirn(['oxygenation', '--altitude', '4000m', '--spo2', reading]).stdout;
  assert.match(text, /Time at this altitude not given/);
  // A reading well inside both bands is "within" whatever the time.
  const high = `${Math.ceil(Math.max(arrival.spo2_expected_low_pct, weeks.spo2_expected_low_pct) + 1)}`;
  const both = firnJson(['oxygenation', '--altitude', '4000m', '--spo2', high]);
  assert.ok(['within', 'above'].includes(both.spo2_assessment), `${high} %: ${both.spo2_assessment}`);
  assert.equal(both.spo2_band_judged_at, 'acclimatised');
});

test('oxygen: cannula flow for the WMS target SpO2 > 90 % (Luks 2019) and "not reachable"', () => {
  const out = firnJson(['oxygenation', '--altitude', '5000m', '--device', 'cannula', '--flow', '2']);
  near(out.device_fio2, 0.29, 0.001, 'cannula 2 L/min rule of thumb (common practice)');
  assert.ok(out.spo2_with_oxygen_pct > out.spo2_expected_pct);
  assert.equal(out.target_spo2_pct, 90);
  assert.equal(out.target_reachable, true);
  assert.ok(out.lowest_flow_lpm >= 0.5 && out.lowest_flow_lpm <= 6);
  const high = firnJson(['oxygenation', '--pressure', '330hPa', '--device', 'cannula', '--target', '98']);
  assert.equal(high.target_reachable, false);
  assert.equal(high.lowest_flow_lpm, null);
});

test('SpO2 on oxygen is compared with the band on that oxygen (issue 11: 4500 m, 86 % on cannula 4 L/min)', () => {
  // The cannula rule of thumb (common practice) gives FiO2 0.37; a healthy lowlander on it sits
  // above 90 %. 86 % is well below: hypoxaemia out of proportion (WMS, Luks 2019/2024), and below
  // the WMS target of 90 % on oxygen. It must never read "above" (the room-air band).
  const out = firnJson(['oxygenation', '--altitude', '4500m', '--spo2', '86', '--device', 'cannula', '--flow', '4']);
  assert.equal(out.spo2_compared_with, 'oxygen');
  assert.ok(out.spo2_band_low_pct > 90, `band on oxygen ${out.spo2_band_low_pct}`);
  assert.equal(out.spo2_assessment, 'well-below');
  assert.equal(out.hape_suspected, true);
  assert.equal(out.below_oxygen_target, true);
  assert.ok(out.why.some((w) => w.includes('WMS')));
  const air = firnJson(['oxygenation', '--altitude', '4500m', '--time-at-altitude', '0h', '--spo2', '86']);
  assert.equal(air.spo2_compared_with, 'air');
  assert.equal(air.spo2_assessment, 'above');
});

test('5200 m two days after arrival, 68 % on air: never "within" (issue 11)', () => {
  const out = firnJson(['oxygenation', '--altitude', '5200m', '--time-at-altitude', '2d', '--spo2', '68']);
  assert.equal(out.extrapolated, true);  // beyond the calibration data (3000–5000 m)
  assert.ok(['well-below', 'critical'].includes(out.spo2_assessment), out.spo2_assessment);
  assert.equal(out.hape_suspected, true);
  assert.equal(out.oximeter_unreliable, true);
  assert.ok(out.cautions.some((c) => c.includes('Carbon monoxide')));
  // Inside an extrapolated band there is no verdict at all.
  const inside = firnJson(['oxygenation', '--altitude', '5200m', '--time-at-altitude', '0h', '--spo2', '70']);
  assert.equal(inside.extrapolated, true);
  assert.equal(inside.spo2_assessment, 'extrapolated');
  assert.match(inside.spo2_verdict, /^No verdict/);
});

test('below 65 % is critical at any altitude (Tannheimer M et al., Int J Sports Med 2002)', () => {
  const out = firnJson(['oxygenation', '--altitude', '4850m', '--spo2', '64', '--acclimatised']);
  assert.equal(out.spo2_assessment, 'critical');
  assert.equal(out.hape_suspected, true);
  assert.ok(out.why.some((w) => w.includes('Tannheimer')));
  assert.ok(out.spo2_action.length > 0);
});

test('time at altitude moves the band between the presets (acclimatisation time course)', () => {
  const acute = firnJson(['oxygenation', '--altitude', '4500m', '--time-at-altitude', '0h']);
  const partly = firnJson(['oxygenation', '--altitude', '4500m', '--time-at-altitude', '36h']);
  const week = firnJson(['oxygenation', '--altitude', '4500m', '--time-at-altitude', '7d']);
  const accl = firnJson(['oxygenation', '--altitude', '4500m', '--acclimatised']);
  assert.equal(acute.exposure, 'acute');
  assert.equal(acute.time_at_altitude_h, 0);
  assert.equal(partly.exposure, 'partly acclimatised');
  assert.equal(partly.time_at_altitude_h, 36);
  assert.equal(accl.exposure, 'acclimatised');
  assert.equal(accl.time_at_altitude_h, 504);
  assert.ok(acute.spo2_expected_pct < partly.spo2_expected_pct);
  assert.ok(partly.spo2_expected_pct < week.spo2_expected_pct);
  assert.ok(week.spo2_expected_pct <= accl.spo2_expected_pct);
  assert.ok(partly.paco2_mmhg < acute.paco2_mmhg && partly.paco2_mmhg > accl.paco2_mmhg);
  // 21 days is the acclimatised preset itself.
  assert.equal(firnJson(['oxygenation', '--altitude', '4500m', '--time-at-altitude', '21d']).spo2_expected_pct,
    accl.spo2_expected_pct);
  assert.match(firnError(['oxygenation', '--altitude', '4500m', '--time-at-altitude', '2d', '--acclimatised']), /not both/);
  assert.match(firnError(['oxygenation', '--altitude', '4500m', '--time-at-altitude', '400d']),
    /between 0 and 365 days/);
});

test('flow for this casualty from the SpO2 on air: virtual shunt (Benatar, Hewlett & Nunn 1973), an estimate', () => {
  const out = firnJson(['oxygenation', '--altitude', '4500m', '--spo2', '62', '--device', 'cannula']);
  assert.equal(out.casualty_flow_is_estimate, true);
  assert.ok(out.casualty_virtual_shunt_pct > 0);
  // The healthy-lowlander figure underestimates what this casualty needs (issue 11 §4).
  assert.ok(out.casualty_lowest_flow_lpm === null || out.casualty_lowest_flow_lpm > out.lowest_flow_lpm,
    `casualty ${out.casualty_lowest_flow_lpm} vs healthy ${out.lowest_flow_lpm}`);
  if (out.casualty_lowest_flow_lpm !== null) {
    assert.equal((out.casualty_lowest_flow_lpm * 2) % 1, 0);  // a 0.5 L/min flowmeter step
    const at = out.casualty_spo2_by_flow.find((p) => p.flow_lpm === out.casualty_lowest_flow_lpm);
    assert.ok(at.spo2_pct >= 90);
  }
  assert.equal(out.casualty_spo2_by_flow.length, 12);  // 0.5…6 L/min
  const { stdout } = runFirn(['oxygenation', '--altitude', '4500m', '--spo2', '62', '--device', 'cannula']);
  assert.match(stdout, /titrate to the oximeter/);
  // On oxygen (with --flow) the reading is not on air: no casualty flow from it.
  const onO2 = firnJson(['oxygenation', '--altitude', '4500m', '--spo2', '86', '--device', 'cannula', '--flow', '4']);
  assert.equal(onO2.casualty_lowest_flow_lpm, undefined);
});

test('FiO2 at altitude: free-gas litres expand by P0/P; only distress lowers it (issue 11 §4)', () => {
  const rest = firnJson(['oxygenation', '--altitude', '4500m', '--device', 'cannula', '--flow', '2']);
  assert.equal(rest.breathing, 'rest');
  assert.ok(rest.device_fio2_at_altitude > rest.device_fio2, `${rest.device_fio2_at_altitude} vs ${rest.device_fio2}`);
  const distress = firnJson(['oxygenation', '--altitude', '4500m', '--device', 'cannula', '--flow', '2', '--breathing', 'distress']);
  assert.ok(distress.device_fio2_at_altitude < distress.device_fio2);
  assert.ok(distress.minute_ventilation_lpm > rest.minute_ventilation_lpm);
  // Planning in distress never asks for less flow than at rest.
  assert.ok(distress.lowest_flow_lpm === null || distress.lowest_flow_lpm >= rest.lowest_flow_lpm);
  assert.match(firnError(['oxygenation', '--altitude', '4500m', '--device', 'cannula', '--breathing', 'panting']),
    /rest or distress/);
});

test('human-readable output carries the cautions', () => {
  const { code, stdout } = runFirn(['oxygenation', '--altitude', '4000m']);
  assert.equal(code, 0);
  assert.match(stdout, /Expected SpO2/);
  assert.match(stdout, /Clinical signs first/);
});

test('oxygenation: bad input is exit 2 with range and unit', () => {
  assert.match(firnError(['oxygenation', '--altitude', '12000m']), /between 0 and 9000 m/);
  assert.match(firnError(['oxygenation', '--altitude', '4000yd']), /unknown unit/);
  assert.match(firnError(['oxygenation']), /--altitude or --pressure is required/);
  assert.match(firnError(['oxygenation', '--altitude', '4000m', '--spo2', 'nan']), /not a number/);
  assert.match(firnError(['oxygenation', '--altitude', '4000m', '--spo2=-5']), /between 30 and 100 %/);
  assert.match(firnError(['oxygenation', '--altitude', '4000m', '--fio2', '1.5']), /between 0.15 and 1/);
  assert.match(firnError(['oxygenation', '--pressure', '50hPa']), /between 150 and 1100 hPa/);
  assert.match(firnError(['oxygenation', '--altitude', '4000m', '--pressure', '600hPa']), /not both/);
  assert.match(firnError(['oxygenation', '--altitude', '4000m', '--model', 'mars']), /isa or west/);
  assert.match(firnError(['oxygenation', '--altitude', '4000m', '--device', 'cannula', '--flow', '8']),
    /between 0.5 and 6 L\/min/);
  assert.match(firnError(['oxygenation', '--altitude', '4000m', '--device', 'tent']), /cannula, mask or non-rebreather/);
  assert.match(firnError(['oxygenation', '--altitude', '4000m', '--altitude']), /.+/);
});

test('curve: Severinghaus 1979 check values', () => {
  // Severinghaus JW, J Appl Physiol 1979;46:599-602 (domain brief check values).
  const cases = [[27, 50.35], [40, 74.95], [60, 90.58], [100, 97.75]];
  for (const [po2, so2] of cases) {
    const out = firnJson(['curve', '--po2', `${po2}mmHg`]);
    near(out.so2_pct, so2, 0.01, `PO2 ${po2}`);
  }
  // 8 kPa = 60.0 mmHg.
  near(firnJson(['curve', '--po2', '8kPa']).so2_pct, 90.58, 0.02, '8 kPa');
  near(firnJson(['curve', '--po2', '40mmHg']).p50_mmhg, 26.8, 0.1, 'P50 (Severinghaus 1979)');
});

test('curve: alkalosis, cold and low P50 shift left; acidosis, fever and high P50 shift right', () => {
  const base = firnJson(['curve', '--po2', '40mmHg']).so2_pct;
  assert.ok(firnJson(['curve', '--po2', '40mmHg', '--ph', '7.55']).so2_pct > base);
  assert.ok(firnJson(['curve', '--po2', '40mmHg', '--ph', '7.2']).so2_pct < base);
  assert.ok(firnJson(['curve', '--po2', '40mmHg', '--temperature', '33C']).so2_pct > base);
  assert.ok(firnJson(['curve', '--po2', '40mmHg', '--temperature', '104F']).so2_pct < base);
  assert.ok(firnJson(['curve', '--po2', '40mmHg', '--p50', '30mmHg']).so2_pct < base);
  assert.ok(firnJson(['curve', '--po2', '40mmHg', '--base-excess', '-10']).so2_pct > base);
});

test('curve: bad input is exit 2 with range and unit', () => {
  assert.match(firnError(['curve']), /--po2 is required/);
  assert.match(firnError(['curve', '--po2', '60']), /needs a unit/);
  assert.match(firnError(['curve', '--po2', '60furlongs']), /unknown unit/);
  assert.match(firnError(['curve', '--po2=-5mmHg']), /between 0 and 1000 mmHg/);
  assert.match(firnError(['curve', '--po2', '60mmHg', '--ph', '8.5']), /between 6.8 and 7.8/);
  assert.match(firnError(['curve', '--po2', '60mmHg', '--ph', 'nan']), /not a number/);
  assert.match(firnError(['curve', '--po2', '60mmHg', '--temperature', '50C']), /between 20 and 43 °C/);
  assert.match(firnError(['curve', '--po2', '60mmHg', '--p50', '60mmHg']), /between 15 and 40 mmHg/);
  assert.match(firnError(['curve', '--po2', '60mmHg', '--base-excess', '40']), /mmol\/L/);
});
