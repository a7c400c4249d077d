import { existsSync, readdirSync } from 'node:fs';
import { extname, join } from 'node:path';
import express, { type Express, type Request, type Response } from 'express';
import { acceptedEncoding } from './encoding.ts';

const SUFFIX = { br: '.br', gzip: '.gz' } as const;

/**
 * Serves the built web app. Files under /assets carry a content hash in their names, so browsers
 * keep them for a year without asking again; index.html is checked on every visit (`no-cache`),
 * so a new build is picked up at once. The .br/.gz copies written at build time are sent to
 * clients that accept them.
 */
export function serveWeb(app: Express, dist: string): void {
  const assets = join(dist, 'assets');
  const index = join(dist, 'index.html');
  const compressed = new Set(existsSync(assets) ? readdirSync(assets).filter((n) => n.endsWith('.br') || n.endsWith('.gz')) : []);

  const sendFile = (req: Request, res: Response, file: string, name: string, cacheControl: string, has: (name: string) => boolean) => {
    res.vary('Accept-Encoding');
    res.setHeader('Cache-Control', cacheControl);
    res.type(extname(name));
    const encoding = acceptedEncoding(req);
    const variant = encoding && has(`${name}${SUFFIX[encoding]}`) ? encoding : null;
    if (variant) res.setHeader('Content-Encoding', variant);
    res.sendFile(variant ? `${file}${SUFFIX[variant]}` : file, { cacheControl: false });
  };

  app.get('/assets/{*path}', (req, res) => {
    const name = req.path.slice('/assets/'.length);
    // Only names the build wrote, so nothing outside the folder is reachable and a missing asset is a 404, not the page.
    if (!/^[\w.-]+$/.test(name) || !existsSync(join(assets, name))) return res.status(404).end();
    sendFile(req, res, join(assets, name), name, 'public, max-age=31536000, immutable', (n) => compressed.has(n));
  });
  const indexVariants = new Set(['index.html.br', 'index.html.gz'].filter((n) => existsSync(join(dist, n))));
  app.use(express.static(dist, { index: false, maxAge: '1h', setHeaders: (res, path) => path.endsWith('.html') && res.setHeader('Cache-Control', 'no-cache') }));
  // Browsers and feed readers ask for /favicon.ico whatever the page links; a build without it answers 404, never the page.
  app.get('/favicon.ico', (_req, res) => res.status(404).end());
  app.get(/.*/, (req, res) => sendFile(req, res, index, 'index.html', 'no-cache', (n) => indexVariants.has(n)));
}
