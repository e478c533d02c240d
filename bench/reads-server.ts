// Beadloom's server for bench/reads.ts, in its own process as `npm start` runs it (production
// settings come from the environment the bench passes). Prints "READY <url>"; stops in order on
// SIGTERM. With BENCH_PROFILE_DIR, SIGUSR2 starts V8's CPU profiler (the one `node --cpu-prof` uses)
// and a second SIGUSR2 writes the profile there: the bench profiles its measured window only, not the
// sign-ins before it (bcrypt would fill the profile).
import { Session } from 'node:inspector/promises';
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { configFromEnv } from '../server/config';
import { startServer } from '../server/index';

const running = await startServer(configFromEnv());
const profileDir = process.env.BENCH_PROFILE_DIR;
if (profileDir) {
  const session = new Session();
  session.connect();
  let on = false;
  process.on('SIGUSR2', () => {
    on = !on;
    void (on
      ? session.post('Profiler.enable').then(() => session.post('Profiler.start'))
      : session.post('Profiler.stop').then(({ profile }) => writeFileSync(join(profileDir, `reads-${Date.now()}.cpuprofile`), JSON.stringify(profile))));
  });
}
process.stdout.write(`READY ${running.url}\n`);
process.once('SIGTERM', () => void running.stop().finally(() => process.exit(0)));
