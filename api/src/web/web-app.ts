import { existsSync } from 'node:fs';
import path from 'node:path';
import express, { Router } from 'express';

/** The default place of the built Angular app. */
export const defaultWebDir = path.resolve(import.meta.dirname, '../../../dist/web');

/** Angular's builder writes into `<outputPath>/browser` unless told otherwise; accept both layouts. */
export function resolveWebRoot(webDir: string): string {
  const browser = path.join(webDir, 'browser');
  return existsSync(path.join(browser, 'index.html')) ? browser : webDir;
}

const notBuiltPage =
  '<!doctype html><meta charset="utf-8"><title>Conserva</title>' +
  '<p>The Conserva web app has not been built yet. <code>npm start</code> builds it when the web sources are ' +
  'present (or run <code>npx ng build</code>), then restart the server.</p>';

/**
 * Serves the built web app: hashed files cached for good, index.html never cached, and every other GET
 * path answered with index.html so the app's own router handles deep links (history fallback).
 */
export function webAppRouter(webDir: string): Router {
  const root = resolveWebRoot(webDir);
  const index = path.join(root, 'index.html');
  const router = Router();
  router.use(express.static(root, { index: false, maxAge: '1y', immutable: true }));
  router.get('/{*splat}', (_req, res, next) => {
    if (!existsSync(index)) {
      res.status(503).type('html').send(notBuiltPage);
      return;
    }
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(index, (err) => err && next(err));
  });
  return router;
}
