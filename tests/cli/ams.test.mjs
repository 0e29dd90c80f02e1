// CLI: `firn ams`, the 2018 Lake Louise AMS score (Roach RC et al., High Alt Med Biol
// 2018;19:4-6): four items 0–3; AMS = recent ascent + headache + total ≥ 3;
// mild 3–5, moderate 6–9, severe 10–12.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { firnJson, firnError } from './run_firn.mjs';

const ams = (h, g, f, d, extra = []) =>
  firnJson(['ams', '--headache', `${h}`, '--gi', `${g}`, '--fatigue', `${f}`, '--dizziness', `${d}`, ...extra]);

test('total and category boundaries (Roach 2018)', () => {
  assert.deepEqual([ams(0, 0, 0, 0).total, ams(0, 0, 0, 0).category], [0, 'none']);
  assert.equal(ams(1, 1, 0, 0).category, 'none');  // total 2
  assert.deepEqual([ams(1, 1, 1, 0).total, ams(1, 1, 1, 0).category], [3, 'mild']);
  assert.equal(ams(2, 2, 1, 0).category, 'mild');      // 5
  assert.equal(ams(2, 2, 2, 0).category, 'moderate');  // 6
  assert.equal(ams(3, 3, 3, 0).category, 'moderate');  // 9
  assert.equal(ams(3, 3, 3, 1).category, 'severe');    // 10
  const max = ams(3, 3, 3, 3);
  assert.deepEqual([max.total, max.category, max.ams], [12, 'severe', true]);
});

test('no headache or no recent ascent: not AMS whatever the total (Roach 2018)', () => {
  const noHeadache = ams(0, 3, 3, 3);
  assert.equal(noHeadache.total, 9);
  assert.equal(noHeadache.category, 'none');
  assert.equal(noHeadache.ams, false);
  const noAscent = ams(2, 2, 2, 2, ['--no-recent-ascent']);
  assert.equal(noAscent.category, 'none');
  assert.equal(noAscent.recent_ascent, false);
  assert.ok(Array.isArray(noAscent.caveats) && noAscent.caveats.length > 0);
});

test('bad items are exit 2 naming the 0–3 range', () => {
  assert.match(firnError(['ams', '--headache', '4', '--gi', '0', '--fatigue', '0', '--dizziness', '0']),
    /headache item must be between 0 and 3 points/);
  assert.match(firnError(['ams', '--headache=-1', '--gi', '0', '--fatigue', '0', '--dizziness', '0']),
    /between 0 and 3 points/);
  assert.match(firnError(['ams', '--headache', '1', '--fatigue', '0', '--dizziness', '0']), /--gi is required/);
  assert.match(firnError(['ams', '--headache', '1', '--gi', '0', '--fatigue', '1.5', '--dizziness', '0']),
    /whole number/);
  assert.match(firnError(['ams', '--headache', '1', '--gi', '0', '--fatigue', '0', '--dizziness', 'nan']),
    /not a number/);
});

test('a score of 3 or more without headache prompts other causes (Roach 2018; common practice)', () => {
  const out = ams(0, 2, 2, 1);
  assert.equal(out.ams, false);
  assert.equal(out.consider_other_causes, true);
  assert.match(out.other_causes, /exhaustion, dehydration, hypothermia, hyponatraemia, carbon monoxide/);
  assert.equal(ams(1, 1, 1, 0).consider_other_causes, false);
});
