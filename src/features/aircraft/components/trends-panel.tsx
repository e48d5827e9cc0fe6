import { useMemo } from 'react';
import type { ServiceEntry, TrendPoint } from '../../../../shared/schemas/aircraft';
import { inkSeries, motorColor } from '../../../components/charts/palette';
import { ErrorNote } from '../../../components/ui/alert';
import { Empty, Loading } from '../../../components/ui/panel';
import { useServiceLog, useTrends } from '../../../api/aircraft-records';
import { TrendChart, type TrendEvent, type TrendSeries } from './trend-chart';
import { useDriftMarks, type DriftMark } from '../model/drift-marks';

/** Drift marks of the given codes as chart lines, and in words for the chart's label. */
function marksOf(marks: DriftMark[], codes: string[]) {
  const hits = marks.filter((m) => m.codes.some((c) => codes.includes(c)));
  const lines = hits.map((m) => ({
    t: m.t,
    label: m.motors.length ? `drift m${m.motors.join(',')}` : 'drift',
  }));
  const words = hits.length
    ? `; drift raised by ${hits.length} flight${hits.length === 1 ? '' : 's'} (${hits
        .map((m) => m.recordedAt.slice(0, 10))
        .join(', ')})`
    : '';
  return { lines, words };
}

const axisColors = {
  gyro_x: inkSeries.roll,
  gyro_y: inkSeries.pitch,
  gyro_z: inkSeries.yaw,
} as Record<string, string>;
const extraColors = ['#4a5866', '#8a5a2b', '#6b4c7a', '#3f6e8c', '#1f3a4d', '#7d8894'];

/**
 * Smallest axis span per chart, in its unit: differences below these are within what one flight
 * differs from the next on the same aircraft (our own choice for display, not a limit the
 * verdict uses), so a steady aircraft draws a flat line instead of a steep one.
 */
const MIN_SPAN = {
  deviationPct: 6,
  bandRms: 2,
  torqueAndCg: 6,
  volts: 0.2,
  milliohms: 5,
};

function seriesOf(
  points: TrendPoint[],
  name: string,
  color: string,
  pick: (p: TrendPoint) => number | null | undefined,
  dashed = false,
): TrendSeries {
  return {
    name,
    color,
    dashed,
    points: points.map((p) => {
      const v = pick(p);
      return [
        Date.parse(p.recordedAt),
        v === undefined || v === null || !Number.isFinite(v) ? null : v,
      ];
    }),
  };
}

/** How the aircraft has changed across its flights: balance, vibration, torque split and the pack. */
export function TrendsPanel({ aircraftId }: { aircraftId: string }) {
  const trends = useTrends(aircraftId);
  const service = useServiceLog(aircraftId);
  const drift = useDriftMarks(aircraftId, trends.data?.points, service.data?.entries);
  const balanceMarks = marksOf(drift, ['motor-drift']);
  const vibrationMarks = marksOf(drift, ['vibration-drift']);
  const packMarks = marksOf(drift, ['pack-ageing']);
  const events: TrendEvent[] = useMemo(
    () =>
      (service.data?.entries ?? []).map((e: ServiceEntry) => ({
        t: Date.parse(`${e.date}T12:00:00`),
        label: e.motor ? `${e.kind} m${e.motor}` : e.kind,
      })),
    [service.data],
  );
  const charts = useMemo(() => {
    const points = trends.data?.points ?? [];
    const motorCount = Math.max(0, ...points.map((p) => p.deviationPct.length));
    const balance = Array.from({ length: motorCount }, (_, i) =>
      seriesOf(points, `Motor ${i + 1}`, motorColor(i + 1), (p) => p.deviationPct[i]),
    );
    const channels = [...new Set(points.flatMap((p) => Object.keys(p.bandRms)))].sort();
    const vibration = channels.map((c, i) =>
      seriesOf(
        points,
        c,
        axisColors[c] ?? extraColors[i % extraColors.length]!,
        (p) => p.bandRms[c],
        c.startsWith('acc'),
      ),
    );
    const torque = [
      seriesOf(points, 'cw − ccw asymmetry (%)', inkSeries.collective, (p) => p.asymmetryPct),
      seriesOf(points, 'CG x (mm)', inkSeries.pitch, (p) => p.cg?.xMm, true),
      seriesOf(points, 'CG y (mm)', inkSeries.roll, (p) => p.cg?.yMm, true),
    ];
    const battery = [
      seriesOf(points, 'Sag per cell (V)', inkSeries.collective, (p) => p.sagCellV),
      seriesOf(points, 'Lowest cell (V)', inkSeries.throttle, (p) => p.minCellV, true),
    ];
    const resistance = [
      seriesOf(points, 'Pack resistance (mΩ)', inkSeries.yaw, (p) =>
        p.internalResistanceOhm === null ? null : p.internalResistanceOhm * 1000,
      ),
    ];
    return { balance, vibration, torque, battery, resistance, count: points.length };
  }, [trends.data]);

  if (trends.isPending) return <Loading what="trends" />;
  if (trends.isError) return <ErrorNote error={trends.error} />;
  if (charts.count === 0)
    return <Empty>Trends appear once this aircraft has synced flights.</Empty>;
  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-5 lg:grid-cols-2">
      <section>
        <h2 className="text-sm font-semibold text-slate-brand">Balance: deviation per motor</h2>
        <p className="text-xs text-ink-soft">
          Hover output against what the airframe predicts. A motor drifting up is working harder:
          check its bearings, prop and mounting. A solid line marks a flight that raised drift
          against the aircraft’s recent flights; dotted lines are service-log entries.
        </p>
        <TrendChart
          ariaLabel={`Balance trend${balanceMarks.words}`}
          yName="%"
          minSpan={MIN_SPAN.deviationPct}
          series={charts.balance}
          events={events}
          marks={balanceMarks.lines}
        />
      </section>
      <section>
        <h2 className="text-sm font-semibold text-slate-brand">Vibration: band RMS above 50 Hz</h2>
        <p className="text-xs text-ink-soft">
          Gyro in deg/s (solid), accelerometer in its unit (dashed). Rising after a crash often
          means a bent prop or shaft.
        </p>
        <TrendChart
          ariaLabel={`Vibration trend${vibrationMarks.words}`}
          yName="RMS"
          minSpan={MIN_SPAN.bandRms}
          series={charts.vibration}
          events={events}
          marks={vibrationMarks.lines}
        />
      </section>
      <section>
        <h2 className="text-sm font-semibold text-slate-brand">Torque split and CG</h2>
        <TrendChart
          ariaLabel="Torque split and CG trend"
          yName="% / mm"
          minSpan={MIN_SPAN.torqueAndCg}
          series={charts.torque}
          events={events}
        />
      </section>
      <section>
        <h2 className="text-sm font-semibold text-slate-brand">Battery: sag and lowest cell</h2>
        <p className="text-xs text-ink-soft">More sag at the same load means the pack is ageing.</p>
        <TrendChart
          ariaLabel="Battery trend"
          yName="V"
          minSpan={MIN_SPAN.volts}
          series={charts.battery}
          events={events}
        />
        <TrendChart
          ariaLabel={`Pack resistance trend${packMarks.words}`}
          yName="mΩ"
          minSpan={MIN_SPAN.milliohms}
          series={charts.resistance}
          marks={packMarks.lines}
          height={150}
        />
      </section>
    </div>
  );
}
