import { Router, type Request, type Response } from 'express';
import multer from 'multer';
import { paths } from '../../shared/api/paths';
import { IdParam, TeamIdParam } from '../../shared/schemas/common';
import {
  FlightListQuery,
  FlightPutInput,
  ReviewRequestInput,
  ReviewStateInput,
  type FlightDetail,
  type FlightPage,
  type FlightPutResponse,
  type FlightSummary,
  type RawUploadResponse,
} from '../../shared/schemas/flights';
import type { Config } from '../config';
import { BadRequestError, TooLargeError } from '../http/errors';
import { deleteRoute } from '../http/routes';
import { requireUser } from '../http/session';
import type { Services } from '../services';
import { rawUpload, type StagedFile } from './raw-upload';

/** A file name safe inside a Content-Disposition header, keeping the extension. */
function attachmentName(fileName: string, gzip: boolean) {
  const base = fileName.replace(/[^\w.\- ]+/g, '_').slice(0, 120) || 'flight.csv';
  return gzip && !base.endsWith('.gz') ? `${base}.gz` : base;
}

export function flightsRouter({ flights, rawLogs, reviews }: Services, config: Config) {
  const router = Router();
  const upload = rawUpload(rawLogs.rawStore.stagingDir, config.maxUploadBytes);
  const receive = (req: Request, res: Response) =>
    new Promise<void>((resolve, reject) => {
      upload(req, res, (err: unknown) => {
        if (err instanceof multer.MulterError) {
          reject(
            err.code === 'LIMIT_FILE_SIZE'
              ? new TooLargeError(
                  `The log is larger than ${Math.round(config.maxUploadBytes / 1048576)} MB.`,
                )
              : new BadRequestError(
                  `The upload could not be read (${err.message}). Send one file in the field "file".`,
                ),
          );
        } else if (err) reject(err instanceof Error ? err : new Error(String(err)));
        else resolve();
      });
    });

  router.get(paths.teamFlights, async (req, res) => {
    const user = requireUser(req);
    const { teamId } = TeamIdParam.parse(req.params);
    const query = FlightListQuery.parse(req.query);
    res.json((await flights.list(user.id, teamId, query)) satisfies FlightPage);
  });

  router.put(paths.flight, async (req, res) => {
    const user = requireUser(req);
    const { id } = IdParam.parse(req.params);
    const result = await flights.put(user.id, id, FlightPutInput.parse(req.body));
    res.status(result.outcome === 'created' ? 201 : 200).json(result satisfies FlightPutResponse);
  });

  router.get(paths.flight, async (req, res) => {
    const user = requireUser(req);
    res.json((await flights.get(user.id, IdParam.parse(req.params).id)) satisfies FlightDetail);
  });

  router.delete(
    paths.flight,
    deleteRoute(IdParam, (userId, { id }) => flights.remove(userId, id)),
  );

  /** multipart/form-data with one part `file`: the log exactly as dropped (.csv or .csv.gz). */
  router.put(paths.flightRaw, async (req, res) => {
    const user = requireUser(req);
    const { id } = IdParam.parse(req.params);
    // Refuse before reading a large body when the caller may not attach it anyway.
    await flights.access(user.id, id, 'flights.upload');
    await receive(req, res);
    const staged = (req.file as (Express.Multer.File & { staged?: StagedFile }) | undefined)
      ?.staged;
    if (!staged)
      throw new BadRequestError('Send the log as multipart/form-data in the field "file".');
    const result = await rawLogs.attach(user.id, id, staged);
    res.status(result.stored ? 201 : 200).json(result satisfies RawUploadResponse);
  });

  router.get(paths.flightRaw, async (req, res) => {
    const user = requireUser(req);
    const raw = await rawLogs.open(user.id, IdParam.parse(req.params).id);
    res.set({
      'content-type': raw.gzip ? 'application/gzip' : 'text/csv; charset=utf-8',
      'content-length': String(raw.size),
      'content-disposition': `attachment; filename="${attachmentName(raw.fileName, raw.gzip)}"`,
      'cache-control': 'private, max-age=0',
    });
    raw.stream.on('error', (err) => res.destroy(err));
    raw.stream.pipe(res);
  });

  router.post(paths.reviewRequest, async (req, res) => {
    const user = requireUser(req);
    const { id } = IdParam.parse(req.params);
    res.json(
      (await reviews.requestReview(
        user.id,
        id,
        ReviewRequestInput.parse(req.body),
      )) satisfies FlightSummary,
    );
  });

  router.post(paths.review, async (req, res) => {
    const user = requireUser(req);
    const { id } = IdParam.parse(req.params);
    res.json(
      (await reviews.setReview(
        user.id,
        id,
        ReviewStateInput.parse(req.body),
      )) satisfies FlightSummary,
    );
  });

  return router;
}
