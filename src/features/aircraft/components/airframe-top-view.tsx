import type { Motor } from '../../../../shared/schemas/airframe';
import { motorColor } from '../../../components/charts/palette';
import {
  MM_PER_INCH,
  scaleBarMm,
  spinArc,
  toScreen,
  viewExtent,
} from '../../../components/airframe/top-view-geometry';

/**
 * The airframe seen from above, drawn from its geometry: arms, prop discs in each motor's
 * colour, spin arrows, motor numbers, the nose and the design CG.
 */
export function AirframeTopView({
  motors,
  propDiameterIn,
  cg,
  className = 'aspect-square w-full rounded border border-line',
}: {
  motors: readonly Motor[];
  propDiameterIn: number;
  cg?: { x: number; y: number } | undefined;
  /** Size and frame; defaults to a bordered square filling its column. */
  className?: string;
}) {
  const propR =
    Number.isFinite(propDiameterIn) && propDiameterIn > 0 ? (propDiameterIn * MM_PER_INCH) / 2 : 50;
  const drawable = motors.filter((m) => Number.isFinite(m.x) && Number.isFinite(m.y));
  const ext = viewExtent(drawable, propR);
  const bar = scaleBarMm(ext);
  const label = `Top view: ${motors.length} motors, nose up`;
  const stroke = ext / 160;

  return (
    <svg
      role="img"
      aria-label={label}
      viewBox={`${-ext} ${-ext} ${ext * 2} ${ext * 2}`}
      className={'bg-paper ' + className}
    >
      {/* nose marker */}
      <g aria-hidden>
        <path
          d={`M 0 ${-ext * 0.97} L ${ext * 0.04} ${-ext * 0.88} L ${-ext * 0.04} ${-ext * 0.88} Z`}
          className="fill-slate-brand"
        />
        <text x={ext * 0.06} y={-ext * 0.89} fontSize={ext * 0.05} className="fill-ink-soft">
          nose
        </text>
      </g>
      {drawable.map((m, i) => {
        const { sx, sy } = toScreen(m);
        return (
          <line
            key={`arm-${i}`}
            x1={0}
            y1={0}
            x2={sx}
            y2={sy}
            stroke="#4a5866"
            strokeWidth={stroke * 4}
            strokeLinecap="round"
          />
        );
      })}
      <rect
        x={-ext * 0.09}
        y={-ext * 0.13}
        width={ext * 0.18}
        height={ext * 0.26}
        rx={ext * 0.03}
        className="fill-slate-brand"
      />
      {motors.map((m, i) => {
        if (!Number.isFinite(m.x) || !Number.isFinite(m.y)) return null;
        const n = i + 1;
        const { sx, sy } = toScreen(m);
        const colour = motorColor(n);
        const arrow = spinArc(sx, sy, propR * 0.72, m.spin);
        return (
          <g key={n} data-motor={n} aria-label={`Motor ${n}, ${m.spin}`} role="group">
            <title>{`Motor ${n}: x ${m.x} mm, y ${m.y} mm, ${m.spin}`}</title>
            <circle
              cx={sx}
              cy={sy}
              r={propR}
              fill={colour}
              fillOpacity={0.12}
              stroke={colour}
              strokeWidth={stroke * 1.5}
            />
            <path d={arrow.path} fill="none" stroke={colour} strokeWidth={stroke * 2.5} />
            <path d={arrow.head} fill={colour} />
            <circle
              cx={sx}
              cy={sy}
              r={ext * 0.045}
              fill="#ffffff"
              stroke={colour}
              strokeWidth={stroke * 2}
            />
            <text
              x={sx}
              y={sy}
              textAnchor="middle"
              dominantBaseline="central"
              fontSize={ext * 0.05}
              fontFamily="JetBrains Mono, monospace"
              fontWeight={600}
              className="fill-ink"
            >
              {n}
            </text>
          </g>
        );
      })}
      {cg && (cg.x !== 0 || cg.y !== 0) && (
        <g aria-label={`Design CG at x ${cg.x} mm, y ${cg.y} mm`} role="group">
          <circle
            cx={cg.y}
            cy={-cg.x}
            r={ext * 0.025}
            fill="none"
            stroke="#c7771a"
            strokeWidth={stroke * 2}
          />
          <line
            x1={cg.y - ext * 0.04}
            y1={-cg.x}
            x2={cg.y + ext * 0.04}
            y2={-cg.x}
            stroke="#c7771a"
            strokeWidth={stroke * 1.5}
          />
          <line
            x1={cg.y}
            y1={-cg.x - ext * 0.04}
            x2={cg.y}
            y2={-cg.x + ext * 0.04}
            stroke="#c7771a"
            strokeWidth={stroke * 1.5}
          />
        </g>
      )}
      <g aria-hidden>
        <line
          x1={-ext * 0.92}
          y1={ext * 0.92}
          x2={-ext * 0.92 + bar}
          y2={ext * 0.92}
          stroke="#1c2733"
          strokeWidth={stroke * 2}
        />
        <text
          x={-ext * 0.92}
          y={ext * 0.87}
          fontSize={ext * 0.045}
          fontFamily="JetBrains Mono, monospace"
          className="fill-ink-soft"
        >
          {bar} mm
        </text>
      </g>
    </svg>
  );
}
