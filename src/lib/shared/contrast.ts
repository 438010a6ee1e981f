/**
 * Which text colour reads on a firm's brand colour. Pure and browser-safe: the server pages, the
 * widget islands and the loader all pick the same colour for the same brand.
 */

/** Our ink (Tailwind `ink`), the dark choice for text on a light brand colour. */
export const INK = '#1F2A2E';
export const WHITE = '#FFFFFF';

/** `#RRGGBB` → red, green and blue in 0..255; null for anything else. */
function channels(hex: string): [number, number, number] | null {
  const match = /^#([0-9a-f]{2})([0-9a-f]{2})([0-9a-f]{2})$/i.exec(hex);
  if (!match) return null;
  return [parseInt(match[1]!, 16), parseInt(match[2]!, 16), parseInt(match[3]!, 16)];
}

/**
 * Relative luminance of an sRGB colour, 0 (black) to 1 (white).
 * Source: W3C, WCAG 2.2, definition "relative luminance" (https://www.w3.org/TR/WCAG22/#dfn-relative-luminance);
 * docs/sources.md §17. The 0.04045 threshold is the sRGB standard's; WCAG 2.x printed 0.03928 earlier,
 * which gives the same result for every 8-bit value.
 */
export function relativeLuminance(hex: string): number {
  const rgb = channels(hex);
  if (!rgb) throw new Error(`Not a #RRGGBB colour: ${hex}`);
  const [r, g, b] = rgb.map((value) => {
    const c = value / 255;
    return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  }) as [number, number, number];
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

/**
 * Contrast ratio (L1 + 0.05) / (L2 + 0.05), L1 the lighter; from 1 to 21.
 * Source: W3C, WCAG 2.2, definition "contrast ratio" (https://www.w3.org/TR/WCAG22/#dfn-contrast-ratio); docs/sources.md §17.
 */
export function contrastRatio(a: string, b: string): number {
  const [la, lb] = [relativeLuminance(a), relativeLuminance(b)];
  return (Math.max(la, lb) + 0.05) / (Math.min(la, lb) + 0.05);
}

/** White or ink, whichever contrasts more with `background`; ink for a colour we cannot read. */
export function textOn(background: string): typeof WHITE | typeof INK {
  if (!channels(background)) return INK;
  return contrastRatio(WHITE, background) >= contrastRatio(INK, background) ? WHITE : INK;
}

/**
 * Least contrast for normal text at level AA. Source: W3C, WCAG 2.2, Success Criterion 1.4.3
 * Contrast (Minimum), https://www.w3.org/TR/WCAG22/#contrast-minimum; docs/sources.md §17.
 */
export const AA_TEXT_CONTRAST = 4.5;

/** The text colour the widget would put on `background` and the contrast it reaches; null for a malformed colour. */
export function brandTextContrast(background: string): { text: typeof WHITE | typeof INK; ratio: number } | null {
  if (!channels(background)) return null;
  const text = textOn(background);
  return { text, ratio: contrastRatio(text, background) };
}

/** A ratio as people read it: 4.48 → "4.4:1" (rounded down, so a colour just short of 4.5 never reads as 4.5). */
export function formatRatio(ratio: number): string {
  return `${(Math.floor(ratio * 10) / 10).toFixed(1)}:1`;
}
