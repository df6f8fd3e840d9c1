import express from 'express';
import helmet from 'helmet';
import cookieParser from 'cookie-parser';
import { pinoHttp } from 'pino-http';
import fs from 'node:fs';
import path from 'node:path';
import type { AppDeps } from './app-deps';
import { PROJECT_ROOT } from './lib/project-root';
import { Api } from './http/api';
import { authenticate } from './middleware/authenticate';
import { sameOrigin } from './middleware/same-origin';
import { makeSignInLimits } from './middleware/sign-in-limits';
import { errorHandler, notFoundApi } from './middleware/error-handler';
import { registerAuthRoutes } from './routes/auth.routes';
import { registerUserRoutes } from './routes/users.routes';
import { registerStationRoutes } from './routes/stations.routes';
import { registerDeviceRoutes } from './routes/devices.routes';
import { registerScanRoutes } from './routes/scans.routes';
import { registerShippingRoutes } from './routes/shipping.routes';
import { registerSalesRoutes } from './routes/sales.routes';
import { registerMailRoutes } from './routes/mail.routes';
import { registerAdminRoutes } from './routes/admin.routes';
import { registerOrderRoutes } from './routes/orders.routes';
import { registerTrayRoutes } from './routes/trays.routes';
import { registerLiveRoutes } from './routes/live.routes';
import { registerReportRoutes } from './routes/reports.routes';
import { registerCalendarRoutes } from './routes/calendar.routes';
import { registerLoadRoutes } from './routes/loads.routes';
import { registerPaymentRoutes } from './routes/payments.routes';
import { registerPortalRoutes } from './routes/portal.routes';
import { registerQuoteRoutes } from './routes/quotes.routes';
import { addScanHook } from './services/scan-ingest.service';
import { statusAfterScans } from './services/shipping.service';
import { reportFactsService } from './services/report-facts.service';
import { startMailWorker } from './services/mail.service';
import { registerCostingRoutes } from './routes/costing.routes';
import { registerProjectionRoutes } from './routes/projections.routes';

const clientDist = path.join(PROJECT_ROOT, 'dist');

export interface CreatedApp {
  app: express.Express;
  api: Api;
  /** stops the background work started here (the mail worker) */
  stop(): void;
}

/**
 * Builds the HTTP app without listening (the Supertest target), and wires what runs beside the
 * requests, here and nowhere else (no module does work when it is imported):
 * - scan hooks: an order becomes packed or shipped as its trays finish (in the scan's transaction);
 * - with `background` (the server; tests leave it off and call what they need): the report-facts
 *   follower that keeps the report tables fresh after floor changes, and the mail queue worker
 *   when `deps.mail` is connected (server/index.ts).
 */
export function createApp(deps: AppDeps, options: { serveClient?: boolean; background?: boolean } = {}): CreatedApp {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          'img-src': ["'self'", 'data:', 'blob:'],
          'media-src': ["'self'", 'blob:'],
          'worker-src': ["'self'", 'blob:'],
          'connect-src': ["'self'"],
          'upgrade-insecure-requests': deps.env.publicUrl.startsWith('https://') ? [] : null,
        },
      },
      strictTransportSecurity: deps.env.publicUrl.startsWith('https://'),
    }),
  );
  app.use(
    pinoHttp({
      logger: deps.log,
      autoLogging: { ignore: (req) => req.url === '/api/health' },
      serializers: { req: (req) => ({ method: req.method, url: req.url }), res: (res) => ({ statusCode: res.statusCode }) },
    }),
  );
  app.use(cookieParser());

  addScanHook(deps, statusAfterScans);
  const stops: (() => void)[] = [];
  if (options.background) {
    reportFactsService.follow(deps);
    if (deps.mail) stops.push(startMailWorker(deps).stop);
  }

  const api = new Api(deps);
  const limits = makeSignInLimits(deps);
  registerAuthRoutes(api, limits);
  registerUserRoutes(api);
  registerStationRoutes(api);
  registerDeviceRoutes(api, deps);
  registerScanRoutes(api, limits);
  registerShippingRoutes(api);
  registerSalesRoutes(api);
  registerMailRoutes(api);
  registerAdminRoutes(api);
  registerOrderRoutes(api);
  registerTrayRoutes(api);
  registerLiveRoutes(api);
  registerReportRoutes(api);
  registerCalendarRoutes(api);
  registerLoadRoutes(api);
  registerPaymentRoutes(api);
  registerPortalRoutes(api);
  registerQuoteRoutes(api);
  registerCostingRoutes(api);
  registerProjectionRoutes(api);

  // The payment webhook's signature is made over the exact bytes sent: keep them raw for it alone.
  app.use('/api/payments/webhook', express.raw({ type: () => true, limit: '256kb' }));
  app.use('/api', sameOrigin(deps.env, api.signedRoutes), express.json({ limit: '1mb' }), authenticate(deps), api.router, notFoundApi);

  if (options.serveClient !== false && fs.existsSync(path.join(clientDist, 'index.html'))) {
    app.use(express.static(clientDist, { index: false, maxAge: '1h' }));
    // A customer's status page is private: search engines must not index it.
    app.use(['/status', '/quote'], (_req, res, next) => {
      res.set('X-Robots-Tag', 'noindex, nofollow, noarchive');
      res.set('Referrer-Policy', 'no-referrer');
      next();
    });
    // Client-side routes: every other GET gets the app shell.
    app.get(/^\/(?!api\/).*/, (_req, res) => {
      res.set('Cache-Control', 'no-cache');
      res.sendFile(path.join(clientDist, 'index.html'));
    });
  }
  app.use(errorHandler);
  return { app, api, stop: () => stops.forEach((stop) => stop()) };
}
