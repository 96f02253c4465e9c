import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { createHmac, pbkdf2Sync } from 'node:crypto';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';

const root = path.resolve(import.meta.dirname, '../..');
const SALT = 'a1b2c3d4e5f60718293a4b5c6d7e8f90';

function expected(passphrase: string, id: string): string {
  const key = pbkdf2Sync(passphrase, Buffer.from(SALT, 'hex'), 310_000, 32, 'sha256');
  return createHmac('sha256', key).update(id.trim().toUpperCase()).digest('hex');
}

function run(args: string[], input?: string) {
  return spawnSync(path.join(root, 'node_modules/.bin/tsx'), ['scripts/pseudonym.ts', ...args], {
    cwd: root,
    input,
    encoding: 'utf8',
  });
}

describe('scripts/pseudonym.ts (offline CLI)', () => {
  const dir = mkdtempSync(path.join(tmpdir(), 'loadline-pseudonym-'));
  const file = path.join(dir, 'passphrase.txt');
  writeFileSync(file, 'clinic passphrase 42\n');

  it('prints id,pseudonym for arguments, matching node:crypto', () => {
    const r = run(['--salt', SALT, '--passphrase-file', file, 'P-1', 'p-2']);
    expect(r.status).toBe(0);
    expect(r.stdout.trim().split('\n')).toEqual([
      'id,pseudonym',
      `P-1,${expected('clinic passphrase 42', 'P-1')}`,
      `p-2,${expected('clinic passphrase 42', 'p-2')}`,
    ]);
  }, 20_000);

  it('reads identifiers from stdin and can print pseudonyms only', () => {
    const r = run(['--salt', SALT, '--passphrase-file', file, '--pseudonyms-only'], 'A7\n\nB8\n');
    expect(r.status).toBe(0);
    expect(r.stdout.trim().split('\n')).toEqual([expected('clinic passphrase 42', 'A7'), expected('clinic passphrase 42', 'B8')]);
  }, 20_000);

  it('warns in its help that the output re-identifies patients, and fails clearly without a salt', () => {
    const help = run(['--help']);
    expect(help.stdout).toMatch(/clinic's own use only/);
    const bad = run(['--passphrase-file', file, 'X']);
    expect(bad.status).toBe(1);
    expect(bad.stderr).toMatch(/--salt/);
  }, 20_000);
});
