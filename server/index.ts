import { loadEnv } from './env';
import { boot } from './boot';
import { createApp } from './app';

const env = loadEnv();
const deps = await boot(env);
const { app } = createApp(deps);
const server = app.listen(env.port, () => {
  deps.log.info(`Trayce is serving on http://localhost:${env.port}`);
});

function shutdown(signal: string) {
  deps.log.info(`${signal}: closing`);
  server.close(() => {
    deps.db.$client.close();
    process.exit(0);
  });
  // Long-lived streams (the wall) would keep close() waiting.
  server.closeAllConnections?.();
  setTimeout(() => process.exit(0), 3000).unref();
}
process.on('SIGINT', () => shutdown('SIGINT'));
process.on('SIGTERM', () => shutdown('SIGTERM'));
