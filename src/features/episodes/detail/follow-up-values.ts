import type { z } from 'zod';
import type { Resolver } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { FOLLOW_UP_TIMEPOINTS } from '../../../../shared/constants';
import { AssessmentInputSchema, type AssessmentInput, type EpisodeDetail } from '../../../../shared/schemas/episode';
import type { InstrumentInfo } from '../../../../shared/schemas/reference';
import { friendlyIssue, measuredScores, scoreRangeErrors, type ScoreInputs } from '../form-validation';

type Input = z.input<typeof AssessmentInputSchema>;
export type FollowUpValues = Omit<Input, 'scores'> & { scores: ScoreInputs };
type Result = Awaited<ReturnType<Resolver<FollowUpValues, unknown, AssessmentInput>>>;

/** AssessmentInputSchema through zodResolver, plus each score inside its instrument's range. */
export function followUpResolver(instruments: InstrumentInfo[]): Resolver<FollowUpValues, unknown, AssessmentInput> {
  const base = zodResolver(AssessmentInputSchema, { error: friendlyIssue });
  return async (values, context, options) => {
    const scores = measuredScores(values.scores);
    const result = await base({ ...values, scores }, context, options as Parameters<typeof base>[2]);
    const range = scoreRangeErrors(scores, instruments);
    if (Object.keys(range).length === 0) return result as Result;
    const errors = { ...result.errors, scores: { ...((result.errors.scores as object | undefined) ?? {}), ...range } };
    return { values: {}, errors } as Result;
  };
}

/** The first scheduled follow-up the episode does not have yet (an extra check once all are done). */
export function nextTimepoint(episode: EpisodeDetail): Input['timepoint'] {
  const done = new Set(episode.assessments.map((a) => a.timepoint));
  return FOLLOW_UP_TIMEPOINTS.find((t) => !done.has(t)) ?? 'interim';
}
