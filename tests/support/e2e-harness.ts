import { createServer, type Server } from 'node:http';
import { resolve } from 'node:path';
import { chromium, type Browser, type BrowserContext, type Locator, type Page } from 'playwright-core';
import { DEMO_PASSWORD } from '@busbar/db';
import { SESSION_COOKIE } from '../../apps/api/src/routes/session.ts';
import { startHarness, type Harness } from './api-harness.ts';

export interface E2e {
  baseUrl: string;
  harness: Harness;
  browser: Browser;
  /**
   * A browser context with one page, as fresh as a new one to the app: no cookies, nothing in
   * local storage, no other page. Closing it empties it for the next test of the file, which then
   * finds the app's code in its cache (a new context spends a second of CPU loading and compiling it).
   */
  newPage(): Promise<Page>;
  signIn(page: Page, email: string, password?: string): Promise<void>;
  close(): Promise<void>;
}

/** The session id in a session cookie's value: `s:` + id + `.` + signature, URL-encoded (express-session). */
const sessionIdOf = (value: string) => {
  const signed = decodeURIComponent(value);
  return signed.slice(2, signed.lastIndexOf('.'));
};

function freePort(): Promise<number> {
  return new Promise((done, fail) => {
    const probe = createServer().listen(0, '127.0.0.1', () => {
      const address = probe.address();
      probe.close(() => (typeof address === 'object' && address ? done(address.port) : fail(new Error('no port'))));
    });
  });
}

/**
 * The built web app (`vite build` → dist/web, or the folder in BUSBAR_E2E_WEB when one build is
 * tried while another is being made) served by the real API, driven in Debian's Chromium.
 * `demo.history` adds the demo's two years of builds and claims (slower; ask only when needed).
 */
export async function startE2e(demo: { history?: boolean } = {}): Promise<E2e> {
  const port = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  const harness = await startHarness({ webDist: resolve(process.env.BUSBAR_E2E_WEB ?? 'dist/web'), publicUrl: baseUrl }, true, demo);
  const server: Server = await new Promise((done) => {
    const s = harness.app.listen(port, '127.0.0.1', () => done(s));
  });
  // Playwright gives every launch a fresh, empty profile directory of its own.
  const browser = await chromium.launch({
    executablePath: '/usr/bin/chromium',
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });

  const emptied: BrowserContext[] = [];
  /**
   * Closing the context empties it instead: cookies and the app's local storage cleared, every page
   * closed but a blank one, which keeps the context's compiled code alive for its next page. The app
   * renews the session cookie with every answer, and the browser still takes the cookie of an answer
   * to a page closed while the request was on its way, after the cookies were cleared: so the
   * session is also ended on the server, as if it had expired, and its cookie stands for nothing.
   */
  const reusable = async (context: BrowserContext) => {
    const blank = await context.newPage();
    const close = context.close.bind(context);
    context.close = async (options) => {
      const app = context.pages().find((page) => page.url().startsWith(baseUrl));
      // Without a page on the app's address its storage cannot be reached: then it closes for good.
      if (!app || !(await app.evaluate(() => localStorage.clear()).then(() => true, () => false))) return close(options);
      for (const page of context.pages()) if (page !== blank) await page.close();
      const session = (await context.cookies()).find((cookie) => cookie.name === SESSION_COOKIE);
      if (session) await harness.db.deleteFrom('sessions').where('sid', '=', sessionIdOf(session.value)).execute();
      await context.clearCookies();
      emptied.push(context);
    };
    return context;
  };

  return {
    baseUrl,
    harness,
    browser,
    async newPage() {
      const reused = emptied.pop();
      // Cleared again of what the last answers set after their pages closed (see reusable).
      await reused?.clearCookies();
      const context = reused ?? (await reusable(await browser.newContext({ baseURL: baseUrl, viewport: { width: 1280, height: 800 } })));
      return context.newPage();
    },
    async signIn(page, email, password = DEMO_PASSWORD) {
      await page.goto('/sign-in');
      await page
        .getByLabel('E-mail')
        .fill(email)
        .catch(async (error: Error) => {
          // What the page showed instead of the form says why (it was once the last test's person's home).
          const shown = await page.evaluate(() => document.body.innerText.slice(0, 400)).catch(() => '(page unreadable)');
          throw new Error(`${error.message}\nThe page at ${page.url()} showed: ${JSON.stringify(shown)}`, { cause: error });
        });
      await page.getByLabel('Password').fill(password);
      await page.getByRole('button', { name: 'Sign in' }).click();
      await page.getByRole('button', { name: 'Sign out' }).waitFor();
    },
    async close() {
      await browser.close();
      await new Promise((done) => server.close(done));
      await harness.close();
    },
  };
}

/**
 * Picks an option of an ant-design select by its field label: a click on the select's box (its
 * current choice covers the input) opens the dropdown, whose visible items are the options.
 */
export async function choose(page: Page, within: Locator, label: string, option: string): Promise<void> {
  await within.locator('.ant-select').filter({ has: page.getByLabel(label) }).click();
  await page.locator('.ant-select-dropdown:visible .ant-select-item-option', { hasText: option }).first().click();
}
