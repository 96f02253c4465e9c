/** Sign-in screen (filled in by the sign-in issue). */
export function Component() {
  return (
    <section className="mx-auto max-w-sm space-y-3">
      <h1 className="text-2xl font-semibold">Sign in</h1>
      <p className="text-ink-soft">Sign-in with a registry account is on its way.</p>
    </section>
  );
}
