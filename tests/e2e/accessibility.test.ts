import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { createAbility, type Action, type AppRule, type Subject } from '@busbar/shared';
import type axe from 'axe-core';
import type { BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { insertInvite } from '../../apps/api/src/queries/invites.ts';
import { demoIds } from '../support/api-harness.ts';
import { startE2e, type E2e } from '../support/e2e-harness.ts';
import { feederPlan } from '../support/margin-plans.ts';
import { addPerson, SIGN_INS } from '../support/staff-fixtures.ts';

const AXE_SCRIPT = createRequire(import.meta.url).resolve('axe-core/axe.min.js');
/** WCAG 2.1 A and AA; best practices are advice, not the standard, and are left out. */
const WCAG_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'];
const WIDTHS = [1280, 390] as const;
const INVITE_TOKEN = 'a11y-invite-token-0000000000000000000000000'; // 43 characters, as the API issues them

/** Real Denver records: every role below reads Denver (the regional manager through the West region). */
interface Records {
  build: number;
  claim: number;
  customer: number;
  person: number;
  quickPlan: number;
}

interface Screen {
  /** The route's name in router.ts. */
  route: string;
  path: (r: Records) => string;
  need?: [Action, Subject];
  /** Names a second look at the same route (a tab). */
  label?: string;
  /** What it shows changes with the role (home, hidden fields, commands): every role checks it. */
  byRole?: true;
}

const SCREENS: Screen[] = [
  { route: 'overview', byRole: true, path: () => '/' },
  { route: 'shop-week', path: () => '/shop-week', need: ['plan', 'Build'] },
  // A person's own work: the owner's bay is empty, a technician's has their builds of the day.
  { route: 'my-bay', byRole: true, path: () => '/my-bay', need: ['update', 'Build'] },
  { route: 'builds', byRole: true, path: () => '/builds', need: ['read', 'Build'] },
  { route: 'builds-new', path: () => '/builds/new', need: ['create', 'Build'] },
  { route: 'builds-import', path: () => '/builds/import', need: ['create', 'Build'] },
  { route: 'builds-detail', byRole: true, path: (r) => `/builds/${r.build}`, need: ['read', 'Build'] },
  { route: 'builds-detail', label: 'power plan tab', path: (r) => `/builds/${r.build}?tab=plan`, need: ['read', 'Build'] },
  { route: 'builds-plan-print', path: (r) => `/builds/${r.build}/plan/print`, need: ['read', 'Build'] },
  { route: 'plans', path: () => '/plans', need: ['create', 'Plan'] },
  { route: 'plans-new', path: () => '/plans/new', need: ['create', 'Plan'] },
  { route: 'plans-detail', path: (r) => `/plans/${r.quickPlan}`, need: ['read', 'Plan'] },
  { route: 'plans-print', path: (r) => `/plans/${r.quickPlan}/print`, need: ['read', 'Plan'] },
  { route: 'customers', byRole: true, path: () => '/customers', need: ['read', 'Customer'] },
  { route: 'customers-detail', byRole: true, path: (r) => `/customers/${r.customer}`, need: ['read', 'Customer'] },
  { route: 'serials', path: () => '/serials?q=KST', need: ['read', 'Build'] },
  { route: 'claims', path: () => '/claims', need: ['read', 'Claim'] },
  { route: 'claims-new', path: () => '/claims/new', need: ['create', 'Claim'] },
  { route: 'claims-detail', byRole: true, path: (r) => `/claims/${r.claim}`, need: ['read', 'Claim'] },
  { route: 'reliability', path: () => '/reliability', need: ['read', 'Reliability'] },
  { route: 'reliability-detail', path: () => '/reliability/category/house_battery', need: ['read', 'Reliability'] },
  { route: 'compare', path: () => '/compare', need: ['read', 'Report'] },
  { route: 'catalog', byRole: true, path: () => '/catalog', need: ['read', 'CatalogItem'] },
  { route: 'vendors', path: () => '/vendors', need: ['read', 'Vendor'] },
  { route: 'locations', path: () => '/locations', need: ['update', 'Location'] },
  { route: 'staff', byRole: true, path: () => '/staff', need: ['read', 'RoleAssignment'] },
  { route: 'staff-person', path: (r) => `/staff/${r.person}`, need: ['read', 'RoleAssignment'] },
  { route: 'outbox', path: () => '/outbox', need: ['read', 'Mail'] },
  { route: 'audit', path: () => '/audit', need: ['read', 'AuditLog'] },
  { route: 'closes', path: () => '/month-close', need: ['export', 'Report'] },
  { route: 'close-status', path: () => '/month-close/status', need: ['export', 'Report'] },
  { route: 'exports', path: () => '/exports', need: ['export', 'Report'] },
  { route: 'change-password', path: () => '/account/password' },
  { route: 'forbidden', path: () => '/forbidden' },
  { route: 'not-found', path: () => '/no-such-page' },
];
const SIGNED_OUT: Screen[] = [
  { route: 'sign-in', path: () => '/sign-in' },
  { route: 'forgot-password', path: () => '/forgot-password' },
  // The same form as setting a first password, checked below with a real invite; here a spent link.
  { route: 'reset-password', path: () => `/reset-password?token=${'x'.repeat(43)}` },
  { route: 'set-password', path: () => `/set-password?token=${INVITE_TOKEN}` },
];

let e2e: E2e;
let records: Records;

beforeAll(async () => {
  e2e = await startE2e({ history: true });
  const db = e2e.harness.db;
  const denver = (await demoIds(db)).location('DEN');
  const one = <T>(row: T | undefined, what: string): T => {
    if (!row) throw new Error(`The demo has no Denver ${what}`);
    return row;
  };
  // A build with a power plan, so its plan tab and sheet show a real plan.
  const planned = one(
    await db.selectFrom('powerPlans').select('buildId').where('locationId', '=', denver).where('buildId', 'is not', null).orderBy('id').executeTakeFirst(),
    'build with a power plan',
  );
  // The demo has no quick plans: the technician saves one, as on the shop floor.
  const quick = await (await e2e.harness.signedIn(SIGN_INS.tech)).post('/api/plans').send({ locationId: denver, name: 'Van consult', input: feederPlan });
  expect(quick.status).toBe(201);
  const claim = one(await db.selectFrom('warrantyClaims').select('id').where('locationId', '=', denver).orderBy('id').executeTakeFirst(), 'claim');
  const customer = one(await db.selectFrom('customers').select('id').where('locationId', '=', denver).orderBy('id').executeTakeFirst(), 'customer');
  const person = await db.selectFrom('users').select('id').where('email', '=', SIGN_INS.tech).executeTakeFirstOrThrow();
  records = { build: planned.buildId!, claim: claim.id, customer: customer.id, person: person.id, quickPlan: quick.body.id };
  // An open invite, so the set-password page shows its form rather than a broken link.
  const owner = await db.selectFrom('users').select('id').where('email', '=', SIGN_INS.owner).executeTakeFirstOrThrow();
  const invited = await addPerson(db, { role: 'technician', locationId: denver }, 'invited');
  await insertInvite(db, { userId: invited.id, token: INVITE_TOKEN, createdAt: '2026-06-14T12:00:00.000Z', createdBy: owner.id, expiresAt: '2026-07-14T12:00:00.000Z' });
}, 120000);
afterAll(async () => {
  await e2e?.close();
});

interface Finding {
  id: string;
  impact: string;
  help: string;
  nodes: { target: string; summary: string }[];
}

/** How long a page must have had no request open before its screen counts as having its data. */
const QUIET_MS = 200;
const withAxe = new WeakSet<BrowserContext>();
/** When each page last started or finished a request, and how many it has open. */
const traffic = new WeakMap<Page, { open: number; lastChange: number }>();

/**
 * Waits until the screen has its data: a heading, no spinner, skeleton or loading note, and no
 * request open or finished for QUIET_MS (the app asks for a screen's code and data one request
 * right after another, so a moment without one means they are done).
 */
async function settle(page: Page): Promise<void> {
  const seen = traffic.get(page)!;
  const quiet = () => seen.open === 0 && performance.now() - seen.lastChange >= QUIET_MS;
  const loading = page.locator('.ant-spin-spinning, .ant-skeleton-active, .empty-words:text-matches("^Loading")');
  await page.locator('h1').first().waitFor();
  // Quiet before and after the look for loading signs, so no request came and went in between.
  await expect.poll(async () => quiet() && (await loading.count()) === 0 && quiet(), { timeout: 15000, interval: 50 }).toBe(true);
}

/** The serious and critical WCAG 2.1 A/AA violations axe-core finds on the page as it is. */
async function seriousViolations(page: Page): Promise<Finding[]> {
  return page.evaluate(async (tags) => {
    const engine = (window as unknown as { axe: typeof axe }).axe;
    const result = await engine.run(document, { runOnly: { type: 'tag', values: tags }, resultTypes: ['violations'] });
    return result.violations
      .filter((v) => v.impact === 'serious' || v.impact === 'critical')
      .map((v) => ({
        id: v.id,
        impact: v.impact ?? '',
        help: v.help,
        nodes: v.nodes.map((n) => ({ target: n.target.join(' '), summary: (n.failureSummary ?? '').replace(/\s+/g, ' ') })),
      }));
  }, WCAG_TAGS);
}

const describeFindings = (where: string, findings: Finding[]) =>
  findings.map((f) => `${where}: ${f.impact} ${f.id} (${f.help})\n${f.nodes.map((n) => `    at ${n.target}: ${n.summary}`).join('\n')}`);

/** Checks the open screen at each width (the same load, resized): axe's findings and any sideways scroll of the page. */
async function checkScreen(page: Page, name: string): Promise<string[]> {
  const problems: string[] = [];
  for (const width of WIDTHS) {
    await page.setViewportSize({ width, height: width > 600 ? 800 : 844 });
    await page.evaluate(() => new Promise((done) => requestAnimationFrame(() => requestAnimationFrame(done))));
    // Colours are measured once the screen stands still: no fade or slide half done.
    await page.waitForFunction(() => document.getAnimations().every((a) => a.playState !== 'running' || a.effect?.getComputedTiming().endTime === Infinity));
    problems.push(...describeFindings(`${name} at ${width} px`, await seriousViolations(page)));
    const sideways = await page.evaluate(() => document.scrollingElement!.scrollWidth - document.scrollingElement!.clientWidth);
    if (sideways > 0) problems.push(`${name} at ${width} px: the page scrolls sideways by ${sideways} px`);
  }
  await page.setViewportSize({ width: 1280, height: 800 });
  return problems;
}

async function visit(page: Page, screen: Screen): Promise<string> {
  await page.goto(screen.path(records));
  await settle(page);
  // Arriving at / lands a person on their own home; the menu's Overview opens the overview itself.
  if (screen.route === 'overview' && new URL(page.url()).pathname !== '/') {
    await page.getByRole('navigation').getByRole('link', { name: 'Overview', exact: true }).click();
    await page.waitForURL((url) => url.pathname === '/');
    await settle(page);
  }
  return screen.label ? `${screen.route} (${screen.label})` : screen.route;
}

/**
 * A page that loads axe-core into every document, before the app's own scripts (the app's CSP
 * allows no added script tag), and whose requests are counted for settle().
 */
async function newPage(): Promise<Page> {
  const page = await e2e.newPage();
  // A context is reused once closed (e2e-harness.ts): it keeps the script added before.
  if (!withAxe.has(page.context())) await page.context().addInitScript({ path: AXE_SCRIPT });
  withAxe.add(page.context());
  const seen = { open: 0, lastChange: performance.now() };
  const change = (by: number) => () => {
    seen.open += by;
    seen.lastChange = performance.now();
  };
  page.on('request', change(1));
  page.on('requestfinished', change(-1));
  page.on('requestfailed', change(-1));
  traffic.set(page, seen);
  return page;
}

describe('accessibility of every screen (axe-core, WCAG 2.1 A and AA)', () => {
  it('covers every route of the router', () => {
    const routes = [...readFileSync('apps/web/src/router.ts', 'utf8').matchAll(/name: '([\w-]+)'/g)].map((m) => m[1]);
    const covered = new Set([...SCREENS, ...SIGNED_OUT].map((s) => s.route));
    expect(routes.filter((route) => !covered.has(route!))).toEqual([]);
  });

  it('signed out: the sign-in and password pages have no serious or critical violations at 1280 and 390 px', async () => {
    const page = await newPage();
    const problems: string[] = [];
    for (const screen of SIGNED_OUT) problems.push(...(await checkScreen(page, await visit(page, screen))));
    await page.getByLabel('New password').waitFor();
    expect(problems.join('\n')).toBe('');
    await page.context().close();
  });

  // The owner opens every screen; the other roles open the screens whose content changes with the
  // role (the rest is the same markup the owner's check already saw). Each screen is checked by at
  // least one role that can open it (the last test below).
  const checked = new Set<Screen>();
  for (const [role, email] of Object.entries(SIGN_INS).filter(([role]) => role !== 'lead2')) {
    const everyScreen = role === 'owner';
    it(`${role}: ${everyScreen ? 'every screen' : 'every screen that changes with the role'} they can open has no serious or critical violations at 1280 and 390 px`, async () => {
      const page = await newPage();
      await e2e.signIn(page, email);
      const rules = (await page.evaluate(() => fetch('/api/session').then((res) => res.json()))) as { rules: AppRule[] };
      const ability = createAbility(rules.rules);
      const problems: string[] = [];
      for (const screen of SCREENS.filter((s) => (everyScreen || s.byRole) && (!s.need || ability.can(...s.need)))) {
        checked.add(screen);
        const name = await visit(page, screen);
        if (screen.route !== 'forbidden') expect(new URL(page.url()).pathname, name).not.toBe('/forbidden');
        problems.push(...(await checkScreen(page, name)));
      }
      expect(problems.join('\n')).toBe('');
      await page.context().close();
    }, 300000);
  }

  it('checked every screen with some role', () => {
    expect(SCREENS.filter((s) => !checked.has(s)).map((s) => s.route)).toEqual([]);
  });
});

describe('the catalog and the build list fit the screen', () => {
  /** How far the page and each table's own scroll box reach past their visible width, in pixels. */
  const overflow = (page: Page) =>
    page.evaluate(() => {
      const page = document.scrollingElement!;
      const boxes = [...document.querySelectorAll('.ant-table-content, .ant-table-body, .ant-table-container')];
      return { page: page.scrollWidth - page.clientWidth, table: Math.max(...boxes.map((box) => box.scrollWidth - box.clientWidth)) };
    });

  it('shows the owner every column at 1280 px with no sideways scroll, and scrolls the table in its own box at 390 px', async () => {
    const page = await newPage();
    await e2e.signIn(page, SIGN_INS.owner);
    for (const [path, headers] of [
      ['/catalog?active=all', ['Item', 'Category and vendor', 'Specs', 'Serial no.', 'Warranty', 'Unit cost', 'Margin', 'Unit price', 'Actions']],
      ['/builds', ['Build', 'Customer and vehicle', 'Shop', 'Status', 'Lead technician', 'Booked for', 'Total', 'Last change']],
    ] as const) {
      await page.setViewportSize({ width: 1280, height: 800 });
      await page.goto(path);
      await settle(page);
      await page.locator('.ant-table-row').first().waitFor();
      expect(await page.locator('.ant-table-thead th').allInnerTexts(), path).toEqual(headers);
      expect(await overflow(page), `${path} at 1280 px`).toEqual({ page: 0, table: 0 });
      await page.setViewportSize({ width: 390, height: 844 });
      await expect.poll(() => overflow(page).then((o) => o.page), { message: `${path} at 390 px` }).toBe(0);
      expect((await overflow(page)).table, `${path} at 390 px scrolls inside the table`).toBeGreaterThan(0);
    }
    await page.context().close();
  });
});
