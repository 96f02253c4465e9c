import { useState } from 'react';
import type { DataRequest } from '../../../shared/schemas/data-request';
import { ErrorNotice } from '../../components/error-notice';
import { inputClass } from '../../components/form-field';
import { primaryButton, quietButton } from '../cohorts/buttons';
import { useDecideDataRequest } from './api/decide-data-request';

const inDays = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);

/** The steward's decision: approve with an expiry day and the de-identification settings, or decline with a reason. */
export function DecisionForm({ request }: { request: DataRequest }) {
  const decide = useDecideDataRequest();
  const [expiresOn, setExpiresOn] = useState(inDays(90));
  const [granularity, setGranularity] = useState<'year' | 'quarter'>('year');
  const [allowRawBmi, setAllowRawBmi] = useState(false);
  const [k, setK] = useState('');
  const [reason, setReason] = useState('');
  const id = `decide-${request.id}`;
  const approve = () =>
    decide.mutate({
      kind: 'approve',
      id: request.id,
      body: { expiresOn, startGranularity: granularity, allowRawBmi, ...(k ? { k: Number(k) } : {}) },
    });
  return (
    <div className="space-y-3 border-t border-line pt-3">
      <div className="grid gap-3 sm:grid-cols-4">
        <label className="space-y-1 text-sm">
          <span className="block font-medium">Downloadable until</span>
          <input
            type="date"
            className={inputClass}
            value={expiresOn}
            min={inDays(0)}
            onChange={(e) => setExpiresOn(e.target.value)}
          />
        </label>
        <label className="space-y-1 text-sm">
          <span className="block font-medium">Start dates as</span>
          <select
            className={inputClass}
            value={granularity}
            onChange={(e) => setGranularity(e.target.value as 'year' | 'quarter')}
          >
            <option value="year">Year only</option>
            <option value="quarter">Year and quarter</option>
          </select>
        </label>
        <label className="space-y-1 text-sm">
          <span className="block font-medium">k (at least 3)</span>
          <input
            type="number"
            min={3}
            max={100}
            placeholder="registry default"
            className={inputClass}
            value={k}
            onChange={(e) => setK(e.target.value)}
          />
        </label>
        <label className="flex items-end gap-2 pb-2 text-sm">
          <input type="checkbox" checked={allowRawBmi} onChange={(e) => setAllowRawBmi(e.target.checked)} />
          Include raw BMI
        </label>
      </div>
      <div className="flex flex-wrap items-end gap-3">
        <button type="button" className={primaryButton} disabled={decide.isPending} onClick={approve}>
          Approve
        </button>
        <label htmlFor={`${id}-reason`} className="sr-only">
          Reason for declining
        </label>
        <input
          id={`${id}-reason`}
          className={`${inputClass} max-w-md`}
          placeholder="Reason, if declining"
          value={reason}
          onChange={(e) => setReason(e.target.value)}
        />
        <button
          type="button"
          className={quietButton}
          disabled={decide.isPending || reason.trim().length < 5}
          onClick={() => decide.mutate({ kind: 'decline', id: request.id, body: { reason } })}
        >
          Decline
        </button>
      </div>
      {decide.error ? <ErrorNotice error={decide.error} title="The decision was not saved" /> : null}
    </div>
  );
}
