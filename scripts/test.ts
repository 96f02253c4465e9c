/**
 * `npm test`: the same bootstrap as `npm start` (dependencies, PostgreSQL), then the type-check,
 * the lint, and every Vitest project. Each integration run gets its own throw-away database
 * (tests/setup/global-setup.ts), never the demo database.
 */
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import path from 'node:path';
import { checkoutRoot, ensurePostgres } from './db';
import { fail } from './lib-setup';

function step(title: string, cmd: string, args: string[]): void {
  console.log(`\nloadline: ${title}`);
  const r = spawnSync(path.join(checkoutRoot, 'node_modules', '.bin', cmd), args, { cwd: checkoutRoot, stdio: 'inherit' });
  if (r.status !== 0) {
    console.error(`loadline: ${title} failed`);
    process.exit(r.status ?? 1);
  }
}

/** Debian's Chromium for the browser tests (never a browser download). */
function ensureChromium(): void {
  if (existsSync('/usr/bin/chromium')) return;
  if (process.getuid?.() !== 0) {
    throw new Error('Chromium is not installed for the browser tests. Install it with: sudo apt-get install -y chromium');
  }
  console.log('loadline: installing Chromium for the browser tests (apt-get install -y chromium)…');
  let r = spawnSync('apt-get', ['install', '-y', 'chromium'], { stdio: 'inherit' });
  if (r.status !== 0) {
    spawnSync('apt-get', ['update'], { stdio: 'inherit' });
    r = spawnSync('apt-get', ['install', '-y', 'chromium'], { stdio: 'inherit' });
  }
  if (r.status !== 0 || !existsSync('/usr/bin/chromium')) throw new Error('apt-get install -y chromium failed; see above');
}

async function main(): Promise<void> {
  await ensurePostgres();
  ensureChromium();
  step('type-check (tsc --noEmit)', 'tsc', ['--noEmit', '-p', 'tsconfig.json']);
  step('lint (eslint)', 'eslint', ['.', '--max-warnings', '0']);
  step('tests (vitest)', 'vitest', ['run', ...process.argv.slice(2)]);
}

main().catch(fail);
