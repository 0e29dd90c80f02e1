// Runs the firn executable named by $FIRN_BIN and returns what it printed.
import { spawnSync } from 'node:child_process';
import assert from 'node:assert/strict';

export const firnBin = process.env.FIRN_BIN;
assert.ok(firnBin, 'FIRN_BIN must name the firn executable (ctest sets it)');

export function runFirn(args) {
  const result = spawnSync(firnBin, args, { encoding: 'utf8', timeout: 30000 });
  return { code: result.status, stdout: result.stdout, stderr: result.stderr };
}

// Runs with --json; asserts exit 0 and returns the parsed object.
export function firnJson(args) {
  const { code, stdout, stderr } = runFirn([...args, '--json']);
  assert.equal(code, 0, `firn ${args.join(' ')} failed: ${stderr}`);
  return JSON.parse(stdout);
}

// Runs with --json; asserts the bad-input contract (exit 2, one stderr line, {"error"}) and
// returns the message.
export function firnError(args) {
  const { code, stdout, stderr } = runFirn([...args, '--json']);
  assert.equal(code, 2, `expected exit 2 for firn ${args.join(' ')}, got ${code}: ${stdout}`);
  assert.equal(stderr.trim().split('\n').length, 1, `stderr is not one line: ${stderr}`);
  const body = JSON.parse(stdout);
  assert.equal(typeof body.error, 'string');
  assert.ok(stderr.includes(body.error));
  return body.error;
}

// Variadic forms: firn('bag', '--altitude', '4243m') → {code, stdout, stderr}; firnResult(...)
// adds --json and the parsed body (json) without asserting the exit code, for tests that check
// both success and failure shapes.
export function firn(...args) {
  return runFirn(args);
}

export function firnResult(...args) {
  const r = runFirn([...args, '--json']);
  return { ...r, json: JSON.parse(r.stdout) };
}
