import path from 'node:path';
import { existsSync } from 'node:fs';
import express, { type RequestHandler } from 'express';
import { checkoutRoot } from './paths';

/** Serves the built client from dist/client, with index.html for every client route. */
export function builtClient(): RequestHandler[] {
  const dir = path.join(checkoutRoot, 'dist', 'client');
  const index = path.join(dir, 'index.html');
  if (!existsSync(index)) throw new Error('The client is not built (dist/client/index.html missing); run npm run build');
  const spaFallback: RequestHandler = (req, res, next) => {
    if (req.method !== 'GET' && req.method !== 'HEAD') return next();
    res.sendFile(index);
  };
  return [express.static(dir, { index: false, maxAge: '1h' }), spaFallback];
}

/** Vite in middleware mode: one port serves API and client during development. */
export async function viteClient(): Promise<RequestHandler[]> {
  const { createServer } = await import('vite');
  const vite = await createServer({ root: checkoutRoot, server: { middlewareMode: true }, appType: 'spa' });
  return [vite.middlewares as unknown as RequestHandler];
}
