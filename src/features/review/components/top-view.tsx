import type { Airframe } from '../../../../shared/schemas/airframe';
import { MM_PER_INCH, toScreen } from '../../../components/airframe/top-view-geometry';
import { motorColor } from '../../../components/charts/palette';
import { signedFixed } from '../model/format';

export interface TopViewProps {
  airframe: Airframe;
  /** Per motor, % against the airframe's expected hover output. */
  deviationPct: readonly number[];
  /** Estimated CG, mm in the airframe's frame, or null when there was too little hover. */
  cg: { xMm: number; yMm: number } | null;
  /** 1-based motors the verdict names. */
  flagged: ReadonlySet<number>;
}

const fmtPct = (v: number) => `${signedFixed(v)} %`;
const BAR_FULL_PCT = 20;

const motorSummary = (n: number, spin: string, dev: number, isFlagged: boolean) =>
  `Motor ${n}, ${spin}, deviation ${Number.isFinite(dev) ? fmtPct(dev) : 'not measured'}${isFlagged ? ', named in the verdict' : ''}`;

/** The image's text alternative: what it shows and the figures it shows, in reading order. */
function topViewSummary(
  airframe: Airframe,
  deviationPct: readonly number[],
  cg: { xMm: number; yMm: number } | null,
  flagged: ReadonlySet<number>,
): string {
  const marked = flagged.size ? `, motor ${[...flagged].join(' and ')} marked` : '';
  const devs = airframe.motors
    .map((_, i) => {
      const dev = deviationPct[i] ?? NaN;
      return `motor ${i + 1} ${Number.isFinite(dev) ? fmtPct(dev) : 'not measured'}`;
    })
    .join(', ');
  const cgText = cg ? `; estimated CG at x ${cg.xMm.toFixed(1)} mm, y ${cg.yMm.toFixed(1)} mm` : '';
  return `Top view of ${airframe.name}: ${airframe.motors.length} motors${marked}. Deviation from expected hover output: ${devs}${cgText}`;
}

/**
 * The airframe seen from above, drawn from its geometry: nose up, right side right (FRD x
 * forward → screen up, y right → screen right). Each motor shows its spin, its deviation as a
 * number and a bar, and the motors the verdict names are ringed.
 */
