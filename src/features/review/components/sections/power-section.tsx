import { Caution } from '../../../../components/ui/caution';
import type { FlightReport } from '../../../../../shared/schemas/report';
import type { Trace } from '../../../../../shared/analysis/review-detail';
import { TimeChart } from '../../../../components/charts/time-chart';
import { inkSeries } from '../../../../components/charts/palette';
import { followReviewTime, traceSeries, type TimeContext } from './time-context';

const f = (v: number | null | undefined, d: number, unit: string) =>
  v === null || v === undefined || !Number.isFinite(v) ? '—' : `${v.toFixed(d)} ${unit}`;

export function PowerSection({
  report,
  power,
  time,
}: {
  report: FlightReport;
  power: Trace | null;
  time: TimeContext;
}) {
  const p = report.power;
  if (!p || !power)
    return (
      <p className="text-sm text-ink-soft">
        This log has no pack voltage (vbat), so there is nothing to say about power.
      </p>
    );
  const volts = traceSeries(power, [
    { key: 'cell_v', name: 'Per cell', color: inkSeries.measured, width: 1.6 },
  ]);
  const amps = traceSeries(power, [{ key: 'ibat', name: 'Pack current', color: inkSeries.pitch }]);
  return (
    <div className="flex flex-col gap-4">
      <dl className="num grid grid-cols-2 gap-x-6 gap-y-1 text-sm sm:grid-cols-4">
        <dt className="font-sans text-ink-soft">Cells</dt>
        <dd>{p.cells}S</dd>
        <dt className="font-sans text-ink-soft">At rest</dt>
        <dd>{f(p.restCellV, 2, 'V/cell')}</dd>
        <dt className="font-sans text-ink-soft">Lowest under load</dt>
        <dd>{f(p.minCellV, 2, 'V/cell')}</dd>
        <dt className="font-sans text-ink-soft">Sag</dt>
        <dd>{f(p.sagCellV, 2, 'V/cell')}</dd>
        <dt className="font-sans text-ink-soft">Internal resistance</dt>
        <dd>
          {f(
            p.internalResistanceOhm !== null ? p.internalResistanceOhm * 1000 : null,
            1,
            'mΩ (pack)',
          )}
        </dd>
        <dt className="font-sans text-ink-soft">Used</dt>
        <dd>
          {f(p.mAh, 0, 'mAh')} · {f(p.wh, 1, 'Wh')}
        </dd>
      </dl>
      {volts.length > 0 && (
        <TimeChart
          t={power.t}
          series={volts}
          {...followReviewTime(time)}
          height={200}
          yName="V/cell"
          ariaLabel="Cell voltage over time"
        />
      )}
      {amps.length > 0 && (
        <TimeChart
          t={power.t}
          series={amps}
          {...followReviewTime(time)}
          height={180}
          yName="A"
          ariaLabel="Pack current over time"
        />
      )}
      <Caution title="LiPo packs">
        <p>
          LiPo packs: land before the cells sag below about 3.5 V under load, store them near 3.8 V
          per cell, charge on a fireproof surface at the rate their maker states, and retire packs
          that puff or run hot. Internal resistance that climbs flight after flight is a tired pack.
        </p>
      </Caution>
    </div>
  );
}
