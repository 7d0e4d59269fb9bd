/** A signed-in browser over plain HTTP: its cookies and the CSRF header to echo. */
export interface HttpSession {
  /** Headers for a request: the cookies and `X-XSRF-TOKEN`. */
  headers(): Record<string, string>;
  /** The same plus `Content-Type: application/json`. */
  json(): Record<string, string>;
}

/** Signs in through the API with fetch, keeping cookies as a browser does; throws when refused. */
export async function signInOverHttp(baseUrl: string, email: string, password: string): Promise<HttpSession> {
  const jar = new Map<string, string>();
  const keep = (res: Response) => {
    for (const line of res.headers.getSetCookie()) {
      const [pair] = line.split(';');
      const eq = pair!.indexOf('=');
      jar.set(pair!.slice(0, eq), pair!.slice(eq + 1));
    }
    return res;
  };
  const headers = () => ({ cookie: [...jar].map(([k, v]) => `${k}=${v}`).join('; '), 'x-xsrf-token': decodeURIComponent(jar.get('XSRF-TOKEN') ?? '') });
  const session: HttpSession = { headers, json: () => ({ ...headers(), 'content-type': 'application/json' }) };
  keep(await fetch(`${baseUrl}/api/health`));
  const res = keep(await fetch(`${baseUrl}/api/auth/login`, { method: 'POST', headers: session.json(), body: JSON.stringify({ email, password }) }));
  if (!res.ok) throw new Error(`sign-in as ${email} answered ${res.status}: ${await res.text()}`);
  return session;
}
