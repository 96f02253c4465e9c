import http from 'node:http';
import { randomBytes } from 'node:crypto';

export type Answer = { status: number; headers: http.IncomingHttpHeaders; body: Buffer; ms: number; json<T = unknown>(): T };
export type FilePart = { field: string; name: string; type: string; data: Buffer };

/** A keep-alive agent for one simulated person (their browser keeps a few connections open). */
export const keepAliveAgent = (maxSockets = 2) => new http.Agent({ keepAlive: true, maxSockets });

function multipart(file: FilePart): { body: Buffer; type: string } {
  const boundary = `----loadline${randomBytes(8).toString('hex')}`;
  const head = `--${boundary}\r\nContent-Disposition: form-data; name="${file.field}"; filename="${file.name}"\r\nContent-Type: ${file.type}\r\n\r\n`;
  return { body: Buffer.concat([Buffer.from(head), file.data, Buffer.from(`\r\n--${boundary}--\r\n`)]), type: `multipart/form-data; boundary=${boundary}` };
}

/**
 * A signed-in person over real HTTP: keeps the session and CSRF cookies, sends the CSRF header on every
 * state-changing request, and times each answer (ms from sending to the last byte).
 */
export class HttpClient {
  private cookies = new Map<string, string>();
  private csrf = '';

  constructor(
    readonly base: string,
    readonly agent: http.Agent = keepAliveAgent(),
  ) {}

  request(method: string, path: string, send: { json?: unknown; file?: FilePart; timeoutMs?: number } = {}): Promise<Answer> {
    let body: Buffer | undefined;
    const headers: Record<string, string> = { accept: 'application/json' };
    if (send.json !== undefined) {
      body = Buffer.from(JSON.stringify(send.json));
      headers['content-type'] = 'application/json';
    } else if (send.file) {
      const m = multipart(send.file);
      body = m.body;
      headers['content-type'] = m.type;
    }
    if (body) headers['content-length'] = String(body.length);
    if (method !== 'GET' && method !== 'HEAD' && this.csrf) headers['x-csrf-token'] = this.csrf;
    if (this.cookies.size) headers.cookie = [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
    const started = performance.now();
    return new Promise<Answer>((resolve, reject) => {
      const req = http.request(new URL(path, this.base), { method, headers, agent: this.agent, timeout: send.timeoutMs ?? 60_000 }, (res) => {
        for (const c of res.headers['set-cookie'] ?? []) {
          const [pair] = c.split(';');
          const at = pair!.indexOf('=');
          this.cookies.set(pair!.slice(0, at).trim(), pair!.slice(at + 1).trim());
        }
        const chunks: Buffer[] = [];
        res.on('data', (d: Buffer) => chunks.push(d));
        res.on('error', reject);
        res.on('end', () => {
          const buf = Buffer.concat(chunks);
          resolve({ status: res.statusCode ?? 0, headers: res.headers, body: buf, ms: performance.now() - started, json: <T>() => JSON.parse(buf.toString('utf8')) as T });
        });
      });
      req.on('timeout', () => req.destroy(new Error(`${method} ${path}: no answer within ${send.timeoutMs ?? 60_000} ms`)));
      req.on('error', reject);
      req.end(body);
    });
  }

  get = (path: string) => this.request('GET', path);
  post = (path: string, json?: unknown) => this.request('POST', path, { json: json ?? {} });
  patch = (path: string, json: unknown) => this.request('PATCH', path, { json });

  async refreshCsrf(): Promise<void> {
    const r = await this.get('/api/auth/csrf');
    if (r.status !== 200) throw new Error(`GET /api/auth/csrf answered ${r.status}`);
    this.csrf = r.json<{ token: string }>().token;
  }

  /** Signs in through the real login route (a new CSRF token is bound to the new session afterwards). */
  async signIn(email: string, password: string): Promise<void> {
    await this.refreshCsrf();
    const r = await this.post('/api/auth/login', { email, password });
    if (r.status !== 200) throw new Error(`sign-in of ${email} failed: ${r.status} ${r.body.toString()}`);
    await this.refreshCsrf();
  }

  close(): void {
    this.agent.destroy();
  }
}
