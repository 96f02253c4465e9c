/**
 * `npm run bench`: every benchmark of the project, one after the other, then the client's own figures (entry bundle,
 * time to first chart; scripts/bench/first-chart.ts). Each benchmark's own report is passed through on stderr; stdout
 * carries JSON lines only, one per figure:
 *
 *   {"benchmark":"bench:upload","figure":"commit 2.43 s 41,152 rows/s …","values":[{"value":2.43,"unit":"s"},…]}
 *   {"benchmark":"first-chart","figure":"entry bundle (gzip, JS + CSS)","value":151234,"unit":"bytes","target":204800,"ratio":0.739}
 *
 * The other benchmarks print their figures (and targets) as text; a line of theirs that carries a number with a
 * unit or a ratio becomes one figure, with the numbers picked out. Not part of `npm test`: speed is measured here.
 * Every benchmark runs whatever the one before it did: a missed target is a figure (a benchmark's `target met: no`
 * line becomes `"targetMet": false` on its wall-time line), and only a benchmark that could not run (non-zero exit)
 * makes the whole run exit 1, after all of them.
 *   npm run bench [-- --only bench:upload,first-chart]
 */
import { spawn } from 'node:child_process';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { checkoutRoot } from '../db';
import { clientFigures } from './first-chart';

const BENCHMARKS = ['bench:analysis', 'bench:upload', 'bench:analytics', 'bench:export'];
const UNIT = /(-?\d[\d,]*(?:\.\d+)?)\s*(ms|s|rows\/s|MB\/s|MB|KB|kB|GB|%|x)(?![a-z])|ratio=(\d+(?:\.\d+)?)/g;

const emit = (line: Record<string, unknown>) => process.stdout.write(`${JSON.stringify(line)}\n`);

/** Numbers with their units in one line of a benchmark's report. */
export function valuesIn(line: string): { value: number; unit: string }[] {
  return [...line.matchAll(UNIT)].map((m) =>
    m[3] ? { value: Number(m[3]), unit: 'ratio' } : { value: Number(m[1]!.replace(/,/g, '')), unit: m[2]! },
  );
}

/** Runs one npm script, relaying its output to stderr; resolves with its lines and exit code. */
function runScript(name: string): Promise<{ lines: string[]; code: number; seconds: number }> {
  const started = performance.now();
  return new Promise((resolve) => {
    const child = spawn('npm', ['run', '--silent', name], { cwd: checkoutRoot, stdio: ['ignore', 'pipe', 'pipe'] });
    let text = '';
    const relay = (d: Buffer) => {
      text += d.toString();
      process.stderr.write(d.toString().replace(/^(?=.)/gm, `[${name}] `));
    };
    child.stdout.on('data', relay);
    child.stderr.on('data', relay);
    const done = (code: number) =>
      resolve({ lines: text.split('\n'), code, seconds: (performance.now() - started) / 1000 });
    // A script that cannot even start is one failed benchmark, not the end of the run.
    child.on('error', (e) => {
      text += `\nbench: could not start ${name}: ${e.message}`;
      done(1);
    });
    child.on('close', (code) => done(code ?? 1));
  });
}

async function main(): Promise<void> {
  const at = process.argv.indexOf('--only');
  const only = at === -1 ? null : new Set(process.argv[at + 1]!.split(','));
  const scripts = (
    JSON.parse(readFileSync(path.join(checkoutRoot, 'package.json'), 'utf8')) as { scripts: Record<string, string> }
  ).scripts;
  let failed = 0;
  for (const name of BENCHMARKS) {
    if (only && !only.has(name)) continue;
    if (!scripts[name]) {
      emit({ benchmark: name, figure: 'missing', note: `no "${name}" script in package.json` });
      continue;
    }
    process.stderr.write(`\n== ${name}\n`);
    const r = await runScript(name);
    for (const raw of r.lines) {
      const line = raw.trim();
      const values = valuesIn(line);
      if (values.length > 0) emit({ benchmark: name, figure: line, values });
    }
    const verdicts = r.lines.map((l) => /target met: (yes|no)/.exec(l)?.[1]).filter((v) => v !== undefined);
    const targetMet = verdicts.length > 0 ? verdicts.every((v) => v === 'yes') : undefined;
    emit({
      benchmark: name,
      figure: 'wall time',
      value: Number(r.seconds.toFixed(1)),
      unit: 's',
      exitCode: r.code,
      targetMet,
    });
    if (r.code !== 0) failed++;
  }
  if (!only || only.has('first-chart')) {
    process.stderr.write('\n== first-chart\n');
    try {
      for (const f of await clientFigures()) emit({ benchmark: 'first-chart', ...f });
    } catch (e) {
      failed++;
      emit({ benchmark: 'first-chart', figure: 'failed', note: e instanceof Error ? e.message : String(e) });
    }
  }
  process.exit(failed ? 1 : 0);
}

main().catch((e: unknown) => {
  console.error(`bench: ${e instanceof Error ? e.message : String(e)}`);
  process.exit(1);
});
