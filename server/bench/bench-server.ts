import { spawn } from 'node:child_process';
import { join } from 'node:path';

/** The built server as `npm start` runs it, on a scratch data folder with the demo accounts only. */
export async function startServer(dir: string) {
  const port = 3900 + Math.floor(Math.random() * 90);
  const env = {
    ...process.env,
    PORT: String(port),
    DATA_DIR: join(dir, 'data'),
    DEMO: '1',
    DEMO_DATA_DIR: join(dir, 'none'),
    UPLOAD_LIMIT_MB: '200',
  };
  const server = spawn(process.execPath, ['server/dist/main.js'], {
    env,
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  const base = `http://127.0.0.1:${port}`;
  // A first start creates and migrates the database; on a busy machine that takes a while.
  for (let i = 0; i < 900; i++) {
    try {
      if ((await fetch(`${base}/api/health`)).ok) return { base, server };
    } catch {
      // starting
    }
    await new Promise((r) => setTimeout(r, 100));
  }
  server.kill('SIGTERM');
  throw new Error('the server did not start within 90 s');
}
