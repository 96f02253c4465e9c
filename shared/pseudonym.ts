/**
 * Registry pseudonyms, made at the clinic: HMAC-SHA-256 (RFC 2104; NIST FIPS 198-1) of the clinic's own
 * patient identifier, keyed with a key derived from the clinic's passphrase by PBKDF2-HMAC-SHA-256
 * (RFC 8018) over the clinic's salt. Only Web Crypto (`globalThis.crypto.subtle`), so the browser,
 * the offline CLI (scripts/pseudonym.ts) and the demo seed run this one implementation.
 *
 * The passphrase never leaves the clinic; the registry only ever sees the 64-hex-character result.
 */

/** OWASP Password Storage Cheat Sheet's figure for PBKDF2-HMAC-SHA256 (310,000 at the time of writing; from memory). */
export const PBKDF2_ITERATIONS = 310_000;
export const PSEUDONYM_ALGORITHM = 'PBKDF2-HMAC-SHA-256 (310,000 iterations) → HMAC-SHA-256, hex' as const;

const SALT_HEX = /^[0-9a-f]{32}$/;

function subtle(): SubtleCrypto {
  const s = globalThis.crypto?.subtle;
  if (!s) throw new Error('Web Crypto is not available here (it needs a secure context: https or localhost)');
  return s;
}

function hexToBytes(hex: string): Uint8Array<ArrayBuffer> {
  const out = new Uint8Array(new ArrayBuffer(hex.length / 2));
  for (let i = 0; i < out.length; i++) out[i] = parseInt(hex.slice(i * 2, i * 2 + 2), 16);
  return out;
}

function bytesToHex(bytes: ArrayBuffer): string {
  let s = '';
  for (const b of new Uint8Array(bytes)) s += b.toString(16).padStart(2, '0');
  return s;
}

/** The identifier as hashed: surrounding spaces removed, upper case (so " ab12 " and "AB12" link). */
export function normaliseLocalId(localId: string): string {
  return localId.trim().toUpperCase();
}

/**
 * The clinic's HMAC key (non-extractable). Slow on purpose (PBKDF2): derive it once per clinic and session,
 * then call `pseudonymFor` per patient. The passphrase is used exactly as given (UTF-8, no trimming).
 */
export async function derivePseudonymKey(passphrase: string, saltHex: string): Promise<CryptoKey> {
  if (!SALT_HEX.test(saltHex)) throw new Error('The clinic salt must be 32 lower-case hexadecimal characters');
  if (passphrase.length === 0) throw new Error('Enter the clinic passphrase');
  const s = subtle();
  const base = await s.importKey('raw', new TextEncoder().encode(passphrase), 'PBKDF2', false, ['deriveBits']);
  const bits = await s.deriveBits(
    { name: 'PBKDF2', hash: 'SHA-256', salt: hexToBytes(saltHex), iterations: PBKDF2_ITERATIONS },
    base,
    256,
  );
  return s.importKey('raw', bits, { name: 'HMAC', hash: 'SHA-256' }, false, ['sign']);
}

/** The pseudonym of one local identifier: 64 lower-case hex characters. */
export async function pseudonymFor(key: CryptoKey, localId: string): Promise<string> {
  const id = normaliseLocalId(localId);
  if (id.length === 0) throw new Error('The local identifier is empty');
  const mac = await subtle().sign('HMAC', key, new TextEncoder().encode(id));
  return bytesToHex(mac);
}
