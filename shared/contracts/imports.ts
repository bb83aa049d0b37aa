import './zod';
import * as z from 'zod/mini';
import type { CsvKind, CsvLayout, CsvPeriod, CsvPreview } from '../csv/csv-types';

export const importKinds = ['interest', 'sales'] as const;
export const dateOrders = ['MDY', 'DMY'] as const;
export const importStatuses = ['preview', 'committing', 'committed', 'failed'] as const;
export type ImportStatus = (typeof importStatuses)[number];

// The mapping itself is checked against the file's header by shared/csv (validateMapping), so here
// it only has to be an object; the problems it causes come back by row and column.
const mapping = z.optional(z.record(z.string(), z.unknown()));

/** Multipart text fields beside `file` on POST /imports (mapping as JSON text). */
export const uploadFields = z.object({
  kind: z.optional(z.enum(importKinds, 'kind must be "interest" or "sales"')),
  dateOrder: z.optional(z.enum(dateOrders, 'dateOrder must be "MDY" (month first) or "DMY" (day first)')),
  mapping,
});
export type UploadFields = z.infer<typeof uploadFields>;

/** PATCH /imports/:id: re-check the preview with a corrected mapping or date order. */
export const previewChange = z.object({
  kind: z.optional(z.enum(importKinds, 'kind must be "interest" or "sales"')),
  dateOrder: z.optional(z.enum(dateOrders, 'dateOrder must be "MDY" (month first) or "DMY" (day first)')),
  mapping,
});
export type PreviewChange = z.infer<typeof previewChange>;

export const commitRequest = z.object({
  mapping,
  dateOrder: z.optional(z.enum(dateOrders, 'dateOrder must be "MDY" (month first) or "DMY" (day first)')),
  onDuplicate: z.optional(z.enum(['skip', 'replace'], 'onDuplicate must be "skip" or "replace"')),
});
export type CommitRequest = z.infer<typeof commitRequest>;

export interface DuplicateOf {
  id: number;
  fileName: string;
  committedAt: string | null;
}

/** The preview of shared/csv (detection, columns, mapping, sample, problems) over the whole file, plus the upload's facts. */
export interface ImportPreview extends CsvPreview {
  id: number;
  status: ImportStatus;
  fileName: string;
  /** The date order chosen for ambiguous slash dates; `dateAmbiguous` files need one to commit. */
  dateOrder: 'MDY' | 'DMY' | null;
  /** Whether any problem is an error, which blocks the commit. */
  hasErrors: boolean;
  byteSize: number;
  sha256: string;
  /** An earlier committed import of the same file (same SHA-256) in this studio. */
  duplicateOf: DuplicateOf | null;
}

export interface CommittedSeries {
  id: number;
  term: string;
  region: string | null;
  kind: CsvKind;
  period: CsvPeriod;
  /** Points this import wrote to the series. */
  points: number;
}

export interface CommitResult {
  id: number;
  status: 'committed';
  series: CommittedSeries[];
  sales: { rows: number };
  /** Set when onDuplicate was "skip": the answer is the earlier import's, nothing new was stored. */
  skipped?: boolean;
}

export interface ImportListItem {
  id: number;
  fileName: string;
  kind: CsvKind;
  layout: CsvLayout;
  status: ImportStatus;
  rows: number;
  seriesCount: number;
  salesRows: number;
  periodStart: string | null;
  periodEnd: string | null;
  createdBy: { id: number; name: string } | null;
  createdAt: string;
  committedAt: string | null;
}

export interface ImportSeriesDetail extends CommittedSeries {
  /** Points of this import that replaced points an earlier import had written (newer points win). */
  replaced: number;
  /** Points the series holds now, from every import. */
  total: number;
  start: string | null;
  end: string | null;
  values: { date: string; value: number | null }[];
}

export interface ImportDetail extends ImportListItem {
  progressRows: number;
  failure: string | null;
  /** The preview while the import is not committed yet. */
  preview: ImportPreview | null;
  series: ImportSeriesDetail[];
}
