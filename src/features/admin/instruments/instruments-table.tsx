import { Fragment, useState } from 'react';
import type { Instrument } from '../../../../shared/schemas/admin';
import { errorText } from '../../../components/error-notice';
import { useChangeInstrument } from '../api/change-instrument';
import { linkButton } from '../components/buttons';
import { ConfirmButton } from '../components/confirm-button';
import { formatRange } from '../format';
import { InstrumentEditor } from './instrument-editor';
import { TableFrame } from '../../../components/table-frame';

const td = 'px-4 py-2.5 align-top';

function RowActions({ i, onEdit }: { i: Instrument; onEdit: () => void }) {
  const change = useChangeInstrument();
  return (
    <div className="flex flex-col items-start gap-1.5">
      <button type="button" className={linkButton} onClick={onEdit}>
        Edit {i.code}
      </button>
      {i.retired ? (
        <button type="button" className={linkButton} onClick={() => change.mutate({ kind: 'reinstate', id: i.id })}>
          Put back in service
        </button>
      ) : (
        <ConfirmButton
          label="Retire"
          confirmLabel={`Retire ${i.code}`}
          danger={false}
          busy={change.isPending}
          consequence={`${i.code} keeps its ${i.scoreCount} stored scores but takes no new ones.`}
          onConfirm={() => change.mutate({ kind: 'retire', id: i.id })}
        />
      )}
      {i.scoreCount === 0 ? (
        <ConfirmButton
          label="Delete"
          confirmLabel={`Delete ${i.code}`}
          busy={change.isPending}
          consequence={`${i.code} has never held a score; it is removed for good.`}
          onConfirm={() => change.mutate({ kind: 'delete', id: i.id })}
        />
      ) : null}
      {change.error ? (
        <p role="alert" className="text-xs text-bad">
          {errorText(change.error)}
        </p>
      ) : null}
    </div>
  );
}

/** The outcome measures, with what is stored on each (a range can never shrink past it). */
export function InstrumentsTable({ instruments }: { instruments: Instrument[] }) {
  const [editing, setEditing] = useState<number | null>(null);
  return (
    <TableFrame
      caption="Outcome measures"
      cell="px-4 py-2"
      columns={[
        'Instrument',
        'Range',
        'Better is',
        'MCID and source',
        'Region',
        'Stored scores',
        '<span className="sr-only">Actions</span>',
      ]}
    >
      {instruments.map((i) => (
        <Fragment key={i.id}>
          <tr className={`border-b border-line last:border-0 ${i.retired ? 'text-ink-faint' : ''}`}>
            <td className={td}>
              <span className="font-medium">{i.label}</span>
              <span className="block text-xs text-ink-soft">
                {i.code}
                {i.retired ? ' · retired' : ''}
              </span>
            </td>
            <td className={td}>
              {formatRange(i.min, i.max)} {i.unit}
            </td>
            <td className={td}>{i.higherIsBetter ? 'higher' : 'lower'}</td>
            <td className={`${td} max-w-sm`}>
              <span className="font-medium">{i.mcid ?? 'none'}</span>
              <span className="block text-xs text-ink-soft">{i.mcidSource}</span>
            </td>
            <td className={td}>{i.bodyRegion}</td>
            <td className={td}>
              {i.scoreCount}
              {i.storedMin !== null ? (
                <span className="block text-xs text-ink-faint">
                  {formatRange(i.storedMin, i.storedMax ?? i.storedMin)}
                </span>
              ) : null}
            </td>
            <td className={td}>
              <RowActions i={i} onEdit={() => setEditing(editing === i.id ? null : i.id)} />
            </td>
          </tr>
          {editing === i.id ? (
            <tr className="border-b border-line">
              <td colSpan={7} className="px-4 py-3">
                <InstrumentEditor instrument={i} onDone={() => setEditing(null)} />
              </td>
            </tr>
          ) : null}
        </Fragment>
      ))}
    </TableFrame>
  );
}
