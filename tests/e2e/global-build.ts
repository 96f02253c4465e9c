import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { TestProject } from 'vitest/node';
import { childEnv } from '../../server/env';
import { checkoutRoot } from '../../scripts/db';

declare module 'vitest' {
  export interface ProvidedContext {
    /** The client, built once for the browser tests (never the checkout's dist/client). */
    e2eClientDir: string;
  }
}

/**
 * Builds the client once per browser-test run into a temporary folder, removed at the end. The build runs in
 * its own process with NODE_ENV=production: Vitest's NODE_ENV=test would give React's development build,
 * and the browser tests check what users get.
 */
export default function setup(project: TestProject): () => void {
  const outDir = mkdtempSync(path.join(tmpdir(), 'loadline-e2e-client-'));
  const vite = path.join(checkoutRoot, 'node_modules', '.bin', 'vite');
  const r = spawnSync(vite, ['build', '--outDir', outDir, '--emptyOutDir', '--logLevel', 'warn'], {
    cwd: checkoutRoot,
    env: childEnv({ NODE_ENV: 'production' }),
    encoding: 'utf8',
  });
  if (r.status !== 0) throw new Error(`the client build for the browser tests failed:\n${r.stderr || r.stdout}`);
  project.provide('e2eClientDir', outDir);
  return () => rmSync(outDir, { recursive: true, force: true });
}
