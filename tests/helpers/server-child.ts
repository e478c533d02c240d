// The whole server in its own process, for tests that kill it (SIGKILL) and start it again.
// Settings come from the environment the test passes; prints "READY <url>" once listening.
import { configFromEnv } from '../../server/config';
import { startServer } from '../../server/index';

const running = await startServer(configFromEnv());
process.stdout.write(`READY ${running.url}\n`);
