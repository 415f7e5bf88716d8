/** What every client saw, for the summary and the checks on failover behaviour. */
export interface Tally {
  byStatus: Record<string, number>;
  /** Responses that took longer than the 10 s a request may wait, or never came. */
  hangs: number;
  /** 503s that came without a Retry-After header. */
  unclean503: number;
  slowestMs: number;
  /** Requests that got no HTTP answer at all, and why (the client retries them). */
  noAnswer: string[];
  /**
   * Answers whose headers came but whose body was cut off because the instance died while sending
   * it: nothing can turn those into a 503 any more; the client sees the cut and retries.
   */
  cutMidAnswer: string[];
}

export const newTally = (): Tally => ({
  byStatus: {},
  hangs: 0,
  unclean503: 0,
  slowestMs: 0,
  noAnswer: [],
  cutMidAnswer: [],
});

export interface Reply {
  status: number;
  body: any;
  retryAfter: number;
}

const HANG_MS = 10_000;

/**
 * A browser-like API client: keeps the session cookie, sends the CSRF token on writes. Status 0
 * stands for a request that got no HTTP answer at all (connection refused or reset).
 */
export class ApiClient {
  private cookie = '';
  private csrf = '';
  constructor(
    private readonly base: string,
    private readonly tally: Tally,
  ) {}

  async call(method: string, url: string, body?: object | FormData): Promise<Reply> {
    const headers: Record<string, string> = { accept: 'application/json' };
    if (this.cookie) headers.cookie = this.cookie;
    if (method !== 'GET') headers['x-csrf-token'] = this.csrf;
    if (body && !(body instanceof FormData)) headers['content-type'] = 'application/json';
    const started = Date.now();
    let reply: Reply;
    try {
      const res = await fetch(this.base + url, {
        method,
        headers,
        body: body instanceof FormData ? body : body ? JSON.stringify(body) : undefined,
        signal: AbortSignal.timeout(HANG_MS + 5_000),
      });
      const cookie = res.headers.getSetCookie().find((c) => c.startsWith('tt.sid='));
      if (cookie) this.cookie = cookie.split(';')[0];
      const text = await res.text().catch((err: Error) => {
        if (err.name === 'TimeoutError') throw err; // a hang, counted below
        this.tally.cutMidAnswer.push(
          `${new Date().toISOString()} ${method} ${url} (${res.status}): ${String(err.cause ?? err)}`,
        );
        return null;
      });
      if (text === null) {
        this.tally.byStatus['cut'] = (this.tally.byStatus['cut'] ?? 0) + 1;
        return { status: 0, body: 'answer cut off', retryAfter: 1 };
      }
      reply = {
        status: res.status,
        body: text.startsWith('{') || text.startsWith('[') ? JSON.parse(text) : text,
        retryAfter: Number(res.headers.get('retry-after') ?? 0),
      };
      if (res.status === 503 && !res.headers.get('retry-after')) this.tally.unclean503++;
    } catch (err) {
      if ((err as Error).name === 'TimeoutError') this.tally.hangs++;
      reply = { status: 0, body: String((err as Error).cause ?? err), retryAfter: 1 };
      this.tally.noAnswer.push(`${new Date().toISOString()} ${method} ${url}: ${reply.body}`);
    }
    const ms = Date.now() - started;
    if (ms > HANG_MS && reply.status !== 0) this.tally.hangs++;
    this.tally.slowestMs = Math.max(this.tally.slowestMs, ms);
    this.tally.byStatus[reply.status] = (this.tally.byStatus[reply.status] ?? 0) + 1;
    if (body && typeof reply.body?.csrfToken === 'string') this.csrf = reply.body.csrfToken;
    return reply;
  }

  async signIn(username: string, password: string): Promise<void> {
    await retrying(`session for ${username}`, async () => {
      const s = await this.call('GET', '/api/session');
      if (s.status !== 200) return undefined;
      this.csrf = s.body.csrfToken;
      const login = await this.call('POST', '/api/auth/login', { username, password });
      if (login.status === 200) return true;
      if (transient(login)) return undefined;
      throw new Error(`sign-in of ${username}: ${login.status} ${JSON.stringify(login.body)}`);
    });
  }
}

/** An answer that says "try again": a 503, or no answer at all because an instance died. */
export const transient = (r: Reply) => r.status === 503 || r.status === 0;

/**
 * Runs `attempt` until it returns a value; `undefined` means "transient, wait and try again"
 * (waiting as long as Retry-After said, capped). A client gives up after many tries, loudly.
 */
export async function retrying<T>(what: string, attempt: () => Promise<T | undefined>, tries = 60): Promise<T> {
  for (let i = 0; i < tries; i++) {
    const value = await attempt();
    if (value !== undefined) return value;
    await new Promise((r) => setTimeout(r, 250 + Math.random() * 750));
  }
  throw new Error(`${what}: still failing after ${tries} tries`);
}
