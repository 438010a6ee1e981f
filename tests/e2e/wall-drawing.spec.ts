import { expect, test } from '@playwright/test';
import sharp from 'sharp';

test('wall drawings render to scale with boards, openings and a text alternative', async ({ page }) => {
  await page.setViewportSize({ width: 390, height: 844 });
  await page.goto('/');
  const figures = page.getByTestId('example-wall');
  await expect(figures).toHaveCount(2);

  // The bedroom accent wall: vertical strips, so many wood pieces, and an accessible description.
  const bedroom = figures.nth(1).getByRole('img');
  await bedroom.scrollIntoViewIfNeeded();
  await expect(bedroom).toHaveAccessibleName(/wall/i);
  const description = await bedroom.evaluate((svg) => svg.querySelector('desc')?.textContent ?? '');
  // 150 in of wall, 5-7/8 in strips, 1/8 in gaps: 25 × 5.875 + 24 × 0.125 = 149.875 in, and the last
  // 1/8 in is narrower than a gap, so 25 strips and no ripped sliver. Source: arithmetic, computed here.
  expect(description).toContain('25 vertical boards 5-7/8" wide with 1/8" gaps');

  // Stays readable on a phone: the drawing fits the 390 px viewport.
  const box = await bedroom.boundingBox();
  expect(box!.width).toBeGreaterThan(250);
  expect(box!.width).toBeLessThanOrEqual(390);

  // The screenshot is a real picture, not a blank box: several distinct tones (ink, wood, white).
  const png = await figures.nth(0).screenshot();
  await test.info().attach('dining-room-wall.png', { body: png, contentType: 'image/png' });
  const { channels } = await sharp(png).stats();
  expect(channels[0]!.stdev).toBeGreaterThan(10);
});
