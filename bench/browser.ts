import { DEMO_PASSWORD } from '@busbar/db';
import { chromium, type Page } from 'playwright-core';

/** The owner's screens with the most on them, drawn in Chromium, each ready when its selector shows. */
export const DRAWN_SCREENS: readonly (readonly [label: string, path: string, ready: string])[] = [
  ['overview', '/', 'h1:has-text("Welcome")'],
  ['builds', '/builds', '#main .ant-table-row, #main .ant-card'],
  ['claims', '/claims', '#main .ant-table-row, #main .ant-card'],
  ['customers', '/customers', '#main .ant-table-row, #main .ant-card'],
  ['catalog', '/catalog', '#main .ant-table-row, #main .ant-card'],
  ['staff', '/staff', '#main .ant-table-row, #main .ant-card'],
  ['audit log', '/audit', '#main .ant-table-row, #main .ant-card'],
  ['locations', '/locations', '#main .ant-table-row, #main .ant-card'],
  ['reliability', '/reliability', '#main .ant-table-row'],
  ['reliability, one category', '/reliability/category/house_battery', '#main .ant-table-row'],
  ['locations compared', '/compare', '#main .ant-table-row'],
  ['month close', '/month-close', '#main .ant-table-row, #main .ant-card'],
  ['close status', '/month-close/status', '#main .ant-table-row, #main .ant-card'],
];
export const WIDTHS = [1280, 390] as const;
const ROUNDS = 5;

/** One screen drawn: the median time to its content, the API requests it made, its page's elements, and any sideways scroll in px. */
export interface Drawn {
  ms: number;
  requests: number;
  elements: number;
  sideways: number;
}
export type DrawnScreens = Record<(typeof WIDTHS)[number], Map<string, Drawn>>;

/** Opens the screen from another page as the menu does, and times it to its content. */
async function drawOnce(page: Page, path: string, ready: string): Promise<Drawn> {
  await page.evaluate(() => {
    history.pushState({}, '', '/account/password');
    dispatchEvent(new PopStateEvent('popstate'));
  });
  await page.getByRole('heading', { level: 1 }).first().waitFor();
  await page.waitForLoadState('networkidle');
  let requests = 0;
  const count = (request: { url(): string }) => void (request.url().includes('/api/') && requests++);
  page.on('request', count);
  const started = performance.now();
  await page.evaluate((to) => {
    history.pushState({}, '', to);
    dispatchEvent(new PopStateEvent('popstate'));
  }, path);
  await page.locator(ready).first().waitFor({ timeout: 60_000 });
  const ms = performance.now() - started;
  page.off('request', count);
  const [elements, sideways] = await page.evaluate(() => [document.getElementsByTagName('*').length, document.documentElement.scrollWidth - document.documentElement.clientWidth]);
  return { ms, requests, elements: elements!, sideways: sideways! };
}

/**
 * The owner's largest screens in Debian's Chromium at a desktop's and a phone's width: each opened
 * `ROUNDS` times after a first, untimed; the median time from the click to its first rows.
 */
export async function measureDrawn(baseUrl: string, onScreen: (label: string) => void): Promise<DrawnScreens> {
  const browser = await chromium.launch({
    executablePath: '/usr/bin/chromium',
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
  try {
    const drawn = {} as DrawnScreens;
    for (const width of WIDTHS) {
      const page = await (await browser.newContext({ baseURL: baseUrl, viewport: { width, height: 900 } })).newPage();
      await page.goto('/sign-in');
      await page.getByLabel('E-mail').fill('owner@demo.busbar.test');
      await page.getByLabel('Password').fill(DEMO_PASSWORD);
      await page.getByRole('button', { name: 'Sign in' }).click();
      await page.getByRole('button', { name: 'Sign out' }).waitFor();
      drawn[width] = new Map();
      for (const [label, path, ready] of DRAWN_SCREENS) {
        onScreen(`${label} at ${width} px`);
        await drawOnce(page, path, ready);
        const rounds: Drawn[] = [];
        for (let i = 0; i < ROUNDS; i++) rounds.push(await drawOnce(page, path, ready));
        const median = rounds.sort((a, b) => a.ms - b.ms)[Math.floor(ROUNDS / 2)]!;
        drawn[width].set(label, median);
      }
      await page.context().close();
    }
    return drawn;
  } finally {
    await browser.close();
  }
}

const drawnCell = (d: Drawn | undefined) => (d ? `${Math.round(d.ms)} ms, ${d.requests} request${d.requests === 1 ? '' : 's'}, ${d.elements.toLocaleString('en-US')} elements${d.sideways > 0 ? `, **${d.sideways} px sideways**` : ''}` : '–');

/** The drawn screens as a Markdown table, the demo beside the network. */
export function drawnTable(demo: DrawnScreens, network: DrawnScreens): string[] {
  return [
    "The owner's largest screens in Chromium (median of 5 openings from another screen, to the first rows; the API requests the screen made and the elements of its page):",
    '',
    `| screen | ${WIDTHS.map((w) => `demo, ${w} px | network, ${w} px`).join(' | ')} |`,
    `|---|${WIDTHS.map(() => '---|---|').join('')}`,
    ...DRAWN_SCREENS.map(([label]) => `| ${label} | ${WIDTHS.map((w) => `${drawnCell(demo[w].get(label))} | ${drawnCell(network[w].get(label))}`).join(' | ')} |`),
  ];
}
