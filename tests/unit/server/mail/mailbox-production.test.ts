import { afterEach, describe, expect, it, vi } from 'vitest';

// A production server with the local sink configured: the Mailbox must not exist unless the
// operator says it is a demo. env() is read once per module load, so each case loads afresh.
async function load(extra: Record<string, string>) {
  vi.resetModules();
  for (const [key, value] of Object.entries({
    NODE_ENV: 'production',
    DATABASE_URL: 'postgres://nobody@127.0.0.1:1/none',
    SMTP_URL: 'smtp://127.0.0.1:2525',
    MAILBOX_DIR: '/tmp/ringpass-no-such-mailbox',
    ...extra,
  })) {
    vi.stubEnv(key, value);
  }
  return {
    page: (await import('@/app/(shop)/mailbox/page')).default,
    mailbox: await import('@/server/mail/mailbox'),
  };
}

afterEach(() => vi.unstubAllEnvs());

describe('the Mailbox on a production server', () => {
  it('is a 404 for everyone without MAILBOX_DEMO, before any sign-in is looked at', async () => {
    const { page, mailbox } = await load({});
    expect(mailbox.mailboxEnabled()).toBe(false);
    await expect(page()).rejects.toMatchObject({ digest: 'NEXT_HTTP_ERROR_FALLBACK;404' });
  });

  it('stays off with MAILBOX_DEMO=false', async () => {
    const { mailbox } = await load({ MAILBOX_DEMO: 'false' });
    expect(mailbox.mailboxEnabled()).toBe(false);
  });

  it('exists for a demo only when MAILBOX_DEMO=true, and then says it is a demo', async () => {
    const { mailbox } = await load({ MAILBOX_DEMO: 'true' });
    expect(mailbox.mailboxEnabled()).toBe(true);
    expect(mailbox.mailboxIsDemo()).toBe(true);
  });

  it('in development it exists without the flag and shows no demo banner', async () => {
    const { mailbox } = await load({ NODE_ENV: 'development' });
    expect(mailbox.mailboxEnabled()).toBe(true);
    expect(mailbox.mailboxIsDemo()).toBe(false);
  });
});
