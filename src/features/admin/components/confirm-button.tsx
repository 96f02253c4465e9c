import { useState, type ReactNode } from 'react';
import { dangerButton, quietButton } from './buttons';

/**
 * A consequential action asked twice: the first press shows what will happen and a confirm button,
 * so no single mis-click deactivates a clinic or a person.
 */
export function ConfirmButton({
  label,
  confirmLabel,
  consequence,
  onConfirm,
  busy,
  danger = true,
}: {
  label: string;
  confirmLabel: string;
  consequence: ReactNode;
  onConfirm: () => void;
  busy?: boolean;
  danger?: boolean;
}) {
  const [asking, setAsking] = useState(false);
  if (!asking) {
    return (
      <button type="button" className={danger ? dangerButton : quietButton} onClick={() => setAsking(true)}>
        {label}
      </button>
    );
  }
  return (
    <div role="group" aria-label={label} className="space-y-2 rounded border border-line bg-canvas p-3 text-sm">
      <p className="text-ink">{consequence}</p>
      <div className="flex gap-2">
        <button
          type="button"
          className={danger ? dangerButton : quietButton}
          disabled={busy}
          onClick={() => {
            onConfirm();
            setAsking(false);
          }}
        >
          {confirmLabel}
        </button>
        <button type="button" className={quietButton} onClick={() => setAsking(false)}>
          Keep as is
        </button>
      </div>
    </div>
  );
}
