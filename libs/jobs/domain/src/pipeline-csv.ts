/**
 * The pipeline table's CSV export: a header and one row per job, in RFC 4180 form.
 */
import { csvDocument, type CsvCell } from './csv';
import { formatMinor } from './money';
import type { PipelineJob } from './pipeline';
import { STAGE_LABELS } from './stages';

/** Column headings of the export, in order. */
export const PIPELINE_CSV_HEADER: readonly string[] = [
  'Reference',
  'Title',
  'Customer',
  'Stage',
  'Value',
  'Owner',
  'Enquiry date',
  'Stage changed',
  'Expected start',
];

/**
 * One job as export cells. The value is written as a plain decimal ("1234.56") so a
 * spreadsheet reads it as a number; `digits` is the currency's minor-unit exponent.
 */
export function pipelineCsvCells(job: PipelineJob, digits = 2): CsvCell[] {
  return [
    job.reference,
    job.title,
    job.customerName ?? '',
    STAGE_LABELS[job.stage],
    job.valueMinor === null ? '' : formatMinor(job.valueMinor, digits),
    job.ownerName ?? '',
    job.enquiredOn,
    job.stageChangedOn ?? '',
    job.expectedStartOn ?? '',
  ];
}

/** The whole export file, header first, with a BOM for spreadsheet programs. */
export function pipelineCsv(jobs: readonly PipelineJob[], digits = 2): string {
  return csvDocument([PIPELINE_CSV_HEADER, ...jobs.map((j) => pipelineCsvCells(j, digits))], {
    bom: true,
  });
}
