// `npm run dev`: the private MariaDB of `npm start`, then the API server under
// `tsx watch` (restarts on change, port 4821) and the Vite dev server (port
// 4820, proxying /api, /dev and /collab to it).
import { spawn } from 'node:child_process';
import { startLocalDatabase, sessionSecret } from './lib/local-db';
import { bin } from './lib/run';

const { mariadb } = await startLocalDatabase(true);

const webPort = process.env.PORT ?? '4820';
const env = {
  ...process.env,
  DATABASE_URL: mariadb.url,
  SESSION_SECRET: sessionSecret(),
  PORT: '4821',
  APP_URL: `http://localhost:${webPort}`,
  CLIENT_DIR: '',
  LOG_LEVEL: process.env.LOG_LEVEL ?? 'info',
};
const children = [
  spawn(bin('tsx'), ['watch', '--clear-screen=false', 'server/index.ts'], { stdio: 'inherit', env }),
  spawn(bin('vite'), ['--port', webPort, '--strictPort'], { stdio: 'inherit', env: { ...process.env, API_PORT: '4821' } }),
];
console.log(`[beadloom] dev server on http://localhost:${webPort} (API on 4821)`);

let stopping = false;
const stop = async () => {
  if (stopping) return;
  stopping = true;
  for (const c of children) c.kill('SIGTERM');
  await mariadb.stop();
  process.exit(0);
};
process.on('SIGINT', () => void stop());
process.on('SIGTERM', () => void stop());
for (const c of children) c.on('exit', () => void stop());
