import { it } from 'vitest';
import { sql } from 'drizzle-orm';
import { newPage, signIn, startE2eApp } from './harness';

it('scratch look', async () => {
  const app = await startE2eApp();
  const t = await newPage(app, { viewport: { width: 1280, height: 900 } });
  await signIn(t.page, 'clinician@demo.loadline.test');
  const { rows } = await app.db.execute<{ id: number }>(sql`select e.id from episode e join clinic c on c.id = e.clinic_id join assessment a on a.episode_id = e.id where c.code = 'C01' group by e.id order by count(*) desc, e.id limit 1`);
  for (const p of ['/results', `/episodes/${rows[0]!.id}`]) {
    await t.page.goto(p);
    await t.page.locator('figure svg').first().waitFor({ timeout: 60_000 });
    await t.page.waitForTimeout(1500);
    await t.page.screenshot({ path: `/tmp/look2-${p.replace(/[^a-z0-9]/g, '')}.png`, fullPage: true });
  }
  await t.close();
  await app.close();
}, 600_000);
