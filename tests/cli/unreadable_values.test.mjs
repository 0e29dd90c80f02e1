// Every option, given text that is not a number (or nothing), still names its valid range and
// unit: the brief's rule for bad input. The range is the model's own, so it follows the model
// chosen (West 1996 0–9000 m, ISA −500–20000 m). Ranges below are the ones the models document
// in core/model/*.hpp.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { firnError } from './run_firn.mjs';

const cases = [
  [['pressure', '--altitude', 'nan'], /altitude must be between 0 and 9000 m for the West 1996 model/],
  [['pressure', '--altitude', 'abc', '--model', 'isa'], /between -500 and 20000 m for the ISA model/],
  [['pressure', '--altitude', '12'], /needs a unit.*between 0 and 9000 m/],
  [['pressure'], /--altitude is required.*between 0 and 9000 m/],
  [['pressure', '--altitude', '1000m', '--qnh', 'x'], /QNH .*between 900 and 1100 hPa/],
  [['pressure', '--altitude', '1000m', '--qnh', '1013hPa', '--temperature', 'warm'],
    /air temperature must be between -60 and 50 °C/],
  [['pressure', '--altitude', '5000m', '--latitude', 'x', '--month', '1'],
    /latitude must be between -90 and 90 degrees/],
  [['pressure', '--altitude', '5000m', '--latitude', '60', '--month', 'x'], /month must be between 1 and 12/],
  [['pressure', '--station', 'x'], /station barometer reading must be between 150 and 1100 hPa/],
  [['pressure', '--station', '700hPa', '--altitude', 'x'], /altitude must be between 0 and 9000 m/],
  [['altitude', '--pressure', 'inf'], /pressure must be between 330 and 1012\.6 hPa for the West 1996/],
  [['bag', '--altitude', 'x'], /altitude must be between 0 and 9000 m/],
  [['bag', '--altitude', '3000m', '--gauge', 'x'], /bag gauge pressure must be between 0 and 250 hPa/],
  [['bag', '--altitude', '3000m', '--flush', 'nan'], /flush flow must be between 5 and 300 L\/min/],
  [['bag', '--pressure', 'x'], /ambient pressure must be between 330 and 1012\.6 hPa/],
  [['bag', '--altitude', '3000m', '--vco2', 'x'], /VCO2 must be between 0\.05 and 2 L\/min/],
  [['bag', '--altitude', '3000m', '--vo2', 'nan'], /VO2 must be between 0\.05 and 2\.5 L\/min/],
  [['bag', '--altitude', '3000m', '--chamber-temperature', 'x'],
    /chamber temperature must be between -30 and 45 °C/],
  [['cylinder', '--size', 'E', '--pressure', 'x', '--flow', '2'], /between 0 and 350 bar/],
  [['cylinder', '--water-capacity', 'x', '--pressure', '200bar', '--flow', '2'],
    /water capacity must be between 0\.1 and 100 L/],
  [['cylinder', '--size', 'E', '--pressure', '200bar', '--flow', '2', '--reserve', 'x'],
    /reserve pressure \(gauge\) must be between 0 and 100 bar/],
  [['cylinder', '--size', 'E', '--pressure', '200bar', '--flow', '2', '--ambient-pressure', 'x'],
    /ambient pressure must be between 150 and 1100 hPa/],
  [['cylinder', '--size', 'E', '--pressure', '200', '--flow', '2'],
    /needs a gauge unit: bar, psi \(gauge\), kPa or MPa.*between 0 and 350 bar/],
  [['cylinder', '--size', 'E', '--pressure', '200bar', '--flow', '2L/h'], /between 0\.1 and 30 L\/min/],
  [['cylinder', '--size', 'E', '--pressure', '200bar', '--flow', '2', '--temperature', 'x'],
    /cylinder temperature must be between -40 and 60 °C/],
  [['cylinder', '--size', 'E', '--pressure', '200bar', '--flow', 'nan'], /between 0\.1 and 30 L\/min/],
  [['oxygenation', '--altitude', 'x'], /^--altitude: .*between 0 and 9000 m/],
  [['oxygenation', '--pressure', 'x'], /between 150 and 1100 hPa/],
  [['oxygenation', '--altitude', '4000m', '--fio2', 'x'], /FiO2 must be between 0\.15 and 1/],
  [['oxygenation', '--altitude', '4000m', '--spo2', 'nan'], /measured SpO2 must be between 30 and 100 %/],
  [['oxygenation', '--altitude', '4000m', '--device', 'mask', '--flow', 'x'],
    /oxygen flow for a simple face mask must be between 5 and 10 L\/min/],
  [['oxygenation', '--altitude', '4000m', '--device', 'mask', '--target', 'x'],
    /target SpO2 must be between 80 and 99 %/],
  [['oxygenation', '--altitude', '4000m', '--time-at-altitude', 'x'],
    /time at altitude must be between 0 and 365 days/],
  [['oxygenation', '--altitude', '4000m', '--time-at-altitude', '2'],
    /needs a unit.*between 0 and 365 days/],
  [['curve', '--po2', 'x'], /PO2 must be between 0 and 1000 mmHg/],
  [['curve', '--po2', '40mmHg', '--ph', 'nan'], /pH must be between 6\.8 and 7\.8/],
  [['curve', '--po2', '40mmHg', '--base-excess', 'x'], /between -30 and 30 mmol\/L/],
  [['curve', '--po2', '40mmHg', '--temperature', 'x'], /body temperature must be between 20 and 43 °C/],
  [['curve', '--po2', '40mmHg', '--p50', 'x'], /P50 must be between 15 and 40 mmHg/],
  [['ams', '--headache', 'x', '--gi', '0', '--fatigue', '0', '--dizziness', '0'],
    /between 0 and 3 points/]
];

for (const [args, expected] of cases) {
  test(`firn ${args.join(' ')}: the message names the valid range and unit`, () => {
    const message = firnError(args);
    assert.match(message, expected);
    assert.doesNotMatch(message, /got a value that is not a number/);
  });
}
