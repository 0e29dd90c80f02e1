// Emscripten's glue script, minified by terser (Debian's node-terser; closure, which Emscripten
// would use, is not packaged in a version it accepts): compressed, and every name mangled,
// top-level ones too, except `Module`, which the page shell defines and reads. Properties keep
// their names, so what the shell and the tests read (Module._firn_wake, window.firnShell, …)
// and the wasm's import names are untouched. firn.js 25.0 → 18.8 KB gzip (docs/BENCHMARKS.md).
// Usage: NODE_PATH=/usr/share/nodejs node minify_js.cjs IN.js OUT.js
'use strict';
const {minify} = require('terser');
const {readFileSync, writeFileSync} = require('node:fs');

const [input, output] = process.argv.slice(2);
if (!input || !output) {
  console.error('usage: node minify_js.cjs IN.js OUT.js');
  process.exit(2);
}
minify(readFileSync(input, 'utf8'), {
  compress: {passes: 2},
  mangle: {toplevel: true, reserved: ['Module']},
  toplevel: true,
}).then((result) => writeFileSync(output, result.code), (error) => {
  console.error(`minify_js: ${input}: ${error.message ?? error}`);
  process.exit(1);
});
