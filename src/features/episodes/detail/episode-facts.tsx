import type { EpisodeDetail } from '../../../../shared/schemas/episode';
import { Tile, TileGrid } from '../../../components/tile';
import { formatDate, formatNumber } from '../format';
import { ACTIVITY_LABELS, BMI_BAND_LABELS, DISCHARGE_REASON_LABELS, SEX_LABELS, SIDE_LABELS } from '../labels';

/** The episode's facts; BMI and its WHO band are worked out by the server from height and weight. */
export function EpisodeFacts({ episode: e }: { episode: EpisodeDetail }) {
  return (
    <TileGrid>
      <Tile label="Started">{formatDate(e.startDate)}</Tile>
      <Tile label="Affected heel">{SIDE_LABELS[e.side]}</Tile>
      <Tile label="Symptoms before start">{e.symptomWeeks} weeks</Tile>
      <Tile label="Age and sex">
        {e.ageYears} · {SEX_LABELS[e.sex]}
      </Tile>
      <Tile label="Height and weight">
        {formatNumber(e.heightCm)} cm · {formatNumber(e.weightKg)} kg
      </Tile>
      <Tile label="BMI" note={BMI_BAND_LABELS[e.bmiBand]}>
        {formatNumber(e.bmi)} kg/m²
      </Tile>
      <Tile label="Activity group">{ACTIVITY_LABELS[e.activityProfile]}</Tile>
      <Tile label="Standing work">{e.standingWork ? 'Yes' : 'No'}</Tile>
      <Tile label="Research use">{e.researchConsent ? 'Agreed' : 'Not agreed'}</Tile>
      <Tile label="Pseudonym" note="First 8 of 64 characters">
        <span className="font-mono text-base">{e.pseudonym.slice(0, 8)}</span>
      </Tile>
      {e.dischargeDate ? (
        <Tile label="Discharged" note={e.dischargeReason ? DISCHARGE_REASON_LABELS[e.dischargeReason] : undefined}>
          {formatDate(e.dischargeDate)}
        </Tile>
      ) : null}
    </TileGrid>
  );
}
