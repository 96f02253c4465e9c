import { useSyncExternalStore } from 'react';
import { derivePseudonymKey, pseudonymFor } from '../../../shared/pseudonym';
import { onSignedOut } from '../../lib/session-events';

/**
 * The clinic's pseudonym key for this tab, kept in memory only.
 *
 * Why memory and not sessionStorage: Web Crypto gives us a non-extractable CryptoKey, so after
 * derivation neither the passphrase nor the key bytes exist anywhere a script could read them back.
 * sessionStorage holds only strings, so it would have to keep the passphrase (or raw key bytes) in
 * readable form for the life of the tab. The price is typing the passphrase again after a reload.
 * Neither the passphrase nor the local identifier is ever sent to the server.
 */
let held: { saltHex: string; key: CryptoKey } | null = null;
const listeners = new Set<() => void>();
const notify = () => listeners.forEach((l) => l());

/** Derives and keeps the key (slow on purpose: PBKDF2). The passphrase is not kept. */
export async function unlockPseudonyms(passphrase: string, saltHex: string): Promise<void> {
  held = { saltHex, key: await derivePseudonymKey(passphrase, saltHex) };
  notify();
}

/** The pseudonym of a local identifier with the held key; throws when the key is missing or for another clinic. */
export async function pseudonymOf(localId: string, saltHex: string): Promise<string> {
  if (!held || held.saltHex !== saltHex) throw new Error('Enter the clinic passphrase first');
  return pseudonymFor(held.key, localId);
}

/** Drops the key (on sign-out, or when the clinician asks). */
export function forgetPseudonymKey(): void {
  held = null;
  notify();
}
onSignedOut(forgetPseudonymKey);

function subscribe(listener: () => void) {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

/** Whether this tab holds the key for the clinic with this salt. */
export function usePseudonymUnlocked(saltHex: string | undefined): boolean {
  return useSyncExternalStore(subscribe, () => saltHex !== undefined && held?.saltHex === saltHex);
}
