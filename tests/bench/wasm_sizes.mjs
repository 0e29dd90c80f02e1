// Where the bytes of a wasm file go: section sizes, and code size per function group, read from
// a build linked with --profiling-funcs (names kept; the code is the same as without). Used by
// tests/bench/compare.sh to explain the size comparison; prints figures only.
// Usage: node wasm_sizes.mjs FILE.wasm [top-N functions]
import {execFileSync} from 'node:child_process';
import {readFileSync} from 'node:fs';

const [file, topArg] = process.argv.slice(2);
const bytes = readFileSync(file);
let at = 8;  // magic + version
function leb() {
  let result = 0, shift = 0, byte;
  do { byte = bytes[at++]; result += (byte & 0x7f) * 2 ** shift; shift += 7; } while (byte & 0x80);
  return result;
}
function name() { const length = leb(); const text = bytes.toString('utf8', at, at + length); at += length; return text; }

const SECTION_NAMES = ['custom', 'type', 'import', 'function', 'table', 'memory', 'global', 'export',
                       'start', 'element', 'code', 'data', 'data count'];
const sections = [];
let importedFunctions = 0;
const bodies = [];
const names = new Map();
while (at < bytes.length) {
  const id = bytes[at++];
  const size = leb();
  const start = at;
  let label = SECTION_NAMES[id] ?? `id ${id}`;
  if (id === 0) label = `custom "${name()}"`;
  if (id === 2) {
    const count = leb();
    for (let i = 0; i < count; ++i) {
      name(); name();
      const kind = bytes[at++];
      if (kind === 0) { leb(); importedFunctions++; }
      else if (kind === 1) { at++; const flags = leb(); leb(); if (flags & 1) leb(); }
      else if (kind === 2) { const flags = leb(); leb(); if (flags & 1) leb(); }
      else if (kind === 3) { at += 2; }
    }
  }
  if (id === 10) {
    const count = leb();
    for (let i = 0; i < count; ++i) { const bodySize = leb(); bodies.push(bodySize); at += bodySize; }
  }
  if (label === 'custom "name"') {
    while (at < start + size) {
      const kind = bytes[at++];
      const subsize = leb();
      const end = at + subsize;
      if (kind === 1) {
        const count = leb();
        for (let i = 0; i < count; ++i) { const index = leb(); names.set(index, name()); }
      }
      at = end;
    }
  }
  sections.push({label, size});
  at = start + size;
}

console.log(`${file}: ${bytes.length} bytes`);
for (const s of sections) console.log(`  section ${s.label.padEnd(24)} ${String(s.size).padStart(9)}`);
if (names.size === 0) {
  console.log('  (no name section: link with --profiling-funcs for a per-function split)');
  process.exit(0);
}

const mangled = bodies.map((_, i) => names.get(i + importedFunctions) ?? `function ${i}`);
const demangled = execFileSync('c++filt', {input: mangled.join('\n'), maxBuffer: 1 << 26})
  .toString().split('\n');
// Groups, first match wins (demangled names; templates start with their return type).
const GROUPS = [
  ['ImGui example: main loop + inlined demo window', /main::\$_0|ShowDemo|ShowExample|ShowUserGuide|ShowAboutWindow|ShowStyleEditor|ShowFontSelector|HelpMarker/],
  ['ImGui: stb_truetype (font rasteriser)', /stbtt/],
  ['ImGui: stb_textedit, stb_rect_pack', /stb_|stbrp|STB_TEXTEDIT/],
  ['ImGui: backends (GLFW, OpenGL3)', /ImGui_Impl/],
  ['firn::json (its own files: profile, route, record, saved state)', /firn::json::/],
  ['Firn: ui (core/ui)', /firn::ui::/],
  ['Firn: web runner and platform (web/)', /firn::web::|firn_/],
  ['Firn: model (core/model)', /firn::/],
  ['ImGui: core', /ImGui|ImFont|ImDraw|ImVec|ImStr|ImText|ImHash|ImPool|ImTriangle|ImBezier|ImLine|Im[A-Z][a-z]/],
  ['libc++ (std::)', /^(\S+ )?std::|__cxa|__cxx|operator new|operator delete/],
  ['libc, libm, malloc, Emscripten runtime', /./],
];
const groups = new Map();
const all = [];
demangled.forEach((text, i) => {
  const group = GROUPS.find(([, pattern]) => pattern.test(text))[0];
  groups.set(group, (groups.get(group) ?? 0) + bodies[i]);
  all.push({text, size: bodies[i], group});
});
const code = bodies.reduce((a, b) => a + b, 0);
console.log(`  code by group (${bodies.length} functions, ${code} bytes of bodies):`);
for (const [group, size] of [...groups].sort((a, b) => b[1] - a[1])) {
  console.log(`    ${group.padEnd(48)} ${String(size).padStart(9)}  ${(100 * size / code).toFixed(1).padStart(5)} %`);
}
const top = Number(topArg ?? 0);
if (top > 0) {
  console.log(`  largest ${top} functions:`);
  for (const f of all.sort((a, b) => b.size - a.size).slice(0, top)) {
    console.log(`    ${String(f.size).padStart(7)}  ${f.text.slice(0, 110)}`);
  }
}
