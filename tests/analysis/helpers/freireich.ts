import km from '../../fixtures/stats/kaplan-meier-freireich.json';
import type { GroupedObs, Obs } from '../../../analysis/index';

/** 6-MP and placebo arms of Freireich et al. (1963), from the fixture. */
function arm(name: '6-MP' | 'placebo'): Obs[] {
  const d = km.data[name];
  return d.time.map((time, i) => ({ time, event: d.status[i] === 1 }));
}

export const sixMp: readonly Obs[] = Object.freeze(arm('6-MP').map((o) => Object.freeze(o)));
export const placebo: readonly Obs[] = Object.freeze(arm('placebo').map((o) => Object.freeze(o)));

export function tag(obs: readonly Obs[], group: string): GroupedObs[] {
  return obs.map((o) => ({ ...o, group }));
}
