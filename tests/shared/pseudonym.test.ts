import { describe, expect, it } from 'vitest';
import { createHmac, pbkdf2Sync } from 'node:crypto';
import { derivePseudonymKey, normaliseLocalId, PBKDF2_ITERATIONS, pseudonymFor } from '../../shared/pseudonym';

/** An independent computation with node:crypto (not Web Crypto): PBKDF2 (RFC 8018) then HMAC (RFC 2104). */
function nodePseudonym(passphrase: string, saltHex: string, localId: string): string {
  const key = pbkdf2Sync(Buffer.from(passphrase, 'utf8'), Buffer.from(saltHex, 'hex'), 310_000, 32, 'sha256');
  return createHmac('sha256', key).update(localId.trim().toUpperCase(), 'utf8').digest('hex');
}

const SALT = '00112233445566778899aabbccddeeff';

describe('shared/pseudonym (Web Crypto) against node:crypto', () => {
  it('uses 310,000 PBKDF2 iterations', () => {
    expect(PBKDF2_ITERATIONS).toBe(310_000);
  });

  it('gives the same 64-hex pseudonym as pbkdf2Sync + createHmac for the same input', async () => {
    const key = await derivePseudonymKey('correct horse battery staple', SALT);
    for (const id of ['MRN-000123', '  ab12cd ', 'Zoë-7']) {
      const ours = await pseudonymFor(key, id);
      expect(ours).toMatch(/^[0-9a-f]{64}$/);
      expect(ours).toBe(nodePseudonym('correct horse battery staple', SALT, id));
    }
  });

  it('links the same identifier written differently, and separates clinics and passphrases', async () => {
    const a = await derivePseudonymKey('passphrase one', SALT);
    const b = await derivePseudonymKey('passphrase two', SALT);
    const c = await derivePseudonymKey('passphrase one', 'ffeeddccbbaa99887766554433221100');
    expect(await pseudonymFor(a, ' x-1 ')).toBe(await pseudonymFor(a, 'X-1'));
    expect(await pseudonymFor(a, 'X-1')).not.toBe(await pseudonymFor(b, 'X-1'));
    expect(await pseudonymFor(a, 'X-1')).not.toBe(await pseudonymFor(c, 'X-1'));
    expect(normaliseLocalId(' ab ')).toBe('AB');
  });

  it('refuses a malformed salt, an empty passphrase and an empty identifier', async () => {
    await expect(derivePseudonymKey('p', 'xyz')).rejects.toThrow(/32 lower-case hexadecimal/);
    await expect(derivePseudonymKey('', SALT)).rejects.toThrow(/passphrase/);
    const key = await derivePseudonymKey('p', SALT);
    await expect(pseudonymFor(key, '   ')).rejects.toThrow(/empty/);
  });
});
