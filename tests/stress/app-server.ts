/**
 * The app as its own process, for the load and crash tests: `node --import tsx tests/stress/app-server.ts <database-url>`.
 * API only (no client files), on 127.0.0.1 and a free port; prints `listening <port>` once it accepts requests.
 * The database is expected to be migrated already (the test run's throw-away database is).
 */
import type { AddressInfo } from 'node:net';
import { createApp } from '../../server/app';
import { openDatabase } from '../../server/db/client';

const url = process.argv[2];
if (!url) {
  console.error('usage: app-server.ts <database-url>');
  process.exit(2);
}
const database = openDatabase(url, 10);
const app = createApp({ ...database, log: (m) => console.error(m) });
const server = app.listen(0, '127.0.0.1', () => {
  console.log(`listening ${(server.address() as AddressInfo).port}`);
});
// Longer than any client's idle keep-alive socket, so a reused socket is never closed under a request.
server.keepAliveTimeout = 30_000;
process.on('SIGTERM', () => {
  server.close(() => void database.pool.end().then(() => process.exit(0)));
});
