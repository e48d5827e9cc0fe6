/**
 * What the page and the workers say to each other, in one place. The page calls the workers
 * through comlink (their APIs are `ParseApi`, `AnalysisApi`, `SampleApi`); the parse worker hands
 * a read log straight to the analysis worker over a MessagePort of its own (`LogDelivery`), so
 * the columns never pass through the page.
 */
import type { FlightReport } from '../shared/schemas/report';
import type { DetailHead } from '../shared/analysis/review-detail';
import type { ProposedColumnMap } from '../shared/log/column-map';
import type { HeaderPreview } from '../shared/log/header';
import type { ParsedLog } from '../shared/log/types';

export type { ParseApi } from './parse.worker';
export type { AnalysisApi } from './analysis.worker';
export type { SampleApi } from './sample.worker';

/** A read that did not produce a log, as plain data (comlink drops custom error fields). */
export interface ParseFailure {
  /** LogFormatError code, 'cancelled', or 'internal' for a fault of ours. */
  code: string;
  message: string;
  line?: number;
  column?: number;
  header?: string;
  headers?: string[];
  proposal?: ProposedColumnMap;
}

/** A parsed log without its columns: what the page needs once the columns went elsewhere. */
export type LogSummary = Omit<ParsedLog, 'columns'>;
export type HandoffResult = { ok: true; summary: LogSummary } | { ok: false; error: ParseFailure };

/** The one message the parse worker posts on a hand-off port: the log, or word that none is coming. */
export type LogDelivery = { ok: true; log: ParsedLog } | { ok: false };

export type InspectResult =
  { ok: true; preview: HeaderPreview } | { ok: false; error: ParseFailure };

/** Reading progress, posted at most ten times a second. */
export interface ParseProgress {
  bytes: number;
  totalBytes: number;
  rows: number;
}

/** The analysis of a delivered log: the report, and the small part of the detail. */
export interface AnalysedHead {
  report: FlightReport;
  head: DetailHead;
}

/** Every buffer behind a log's columns (a buffer may back more than one column). */
export function columnBuffers(log: ParsedLog): ArrayBuffer[] {
  return [...new Set(Object.values(log.columns).map((c) => c.buffer as ArrayBuffer))];
}

/** Posts the one delivery on a hand-off port, moving the column buffers rather than copying. */
export function postDelivery(port: MessagePort, delivery: LogDelivery): void {
  port.postMessage(delivery, delivery.ok ? columnBuffers(delivery.log) : []);
}

/** Waits for the one delivery on a hand-off port and closes it. */
export function receiveDelivery(port: MessagePort): Promise<LogDelivery> {
  return new Promise((resolve) => {
    port.onmessage = (e: MessageEvent<LogDelivery>) => {
      port.close();
      resolve(e.data);
    };
    port.start();
  });
}
