/**
 * Lapwing's estimating core: framework-free, pure TypeScript (standard library and zod only).
 * Lengths are inches, areas square feet, money integer cents.
 */
export { parseLength, formatLength, formatArea, LengthParseError, MM_PER_INCH, SQ_M_PER_SQ_FT, inchesToMm, mmToInches, sqFtToSqM } from './units.ts';
export type { Units, FormatLengthOptions } from './units.ts';
export { DRESSED_SIZES, NOMINAL_SIZES, dressedSize } from './lumber.ts';
export type { NominalSize } from './lumber.ts';
export { piecesPerSheet } from './sheet-layout.ts';
export type { Rect, SheetLayoutOptions } from './sheet-layout.ts';
export { boardRun, boardPositions } from './board-run.ts';
export type { BoardRunResult } from './board-run.ts';
export { stockPiecesNeeded, planStockCuts, EXACT_LIMIT } from './stock-cutting.ts';
export { clearEstimateMemos } from './memos.ts';
export { gallonsFor, gallonsToBuy, theoreticalCoverage, caulkFeetPerTube, filletFeetPerTube, beadFeetPerTube } from './coverage.ts';
export { formatMoney } from './money.ts';
export { EstimateInputError } from './errors.ts';
export {
  projectSchema,
  rateBookSchema,
  catalogueSchema,
  treatmentSchema,
  OPENING_KINDS,
  MEASURED_BY,
  BUILT_BEFORE_1978,
  TREATMENT_HEIGHTS,
} from './schemas.ts';
export type {
  ProjectInput,
  Project,
  Room,
  Wall,
  Opening,
  RateBookInput,
  RateBook,
  Catalogue,
  Treatment,
  TreatmentKind,
  SheetStock,
  BoardStock,
  MouldingStock,
  MeasuredBy,
} from './schemas.ts';
export { validateProject, checkProject, parseRateBook } from './validate.ts';
export { checkProjectSize, projectSize, PROJECT_LIMITS } from './project-size.ts';
export type { ProjectSize, RoomSize, ProjectLimits } from './project-size.ts';
export { takeoff, coversWall } from './takeoff.ts';
export { priceRange } from './pricing.ts';
export { estimate, estimateParsed } from './estimate.ts';
export { wallSummary } from './summary.ts';
export { sampleRateBook, sampleProject } from './sample-data.ts';
export { cheapestContainers, describePacks, LITRES_PER_US_GALLON } from './containers.ts';
export type { Container, ContainerChoice, Pack } from './containers.ts';
export { siteVisits, setupHoursPerVisit, describeVisits } from './site-visits.ts';
export { paintingLabour } from './painting.ts';
export type * from './types.ts';
