import { proxy, transfer } from 'comlink';
import type { AnalyzeOptions } from '../../../shared/analysis/analyze-flight';
import {
  DETAIL_PARTS,
  type DetailHead,
  type DetailParts,
  type ReviewDetail,
  type Trace,
} from '../../../shared/analysis/review-detail';
import type { FilterSpec } from '../../../shared/schemas/filters';
import type { ProposedColumnMap } from '../../../shared/log/column-map';
import type { HeaderPreview } from '../../../shared/log/header';
import type { ReadOptions } from '../../../shared/log/parse';
import type {
  AnalysedHead,
  HandoffResult,
  ParseFailure,
  ParseProgress,
} from '../../../workers/protocol';
import { analysisWorker, parseWorker, sampleWorker } from './workers';

/**
 * The one path a log takes on this device: read in the parse worker, whose columns go over a
 * port of their own straight to the analysis worker, so a 100 MB log never lands on the page.
 */
async function handOff<T>(
  jobId: string,
  file: Blob,
  options: ReadOptions,
  receive: (port: MessagePort) => Promise<T>,
  onProgress?: (p: ParseProgress) => void,
): Promise<{ read: HandoffResult; received: Promise<T> }> {
  const channel = new MessageChannel();
  const received = receive(transfer(channel.port2, [channel.port2]));
  // Awaited by the caller once the read is known to have worked; a failed read rejects it.
  received.catch(() => undefined);
  const read = await parseWorker().parseInto(
    jobId,
    file,
    options,
    transfer(channel.port1, [channel.port1]),
    onProgress ? proxy(onProgress) : undefined,
  );
  return { read, received };
}

/** Reads and analyses a dropped file under `flightId`; the analysis comes with `received`. */
export const readAndAnalyse = (req: {
  jobId: string;
  flightId: string;
  file: Blob;
  options: ReadOptions;
  analyse: AnalyzeOptions;
  onProgress: (p: ParseProgress) => void;
}): Promise<{ read: HandoffResult; received: Promise<AnalysedHead> }> =>
  handOff(
    req.jobId,
    req.file,
    req.options,
    (port) => analysisWorker().analyzeDelivered(req.flightId, port, req.analyse),
    req.onProgress,
  );

/**
 * Reads a kept log again into the analysis worker's cache (for the filter bench) without
 * analysing it; null once it is there, else why it could not be read.
 */
export async function readIntoAnalysis(
  flightId: string,
  file: Blob,
  options: ReadOptions,
  analyse: AnalyzeOptions,
): Promise<ParseFailure | null> {
  const { read, received } = await handOff(`bench-${flightId}`, file, options, (port) =>
    analysisWorker().loadDelivered(flightId, port, analyse),
  );
  if (!read.ok) return read.error;
  await received;
  return null;
}

/** The bulky detail parts the analysis worker held back, one message each, joined to the head. */
export async function collectDetail(flightId: string, head: DetailHead): Promise<ReviewDetail> {
  const parts: Partial<DetailParts> = {};
  for (const key of DETAIL_PARTS)
    Object.assign(parts, await analysisWorker().detailPart(flightId, key));
  const missing = DETAIL_PARTS.filter((k) => !(k in parts));
  if (missing.length > 0) throw new Error(`the analysis sent no ${missing.join(', ')}`);
  return { ...head, ...(parts as DetailParts) };
}

/** What the column-map step needs to ask about a file whose headers need a map. */
export interface ColumnMapNeeded {
  kind: 'needs-map';
  headers: string[];
  proposal: ProposedColumnMap;
  sampleRows: string[][];
}

/** The start of a file (decompressed), read in the parse worker; throws when even that fails. */
export async function inspectFile(file: Blob): Promise<HeaderPreview> {
  const answer = await parseWorker().inspectHeader(file);
  if (!answer.ok) throw new Error(`The header itself cannot be read: ${answer.error.message}`);
  return answer.preview;
}

/**
 * The "needs a column map" status for a file: its headers, the proposed map and sample rows.
 * After a read that stopped for want of a map, the reader's headers come first; the proposal is
 * the preview's, which has seen the first rows.
 */
export async function columnMapNeeded(
  file: Blob,
  failure?: ParseFailure,
): Promise<ColumnMapNeeded> {
  let preview: HeaderPreview | null = null;
  try {
    preview = await inspectFile(file);
  } catch (e) {
    if (!failure) throw e;
  }
  return {
    kind: 'needs-map',
    headers: failure?.headers ?? preview?.headers ?? [],
    // The preview's proposal has seen the first rows, so it also offers units from values.
    proposal: preview?.proposal ??
      failure?.proposal ?? { entries: [], missing: ['time', 'motor1'] },
    sampleRows: preview?.sampleRows ?? [],
  };
}

/** Asks a running read to stop at its next chunk. */
export const cancelRead = (jobId: string) => parseWorker().cancel(jobId);

/** Drops a flight's log from the analysis worker (an import cancelled after the analysis). */
export const forgetAnalysed = (flightId: string) => analysisWorker().forget(flightId);

/** The thinned strip, for a flight stored before its detail carried one. */
export const thinStrip = (effort: Trace) => analysisWorker().strip(effort);

/** Filter response and spectra for one channel of a flight in the analysis worker's cache. */
export const benchFilters = (flightId: string, channel: string, specs: FilterSpec) =>
  analysisWorker().filterBench(flightId, channel, specs);

/**
 * A synthesised flight of our demo quad with a weak motor, written as a canonical CSV in a
 * worker, so a first-time pilot sees a full review without a log of their own. It goes through
 * the same import path as a dropped file.
 */
export async function synthesiseSampleFile(): Promise<File> {
  const { csv, fileName } = await sampleWorker().sampleFlight();
  return new File([csv], fileName, { type: 'text/csv' });
}
