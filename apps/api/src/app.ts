import path from 'node:path';
import { existsSync } from 'node:fs';
import compression from 'compression';
import express, { raw as rawBody, type Express } from 'express';
import helmet from 'helmet';
import { pinoHttp } from 'pino-http';
import type { AppDeps } from './app-deps.ts';
import { csrfProtection, hostCheck, originCheck } from './middleware/csrf.ts';
import { errorHandler, notFoundHandler } from './middleware/error-handler.ts';
import { requestId } from './middleware/request-id.ts';
import { createSessionMiddleware } from './middleware/session.ts';
import { apiRoutes } from './routes/api-routes.ts';
import { mountRoutes } from './routes/mount-routes.ts';
import { PAYMENT_WEBHOOK_PATH } from './modules/payments/payment-router.ts';

/** Builds the app from its dependencies; it never listens (server.ts does). */
export function createApp(deps: AppDeps): Express {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', deps.env.TRUST_PROXY);
  app.set('query parser', 'simple');

  app.use(requestId);
  app.use(hostCheck(deps.env.APP_ORIGIN, deps.env.ALLOWED_HOSTS, deps.env.NODE_ENV));
  // gzip for the client's scripts and the API's JSON: a phone on a slow mobile link gets a third of the bytes.
  app.use(compression());
  app.use(
    pinoHttp({
      logger: deps.logger,
      genReqId: (req) => (req as express.Request).id,
      autoLogging: { ignore: (req) => req.url === '/api/health' },
    }),
  );
  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: false,
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          styleSrc: ["'self'"],
          imgSrc: ["'self'", 'data:', 'blob:'],
          fontSrc: ["'self'"],
          connectSrc: ["'self'"],
          objectSrc: ["'none'"],
          frameAncestors: ["'none'"],
          baseUri: ["'none'"],
          formAction: ["'self'"],
        },
      },
      crossOriginEmbedderPolicy: false,
    }),
  );

  const api = express.Router();
  // The payment service signs the exact bytes it sends: that one route reads its body raw (the JSON parser
  // below then leaves it alone), and carries a signature instead of a session's CSRF token.
  api.use(PAYMENT_WEBHOOK_PATH, rawBody({ type: '*/*', limit: '1mb' }));
  api.use(express.json({ limit: '100kb' }));
  api.use(createSessionMiddleware(deps.env, deps.db, deps.logger));
  api.use(originCheck(deps.env.APP_ORIGIN, deps.env.NODE_ENV));
  api.use((req, res, next) =>
    req.path === PAYMENT_WEBHOOK_PATH && req.method === 'POST' ? next() : csrfProtection(req, res, next),
  );
  api.use((_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  });
  api.use(mountRoutes(apiRoutes, deps));
  api.use(notFoundHandler);
  app.use('/api', api);

  // The built client, with the SPA's routes falling back to index.html.
  const dist = deps.env.WEB_DIST_DIR;
  if (dist && existsSync(path.join(dist, 'index.html'))) {
    app.use(
      express.static(dist, {
        index: false,
        maxAge: '1h',
        setHeaders: (res, file) => {
          if (file.includes(`${path.sep}assets${path.sep}`))
            res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
        },
      }),
    );
    // The sign-in page comes pre-rendered (vite.config.ts, prerenderSignIn) so it paints before the scripts load.
    app.get('/sign-in', (_req, res) => {
      res.setHeader('Cache-Control', 'no-cache');
      res.sendFile(existsSync(path.join(dist, 'sign-in.html')) ? 'sign-in.html' : 'index.html', { root: dist });
    });
    // Enter pressed in that form before its script ran: the browser posted it; nothing is read, the page comes back.
    app.post('/sign-in', (_req, res) => res.redirect(303, '/sign-in'));
    app.get('/{*splat}', (_req, res) => {
      res.setHeader('Cache-Control', 'no-cache');
      // root + relative name: sendFile refuses absolute paths that pass through a dot-folder (.data/).
      res.sendFile('index.html', { root: dist });
    });
  }
  app.use(notFoundHandler);
  app.use(errorHandler);
  return app;
}
