import { loadEnv } from './env';
import { boot } from './boot';
import { createApp } from './app';
import { connectMail } from './services/mail.service';
import { startPayments } from './services/payments.service';

// A failure nobody awaited (a library's late callback, a stream error) is logged and survived:
// nothing a user sends may end the process. Uploads are decoded in full before they are kept
// (server/lib/upload-decode.ts), so these are a last line, not the way errors are handled.
process.on('unhandledRejection', (reason) => {
  console.error(JSON.stringify({ level: 'error', msg: 'unhandled rejection (survived)', err: String((reason as Error)?.message ?? reason) }));
});
process.on('uncaughtException', (err) => {
  console.error(JSON.stringify({ level: 'error', msg: 'uncaught exception (survived)', err: err.message }));
});

const env = loadEnv();
const deps = await boot(env);
// Outgoing mail: SMTP_URL, or the local catcher on a loopback port (its queue worker starts in createApp).
const mail = await connectMail(deps);
// Hosted checkout: the real service with STRIPE_SECRET_KEY, else the local fake on a loopback
// port, which posts its signed events to this server's webhook.
const payments = await startPayments(deps, () => `http://127.0.0.1:${env.port}/api/payments/webhook`);
const { app, stop } = createApp({ ...deps, mail: mail.mail }, { background: true });
const server = app.listen(env.port, () => {
  deps.log.info(`Trayce is serving on http://localhost:${env.port}`);
});

function shutdown(signal: string) {
  deps.log.info(`${signal}: closing`);
  stop();
  void mail.close();
  void payments.stop();
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
