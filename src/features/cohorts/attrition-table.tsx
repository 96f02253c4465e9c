import type { CohortPreview } from '../../../shared/schemas/cohort';
import { countShort } from './format';
import { TableFrame } from '../../components/table-frame';

/** The flow of episodes into the cohort, criterion by criterion, in order (the diagram a paper needs). */
export function AttritionTable({ steps }: { steps: CohortPreview['attrition'] }) {
  const withheld = steps.some((s) => s.excluded === 'hidden' || s.remaining === 'hidden');
  return (
    <div>
      <TableFrame
        caption="How many episodes each criterion excluded, in order"
        cell="px-3 py-2"
        columns={['Step', { label: 'Excluded', numeric: true }, { label: 'Remaining', numeric: true }]}
      >
        {steps.map((s, i) => (
          <tr key={s.step} className="border-b border-line last:border-0">
            <th scope="row" className="px-3 py-2 font-normal">
              {i === 0 ? s.label : `${i}. ${s.label}`}
            </th>
            <td className="px-3 py-2 text-right text-ink-soft">{i === 0 ? '' : countShort(s.excluded)}</td>
            <td className="px-3 py-2 text-right font-medium">{countShort(s.remaining)}</td>
          </tr>
        ))}
      </TableFrame>
      {withheld && (
        <p className="mt-1 text-xs text-ink-soft">
          “withheld”: not a small number itself, but showing it would let a small one be worked out by subtraction.
        </p>
      )}
    </div>
  );
}
