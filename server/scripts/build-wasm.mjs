/**
 * Builds the cell step's WebAssembly kernel (wasm/cells.ts → wasm/build/cells.wasm) with AssemblyScript.
 * Run at install (the root postinstall) and by `npm run build:wasm -w server`. Without the compiler (an
 * install without dev dependencies) it says so and leaves the plain-JS path in charge; a compile error fails.
 */
import { spawnSync } from 'node:child_process';
import { mkdirSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const server = join(dirname(fileURLToPath(import.meta.url)), '..');
let asc;
try {
  asc = join(dirname(createRequire(import.meta.url).resolve('assemblyscript/package.json')), 'bin', 'asc.js');
} catch {
  console.warn('build:wasm: assemblyscript is not installed; the cell step will run in plain JS');
  process.exit(0);
}
mkdirSync(join(server, 'wasm', 'build'), { recursive: true });
const args = [
  asc,
  'wasm/cells.ts',
  '--outFile',
  'wasm/build/cells.wasm',
  '-O3',
  '--noAssert',
  '--runtime',
  'stub',
  '--importMemory',
  '--enable',
  'simd',
  '--use',
  'abort=',
];
const res = spawnSync(process.execPath, args, { cwd: server, stdio: 'inherit' });
if (res.status !== 0) {
  console.error('build:wasm: the AssemblyScript compiler failed (see above)');
  process.exit(res.status ?? 1);
}
console.log('build:wasm: wrote server/wasm/build/cells.wasm');
