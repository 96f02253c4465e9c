/** `npm start`: database up, migrated, demo loaded, client built, everything served. */
import { build } from 'vite';
import { startServer } from '../server/index';
import { env } from '../server/env';
import { assertPortFree, fail, prepareAppDatabase } from './lib-setup';
import { DEMO_PASSWORD, DEMO_USERS } from './seed';
import { startDevMail } from '../server/mail/dev-mail';

async function main(): Promise<void> {
  await assertPortFree(env().HOST, env().PORT);
  const { url, demo } = await prepareAppDatabase();
  if (demo) console.log(`loadline: demo scenario loaded (${demo.clinics} clinics, ${demo.episodes} episodes)`);
  if (env().CLIENT_MODE === 'built') {
    console.log('loadline: building the client…');
    await build({ logLevel: 'warn' });
  }
  const devMail = await startDevMail();
  if (devMail) console.log(`loadline: e-mail goes to the local fake mail server (127.0.0.1:${devMail.port}); stewards read it in the Outbox`);
  const running = await startServer(url);
  console.log(`\nLoadline is running at ${running.url}\n`);
  console.log('Demo sign-ins (password "%s"):', DEMO_PASSWORD);
  for (const u of DEMO_USERS) console.log(`  ${u.role.padEnd(10)} ${u.email}`);
  console.log('\nPress Ctrl-C to stop. The database keeps its data between runs.');
  const stop = () => void running.close().then(() => process.exit(0));
  process.once('SIGINT', stop);
  process.once('SIGTERM', stop);
}

main().catch(fail);
