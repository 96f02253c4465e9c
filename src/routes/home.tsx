/** Overview: what Loadline does; later issues put each role's start screen here. */
export function Component() {
  return (
    <section className="max-w-3xl space-y-4">
      <h1 className="text-2xl font-semibold">Outcomes of your heel-pain care, side by side with the registry</h1>
      <p className="text-ink-soft">
        Clinics submit pseudonymised episodes of care. Loadline computes change scores, the share of patients improving
        by at least the minimal clinically important difference, time to recovery and comparisons with peers, so a clinic
        can see whether its results meet the three-month expectation.
      </p>
    </section>
  );
}
