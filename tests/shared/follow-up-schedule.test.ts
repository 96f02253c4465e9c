import { execFileSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import {
  addDays,
  daysBetween,
  daysWithoutAssessment,
  followUpSchedule,
  todayUtc,
  type AssessmentMark,
  type FollowUpWindows,
} from '../../shared/follow-up-schedule';
import { childEnv } from '../../server/env';

// The registry's default windows (shared/rules.ts), copied so a change of defaults does not silently move these edges.
const WINDOWS: FollowUpWindows = {
  week6: { fromDay: 35, toDay: 56 },
  week12: { fromDay: 70, toDay: 112 },
  week26: { fromDay: 168, toDay: 210 },
};
const START = '2026-01-01';
const week12 = (today: string, marks: AssessmentMark[] = []) =>
  followUpSchedule(START, today, WINDOWS, marks).find((f) => f.timepoint === 'week12')!;

describe('calendar arithmetic (dates counted by hand on a 2026 and a 2028 calendar)', () => {
  it('adds days across month ends and leap days', () => {
    // 2026-01-01 + 70 days: 31 (January) + 28 (February) + 11 → 12 March.
    expect(addDays(START, 70)).toBe('2026-03-12');
    expect(addDays(START, 112)).toBe('2026-04-23');
    // 2028 is a leap year: 1 February + 35 days → 7 March (29 days in February).
    expect(addDays('2028-02-01', 35)).toBe('2028-03-07');
    expect(daysBetween('2027-12-25', '2028-03-01')).toBe(67);
  });
  it('refuses strings that are not calendar dates', () => {
    expect(() => addDays('2026-02-30', 1)).toThrow(RangeError);
    expect(() => addDays('2026-3-1', 1)).toThrow(RangeError);
  });
});

describe('follow-up states at the window edges (week 12 = days 70–112)', () => {
  it('is upcoming the day before the window opens', () => {
    expect(week12('2026-03-11')).toMatchObject({ state: 'upcoming', opensOn: '2026-03-12', closesOn: '2026-04-23' });
  });
  it('is due on the first day of the window', () => {
    expect(week12('2026-03-12')).toMatchObject({ state: 'due', daysLeft: 42 });
  });
  it('is still due eight days before the window closes', () => {
    expect(week12('2026-04-15')).toMatchObject({ state: 'due', daysLeft: 8 });
  });
  it('is closing from seven days before the last day', () => {
    expect(week12('2026-04-16')).toMatchObject({ state: 'closing', daysLeft: 7 });
  });
  it('is closing on the last day of the window', () => {
    expect(week12('2026-04-23')).toMatchObject({ state: 'closing', daysLeft: 0 });
  });
  it('is missed the day after the window closed without an assessment', () => {
    expect(week12('2026-04-24')).toMatchObject({ state: 'missed', daysLeft: -1 });
  });
  it('is done once an assessment for the timepoint exists, whatever the day', () => {
    const marks: AssessmentMark[] = [{ timepoint: 'week12', assessedOn: '2026-03-20' }];
    expect(week12('2026-03-21', marks)).toMatchObject({ state: 'done', doneOn: '2026-03-20' });
    expect(week12('2026-06-01', marks).state).toBe('done');
  });
  it('counts a discharge assessment inside the window, but not one outside it or one for another timepoint', () => {
    const inside: AssessmentMark[] = [{ timepoint: 'discharge', assessedOn: '2026-04-23' }];
    const outside: AssessmentMark[] = [{ timepoint: 'discharge', assessedOn: '2026-04-24' }];
    const other: AssessmentMark[] = [{ timepoint: 'week6', assessedOn: '2026-03-15' }];
    expect(week12('2026-05-01', inside).state).toBe('done');
    expect(week12('2026-05-01', outside).state).toBe('missed');
    expect(week12('2026-05-01', other).state).toBe('missed');
  });
  it('gives every timepoint its own state', () => {
    const states = followUpSchedule(START, '2026-03-12', WINDOWS).map((f) => [f.timepoint, f.state]);
    expect(states).toEqual([
      ['week6', 'missed'],
      ['week12', 'due'],
      ['week26', 'upcoming'],
    ]);
  });
});

describe('26-week proposal to mark an episode lost', () => {
  it('proposes after 182 days without an assessment and not a day earlier', () => {
    expect(daysWithoutAssessment(START, '2026-01-01', '2026-07-01')).toBe(null); // 181 days
    expect(daysWithoutAssessment(START, '2026-01-01', '2026-07-02')).toBe(182);
    expect(daysWithoutAssessment(START, '2026-02-15', '2026-07-02')).toBe(null);
    expect(daysWithoutAssessment(START, null, '2026-07-02')).toBe(182);
  });
});

describe('time zone independence', () => {
  const moduleUrl = new URL('../../shared/follow-up-schedule.ts', import.meta.url).href;
  // Across the US daylight-saving change of 8 March 2026 and the international date line.
  const script = `import(${JSON.stringify(moduleUrl)}).then((m) => {
    const w = ${JSON.stringify(WINDOWS)};
    console.log(JSON.stringify({
      schedule: m.followUpSchedule('2026-03-01', '2026-04-12', w),
      today: m.todayUtc(new Date('2026-03-11T23:30:00Z')),
      localDate: new Date('2026-03-11T23:30:00Z').getDate(),
    }));
  });`;
  const runIn = (tz: string) =>
    JSON.parse(
      execFileSync(process.execPath, ['--import', 'tsx', '--input-type=module', '-e', script], {
        env: childEnv({ TZ: tz }),
        cwd: fileURLToPath(new URL('../..', import.meta.url)),
        encoding: 'utf8',
      }),
    ) as { schedule: unknown; today: string; localDate: number };

  it('computes the same schedule with TZ=Pacific/Kiritimati (UTC+14) and TZ=America/Adak (UTC−10/−9)', () => {
    const east = runIn('Pacific/Kiritimati');
    const west = runIn('America/Adak');
    // The processes really do see different local calendars …
    expect(east.localDate).toBe(12);
    expect(west.localDate).toBe(11);
    // … and the schedule and the registry's date do not depend on them.
    expect(east.schedule).toEqual(west.schedule);
    expect(east.schedule).toEqual(followUpSchedule('2026-03-01', '2026-04-12', WINDOWS));
    expect(east.today).toBe('2026-03-11');
    expect(west.today).toBe('2026-03-11');
    expect(todayUtc(new Date('2026-03-11T23:30:00Z'))).toBe('2026-03-11');
  });
});
