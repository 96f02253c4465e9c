import { episodeFacts, type DeriveContext, type EpisodeFacts, type FactsRow, type InstrumentFacts } from '../cohorts/derive';

/** Shared by every counting fact: nothing ever adds to it. */
const NO_SCORES: Map<string, InstrumentFacts> = new Map();

/**
 * The facts of one episode for the counting pass when the cohort's criteria need no scores (`needsScores` is
 * false, so no criterion reads them): the episode's fields and bands exactly as `deriveFacts` makes them
 * (`episodeFacts`), and no score facts. `deriveFacts` would also build empty score facts for every
 * instrument, which was half the garbage of the counting pass. The file pass still uses `deriveFacts`;
 * tests/server/exports-scan.test.ts checks that both give the same cohort.
 */
export function countingFacts(row: FactsRow, ctx: DeriveContext): EpisodeFacts {
  return episodeFacts(row, ctx, NO_SCORES, null, 0);
}
