import { useForm, type Resolver } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import {
  InstrumentPatchSchema,
  McidUpdateSchema,
  type Instrument,
  type McidUpdate,
} from '../../../../shared/schemas/admin';
import { ErrorNotice } from '../../../components/error-notice';
import { FormField, inputClass } from '../../../components/form-field';
import { applyServerIssues, friendlyIssue, numberOrBlank } from '../../episodes/form-validation';
import { useChangeInstrument } from '../api/change-instrument';
import { primaryButton, quietButton } from '../components/buttons';
import { formatRange } from '../format';
import { InstrumentFields, type InstrumentFieldValues } from './instrument-fields';

/** Edit one instrument's description and range, and its MCID (always with the published source). */
export function InstrumentEditor({ instrument: i, onDone }: { instrument: Instrument; onDone: () => void }) {
  const details = useChangeInstrument();
  const mcid = useChangeInstrument();
  const d = useForm<InstrumentFieldValues>({
    // The editor always sends every field; the patch schema checks them all the same way.
    resolver: zodResolver(InstrumentPatchSchema, {
      error: friendlyIssue,
    }) as unknown as Resolver<InstrumentFieldValues>,
    defaultValues: {
      label: i.label,
      unit: i.unit,
      min: i.min,
      max: i.max,
      higherIsBetter: i.higherIsBetter,
      bodyRegion: i.bodyRegion,
    },
  });
  const m = useForm<McidUpdate>({
    resolver: zodResolver(McidUpdateSchema, { error: friendlyIssue }),
    defaultValues: { mcid: i.mcid, source: '' },
  });
  const stored =
    i.storedMin === null
      ? 'No scores stored yet'
      : `Stored scores run from ${formatRange(i.storedMin, i.storedMax ?? i.storedMin)}; the range must keep them`;

  const saveDetails = d.handleSubmit(async (patch) => {
    try {
      await details.mutateAsync({ kind: 'edit', id: i.id, patch });
      onDone();
    } catch (e) {
      applyServerIssues(e, d.setError);
    }
  });
  const saveMcid = m.handleSubmit(async (input) => {
    try {
      await mcid.mutateAsync({ kind: 'mcid', id: i.id, input });
      onDone();
    } catch (e) {
      applyServerIssues(e, m.setError);
    }
  });

  return (
    <div className="space-y-5 rounded border border-accent/40 bg-accent-tint/40 p-4">
      <form noValidate onSubmit={(e) => void saveDetails(e)} aria-label={`Edit ${i.code}`} className="space-y-3">
        <InstrumentFields
          register={d.register}
          errors={d.formState.errors}
          idPrefix={`edit-${i.id}`}
          rangeHint={stored}
        />
        {details.error ? <ErrorNotice error={details.error} title="The change was not saved" /> : null}
        <div className="flex gap-2">
          <button type="submit" className={primaryButton} disabled={d.formState.isSubmitting}>
            Save details
          </button>
          <button type="button" className={quietButton} onClick={onDone}>
            Cancel
          </button>
        </div>
      </form>
      <form
        noValidate
        onSubmit={(e) => void saveMcid(e)}
        aria-label={`MCID of ${i.code}`}
        className="space-y-3 border-t border-line pt-4"
      >
        <p className="text-sm text-ink-soft">
          Now: {i.mcid ?? 'none'} — {i.mcidSource}
        </p>
        <div className="grid gap-4 sm:grid-cols-3">
          <FormField
            id={`mcid-${i.id}`}
            label="New MCID (points)"
            hint="Empty: the measure has none"
            error={m.formState.errors.mcid?.message}
          >
            {(a11y) => (
              <input
                {...a11y}
                {...m.register('mcid', { setValueAs: (v) => numberOrBlank(v) ?? null })}
                type="number"
                step="any"
                className={inputClass}
              />
            )}
          </FormField>
          <FormField
            id={`mcid-source-${i.id}`}
            label="Where it was published"
            required
            className="sm:col-span-2"
            error={m.formState.errors.source?.message}
          >
            {(a11y) => (
              <input
                {...a11y}
                {...m.register('source')}
                className={inputClass}
                placeholder="Author year, population, anchor"
              />
            )}
          </FormField>
        </div>
        {mcid.error ? <ErrorNotice error={mcid.error} title="The MCID was not changed" /> : null}
        <button type="submit" className={quietButton} disabled={m.formState.isSubmitting}>
          Change MCID
        </button>
      </form>
    </div>
  );
}
