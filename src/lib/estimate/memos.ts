import { clearSheetLayoutMemo } from './sheet-layout.ts';
import { clearStockCuttingMemo } from './stock-cutting.ts';

/**
 * Empties what the core keeps between estimates (sheet layouts, counted cut lists), for benchmarks
 * that want the cost of an estimate of lists never seen before.
 */
export function clearEstimateMemos(): void {
  clearSheetLayoutMemo();
  clearStockCuttingMemo();
}
