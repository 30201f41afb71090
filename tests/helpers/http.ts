// A small HTTP client for integration tests that keeps one person's session cookie.
import { DEMO_PASSWORD } from "@/db/seeds/01_demo";

export interface Reply<T = unknown> {
  status: number;
  body: T;
  headers: Headers;
}

export class Client {
  private cookie: string | null = null;
  constructor(readonly baseUrl: string) {}

  async request<T = unknown>(
    method: string,
    path: string,
    body?: unknown,
    headers: Record<string, string> = {},
  ) {
    const res = await fetch(`${this.baseUrl}${path}`, {
      method,
      redirect: "manual",
      headers: {
        ...(body !== undefined ? { "content-type": "application/json" } : {}),
        ...(this.cookie ? { cookie: this.cookie } : {}),
        ...headers,
      },
      body: body === undefined ? undefined : typeof body === "string" ? body : JSON.stringify(body),
    });
    const set = res.headers.getSetCookie();
    for (const c of set) {
      const [pair] = c.split(";");
      if (!pair) continue;
      const value = pair.slice(pair.indexOf("=") + 1);
      this.cookie = value ? pair : null;
    }
    const text = await res.text();
    let parsed: unknown = text;
    try {
      parsed = text ? JSON.parse(text) : null;
    } catch {
      // not JSON: keep the text
    }
    return { status: res.status, body: parsed as T, headers: res.headers } satisfies Reply<T>;
  }

  get<T = unknown>(path: string) {
    return this.request<T>("GET", path);
  }
  post<T = unknown>(path: string, body?: unknown, headers?: Record<string, string>) {
    return this.request<T>("POST", path, body ?? {}, headers);
  }
  patch<T = unknown>(path: string, body?: unknown) {
    return this.request<T>("PATCH", path, body ?? {});
  }
  delete<T = unknown>(path: string) {
    return this.request<T>("DELETE", path);
  }

  /** The Cookie header for requests made outside this client (multipart uploads, downloads). */
  cookieHeader(): string {
    return this.cookie ?? "";
  }

  get hasSession(): boolean {
    return this.cookie !== null;
  }
}

export async function signedIn(baseUrl: string, email: string, password = DEMO_PASSWORD): Promise<Client> {
  const c = new Client(baseUrl);
  const r = await c.post("/api/auth/sign-in", { email, password });
  if (r.status !== 200) throw new Error(`sign-in as ${email} failed: ${r.status} ${JSON.stringify(r.body)}`);
  return c;
}
