import type { Motor } from '../../../shared/schemas/airframe';
import { inkSeries, motorColor, motorOutline } from '../charts/palette';
import { palette } from '../ui/palette';
import { signedFixed } from '../../lib/signed-fixed';
import { MM_PER_INCH, scaleBarMm, spinArc, toScreen, viewExtent } from './top-view-geometry';

export interface AirframeTopViewProps {
  motors: readonly Motor[];
  propDiameterIn: number;
  /** Design CG, mm in the airframe's frame: drawn as a ring. */
  designCg?: { x: number; y: number } | undefined;
  /** CG estimated from a flight, mm in the airframe's frame: drawn as a cross, true to scale. */
  estimatedCg?: { xMm: number; yMm: number } | null | undefined;
  /** Per motor, % against its expected hover output: each motor carries the figure and a bar. */
  deviationPct?: readonly number[] | undefined;
  /** 1-based motors to ring (the ones a verdict names). */
  flagged?: ReadonlySet<number> | undefined;
  /** Text alternative; by default the motor count. Give the figures the picture shows. */
  label?: string | undefined;
  /** Draw a scale bar in the lower left corner. */
  scaleBar?: boolean;
  className?: string;
}

/** Deviation bars are full at this many % either way. */
const BAR_FULL_PCT = 20;
const flaggedRing = palette.sev.act;
const cgCross = palette.accent.DEFAULT;

/** A deviation to 0.1 %, signed, with no sign when it rounds to zero. */
export const fmtDeviation = (v: number) =>
  Number.isFinite(v) ? `${signedFixed(v)} %` : 'not measured';

const at = (p: { x: number; y: number }) => toScreen(p);

/**
 * The airframe seen from above, drawn from its geometry and the one frame-to-screen transform
 * (`toScreen`: FRD x forward → screen up, y right → screen right): arms, prop discs in each
 * motor's colour with its spin, motor numbers, the nose, the design CG and, from a flight, the
 * estimated CG and each motor's deviation. Motor colours under 3:1 on paper get an ink outline.
 */
