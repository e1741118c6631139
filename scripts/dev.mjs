// `npm run dev`: rebuilds shared and server on change, restarts the API, and runs Vite with hot reload.
import { spawn } from 'node:child_process';

const bin = (name) => new URL(`../node_modules/.bin/${name}`, import.meta.url).pathname;
const children = [
  spawn(bin('tsc'), ['-p', 'shared/tsconfig.json', '--watch', '--preserveWatchOutput'], { stdio: 'inherit' }),
  spawn(bin('tsc'), ['-p', 'server/tsconfig.build.json', '--watch', '--preserveWatchOutput'], {
    stdio: 'inherit',
  }),
  spawn(process.execPath, ['--watch-path=server/dist', '--watch-path=shared/dist', 'server/dist/main.js'], {
    stdio: 'inherit',
  }),
  // Run vite's own binary: killing an npx wrapper would leave vite running.
  spawn(bin('vite'), [], { cwd: 'client', stdio: 'inherit' }),
];

const stop = () => {
  for (const child of children) child.kill('SIGTERM');
  process.exit(0);
};
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
