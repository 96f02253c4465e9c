/**
 * The standing caution of the patient page. Written for patients in plain words; it names symptoms that need a
 * prompt medical review (heel-pain warning signs, common clinical teaching) and gives no advice from the answers.
 */
export function SafetyNote() {
  return (
    <aside
      aria-labelledby="safety-title"
      className="rounded border border-caution/40 bg-caution/5 p-4 text-sm leading-relaxed text-ink"
    >
      <h2 id="safety-title" className="font-semibold">
        Please read
      </h2>
      <p className="mt-1">
        These questions help your clinic follow how your heel is doing. They do not replace your clinician, and no
        advice is given from your answers.
      </p>
      <p className="mt-2">Contact your clinic or a doctor soon if you notice any of these:</p>
      <ul className="mt-1 list-disc space-y-0.5 pl-5">
        <li>a fever, or a heel that is hot, red and swollen</li>
        <li>numbness, tingling or burning in your foot or toes</li>
        <li>pain at night or at rest that keeps getting worse</li>
        <li>a sudden pop, snap or bruising under the foot</li>
        <li>weight loss you cannot explain</li>
      </ul>
      <p className="mt-2">If it feels urgent, call your local emergency services.</p>
    </aside>
  );
}
