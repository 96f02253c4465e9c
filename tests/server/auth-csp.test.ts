import { afterAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { checkoutRoot } from '../../server/http/paths';
import { testApp } from '../setup/test-app';

const ctx = testApp();
afterAll(() => ctx.close());

describe('content security policy', () => {
  it('allows scripts from our own origin only: no inline scripts, no eval, no other origins', async () => {
    const res = await request(ctx.app).get('/api/health');
    const csp = String(res.headers['content-security-policy']);
    const directive = (name: string) =>
      csp
        .split(';')
        .map((d) => d.trim())
        .find((d) => d.startsWith(`${name} `)) ?? '';
    expect(directive('script-src')).toBe("script-src 'self'");
    expect(directive('default-src')).toBe("default-src 'self'");
    expect(directive('object-src')).toBe("object-src 'none'");
    expect(directive('frame-ancestors')).toBe("frame-ancestors 'self'");
    expect(csp).not.toMatch(/unsafe-eval/);
    expect(directive('connect-src')).toBe("connect-src 'self'");
    expect(res.headers['x-frame-options']).toBe('SAMEORIGIN');
  });

  it('the client page needs no inline script, and the charts evaluate Vega expressions without eval', () => {
    const html = readFileSync(path.join(checkoutRoot, 'index.html'), 'utf8');
    const scripts = [...html.matchAll(/<script\b([^>]*)>([\s\S]*?)<\/script>/g)];
    expect(scripts.length).toBeGreaterThan(0);
    for (const [, attrs, body] of scripts) {
      expect(attrs).toMatch(/\bsrc=/);
      expect(body!.trim()).toBe('');
    }
    // Vega compiles expressions with Function() unless it runs through vega-interpreter (ast: true).
    const chart = readFileSync(path.join(checkoutRoot, 'src/charts/vega-chart.tsx'), 'utf8');
    expect(chart).toMatch(/expressionInterpreter/);
    expect(chart).toMatch(/ast:\s*true/);
  });
});
