import { describe, it, expect } from 'vitest';
import {
  changeScore,
  isResponder,
  selectPrimaryFollowUp,
  classifyResponder,
  responderShare,
  wilsonInterval,
  DEFAULT_FOLLOW_UP_WINDOW,
} from '../../analysis/index';
import type { EpisodeScores } from '../../analysis/index';

// Rules of the trade below (sign convention, responder = change >= MCID, 10-16 week window)
// are common practice with no single published source; the checks are of the stated rules.
describe('changeScore: positive always means better', () => {
  it('lower-is-better (NPRS pain 7 -> 3) gives +4; higher-is-better (40 -> 52) gives +12', () => {
    expect(changeScore(7, 3, false)).toBe(4);
    expect(changeScore(40, 52, true)).toBe(12);
    expect(changeScore(3, 7, false)).toBe(-4);
  });
  it('throws RangeError for non-finite scores', () => {
    expect(() => changeScore(NaN, 3, true)).toThrow(RangeError);
    expect(() => changeScore(3, Infinity, true)).toThrow(RangeError);
  });
});

describe('isResponder: change >= threshold', () => {
  it('at, above and below the threshold', () => {
    expect(isResponder(2, 2)).toBe(true);
    expect(isResponder(2.5, 2)).toBe(true);
    expect(isResponder(1.99, 2)).toBe(false);
    expect(isResponder(-3, 2)).toBe(false);
  });
  it('absorbs floating-point error in decimal scores (0.7 - 0.5 meets 0.2)', () => {
    expect(0.7 - 0.5 >= 0.2).toBe(false); // the raw comparison would fail
    expect(isResponder(0.7 - 0.5, 0.2)).toBe(true);
  });
  it('throws RangeError for threshold <= 0 or non-finite values', () => {
    expect(() => isResponder(3, 0)).toThrow(RangeError);
    expect(() => isResponder(3, -2)).toThrow(RangeError);
    expect(() => isResponder(NaN, 2)).toThrow(RangeError);
  });
});

describe('selectPrimaryFollowUp: nearest to week 12 within 10-16 weeks', () => {
  it('defaults to target 12, window 10-16', () => {
    expect(DEFAULT_FOLLOW_UP_WINDOW).toEqual({ target: 12, from: 10, to: 16 });
  });
  it('picks the nearest; on a tie the earlier one; input order does not matter', () => {
    const a = Object.freeze([
      Object.freeze({ weeks: 15, value: 1 }),
      Object.freeze({ weeks: 13, value: 2 }),
      Object.freeze({ weeks: 11, value: 4 }),
      Object.freeze({ weeks: 6, value: 5 }),
    ]);
    expect(selectPrimaryFollowUp(a)).toEqual({ weeks: 11, value: 4 });
    expect(selectPrimaryFollowUp([...a].reverse())).toEqual({ weeks: 11, value: 4 });
    expect(
      selectPrimaryFollowUp([
        { weeks: 14, value: 1 },
        { weeks: 10.5, value: 3 },
      ]),
    ).toEqual({ weeks: 10.5, value: 3 });
  });
  it('window ends are included; outside the window there is no follow-up', () => {
    expect(selectPrimaryFollowUp([{ weeks: 16, value: 1 }])).toEqual({ weeks: 16, value: 1 });
    expect(selectPrimaryFollowUp([{ weeks: 10, value: 1 }])).toEqual({ weeks: 10, value: 1 });
    expect(
      selectPrimaryFollowUp([
        { weeks: 9.9, value: 1 },
        { weeks: 16.1, value: 1 },
      ]),
    ).toBeNull();
    expect(selectPrimaryFollowUp([])).toBeNull();
  });
  it('the window is configurable', () => {
    const a = [
      { weeks: 6, value: 3 },
      { weeks: 12, value: 1 },
    ];
    expect(selectPrimaryFollowUp(a, { target: 6, from: 4, to: 8 })).toEqual({ weeks: 6, value: 3 });
  });
  it('throws RangeError for an invalid window or assessment', () => {
    expect(() => selectPrimaryFollowUp([], { target: 20, from: 10, to: 16 })).toThrow(RangeError);
    expect(() => selectPrimaryFollowUp([{ weeks: -1, value: 1 }])).toThrow(RangeError);
    expect(() => selectPrimaryFollowUp([{ weeks: 12, value: NaN }])).toThrow(RangeError);
  });
});

describe('classifyResponder and responderShare: missing is never a non-responder', () => {
  const nprs = { higherIsBetter: false, threshold: 2 };
  const episodes: readonly EpisodeScores[] = Object.freeze([
    { baseline: 7, assessments: [{ weeks: 12, value: 3 }] }, // change 4: responder
    { baseline: 6, assessments: [{ weeks: 11, value: 5 }] }, // change 1: non-responder
    { baseline: 8, assessments: [{ weeks: 13, value: 6 }] }, // change 2: responder (at the MCID)
    { baseline: 5, assessments: [{ weeks: 4, value: 1 }] }, // nothing in the window
    { baseline: null, assessments: [{ weeks: 12, value: 1 }] }, // no baseline
    { baseline: 6, assessments: [] }, // no follow-up at all
  ]);
  it('classifies each episode', () => {
    expect(episodes.map((e) => classifyResponder(e, nprs).status)).toEqual([
      'responder',
      'non-responder',
      'responder',
      'missing-follow-up',
      'missing-baseline',
      'missing-follow-up',
    ]);
    expect(classifyResponder(episodes[0] as EpisodeScores, nprs)).toEqual({
      status: 'responder',
      change: 4,
      followUp: { weeks: 12, value: 3 },
    });
  });
  it('counts missing episodes separately and keeps them out of the denominator', () => {
    const share = responderShare(episodes, nprs);
    expect(share).toMatchObject({
      nEpisodes: 6,
      nMissingBaseline: 1,
      nMissingFollowUp: 2,
      nAnalysed: 3,
      responders: 2,
    });
    expect(share.share).toEqual(wilsonInterval(2, 3));
  });
  it('a user-chosen threshold replaces the MCID', () => {
    expect(responderShare(episodes, { ...nprs, threshold: 3 }).responders).toBe(1);
  });
  it('no analysable episode gives a null share', () => {
    expect(responderShare([], nprs).share).toBeNull();
  });
  it('throws RangeError for an invalid threshold or baseline', () => {
    expect(() => classifyResponder({ baseline: 7, assessments: [] }, { higherIsBetter: false, threshold: 0 })).toThrow(
      RangeError,
    );
    expect(() => classifyResponder({ baseline: NaN, assessments: [] }, nprs)).toThrow(RangeError);
  });
});
