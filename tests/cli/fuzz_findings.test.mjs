// CLI regressions found by fuzzing (tests/fuzz/fuzz_cli.cpp, docs/hardening.md).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { spawnSync } from 'node:child_process';
import { firnBin, runFirn } from './run_firn.mjs';

// Node passes arguments as UTF-8; a raw byte needs the shell's printf.
function firnWithByte(before, after) {
  const script = `exec "$0" ${before} "$(printf '\\377')" ${after}`;
  const r = spawnSync('/bin/sh', ['-c', script, firnBin], { encoding: 'utf8', timeout: 30000 });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

test('text that is not UTF-8 in an option with --json: exit 2 and JSON, not an abort', () => {
  // Was: nlohmann::json threw type_error 316 while printing the error, and the process aborted.
  const value = firnWithByte('pressure --altitude', '--json');
  assert.equal(value.code, 2, value.stderr);
  assert.match(JSON.parse(value.stdout).error, /altitude is not a number/);
  const option = firnWithByte('bag --altitude 4000m', '3 --json');
  assert.equal(option.code, 2, option.stderr);
  assert.equal(typeof JSON.parse(option.stdout).error, 'string');
});

test('--json taken as the value of an option still gets a JSON error', () => {
  // Was: "plan --profile --json" read a file named "--json" and printed the error as text only.
  const r = runFirn(['plan', '--profile', '--json']);
  assert.equal(r.code, 2);
  assert.match(JSON.parse(r.stdout).error, /cannot read profile '--json'/);
});

test('the app options refuse NaN, infinity and out-of-range sizes with the range and unit', () => {
  // Was: --pixel-ratio nan or --width 1e9 reached the native window code unchecked.
  const cases = [
    [['--pixel-ratio', 'nan'], /--pixel-ratio: value must be between 0\.5 and 8/],
    [['--pixel-ratio', 'inf'], /--pixel-ratio: value must be between 0\.5 and 8/],
    [['--width', '1e9'], /--width: value must be between 200 and 16384 px/],
    [['--height', '10'], /--height: value must be between 200 and 16384 px/],
    [['--frames', '0'], /--frames: value must be between 1 and 1000 frames/],
    [['--idle-report', '-1'], /--idle-report: value must be between 0\.1 and 600 s/]
  ];
  for (const [args, message] of cases) {
    const { code, stderr } = runFirn(['--screenshot', '/nonexistent/never-written.png', ...args]);
    assert.equal(code, 2, `${args.join(' ')}: ${stderr}`);
    assert.match(stderr, message);
  }
});
