import { useState } from 'react';
import type { InterventionCode } from '../../../../shared/schemas/admin';
import { errorText } from '../../../components/error-notice';
import { inputClass } from '../../../components/form-field';
import { useChangeCode } from '../api/change-code';
import { linkButton, quietButton } from '../components/buttons';
import { CODE_STATUS_WORDS, KIND_WORDS } from './code-words';
import { TableFrame } from '../../../components/table-frame';

const td = 'px-4 py-2.5 align-top';

/** One code's steward actions: relabel, switch grading while unused, decide a proposal. */
function CodeActions({ c }: { c: InterventionCode }) {
  const change = useChangeCode();
  const [label, setLabel] = useState<string | null>(null);
  return (
    <div className="flex flex-col items-start gap-1.5">
      {c.status === 'proposed' ? (
        <div className="flex gap-2">
          <button
            type="button"
            className={quietButton}
            onClick={() => change.mutate({ kind: 'decide', id: c.id, input: { decision: 'accept' } })}
          >
            Accept
          </button>
          <button
            type="button"
            className={quietButton}
            onClick={() => change.mutate({ kind: 'decide', id: c.id, input: { decision: 'decline' } })}
          >
            Decline
          </button>
        </div>
      ) : null}
      {label === null ? (
        <button type="button" className={linkButton} onClick={() => setLabel(c.label)}>
          Relabel
        </button>
      ) : (
        <form
          className="flex gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            change.mutate({ kind: 'edit', id: c.id, patch: { label } }, { onSuccess: () => setLabel(null) });
          }}
        >
          <label htmlFor={`label-${c.id}`} className="sr-only">
            New label for {c.code}
          </label>
          <input
            id={`label-${c.id}`}
            value={label}
            onChange={(e) => setLabel(e.target.value)}
            className={`${inputClass} w-56`}
          />
          <button type="submit" className={quietButton}>
            Save
          </button>
        </form>
      )}
      {c.useCount === 0 ? (
        <button
          type="button"
          className={linkButton}
          onClick={() => change.mutate({ kind: 'edit', id: c.id, patch: { graded: !c.graded } })}
        >
          {c.graded ? 'Make ungraded' : 'Make graded (1–3)'}
        </button>
      ) : null}
      {change.error ? (
        <p role="alert" className="text-xs text-bad">
          {errorText(change.error)}
        </p>
      ) : null}
    </div>
  );
}

/** Intervention codes; `actions` off for a lead's read-only list of proposals. */
export function CodesTable({ codes, actions }: { codes: InterventionCode[]; actions: boolean }) {
  return (
    <TableFrame
      caption="Intervention codes"
      cell="px-4 py-2"
      columns={[
        'Code',
        'Kind',
        'Levels',
        'State',
        'Proposed by',
        'Episodes',
        ...(actions ? [{ label: 'Actions', hidden: true }] : []),
      ]}
    >
      {codes.map((c) => (
        <tr key={c.id} className="border-b border-line last:border-0">
          <td className={td}>
            <span className="font-medium">{c.label}</span>
            <span className="block text-xs text-ink-soft">{c.code}</span>
          </td>
          <td className={td}>{KIND_WORDS[c.kind]}</td>
          <td className={td}>{c.graded ? '1–3' : '—'}</td>
          <td className={td}>
            <span
              className={c.status === 'proposed' ? 'text-caution' : c.status === 'declined' ? 'text-ink-faint' : ''}
            >
              {CODE_STATUS_WORDS[c.status]}
            </span>
          </td>
          <td className={td}>{c.proposedByClinicCode ?? 'Registry'}</td>
          <td className={td}>{c.useCount}</td>
          {actions ? (
            <td className={td}>
              <CodeActions c={c} />
            </td>
          ) : null}
        </tr>
      ))}
    </TableFrame>
  );
}
