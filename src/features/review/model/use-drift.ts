import { useMemo } from 'react';
import { useQuery } from '@tanstack/react-query';
import { useAircraftBaseline, useDeviceBaseline } from '../../../api/baseline';
import { aircraftRecordQueries } from '../../../api/aircraft-records';
import type { ReviewFlight } from '../../../api/flights';
import { thresholdQueries } from '../../../api/thresholds';
import { useOnline } from '../../../lib/use-online';
import { driftSample } from '../../../../shared/analysis/drift';
import {
  judgeAgainst,
  latestConfigChange,
  selectBaseline,
  type DriftOutcome,
} from '../../../../shared/analysis/baseline';
import { defaultThresholds } from '../../../../shared/schemas/thresholds';

/**
 * The flight judged against its aircraft's recent flights: the team's server selects them when
 * it can be asked; otherwise the flights kept on this device, cut at the latest configuration
 * change the cached service log knows of. Null while the baseline loads.
 */
export function useDrift(
  flight: Pick<ReviewFlight, 'id' | 'report' | 'teamId' | 'aircraftId' | 'recordedAt'>,
  opts: { signedIn: boolean; aircraftName: string | null },
): DriftOutcome | null {
  const online = useOnline();
  const aircraftId = flight.aircraftId ?? '';
  // A flight without a recorded time was read just now: everything earlier counts.
  const before = useMemo(() => flight.recordedAt ?? new Date().toISOString(), [flight.recordedAt]);
  const team = opts.signedIn && flight.teamId !== null;
  const askServer = team && online && aircraftId !== '';
  const server = useAircraftBaseline(aircraftId, { before, exclude: flight.id }, askServer);
  const onDevice = aircraftId !== '' && (!askServer || server.isError);
  const device = useDeviceBaseline(aircraftId, onDevice);
  const thresholds = useQuery({ ...thresholdQueries.team(flight.teamId ?? ''), enabled: team });
  // Offline the service log is what this device last read, if it read it at all.
  const serviceLog = useQuery({ ...aircraftRecordQueries.serviceLog(aircraftId), enabled: false });
  const th = thresholds.data?.thresholds ?? defaultThresholds;

  return useMemo(() => {
    if (flight.aircraftId === null)
      return { kind: 'none', reason: 'No drift: this flight is not filed under an aircraft.' };
    const now = driftSample(flight.report);
    if (askServer && server.data) return judgeAgainst(now, before, server.data, th);
    if (!onDevice) return null;
    if (!device.data) return device.isError ? deviceUnreadable : null;
    const entries = serviceLog.data?.entries ?? [];
    const cut = latestConfigChange(entries, before);
    const picked = selectBaseline(
      device.data,
      { beforeIso: before, excludeId: flight.id, cut },
      th,
    );
    return judgeAgainst(
      now,
      before,
      { aircraftName: opts.aircraftName ?? 'This aircraft', since: cut, ...picked },
      th,
      'kept on this device',
    );
  }, [
    flight.aircraftId,
    flight.report,
    flight.id,
    askServer,
    server.data,
    onDevice,
    device.data,
    device.isError,
    serviceLog.data,
    before,
    th,
    opts.aircraftName,
  ]);
}

const deviceUnreadable: DriftOutcome = {
  kind: 'none',
  reason: 'No drift: the flights kept on this device could not be read.',
};
