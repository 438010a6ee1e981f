import { expect, type APIRequestContext, type FrameLocator, type Page } from '@playwright/test';
import { query } from '../../helpers/app-database';
import { MIN_SECONDS_TO_SUBMIT } from '../../../src/lib/server/embed/human-pace.ts';

/** Opens the embed page as a browser would and returns the signed form token it hands the widget. */
export async function formTokenFor(request: APIRequestContext, slug: string): Promise<string> {
  const html = await (await request.get(`/embed/${slug}`)).text();
  // Astro serialises island props into an HTML attribute: "formToken":[0,"…"].
  const props = html.replace(/&quot;/g, '"');
  const match = props.match(/"formToken":\[0,"([^"]+)"\]/);
  if (!match) throw new Error(`No form token on /embed/${slug}`);
  return match[1]!;
}

export const twoRoomProject = {
  rooms: [
    {
      name: 'Dining room',
      ceilingHeight: 96,
      length: 156,
      width: 132,
      walls: [{ side: 'length' }, { side: 'width', openings: [{ kind: 'door' }] }],
      treatment: { id: 'board-and-batten', height: 'wainscot' },
    },
    { name: 'Hallway', ceilingHeight: 96, walls: [{ length: 150, outlets: 1 }], treatment: { id: 'board-and-batten', height: 'wainscot' } },
  ],
  builtBefore1978: 'no',
  measuredBy: 'homeowner-estimate',
};

/**
 * Opens the firm's demo page and waits until the framed widget has hydrated: answers typed
 * into the server-rendered form before then are replaced by the fresh island's empty ones.
 */
export async function openWidgetOnDemoSite(page: Page, size?: { width: number; height: number }): Promise<FrameLocator> {
  if (size) await page.setViewportSize(size);
  await page.goto('/demo/cedar-hollow');
  const widget = page.frameLocator('iframe[title="Price your walls"]');
  await expect(widget.getByRole('heading', { name: 'Your rooms' })).toBeVisible({ timeout: 15_000 });
  noteWidgetOpened(page);
  await expect(widget.locator('astro-island[ssr]')).toHaveCount(0, { timeout: 15_000 });
  return widget;
}

const openedAt = new WeakMap<Page, number>();

/**
 * Call once the widget shows: its form token was issued when its page was rendered, so waiting
 * from here waits at least as long from the token (a cold server can take seconds to render it).
 */
export function noteWidgetOpened(page: Page): void {
  openedAt.set(page, Date.now());
}

/**
 * Waits until a person could have filled the form: the server quietly drops an inquiry sent
 * sooner than MIN_SECONDS_TO_SUBMIT after the form was opened, and a browser test can be faster.
 */
export async function waitUntilAPersonCouldSend(page: Page): Promise<void> {
  const opened = openedAt.get(page);
  if (opened === undefined) throw new Error('Call noteWidgetOpened(page) before opening the widget.');
  const left = opened + MIN_SECONDS_TO_SUBMIT * 1000 + 250 - Date.now();
  if (left > 0) await page.waitForTimeout(left);
  await asANewVisitor();
}

/**
 * Every browser test reaches the app from 127.0.0.1, so all of them share one address's allowance
 * of inquiries (10 in 10 minutes, `api/embed/[slug]/leads.ts`); each test that sends is a visitor
 * of its own, so its address starts afresh. The limit itself is tested in embed-security.spec.ts
 * on the estimate route, which this leaves alone.
 */
export async function asANewVisitor(): Promise<void> {
  await query(`delete from rate_limit where key like 'embed-leads:address:%'`);
}

/** One room, board and batten, straight through to Send. */
export async function priceAndSend(page: Page, widget: FrameLocator, email: string, name = 'Wren Halloway') {
  await widget.getByLabel('Which room?').first().fill('Front hall');
  await widget.getByRole('textbox', { name: 'Room length' }).fill("12'");
  await widget.getByRole('textbox', { name: 'Room width' }).fill("6'");
  await widget.getByRole('textbox', { name: 'Ceiling height' }).fill("8'");
  await widget.getByRole('button', { name: 'Next' }).click();
  await widget.getByText('Board and batten').first().click();
  await widget.getByRole('textbox', { name: /Height to the top of the cap rail/ }).fill('36"');
  await widget.getByRole('button', { name: 'Next' }).click();
  await widget.getByText('Not sure', { exact: true }).click();
  await widget.getByRole('button', { name: 'Next' }).click();
  await widget.getByRole('button', { name: 'Next' }).click();
  await expect(widget.getByTestId('result-range')).toContainText('$', { timeout: 10_000 });
  await widget.getByRole('button', { name: /Send it to/ }).click();
  await widget.getByRole('textbox', { name: 'Your name', exact: true }).fill(name);
  await widget.getByRole('textbox', { name: 'E-mail', exact: true }).fill(email);
  await widget.getByRole('textbox', { name: 'Phone', exact: true }).fill('(512) 555-0176');
  await widget.getByRole('textbox', { name: 'Street address', exact: true }).fill('14 Sorrel Way');
  await widget.getByRole('textbox', { name: 'ZIP or postcode', exact: true }).fill('78704');
  await widget.getByLabel(/may contact me/).check();
  await waitUntilAPersonCouldSend(page);
  await widget.getByRole('button', { name: /Send to/ }).click();
  await expect(widget.getByRole('heading', { name: /Thank you/ })).toBeVisible({ timeout: 15_000 });
}
