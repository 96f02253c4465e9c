import { afterAll, beforeAll, describe, expect, it, onTestFailed } from 'vitest';
import { newPage, signIn, startE2eApp, type E2eApp } from './harness';

// Clinics use tablets at the bench and phones in the gym: no screen may need sideways scrolling of the page.
// (A wide table scrolls inside its own frame; that frame must also contain its screen-reader caption, which is
// positioned absolutely and otherwise widens the page.)
let app: E2eApp;
beforeAll(async () => {
  app = await startE2eApp();
});
afterAll(async () => {
  await app?.close();
});

const WIDTHS = [820, 390];
const cases: { email: string; screens: string[] }[] = [
  { email: 'steward@demo.loadline.test', screens: ['/', '/console/clinics', '/exports'] },
  { email: 'lead@demo.loadline.test', screens: ['/', '/episodes', '/results', '/follow-ups'] },
  { email: 'researcher@demo.loadline.test', screens: ['/cohorts', '/data-requests'] },
];

describe('narrow screens', () => {
  for (const { email, screens } of cases) {
    it(`${email.split('@')[0]}: header and screens fit ${WIDTHS.join(' and ')} px wide without sideways scrolling`, async () => {
      for (const width of WIDTHS) {
        const b = await newPage(app, { viewport: { width, height: 900 } });
        onTestFailed(() => b.saveArtifacts(`narrow-${width}-${email.split('@')[0]}`));
        try {
          await signIn(b.page, email);
          b.clearProblems(); // signed out, /api/auth/me answers 401 by design
          for (const screen of screens) {
            await b.page.goto(screen);
            await b.page.getByRole('main').getByRole('heading').first().waitFor();
            await b.page.waitForLoadState('networkidle');
            const { scroll, client, culprits } = await b.page.evaluate(() => {
              const w = document.documentElement.clientWidth;
              // The outermost elements that stick out on the right, to name in a failure message.
              const out = [...document.querySelectorAll('body *')].filter(
                (el) =>
                  el.getBoundingClientRect().right > w + 1 &&
                  !(el.parentElement && el.parentElement.getBoundingClientRect().right > w + 1),
              );
              return {
                scroll: document.documentElement.scrollWidth,
                client: w,
                culprits: out.slice(0, 3).map((el) => `<${el.tagName.toLowerCase()} class="${el.className}">`),
              };
            });
            expect(scroll, `${screen} at ${width} px: ${culprits.join(' ')}`).toBeLessThanOrEqual(client);
            // Every main-navigation entry stays on screen (wrapped, not cut off).
            const links = b.page.getByRole('navigation', { name: 'Main' }).getByRole('link');
            for (const box of await Promise.all((await links.all()).map((l) => l.boundingBox())))
              expect(box !== null && box.x >= 0 && box.x + box.width <= client, `${screen} at ${width} px`).toBe(true);
          }
          expect(b.problems()).toEqual([]);
        } finally {
          await b.close();
        }
      }
    });
  }
});
