// A signed-in HTTP client for the JSON API, going through Auth.js's real credentials flow.

export const DEMO_PASSWORD = "fjordlight-demo";
export const DEMO_EMAILS = {
  owner: "owner@fjordlight.test",
  analyst: "analyst@fjordlight.test",
  reviewer: "reviewer@fjordlight.test",
  viewer: "viewer@fjordlight.test",
  outsider: "outsider@elsewhere.test",
} as const;
export type DemoUser = keyof typeof DEMO_EMAILS;

export type ApiResponse<T = unknown> = { status: number; body: T; headers: Headers };

export class ApiClient {
  private cookies = new Map<string, string>();
  constructor(readonly baseUrl: string) {}

  private cookieHeader() {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join("; ");
  }

  private keep(res: Response) {
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(";");
      const i = pair.indexOf("=");
      this.cookies.set(pair.slice(0, i), pair.slice(i + 1));
    }
  }

  /** The Cookie header this client sends (for hand-made requests). */
  get cookie(): string {
    return this.cookieHeader();
  }

  /** Signs in; returns the redirect target (contains `error=` on failure). `headers` go with the sign-in POST. */
  async signIn(email: string, password = DEMO_PASSWORD, headers: Record<string, string> = {}): Promise<string> {
    const csrfRes = await fetch(`${this.baseUrl}/api/auth/csrf`, { headers: { cookie: this.cookieHeader() } });
    this.keep(csrfRes);
    const { csrfToken } = (await csrfRes.json()) as { csrfToken: string };
    const res = await fetch(`${this.baseUrl}/api/auth/callback/credentials`, {
      method: "POST",
      redirect: "manual",
      headers: { "content-type": "application/x-www-form-urlencoded", cookie: this.cookieHeader(), ...headers },
      body: new URLSearchParams({ csrfToken, email, password }).toString(),
    });
    this.keep(res);
    return res.headers.get("location") ?? "";
  }

  /** Signs out through Auth.js's own endpoint, as the browser's sign-out does; returns the status. */
  async signOut(): Promise<number> {
    const csrfRes = await fetch(`${this.baseUrl}/api/auth/csrf`, { headers: { cookie: this.cookieHeader() } });
    this.keep(csrfRes);
    const { csrfToken } = (await csrfRes.json()) as { csrfToken: string };
    const res = await fetch(`${this.baseUrl}/api/auth/signout`, {
      method: "POST",
      redirect: "manual",
      headers: { "content-type": "application/x-www-form-urlencoded", cookie: this.cookieHeader() },
      body: new URLSearchParams({ csrfToken }).toString(),
    });
    this.keep(res);
    return res.status;
  }

  /** A second client holding a copy of this one's cookies: a replayed session token. */
  replay(): ApiClient {
    const copy = new ApiClient(this.baseUrl);
    for (const [k, v] of this.cookies) copy.cookies.set(k, v);
    return copy;
  }

  /** A raw request with the session cookie; `body` strings are sent as they are. */
  async request<T = unknown>(method: string, path: string, body?: unknown, headers: Record<string, string> = {}): Promise<ApiResponse<T>> {
    const isRaw = typeof body === "string" || body instanceof Uint8Array;
    const res = await fetch(`${this.baseUrl}${path}`, {
      method,
      redirect: "manual",
      headers: {
        cookie: this.cookieHeader(),
        ...(body === undefined ? {} : { "content-type": "application/json" }),
        ...headers,
      },
      body: body === undefined ? undefined : isRaw ? (body as string) : JSON.stringify(body),
    });
    const text = await res.text();
    let parsed: unknown = text;
    try {
      parsed = text ? JSON.parse(text) : null;
    } catch {
      /* not JSON */
    }
    return { status: res.status, body: parsed as T, headers: res.headers };
  }

  /** A multipart upload (FormData) with the session cookie. */
  async upload<T = unknown>(path: string, form: FormData, headers: Record<string, string> = {}): Promise<ApiResponse<T>> {
    const res = await fetch(`${this.baseUrl}${path}`, { method: "POST", headers: { cookie: this.cookieHeader(), ...headers }, body: form });
    const text = await res.text();
    let parsed: unknown = text;
    try {
      parsed = JSON.parse(text);
    } catch {
      /* not JSON */
    }
    return { status: res.status, body: parsed as T, headers: res.headers };
  }

  get<T = unknown>(path: string) {
    return this.request<T>("GET", path);
  }
}

/** One signed-in client per demo user, plus a signed-out one. */
export async function demoClients(baseUrl: string): Promise<Record<DemoUser | "anonymous", ApiClient>> {
  const entries = await Promise.all(
    (Object.keys(DEMO_EMAILS) as DemoUser[]).map(async (u) => {
      const c = new ApiClient(baseUrl);
      const to = await c.signIn(DEMO_EMAILS[u]);
      if (to.includes("error=")) throw new Error(`demo sign-in failed for ${u}: ${to}`);
      return [u, c] as const;
    }),
  );
  return { ...Object.fromEntries(entries), anonymous: new ApiClient(baseUrl) } as Record<DemoUser | "anonymous", ApiClient>;
}
