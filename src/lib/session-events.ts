/**
 * A 401 from any request means the session is gone. The query client reports it here; the shell
 * registers what to do (go to sign-in and come back afterwards). Kept apart so lib/ needs no router.
 */
type Handler = () => void;
let handler: Handler | null = null;

export function onUnauthorized(fn: Handler): () => void {
  handler = fn;
  return () => {
    if (handler === fn) handler = null;
  };
}

export function notifyUnauthorized(): void {
  handler?.();
}

/** Sign-out: anything held in memory for this user (e.g. the pseudonym key) subscribes and forgets it. */
const signedOutListeners = new Set<Handler>();

export function onSignedOut(fn: Handler): () => void {
  signedOutListeners.add(fn);
  return () => signedOutListeners.delete(fn);
}

export function notifySignedOut(): void {
  signedOutListeners.forEach((fn) => fn());
}
