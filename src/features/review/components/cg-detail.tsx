import { toScreen } from '../../../components/airframe/top-view-geometry';
import { palette } from '../../../components/ui/palette';
import { signedFixed } from '../../../lib/signed-fixed';

/**
 * CG offsets are millimetres on a frame of hundreds, invisible at true scale; this inset shows
 * the design CG and the estimate on a millimetre grid sized to the offset, drawn with the top
 * view's own frame-to-screen transform (nose up, right side right).
 */
export function CgDetail({
  cg,
  design,
}: {
  cg: { xMm: number; yMm: number };
  design: { x: number; y: number };
}) {
  const { sx: dx, sy: dy } = toScreen({ x: cg.xMm - design.x, y: cg.yMm - design.y });
  const span = Math.max(5, Math.ceil((Math.hypot(dx, dy) * 1.5) / 5) * 5);
  const step = span <= 10 ? 1 : span <= 50 ? 5 : 10;
  const ticks: number[] = [];
  for (let v = -span; v <= span; v += step) ticks.push(v);
  const grid = (v: number) => (v === 0 ? palette.line.strong : palette.line.DEFAULT);
  return (
    <svg
      viewBox={`${-span * 1.15} ${-span * 1.15} ${span * 2.3} ${span * 2.3}`}
      role="img"
      aria-label={`CG detail, ±${span} mm: estimate ${signedFixed(cg.xMm - design.x)} mm forward, ${signedFixed(cg.yMm - design.y)} mm right of the design CG`}
      className="h-40 w-40"
    >
      {ticks.map((v) => (
        <g key={v} stroke={grid(v)} strokeWidth={span / 120}>
          <line x1={v} x2={v} y1={-span} y2={span} />
          <line y1={v} y2={v} x1={-span} x2={span} />
        </g>
      ))}
      <circle
        cx={0}
        cy={0}
        r={span * 0.08}
        fill="none"
        stroke={palette.slate.brand}
        strokeWidth={span / 60}
      />
      <line
        x1={0}
        y1={0}
        x2={dx}
        y2={dy}
        stroke={palette.accent.DEFAULT}
        strokeWidth={span / 80}
        strokeDasharray={`${span / 25} ${span / 40}`}
      />
      <g stroke={palette.accent.DEFAULT} strokeWidth={span / 40}>
        <line x1={dx - span * 0.1} x2={dx + span * 0.1} y1={dy} y2={dy} />
        <line x1={dx} x2={dx} y1={dy - span * 0.1} y2={dy + span * 0.1} />
      </g>
      <text x={-span} y={-span * 1.03} fontSize={span / 8} fill={palette.ink.faint}>
        ±{span} mm · nose ↑
      </text>
    </svg>
  );
}
