import type { Server } from 'node:http';
import type { RequestHandler } from 'express';
import { createApp } from './app';
import { openDatabase } from './db/client';
import { migrateDatabase } from './db/migrate';
import { env } from './env';
import { builtClient, viteClient } from './http/client';
import { scheduleReminderDigests } from './jobs/reminders';
import { mailer } from './mail/transport';

export type Running = { server: Server; url: string; close(): Promise<void> };

/** Opens the database, applies migrations, and listens. Fails with one clear line. */
export async function startServer(databaseUrl: string): Promise<Running> {
  const { HOST, PORT, CLIENT_MODE } = env();
  const database = openDatabase(databaseUrl);
  await migrateDatabase(database.db);
  const client: RequestHandler[] =
    CLIENT_MODE === 'built' ? builtClient() : CLIENT_MODE === 'vite' ? await viteClient() : [];
  const app = createApp({ ...database, client });
  const server = await new Promise<Server>((resolve, reject) => {
    const s = app.listen(PORT, HOST);
    s.once('listening', () => resolve(s));
    s.once('error', (e: NodeJS.ErrnoException) =>
      reject(
        new Error(
          e.code === 'EADDRINUSE'
            ? `Port ${PORT} on ${HOST} is already in use; stop the other program or set PORT to a free port`
            : `Cannot listen on ${HOST}:${PORT}: ${e.message}`,
        ),
      ),
    );
  });
  // The daily reminder digests run inside the server process (createApp schedules nothing, so tests never do).
  const reminders = scheduleReminderDigests(database.db, mailer(), (m) => console.error(m));
  return {
    server,
    url: `http://${HOST}:${PORT}`,
    close: async () => {
      await reminders.stop();
      await new Promise((r) => server.close(r));
      await database.pool.end();
    },
  };
}
