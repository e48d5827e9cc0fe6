import type { FlightReport } from '../../../../../shared/schemas/report';
import type { ReviewDetail } from '../../../../../shared/analysis/review-detail';
import type { Airframe } from '../../../../../shared/schemas/airframe';
import { AirframeTopView } from '../../../../components/airframe/airframe-top-view';
import { CgDetail } from '../cg-detail';
import { topViewSummary } from '../../model/top-view-summary';
import { signedFixed } from '../../../../lib/signed-fixed';
import { MotorMarker } from '../../../../components/ui/motor-marker';
import { DeviationBar } from '../../../../components/ui/deviation-bar';

export interface BalanceSectionProps {
  report: FlightReport;
  diagnosis: ReviewDetail['diagnosis'];
  airframe: Airframe;
  /** True when the airframe drawn is an assumption, not the aircraft's own. */
  assumed: boolean;
}

const pct = (v: number | undefined) =>
  v === undefined || !Number.isFinite(v) ? '—' : `${(v * 100).toFixed(1)} %`;
const signed = (v: number | undefined, digits = 1) =>
  v === undefined ? '—' : signedFixed(v, digits);

const patternTitle: Record<ReviewDetail['diagnosis']['pattern'], string> = {
  healthy: 'Balanced',
  'cg-offset': 'CG offset',
  'weak-motor': 'One motor working hard',
  'spin-set': 'One spin set working hard',
  'too-little-hover': 'Too little hover to judge',
};

export function BalanceSection({ report, diagnosis, airframe, assumed }: BalanceSectionProps) {
  const { expectedShare, measuredShare, deviationPct } = report.balance;
  const flagged = new Set(
    report.findings
      .filter(
        (f) => f.motor !== undefined && (f.code === 'motor-working-hard' || f.severity !== 'note'),
      )
      .map((f) => f.motor!),
  );
  const design = airframe.cg ?? { x: 0, y: 0 };
  const mismatch = airframe.motors.length !== report.motorCount;
  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-6 lg:grid-cols-[minmax(0,26rem)_1fr]">
      <figure className="flex flex-col items-center gap-2">
        <AirframeTopView
          motors={airframe.motors}
          propDiameterIn={airframe.prop.diameterIn}
          designCg={design}
          estimatedCg={report.cg}
          deviationPct={deviationPct}
          flagged={flagged}
          label={topViewSummary(airframe, deviationPct, report.cg, flagged)}
          className="h-auto w-full max-w-[26rem]"
        />
        <figcaption className="text-xs text-ink-faint">
          {airframe.name}
          {assumed && ' (assumed — pick the aircraft on import for its own geometry)'} · ring:
          design CG · cross: estimated CG
        </figcaption>
        {mismatch && (
          <p role="alert" className="text-xs text-sev-act">
            The log has {report.motorCount} motors but this airframe has {airframe.motors.length};
            the drawing may not match.
          </p>
        )}
      </figure>
      <div className="flex min-w-0 flex-col gap-4">
        <div className="rounded border-l-4 border-accent bg-paper-raised px-4 py-3">
          <p className="text-sm font-semibold text-ink">
            {patternTitle[diagnosis.pattern]}
            {diagnosis.motor !== undefined && <> · motor {diagnosis.motor}</>}
            <span className="num ml-2 text-xs font-normal text-ink-faint">
              confidence {(diagnosis.confidence * 100).toFixed(0)} %
            </span>
          </p>
          <p className="mt-1 text-sm text-ink-soft">{diagnosis.text}</p>
        </div>
        <table className="w-full text-sm" aria-label="Hover share per motor">
          <thead>
            <tr className="border-b border-line text-left text-xs uppercase tracking-wide text-ink-faint">
              <th className="py-1 pr-3 font-medium">Motor</th>
              <th className="py-1 pr-3 font-medium">Spin</th>
              <th className="py-1 pr-3 text-right font-medium">Share, expected</th>
              <th className="py-1 pr-3 text-right font-medium">Share, measured</th>
              <th className="py-1 pl-4 font-medium">Output vs expected</th>
            </tr>
          </thead>
          <tbody>
            {deviationPct.map((dev, i) => {
              const n = i + 1;
              return (
                <tr
                  key={n}
                  className={
                    'border-b border-line/60 ' + (flagged.has(n) ? 'bg-accent-soft/50' : '')
                  }
                >
                  <td className="py-1 pr-3">
                    <span className="inline-flex items-center gap-1.5">
                      <MotorMarker motor={n} />
                      {n}
                    </span>
                  </td>
                  <td className="num py-1 pr-3 text-ink-soft">{airframe.motors[i]?.spin ?? '—'}</td>
                  <td className="num py-1 pr-3 text-right">{pct(expectedShare[i])}</td>
                  <td className="num py-1 pr-3 text-right">{pct(measuredShare[i])}</td>
                  <td className="py-1 pl-4">
                    <div className="flex items-center gap-2">
                      <span className="num w-16 text-right">{signed(dev)} %</span>
                      <DeviationBar motor={n} pct={dev} className="hidden h-2 w-28 sm:block" />
                    </div>
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
        <div className="flex flex-wrap items-start gap-4">
          {report.cg ? (
            <>
              <CgDetail cg={report.cg} design={design} />
              <dl className="num grid grid-cols-[auto_auto] gap-x-4 gap-y-1 text-sm">
                <dt className="font-sans text-ink-soft">Estimated CG</dt>
                <dd>
                  x {signed(report.cg.xMm)} mm, y {signed(report.cg.yMm)} mm
                </dd>
                <dt className="font-sans text-ink-soft">Design CG</dt>
                <dd>
                  x {signed(design.x)} mm, y {signed(design.y)} mm
                </dd>
                <dt className="font-sans text-ink-soft">Offset</dt>
                <dd>
                  {Math.hypot(report.cg.xMm - design.x, report.cg.yMm - design.y).toFixed(1)} mm{' '}
                  <span className="font-sans text-xs text-ink-faint">
                    ({offsetDirection(report.cg.xMm - design.x, report.cg.yMm - design.y)})
                  </span>
                </dd>
              </dl>
            </>
          ) : (
            <p className="text-sm text-ink-soft">
              No CG estimate: the flight had too little steady hover.
            </p>
          )}
        </div>
        <p className="text-xs text-ink-faint">
          Shares are of the hover thrust: expected from the airframe&apos;s geometry (an asymmetric
          frame carries unequal shares by design), measured from rpm when logged, else from output.
          &ldquo;Output vs expected&rdquo; is how much more (or less) output each motor needed than
          its share calls for: a worn motor carries its share but needs more output for it. Measured
          over {report.segments.hoverS.toFixed(1)} s of hover.
        </p>
      </div>
    </div>
  );
}

/** Words for a CG offset in mm; components under half a millimetre are within rounding. */
function offsetDirection(dxMm: number, dyMm: number): string {
  const parts: string[] = [];
  if (Math.abs(dxMm) >= 0.5) parts.push(dxMm > 0 ? 'forward' : 'aft');
  if (Math.abs(dyMm) >= 0.5) parts.push(dyMm > 0 ? 'right' : 'left');
  return parts.length > 0 ? parts.join(', ') : 'on the design CG';
}
