import { expect, type APIRequestContext } from '@playwright/test';

/**
 * The mail fake's inbox API (the server's MAIL_INBOX_URL). scripts/e2e-server.ts sets it from the app's port, so it
 * is derived the same way here; E2E_INBOX_URL overrides it for a server started by other means.
 */
export function mailInboxUrl(): string {
  return process.env.E2E_INBOX_URL ?? `http://127.0.0.1:${Number(process.env.E2E_PORT ?? 3100) + 10_080}`;
}

/** Waits for the account-confirmation mail to `email` and returns the link in it. */
export async function confirmationLink(request: APIRequestContext, email: string): Promise<string> {
  let link: string | undefined;
  await expect
    .poll(
      async () => {
        const res = await request.get(`${mailInboxUrl()}/messages?to=${encodeURIComponent(email)}`);
        const { messages } = (await res.json()) as { messages: Array<{ subject: string; text: string | null }> };
        const mail = messages.find((m) => /confirm your/i.test(m.subject));
        link = mail?.text ? /https?:\/\/\S+\/api\/auth\/verify-email\?\S+/.exec(mail.text)?.[0] : undefined;
        return link;
      },
      { message: `confirmation mail to ${email}`, timeout: 10_000 },
    )
    .toBeTruthy();
  return link!;
}
