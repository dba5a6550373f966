import { existsSync } from 'node:fs';
import { join } from 'node:path';
import express, { type Router } from 'express';

/**
 * Serves the built web app from the same origin as the API. Hashed assets are cached for a
 * year; index.html never, so a new build shows at once. Any non-API GET falls back to
 * index.html so that deep links into the app work.
 */
export function serveWeb(distDir: string): Router {
  const router = express.Router();
  const indexHtml = join(distDir, 'index.html');
  router.use(
    '/assets',
    express.static(join(distDir, 'assets'), {
      immutable: true,
      maxAge: '365d',
      fallthrough: false,
    }),
  );
  router.use(express.static(distDir, { index: false, maxAge: 0 }));
  router.get(/^\/(?!api\/).*/, (_req, res, next) => {
    if (!existsSync(indexHtml)) return next();
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(indexHtml);
  });
  return router;
}
