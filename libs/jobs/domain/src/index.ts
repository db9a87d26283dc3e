/**
 * @latchwork/jobs-domain — jobs, pipeline and site-survey rules for flooring contractors.
 * Pure TypeScript with no imports: runs in Node and in the browser.
 */
export * from './stages';
export { STAGE_MOVES, moveRule, type MoveKind, type MoveRule } from './stage-table';
export * from './stage-moves';
export * from './references';
export * from './slab-limits';
export * from './slab-readings';
export * from './survey-warnings';
export * from './money';
export * from './csv';
export * from './pipeline';
export * from './pipeline-csv';
export * from './mentions';
export {
  CellError,
  normaliseHeading,
  type ColumnSpec,
  type CsvRows,
  type ImportResult,
  type ParsedRecord,
  type RowError,
} from './import-fields';
export * from './import-customers';
export * from './import-sites';
export * from './import-plan';
