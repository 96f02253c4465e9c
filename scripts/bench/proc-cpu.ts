/**
 * CPU and memory of other processes, read from Linux's /proc (the benchmarks count PostgreSQL's work beside
 * Node's: on a two-core machine both share the cores, so together they bound what a request can reach).
 */
import { existsSync, readdirSync, readFileSync } from 'node:fs';

/** CPU seconds (user + system) a process has used so far, from /proc/<pid>/stat. */
export const cpuOf = (pid: number): number => {
  const fields = readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1]!.split(' ');
  return (Number(fields[11]) + Number(fields[12])) / 100; // utime, stime in clock ticks (USER_HZ = 100)
};

/** CPU seconds so far of each of these processes that still runs. */
export const cpuByPid = (pids: number[]): Map<number, number> =>
  new Map(pids.filter((p) => existsSync(`/proc/${p}/stat`)).map((p) => [p, cpuOf(p)]));

/** CPU the processes used since `before` (a process that started meanwhile counts from zero). */
export const cpuSince = (before: Map<number, number>, now: Map<number, number>): number =>
  [...now].reduce((sum, [pid, cpu]) => sum + cpu - (before.get(pid) ?? 0), 0);

/** Every process of the PostgreSQL server (postmaster, backends, writers, autovacuum). */
export function postgresPids(): number[] {
  const pids: number[] = [];
  for (const name of readdirSync('/proc')) {
    if (!/^\d+$/.test(name)) continue;
    try {
      if (readFileSync(`/proc/${name}/comm`, 'utf8').trim() === 'postgres') pids.push(Number(name));
    } catch {
      // the process ended while the list was read
    }
  }
  return pids;
}

/** Resident memory now and its peak (VmHWM) of a process, in MB. */
export const memoryOf = (pid: number): { rssMb: number; peakMb: number } => {
  const status = readFileSync(`/proc/${pid}/status`, 'utf8');
  const kb = (field: string) => Number(new RegExp(`${field}:\\s+(\\d+) kB`).exec(status)?.[1] ?? NaN);
  return { rssMb: kb('VmRSS') / 1024, peakMb: kb('VmHWM') / 1024 };
};
