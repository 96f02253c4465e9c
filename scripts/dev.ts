/** `npm run dev`: like `npm start`, but the client comes from Vite in middleware mode (hot reload). */
import { startServer } from '../server/index';
import { fail, prepareAppDatabase } from './lib-setup';
import { startDevMail } from '../server/mail/dev-mail';

process.env.CLIENT_MODE = 'vite';
async function main(): Promise<void> {
  const { url } = await prepareAppDatabase();
  await startDevMail();
  const running = await startServer(url);
  console.log(`Loadline (development) at ${running.url}`);
  process.once('SIGINT', () => void running.close().then(() => process.exit(0)));
}
main().catch(fail);
