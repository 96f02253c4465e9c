import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import net from 'node:net';
import path from 'node:path';
import { findBinDir, run, type Cluster } from '../../scripts/db';

export type PrivateCluster = Cluster & { port: number; start(): void; stop(): void; destroy(): void };

const isRoot = process.getuid?.() === 0;

/** A port that was free a moment ago on 127.0.0.1. */
async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.once('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const { port } = srv.address() as net.AddressInfo;
      srv.close(() => resolve(port));
    });
  });
}

/**
 * A throw-away PostgreSQL cluster of its own (initdb into a fresh folder under /var/tmp, its own port), for tests
 * that stop and start the database. Never the project's shared cluster, which other work and the demo use.
 * Durability settings are off: nothing in it outlives the test.
 */
export async function startPrivateCluster(): Promise<PrivateCluster> {
  const bin = findBinDir();
  if (!bin) throw new Error('PostgreSQL is not installed (npm test installs it)');
  const dir = mkdtempSync('/var/tmp/loadline-private-pg-');
  if (isRoot) execFileSync('chown', ['postgres:postgres', dir]);
  const data = path.join(dir, 'data');
  run(path.join(bin, 'initdb'), ['-D', data, '-A', 'trust', '-U', 'app', '-E', 'UTF8', '--locale=C.UTF-8']);
  const port = await freePort();
  const opts = `-c listen_addresses=127.0.0.1 -p ${port} -k ${dir} -c fsync=off -c synchronous_commit=off -c full_page_writes=off`;
  let running = false;
  const cluster: PrivateCluster = {
    external: false,
    port,
    urlFor: (database) => `postgres://app@127.0.0.1:${port}/${database}`,
    start() {
      run(path.join(bin, 'pg_ctl'), ['-D', data, '-o', opts, '-l', path.join(dir, 'server.log'), '-w', '-t', '60', 'start']);
      running = true;
    },
    stop() {
      run(path.join(bin, 'pg_ctl'), ['-D', data, '-m', 'fast', '-w', 'stop']);
      running = false;
    },
    destroy() {
      try {
        if (running) cluster.stop();
      } finally {
        rmSync(dir, { recursive: true, force: true });
      }
    },
  };
  cluster.start();
  return cluster;
}
