import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { checkoutRoot } from '../../scripts/db';

export type ChildServer = {
  url: string;
  pid: number;
  /** What the process wrote to stdout and stderr (the app logs its 5xx errors there). */
  output(): string;
  /** SIGKILL: no clean-up of any kind, as in a power cut of the process. Resolves once it has exited. */
  kill(): Promise<void>;
  /** SIGTERM and wait (the normal stop). */
  stop(): Promise<void>;
};

const exited = (child: ChildProcess) =>
  new Promise<void>((resolve) => (child.exitCode !== null || child.signalCode !== null ? resolve() : child.once('exit', () => resolve())));

/**
 * Starts tests/stress/app-server.ts in a child process. `node --import tsx` rather than the `tsx` command, so
 * the app is this very process (the tsx command would run it in a grandchild that a SIGKILL does not reach).
 */
export async function startChildServer(databaseUrl: string): Promise<ChildServer> {
  const child = spawn(process.execPath, ['--import', 'tsx', path.join(checkoutRoot, 'tests/stress/app-server.ts'), databaseUrl], {
    cwd: checkoutRoot,
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let out = '';
  child.stdout!.on('data', (d: Buffer) => (out += d.toString()));
  child.stderr!.on('data', (d: Buffer) => (out += d.toString()));
  const port = await new Promise<number>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`the app process did not start within 60 s:\n${out}`)), 60_000);
    const onData = () => {
      const m = /listening (\d+)/.exec(out);
      if (m) {
        clearTimeout(timer);
        child.stdout!.off('data', onData);
        resolve(Number(m[1]));
      }
    };
    child.stdout!.on('data', onData);
    child.once('exit', (code, signal) => {
      clearTimeout(timer);
      reject(new Error(`the app process ended before listening (${code ?? signal}):\n${out}`));
    });
  });
  return {
    url: `http://127.0.0.1:${port}`,
    pid: child.pid!,
    output: () => out,
    kill: async () => {
      child.kill('SIGKILL');
      await exited(child);
    },
    stop: async () => {
      child.kill('SIGTERM');
      await exited(child);
    },
  };
}