export function TopView({ airframe, deviationPct, cg, flagged }: TopViewProps) {
  const propR = (airframe.prop.diameterIn * MM_PER_INCH) / 2;
  const reach = Math.max(...airframe.motors.map((m) => Math.hypot(m.x, m.y))) + propR;
  const pad = propR * 0.9 + 40;
  const sx = (m: { x: number; y: number }) => toScreen(m).sx;
  const sy = (m: { x: number; y: number }) => toScreen(m).sy;
  const design = airframe.cg ?? { x: 0, y: 0 };
  const body = Math.max(18, reach * 0.16);
  const font = (reach + pad) / 11;
  const barW = propR * 1.2;
  // Each deviation label (figure over bar) sits just outside its verdict ring, pushed out by
  // its own half-size in that direction, so it never covers a prop disc however wide it is.
  const labels = airframe.motors.map((m, i) => {
    const dev = deviationPct[i] ?? NaN;
    const text = Number.isFinite(dev) ? fmtPct(dev) : '—';
    const cx = sx(m);
    const cy = sy(m);
    const out = Math.hypot(cx, cy) || 1;
    const ux = cx / out;
    const uy = cy / out;
    const halfW = Math.max(barW / 2, 0.28 * font * text.length);
    const halfH = 0.6 * font;
    const d = propR + 10 + Math.abs(ux) * halfW + Math.abs(uy) * halfH;
    return { text, x: cx + ux * d, y: cy + uy * d, halfW, halfH };
  });
  const R = Math.max(
    reach + pad,
    ...labels.map((l) => Math.max(Math.abs(l.x) + l.halfW, Math.abs(l.y) + l.halfH) + 8),
  );

  return (
    <svg
      viewBox={`${-R} ${-R} ${2 * R} ${2 * R}`}
      role="img"
      aria-label={topViewSummary(airframe, deviationPct, cg, flagged)}
      className="h-auto w-full max-w-[26rem]"
    >
      <defs>
        <marker
          id="tv-arrow"
          viewBox="0 0 10 10"
          refX="5"
          refY="5"
          markerWidth="5"
          markerHeight="5"
          orient="auto-start-reverse"
        >
          <path d="M0,0 L10,5 L0,10 z" fill="#4a5866" />
        </marker>
      </defs>
      {/* nose */}
      <path
        d={`M ${-body * 0.5} ${-body - 4} L 0 ${-body - body * 0.9} L ${body * 0.5} ${-body - 4} z`}
        fill="#1f3a4d"
      />
      <text x={0} y={-R + font * 1.2} textAnchor="middle" fontSize={font * 0.8} fill="#5c6773">
        front
      </text>
      {airframe.motors.map((m, i) => (
        <line
          key={`arm-${i}`}
          x1={0}
          y1={0}
          x2={sx(m)}
          y2={sy(m)}
          stroke="#4a5866"
          strokeWidth={Math.max(4, reach * 0.03)}
          strokeLinecap="round"
        />
      ))}
      <rect
        x={-body}
        y={-body}
        width={2 * body}
        height={2 * body}
        rx={body * 0.25}
        fill="#1f3a4d"
      />
      {airframe.motors.map((m, i) => {
        const n = i + 1;
        const cx = sx(m);
        const cy = sy(m);
        const dev = deviationPct[i] ?? NaN;
        const isFlagged = flagged.has(n);
        const out = Math.hypot(cx, cy) || 1;
        const ux = cx / out;
        const uy = cy / out;
        const label = labels[i]!;
        const lx = label.x;
        const ly = label.y;
        const ar = propR * 0.72;
        const a0 = Math.atan2(-uy, -ux) + Math.PI / 2; // start the arrow on the inner side
        const sweep = m.spin === 'cw' ? 1 : -1;
        const a1 = a0 + sweep * ((110 * Math.PI) / 180);
        const p0 = [cx + ar * Math.cos(a0), cy + ar * Math.sin(a0)];
        const p1 = [cx + ar * Math.cos(a1), cy + ar * Math.sin(a1)];
        const frac = Number.isFinite(dev) ? Math.max(-1, Math.min(1, dev / BAR_FULL_PCT)) : 0;
        return (
          <g key={`motor-${n}`} data-motor={n} data-flagged={isFlagged ? 'true' : 'false'}>
            {/* A tooltip for pointer users; inside role="img" an aria-label here is not allowed
                and would not be read, so the image's own name carries the figures. */}
            <title>{motorSummary(n, m.spin, dev, isFlagged)}</title>
            {isFlagged && (
              <circle
                cx={cx}
                cy={cy}
                r={propR + 6}
                fill="none"
                stroke="#a63c35"
                strokeWidth={4}
                strokeDasharray="10 6"
              />
            )}
            <circle
              cx={cx}
              cy={cy}
              r={propR}
              fill={motorColor(n)}
              fillOpacity={0.16}
              stroke={motorColor(n)}
              strokeWidth={2.5}
            />
            <path
              d={`M ${p0[0]} ${p0[1]} A ${ar} ${ar} 0 0 ${m.spin === 'cw' ? 1 : 0} ${p1[0]} ${p1[1]}`}
              fill="none"
              stroke="#4a5866"
              strokeWidth={2}
              markerEnd="url(#tv-arrow)"
            />
            <circle
              cx={cx}
              cy={cy}
              r={propR * 0.2}
              fill={motorColor(n)}
              stroke="#1c2733"
              strokeWidth={1.5}
            />
            <text
              x={cx}
              y={cy + font * 0.35}
              textAnchor="middle"
              fontSize={font}
              fontWeight={700}
              fill="#fff"
              stroke="#1c2733"
              strokeWidth={0.6}
            >
              {n}
            </text>
            <text
              x={lx}
              y={ly + font * 0.1}
              textAnchor="middle"
              fontSize={font * 0.9}
              className="num"
              fill={isFlagged ? '#a63c35' : '#1c2733'}
              fontWeight={isFlagged ? 700 : 500}
            >
              {label.text}
            </text>
            <rect
              x={lx - barW / 2}
              y={ly + font * 0.3}
              width={barW}
              height={font * 0.3}
              fill="#eeebe3"
            />
            <rect
              x={frac >= 0 ? lx : lx + (frac * barW) / 2}
              y={ly + font * 0.3}
              width={(Math.abs(frac) * barW) / 2}
              height={font * 0.3}
              fill={isFlagged ? '#a63c35' : motorColor(n)}
            />
            <line
              x1={lx}
              x2={lx}
              y1={ly + font * 0.25}
              y2={ly + font * 0.65}
              stroke="#4a5866"
              strokeWidth={1}
            />
          </g>
        );
      })}
      {/* design CG: ring; estimated CG: cross, true to scale */}
      <circle
        cx={sx(design)}
        cy={sy(design)}
        r={body * 0.35}
        fill="none"
        stroke="#f7f5f0"
        strokeWidth={2}
      >
        <title>Design CG</title>
      </circle>
      {cg && (
        <g>
          <title>{`Estimated CG at x ${cg.xMm.toFixed(1)} mm, y ${cg.yMm.toFixed(1)} mm`}</title>
          <line
            x1={sx({ x: cg.xMm, y: cg.yMm }) - body * 0.5}
            x2={sx({ x: cg.xMm, y: cg.yMm }) + body * 0.5}
            y1={sy({ x: cg.xMm, y: cg.yMm })}
            y2={sy({ x: cg.xMm, y: cg.yMm })}
            stroke="#c7771a"
            strokeWidth={3}
          />
          <line
            y1={sy({ x: cg.xMm, y: cg.yMm }) - body * 0.5}
            y2={sy({ x: cg.xMm, y: cg.yMm }) + body * 0.5}
            x1={sx({ x: cg.xMm, y: cg.yMm })}
            x2={sx({ x: cg.xMm, y: cg.yMm })}
            stroke="#c7771a"
            strokeWidth={3}
          />
        </g>
      )}
    </svg>
  );
}

