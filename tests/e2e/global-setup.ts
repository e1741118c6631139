import { type ChildProcess, spawn } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import type { TestProject } from 'vitest/node';

const repoRoot = resolve(import.meta.dirname, '../..');

function freePort(): Promise<number> {
  return new Promise((ok, fail) => {
    const srv = createServer();
    srv.on('error', fail);
    srv.listen(0, '127.0.0.1', () => {
      const { port } = srv.address() as { port: number };
      srv.close(() => ok(port));
    });
  });
}

// The first start loads the whole demo season through intake: about 20 s on a quiet 2-core machine,
// several times that when the machine is busy. Give it room; a server that dies is caught at once.
const START_LIMIT_S = 300;

async function waitForHealth(url: string, server: ChildProcess, log: () => string): Promise<void> {
  const deadline = Date.now() + START_LIMIT_S * 1000;
  while (Date.now() < deadline) {
    if (server.exitCode !== null)
      throw new Error(`The server exited early (code ${server.exitCode}):\n${log()}`);
    try {
      if ((await fetch(url)).ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`The server did not become healthy in ${START_LIMIT_S} s:\n${log()}`);
}

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
  }
}

/**
 * Starts the built app exactly as `npm start` runs it (node server/dist/main.js, demo on) on a fresh data
 * folder and a free port, for all browser tests, and stops it afterwards.
 */
export default async function setup(project: TestProject) {
  const dataDir = mkdtempSync(join(tmpdir(), 'stormhour-e2e-'));
  const port = await freePort();
  let output = '';
  const server = spawn(process.execPath, ['server/dist/main.js'], {
    cwd: repoRoot,
    env: {
      ...process.env,
      PORT: String(port),
      DATA_DIR: dataDir,
      DEMO: '1',
      LOGIN_ATTEMPTS_PER_MINUTE: '100',
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  server.stdout?.on('data', (d) => {
    output += d;
  });
  server.stderr?.on('data', (d) => {
    output += d;
  });
  const baseUrl = `http://127.0.0.1:${port}`;
  await waitForHealth(`${baseUrl}/api/health`, server, () => output);
  project.provide('baseUrl', baseUrl);

  return async () => {
    server.kill('SIGTERM');
    await new Promise((r) => server.once('exit', r));
    rmSync(dataDir, { recursive: true, force: true });
  };
}
