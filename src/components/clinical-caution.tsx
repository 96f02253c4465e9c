/** The standing caution shown on every screen. */
export function ClinicalCaution({ className = '' }: { className?: string }) {
  return (
    <p className={`text-xs leading-relaxed text-ink-faint ${className}`}>
      Loadline records and summarises outcomes of groups of episodes. It supports, and does not replace, the
      judgement of a licensed clinician, and it gives no diagnosis or treatment advice for any patient. Associations
      shown here are observational and not evidence of cause. Follow your local regulations and professional codes.
    </p>
  );
}
