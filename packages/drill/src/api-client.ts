/** One signed-in person talking to the API over HTTP, as the browser would: session cookie and CSRF header. */
export interface Answer {
  status: number;
  body: unknown;
  /** 0 when no answer came at all (connection refused, timed out). */
  ms: number;
  error?: string;
}

const requestTimeoutMs = 15_000;

export class ApiClient {
  private cookie = '';
  private csrfToken = '';

  constructor(
    readonly baseUrl: string,
    readonly label: string,
  ) {}

  /** The session cookie (name=value), for a load tool that should act as this person. */
  get sessionCookie(): string {
    return this.cookie;
  }

  private remember(response: Response): void {
    for (const line of response.headers.getSetCookie()) {
      const pair = line.split(';')[0] ?? '';
      if (pair.startsWith('heatfleet.sid=')) this.cookie = pair;
    }
  }

  async send(
    method: string,
    path: string,
    options: { json?: unknown; form?: FormData; headers?: Record<string, string> } = {},
  ): Promise<Answer> {
    const headers: Record<string, string> = { ...options.headers };
    if (this.cookie !== '') headers.cookie = this.cookie;
    if (method !== 'GET') headers['x-csrf-token'] = this.csrfToken;
    let body: string | FormData | undefined;
    if (options.json !== undefined) {
      headers['content-type'] = 'application/json';
      body = JSON.stringify(options.json);
    } else if (options.form !== undefined) {
      body = options.form;
    }
    const began = Date.now();
    try {
      const response = await fetch(`${this.baseUrl}${path}`, {
        method,
        headers,
        body,
        signal: AbortSignal.timeout(requestTimeoutMs),
      });
      this.remember(response);
      const text = await response.text();
      let parsed: unknown = text;
      try {
        parsed = text === '' ? null : JSON.parse(text);
      } catch {
        // not JSON (a CSV, a file): keep the text
      }
      const fresh = (parsed as { csrfToken?: unknown } | null)?.csrfToken;
      if (typeof fresh === 'string') this.csrfToken = fresh;
      return { status: response.status, body: parsed, ms: Date.now() - began };
    } catch (error) {
      return {
        status: 0,
        body: null,
        ms: Date.now() - began,
        error:
          error instanceof Error ? (error.cause instanceof Error ? error.cause.message : error.message) : String(error),
      };
    }
  }

  get(path: string): Promise<Answer> {
    return this.send('GET', path);
  }

  post(path: string, json: unknown, headers?: Record<string, string>): Promise<Answer> {
    return this.send('POST', path, { json, headers });
  }

  async signIn(email: string, password: string): Promise<void> {
    const csrf = await this.get('/api/auth/csrf');
    if (csrf.status !== 200) throw new Error(`${this.label}: GET /api/auth/csrf answered ${csrf.status}`);
    const res = await this.post('/api/auth/sign-in', { email, password });
    if (res.status !== 200)
      throw new Error(`${this.label}: sign-in as ${email} answered ${res.status} ${JSON.stringify(res.body)}`);
  }
}
