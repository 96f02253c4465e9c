import type { z } from 'zod';
import type { Resolver } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { EpisodeCreateSchema, type EpisodeCreate } from '../../../../shared/schemas/episode';
import type { InstrumentInfo } from '../../../../shared/schemas/reference';
import { friendlyIssue, measuredScores, scoreRangeErrors, type ScoreInputs } from '../form-validation';

type CreateInput = z.input<typeof EpisodeCreateSchema>;

/** What the new-episode form holds: the shared schema's input, with blank scores allowed. */
export type NewEpisodeValues = Omit<CreateInput, 'baseline'> & {
  baseline: Omit<CreateInput['baseline'], 'scores'> & { scores: ScoreInputs };
};

/**
 * EpisodeCreateSchema, unchanged, through zodResolver, plus the one check it cannot make on its own:
 * each baseline score inside its instrument's range (the ranges are rows, fetched from the server).
 */
export function newEpisodeResolver(instruments: InstrumentInfo[]): Resolver<NewEpisodeValues, unknown, EpisodeCreate> {
  const base = zodResolver(EpisodeCreateSchema, { error: friendlyIssue });
  return async (values, context, options) => {
    const scores = measuredScores(values.baseline?.scores);
    const input: CreateInput = { ...values, baseline: { ...values.baseline, scores } };
    const result = await base(input, context, options as Parameters<typeof base>[2]);
    const range = scoreRangeErrors(scores, instruments);
    if (Object.keys(range).length === 0)
      return result as Awaited<ReturnType<Resolver<NewEpisodeValues, unknown, EpisodeCreate>>>;
    const errors = { ...result.errors } as Record<string, unknown>;
    const baseline = { ...((errors.baseline as Record<string, unknown> | undefined) ?? {}) };
    baseline.scores = { ...((baseline.scores as object | undefined) ?? {}), ...range };
    errors.baseline = baseline;
    return { values: {}, errors } as Awaited<ReturnType<Resolver<NewEpisodeValues, unknown, EpisodeCreate>>>;
  };
}
