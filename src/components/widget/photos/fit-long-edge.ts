/**
 * The size an image gets when its longer side is brought down to `longEdge`, keeping its shape.
 * Images already within the limit keep their size; sides never round down to zero.
 */
export function fitLongEdge(width: number, height: number, longEdge: number): { width: number; height: number } {
  const longest = Math.max(width, height);
  if (longest <= longEdge) return { width, height };
  const scale = longEdge / longest;
  return { width: Math.max(1, Math.round(width * scale)), height: Math.max(1, Math.round(height * scale)) };
}
