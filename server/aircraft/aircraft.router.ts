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
import { expectedVersion, sendVersion } from '../http/versions';
import type { Services } from '../services';

export function aircraftRouter({ aircraft: service }: Services) {
  const router = Router();

  router.get(paths.teamAircraft, async (req, res) => {
    const user = requireUser(req);
    res.json({
      aircraft: await service.list(user.id, TeamIdParam.parse(req.params).teamId),
    } satisfies AircraftList);
  });
  router.post(paths.teamAircraft, async (req, res) => {
    const user = requireUser(req);
    const { teamId } = TeamIdParam.parse(req.params);
    res
      .status(201)
      .json(
        (await service.create(user.id, teamId, AircraftInput.parse(req.body))) satisfies Aircraft,
      );
  });
  router.get(paths.aircraft, async (req, res) => {
    const user = requireUser(req);
    res.json((await service.get(user.id, IdParam.parse(req.params).id)) satisfies Aircraft);
  });
  router.patch(paths.aircraft, async (req, res) => {
    const user = requireUser(req);
    const { id } = IdParam.parse(req.params);
    const aircraft = await service.update(
      user.id,
      id,
      AircraftPatch.parse(req.body),
      expectedVersion(req),
    );
    // No ETag on GET: the answer also carries flight counts that change without a new version.
    sendVersion(res, aircraft.version).json(aircraft satisfies Aircraft);
  });
  router.delete(paths.aircraft, async (req, res) => {
    const user = requireUser(req);
    await service.remove(user.id, IdParam.parse(req.params).id);
    res.status(204).end();
  });

  router.get(paths.serviceLog, async (req, res) => {
    const user = requireUser(req);
    res.json({
      entries: await service.serviceLog(user.id, IdParam.parse(req.params).id),
    } satisfies ServiceLog);
  });
  router.post(paths.serviceLog, async (req, res) => {
    const user = requireUser(req);
    const { id } = IdParam.parse(req.params);
    res
      .status(201)
      .json(
        (await service.addServiceEntry(
          user.id,
          id,
          ServiceEntryInput.parse(req.body),
        )) satisfies ServiceEntry,
      );
  });

  router.delete(paths.serviceEntry, async (req, res) => {
    const user = requireUser(req);
    const { id, entryId } = ServiceEntryParam.parse(req.params);
    await service.removeServiceEntry(user.id, id, entryId);
    res.status(204).end();
  });

  router.get(paths.benchRuns, async (req, res) => {
    const user = requireUser(req);
    res.json({
      runs: await service.benchRuns(user.id, IdParam.parse(req.params).id),
    } satisfies BenchRunList);
  });
  router.post(paths.benchRuns, async (req, res) => {
    const user = requireUser(req);
    const { id } = IdParam.parse(req.params);
    res
      .status(201)
      .json(
        (await service.addBenchRun(user.id, id, BenchRunInput.parse(req.body))) satisfies BenchRun,
      );
  });

  router.delete(paths.benchRun, async (req, res) => {
    const user = requireUser(req);
    const { id, runId } = BenchRunParam.parse(req.params);
    await service.removeBenchRun(user.id, id, runId);
    res.status(204).end();
  });

  router.get(paths.trends, async (req, res) => {
    const user = requireUser(req);
    res.json((await service.trends(user.id, IdParam.parse(req.params).id)) satisfies Trends);
  });

  return router;
}
