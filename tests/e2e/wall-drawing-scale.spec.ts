import { expect, test, type Frame } from '@playwright/test';
import { estimate, sampleRateBook } from '../../src/lib/estimate/index.ts';
import { presentForHomeowner } from '../../src/lib/server/estimates/present-estimate.ts';
import { roomWallNames } from '../../src/lib/shared/wall-names.ts';
import { openWidgetOnDemoSite } from './helpers/embed';

// An invented 5 × 8 ft bathroom, all four walls in beadboard wainscot, with a tub on the first long wall.
const names = roomWallNames(96, 60);
const bathroom = presentForHomeowner(
  estimate(
    {
      rooms: [
        {
          name: 'Bathroom',
          ceilingHeight: 96,
          length: 96,
          width: 60,
          walls: (['length', 'width', 'length', 'width'] as const).map((side, i) => ({
            side,
            label: names[i]!,
            fixtures: i === 0 ? [{ kind: 'tub' as const, offset: 0 }] : [],
          })),
          treatment: { id: 'beadboard', height: 'wainscot', wainscotHeight: 40 },
          damp: true,
        },
      ],
      builtBefore1978: 'no',
      measuredBy: 'homeowner-tape',
    },
    sampleRateBook(),
  ),
);

test('a room’s walls are drawn to one scale with labels readable on a 320 px phone', async ({ page }) => {
  test.setTimeout(60_000);
  // Whatever the answers, the range comes back as this bathroom, so the drawings are known.
  await page.route('**/api/embed/*/estimate', (route) => route.fulfill({ json: { estimate: bathroom } }));
  const widget = await openWidgetOnDemoSite(page, { width: 320, height: 740 });
  await widget.getByLabel('Which room?').first().fill('Bathroom');
  await widget.getByRole('textbox', { name: 'Room length' }).fill("8'");
  await widget.getByRole('textbox', { name: 'Room width' }).fill("5'");
  await widget.getByRole('textbox', { name: 'Ceiling height' }).fill("8'");
  await widget.getByRole('button', { name: 'Next' }).click();
  await expect(widget.getByRole('heading', { name: 'Treatment and height' })).toBeVisible();
  await widget.getByText('Board and batten').click();
  await widget.getByRole('textbox', { name: /Height to the top of the cap rail/ }).fill('36"');
  await widget.getByRole('button', { name: 'Next' }).click();
  await expect(widget.getByRole('heading', { name: 'A few details' })).toBeVisible();
  await widget.getByText('Not sure', { exact: true }).click();
  await widget.getByRole('button', { name: 'Next' }).click();
  await expect(widget.getByRole('heading', { name: 'Photos', exact: true })).toBeVisible();
  await widget.getByRole('button', { name: 'Next' }).click();
  await expect(widget.getByRole('heading', { name: 'Your price range', exact: true })).toBeVisible();

  const walls = widget.getByTestId('result-wall');
  await expect(walls).toHaveCount(4);
  // Captions use the wall names the homeowner saw on the rooms step.
  await expect(walls.nth(0).locator('figcaption')).toHaveText('Long wall 1');
  await expect(walls.nth(1).locator('figcaption')).toHaveText('Short wall 1');

  // The wall outline (the first rectangle) of the 8 ft and the 5 ft wall, as drawn on screen.
  const longBox = await walls.nth(0).locator('svg > rect').first().boundingBox();
  const shortBox = await walls.nth(1).locator('svg > rect').first().boundingBox();
  // Source: computed here, 60 in / 96 in = 0.625: one scale keeps the ratio of the lengths.
  expect(shortBox!.width / longBox!.width).toBeCloseTo(0.625, 1);
  expect(Math.abs(shortBox!.width / longBox!.width - 0.625)).toBeLessThan(0.01);

  // Every label is at least 11 px on screen (the readability floor at 320 px): font size × the SVG's scale.
  const frame = page.frames().find((f: Frame) => f.url().includes('/embed/'))!;
  const sizes = await frame.$$eval('[data-testid="result-wall"] svg text', (texts) =>
    texts.map((t) => Number(t.getAttribute('font-size')) * ((t as SVGTextElement).getScreenCTM()?.a ?? 0)),
  );
  expect(sizes.length).toBeGreaterThan(8);
  expect(Math.min(...sizes)).toBeGreaterThanOrEqual(11);
  await test.info().attach('bathroom-walls-320.png', { body: await walls.nth(0).screenshot(), contentType: 'image/png' });
});
