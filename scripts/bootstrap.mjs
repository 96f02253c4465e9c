// Entry point of `npm start` and `npm test` on a fresh clone. Plain Node (no dependencies yet):
// installs the locked dependencies when they are missing or stale, then hands over to the
// TypeScript script for the chosen mode (scripts/start.ts, scripts/test.ts, scripts/dev.ts).
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, statSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const mode = process.argv[2];
if (!['start', 'test', 'dev'].includes(mode)) {
  console.error('loadline: usage: node scripts/bootstrap.mjs start | test | dev');
  process.exit(2);
}

const lock = path.join(root, 'package-lock.json');
const installed = path.join(root, 'node_modules', '.package-lock.json');
if (!existsSync(installed) || statSync(lock).mtimeMs > statSync(installed).mtimeMs) {
  console.log('loadline: installing dependencies (npm ci)…');
  const r = spawnSync('npm', ['ci', '--no-audit', '--no-fund'], { cwd: root, stdio: 'inherit' });
  if (r.status !== 0) {
    console.error('loadline: npm ci failed; see the output above');
    process.exit(1);
  }
}

const tsx = path.join(root, 'node_modules', '.bin', 'tsx');
const child = spawn(tsx, [path.join(root, 'scripts', `${mode}.ts`), ...process.argv.slice(3)], {
  cwd: root,
  stdio: 'inherit',
});
// Ctrl-C reaches the whole process group; let the child shut down cleanly and report its code.
for (const sig of ['SIGINT', 'SIGTERM']) process.on(sig, () => child.kill(sig));
child.on('exit', (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