export function AirframeTopView({
  motors,
  propDiameterIn,
  designCg,
  estimatedCg,
  deviationPct,
  flagged = new Set(),
  label,
  scaleBar = false,
  className = 'aspect-square w-full rounded border border-line',
}: AirframeTopViewProps) {
  const propR =
    Number.isFinite(propDiameterIn) && propDiameterIn > 0 ? (propDiameterIn * MM_PER_INCH) / 2 : 50;
  const drawable = motors
    .map((m, i) => ({ m, n: i + 1 }))
    .filter(({ m }) => Number.isFinite(m.x) && Number.isFinite(m.y));
  const base = viewExtent(
    drawable.map((d) => d.m),
    propR,
  );
  const s = base / 160; // one stroke unit
  const font = base / 11;
  const barW = propR * 1.2;
  // Each deviation label (figure over bar) sits outside its motor's disc and ring, pushed out by
  // its own half-size in that direction, so it never covers a disc however wide it is.
  const labels = new Map(
    deviationPct
      ? drawable.map(({ m, n }) => {
          const { sx, sy } = at(m);
          const out = Math.hypot(sx, sy) || 1;
          const [ux, uy] = [sx / out, sy / out];
          const text = Number.isFinite(deviationPct[n - 1] ?? NaN)
            ? fmtDeviation(deviationPct[n - 1]!)
            : '—';
          const halfW = Math.max(barW / 2, 0.28 * font * text.length);
          const halfH = 0.6 * font;
          const d = propR + 10 * s + Math.abs(ux) * halfW + Math.abs(uy) * halfH;
          return [n, { text, x: sx + ux * d, y: sy + uy * d, halfW, halfH }] as const;
        })
      : [],
  );
  const ext = Math.max(
    base,
    ...[...labels.values()].map(
      (l) => Math.max(Math.abs(l.x) + l.halfW, Math.abs(l.y) + l.halfH) + 8 * s,
    ),
  );
  const body = { w: base * 0.18, h: base * 0.26 };
  const design = designCg ?? (estimatedCg ? { x: 0, y: 0 } : undefined);

  return (
    <svg
      role="img"
      aria-label={label ?? `Top view: ${motors.length} motors, nose up`}
      viewBox={`${-ext} ${-ext} ${ext * 2} ${ext * 2}`}
      className={'bg-paper ' + className}
    >
      <g aria-hidden>
        <path
          d={`M 0 ${-body.h / 2 - base * 0.12} L ${base * 0.05} ${-body.h / 2 - base * 0.02} L ${-base * 0.05} ${-body.h / 2 - base * 0.02} Z`}
          fill={palette.slate.brand}
        />
        <text
          x={0}
          y={-ext + font}
          textAnchor="middle"
          fontSize={font * 0.8}
          fill={palette.ink.soft}
        >
          nose
        </text>
        {drawable.map(({ m, n }) => (
          <line
            key={`arm-${n}`}
            x1={0}
            y1={0}
            x2={at(m).sx}
            y2={at(m).sy}
            stroke={inkSeries.axis}
            strokeWidth={s * 4}
            strokeLinecap="round"
          />
        ))}
        <rect
          x={-body.w / 2}
          y={-body.h / 2}
          width={body.w}
          height={body.h}
          rx={base * 0.03}
          fill={palette.slate.brand}
        />
      </g>
      {drawable.map(({ m, n }) => {
        const { sx, sy } = at(m);
        const colour = motorColor(n);
        const outline = motorOutline(n);
        const arrow = spinArc(sx, sy, propR * 0.72, m.spin);
        const dev = deviationPct?.[n - 1] ?? NaN;
        const isFlagged = flagged.has(n);
        const l = labels.get(n);
        const frac = Number.isFinite(dev) ? Math.max(-1, Math.min(1, dev / BAR_FULL_PCT)) : 0;
        return (
          <g key={n} data-motor={n} data-flagged={isFlagged ? 'true' : 'false'}>
            {/* A tooltip for pointer users; inside role="img" its parts are not read out, so the
                image's own name carries what matters. */}
            <title>
              {deviationPct
                ? `Motor ${n}, ${m.spin}, deviation ${fmtDeviation(dev)}${isFlagged ? ', named in the verdict' : ''}`
                : `Motor ${n}: x ${m.x.toFixed(1)} mm, y ${m.y.toFixed(1)} mm, ${m.spin}`}
            </title>
            {isFlagged && (
              <circle
                cx={sx}
                cy={sy}
                r={propR + 6 * s}
                fill="none"
                stroke={flaggedRing}
                strokeWidth={s * 3}
                strokeDasharray={`${s * 8} ${s * 5}`}
              />
            )}
            <circle
              cx={sx}
              cy={sy}
              r={propR}
              fill={colour}
              fillOpacity={0.14}
              stroke={colour}
              strokeWidth={s * 2}
            />
            {outline && (
              <circle
                data-outline
                cx={sx}
                cy={sy}
                r={propR + s * 1.5}
                fill="none"
                stroke={outline}
                strokeWidth={s}
              />
            )}
            <path d={arrow.path} fill="none" stroke={inkSeries.axis} strokeWidth={s * 2} />
            <path d={arrow.head} fill={inkSeries.axis} />
            <circle
              cx={sx}
              cy={sy}
              r={base * 0.05}
              fill={palette.paper.raised}
              stroke={colour}
              strokeWidth={s * 2.5}
            />
            {outline && (
              <circle
                cx={sx}
                cy={sy}
                r={base * 0.05 + s * 1.6}
                fill="none"
                stroke={outline}
                strokeWidth={s * 0.8}
              />
            )}
            <text
              x={sx}
              y={sy}
              textAnchor="middle"
              dominantBaseline="central"
              fontSize={font * 0.55}
              fontFamily="JetBrains Mono, monospace"
              fontWeight={700}
              fill={palette.ink.DEFAULT}
            >
              {n}
            </text>
            {l && (
              <g>
                <text
                  x={l.x}
                  y={l.y + font * 0.1}
                  textAnchor="middle"
                  fontSize={font * 0.9}
                  className="num"
                  fill={isFlagged ? flaggedRing : palette.ink.DEFAULT}
                  fontWeight={isFlagged ? 700 : 500}
                >
                  {l.text}
                </text>
                <rect
                  x={l.x - barW / 2}
                  y={l.y + font * 0.3}
                  width={barW}
                  height={font * 0.3}
                  fill={palette.paper.sunk}
                  stroke={palette.line.strong}
                  strokeWidth={s * 0.5}
                />
                <rect
                  x={frac >= 0 ? l.x : l.x + (frac * barW) / 2}
                  y={l.y + font * 0.3}
                  width={(Math.abs(frac) * barW) / 2}
                  height={font * 0.3}
                  fill={isFlagged ? flaggedRing : colour}
                />
                <line
                  x1={l.x}
                  x2={l.x}
                  y1={l.y + font * 0.25}
                  y2={l.y + font * 0.65}
                  stroke={inkSeries.axis}
                  strokeWidth={s}
                />
              </g>
            )}
          </g>
        );
      })}
      {design && (
        <circle
          data-design-cg
          cx={at(design).sx}
          cy={at(design).sy}
          r={base * 0.035}
          fill="none"
          stroke={palette.paper.DEFAULT}
          strokeWidth={s * 2}
        >
          <title>{`Design CG at x ${design.x.toFixed(1)} mm, y ${design.y.toFixed(1)} mm`}</title>
        </circle>
      )}
      {estimatedCg && (
        <g data-estimated-cg stroke={cgCross} strokeWidth={s * 3}>
          <title>{`Estimated CG at x ${estimatedCg.xMm.toFixed(1)} mm, y ${estimatedCg.yMm.toFixed(1)} mm`}</title>
          {(() => {
            const { sx, sy } = at({ x: estimatedCg.xMm, y: estimatedCg.yMm });
            const r = base * 0.05;
            return (
              <>
                <line x1={sx - r} x2={sx + r} y1={sy} y2={sy} />
                <line x1={sx} x2={sx} y1={sy - r} y2={sy + r} />
              </>
            );
          })()}
        </g>
      )}
      {scaleBar && (
        <g aria-hidden>
          <line
            x1={-ext * 0.92}
            y1={ext * 0.92}
            x2={-ext * 0.92 + scaleBarMm(ext)}
            y2={ext * 0.92}
            stroke={palette.ink.DEFAULT}
            strokeWidth={s * 2}
          />
          <text
            x={-ext * 0.92}
            y={ext * 0.87}
            fontSize={font * 0.5}
            fontFamily="JetBrains Mono, monospace"
            fill={palette.ink.soft}
          >
            {scaleBarMm(ext)} mm
          </text>
        </g>
      )}
    </svg>
  );
}
