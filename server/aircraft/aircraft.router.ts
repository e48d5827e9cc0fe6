import { Router } from 'express';
import { paths } from '../../shared/api/paths';
import {
  AircraftInput,
  AircraftPatch,
  BenchRunInput,
  ServiceEntryInput,
  type Aircraft,
  type AircraftList,
  type BenchRun,
  type BenchRunList,
  type ServiceEntry,
  type ServiceLog,
  type Trends,
} from '../../shared/schemas/aircraft';
import {
  BenchRunParam,
  IdParam,
  ServiceEntryParam,
  TeamIdParam,
} from '../../shared/schemas/common';
import { requireUser } from '../http/session';
import { createRoute, deleteRoute, versionedWriteRoute } from '../http/routes';
import type { Services } from '../services';

export function aircraftRouter({ aircraft: service }: Services) {
  const router = Router();

  router.get(paths.teamAircraft, async (req, res) => {
    const user = requireUser(req);
    res.json({
      aircraft: await service.list(user.id, TeamIdParam.parse(req.params).teamId),
    } satisfies AircraftList);
  });
  router.post(
    paths.teamAircraft,
    createRoute(
      TeamIdParam,
      AircraftInput,
      (userId, { teamId }, input) =>
        service.create(userId, teamId, input) satisfies Promise<Aircraft>,
    ),
  );
  router.get(paths.aircraft, async (req, res) => {
    const user = requireUser(req);
    res.json((await service.get(user.id, IdParam.parse(req.params).id)) satisfies Aircraft);
  });
  // No ETag on GET: the answer also carries flight counts that change without a new version.
  router.patch(
    paths.aircraft,
    versionedWriteRoute(
      IdParam,
      AircraftPatch,
      (userId, { id }, patch, version) =>
        service.update(userId, id, patch, version) satisfies Promise<Aircraft>,
    ),
  );
  router.delete(
    paths.aircraft,
    deleteRoute(IdParam, (userId, { id }) => service.remove(userId, id)),
  );

  router.get(paths.serviceLog, async (req, res) => {
    const user = requireUser(req);
    res.json({
      entries: await service.serviceLog(user.id, IdParam.parse(req.params).id),
    } satisfies ServiceLog);
  });
  router.post(
    paths.serviceLog,
    createRoute(
      IdParam,
      ServiceEntryInput,
      (userId, { id }, input) =>
        service.addServiceEntry(userId, id, input) satisfies Promise<ServiceEntry>,
    ),
  );

  router.delete(
    paths.serviceEntry,
    deleteRoute(ServiceEntryParam, (userId, { id, entryId }) =>
      service.removeServiceEntry(userId, id, entryId),
    ),
  );

  router.get(paths.benchRuns, async (req, res) => {
    const user = requireUser(req);
    res.json({
      runs: await service.benchRuns(user.id, IdParam.parse(req.params).id),
    } satisfies BenchRunList);
  });
  router.post(
    paths.benchRuns,
    createRoute(
      IdParam,
      BenchRunInput,
      (userId, { id }, input) => service.addBenchRun(userId, id, input) satisfies Promise<BenchRun>,
    ),
  );

  router.delete(
    paths.benchRun,
    deleteRoute(BenchRunParam, (userId, { id, runId }) =>
      service.removeBenchRun(userId, id, runId),
    ),
  );

  router.get(paths.trends, async (req, res) => {
    const user = requireUser(req);
    res.json((await service.trends(user.id, IdParam.parse(req.params).id)) satisfies Trends);
  });

  return router;
}