/**
 * CG offsets are millimetres on a frame of hundreds, invisible at true scale; this inset shows
 * the design CG and the estimate on a millimetre grid sized to the offset.
 */
export function CgDetail({
  cg,
  design,
}: {
  cg: { xMm: number; yMm: number };
  design: { x: number; y: number };
}) {
  const dx = cg.yMm - design.y;
  const dy = -(cg.xMm - design.x);
  const span = Math.max(5, Math.ceil((Math.hypot(dx, dy) * 1.5) / 5) * 5);
  const step = span <= 10 ? 1 : span <= 50 ? 5 : 10;
  const ticks: number[] = [];
  for (let v = -span; v <= span; v += step) ticks.push(v);
  return (
    <svg
      viewBox={`${-span * 1.15} ${-span * 1.15} ${span * 2.3} ${span * 2.3}`}
      role="img"
      aria-label={`CG detail, ±${span} mm: estimate ${signedFixed(cg.xMm - design.x)} mm forward, ${signedFixed(cg.yMm - design.y)} mm right of the design CG`}
      className="h-40 w-40"
    >
      {ticks.map((v) => (
        <g key={v}>
          <line
            x1={v}
            x2={v}
            y1={-span}
            y2={span}
            stroke={v === 0 ? '#7d8894' : '#e6e1d6'}
            strokeWidth={span / 120}
          />
          <line
            y1={v}
            y2={v}
            x1={-span}
            x2={span}
            stroke={v === 0 ? '#7d8894' : '#e6e1d6'}
            strokeWidth={span / 120}
          />
        </g>
      ))}
      <circle cx={0} cy={0} r={span * 0.08} fill="none" stroke="#1f3a4d" strokeWidth={span / 60} />
      <line
        x1={0}
        y1={0}
        x2={dx}
        y2={dy}
        stroke="#c7771a"
        strokeWidth={span / 80}
        strokeDasharray={`${span / 25} ${span / 40}`}
      />
      <g stroke="#c7771a" strokeWidth={span / 40}>
        <line x1={dx - span * 0.1} x2={dx + span * 0.1} y1={dy} y2={dy} />
        <line x1={dx} x2={dx} y1={dy - span * 0.1} y2={dy + span * 0.1} />
      </g>
      <text x={-span} y={-span * 1.03} fontSize={span / 8} fill="#5c6773">
        ±{span} mm · front ↑
      </text>
    </svg>
  );
}
