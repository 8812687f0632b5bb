import type { Reply, TestApp } from './test-app';

/** A signed-in client of the test app: it keeps its cookies and sends the app's own Origin, like the browser. */
export interface Client {
  get: (p: string) => Promise<Reply>;
  send: (method: string, p: string, body?: unknown) => Promise<Reply>;
  upload: (p: string, form: FormData) => Promise<Reply>;
  cookie: () => string;
}

/** A client of the test app that starts with the cookies of `setCookies` (Set-Cookie header values). */
export function clientOf(t: TestApp, setCookies: string[] = []): Client {
  const jar = new Map<string, string>();
  const keep = (lines: string[]) => {
    for (const line of lines) {
      const [pair] = line.split(';');
      const [name, ...rest] = pair!.split('=');
      jar.set(name!.trim(), rest.join('='));
    }
  };
  keep(setCookies);
  const cookie = () => [...jar].map(([k, v]) => `${k}=${v}`).join('; ');
  const read = async (res: Response): Promise<Reply> => {
    keep(res.headers.getSetCookie());
    const text = await res.text();
    let body: unknown = text;
    try {
      body = text ? JSON.parse(text) : null;
    } catch {
      /* not JSON */
    }
    return { status: res.status, body, headers: res.headers };
  };
  const headers = () => ({ origin: t.url, cookie: cookie() });
  return {
    get: async (p) => read(await fetch(`${t.url}${p}`, { headers: headers() })),
    send: async (method, p, body) =>
      read(await fetch(`${t.url}${p}`, { method, headers: { ...headers(), 'content-type': 'application/json' }, body: body === undefined ? undefined : JSON.stringify(body) })),
    upload: async (p, form) => read(await fetch(`${t.url}${p}`, { method: 'POST', headers: headers(), body: form })),
    cookie,
  };
}

export async function signIn(t: TestApp, email: string, password = 'spoolyard-demo-1'): Promise<Client> {
  const client = clientOf(t);
  const res = await client.send('POST', '/api/auth/sign-in/email', { email, password });
  if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return client;
}

/**
 * Signs up through HTTP as a person does, then follows the confirmation link from the mail fake's inbox; the link
 * signs the new account in. Returns the session as one Cookie header.
 */
export async function signUpAndConfirm(t: TestApp, input: { name: string; email: string; password: string }): Promise<string> {
  if (!t.mail) throw new Error('signUpAndConfirm needs the mail fake');
  const reply = await t.send('POST', '/api/auth/sign-up/email', input, { origin: t.url });
  if (reply.status !== 200) throw new Error(`sign-up of ${input.email}: ${reply.status} ${JSON.stringify(reply.body)}`);
  const mail = await t.mail.waitForMessage((m) => m.to.includes(input.email) && /confirm your/i.test(m.subject));
  const link = /https?:\/\/\S+\/api\/auth\/verify-email\?\S+/.exec(mail.text ?? '')?.[0];
  if (!link) throw new Error(`no confirmation link in the mail to ${input.email}`);
  const confirmed = await fetch(link.replace(/^https?:\/\/[^/]+/, t.url), { redirect: 'manual' });
  const cookie = confirmed.headers
    .getSetCookie()
    .map((c) => c.split(';')[0]!)
    .join('; ');
  if (!cookie.includes('session_token')) throw new Error(`confirming ${input.email} did not sign in: ${confirmed.status}`);
  return cookie;
}
