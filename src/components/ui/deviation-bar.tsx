import { motorColor, motorOutline } from '../charts/palette';

/**
 * A motor's deviation from its expected output as a bar either side of a centre tick, full at
 * ±`fullPct`. The bar is filled in the motor's colour and outlined in ink where that colour is
 * under 3:1 on paper, as on every other motor mark.
 */
export function DeviationBar({
  motor,
  pct,
  fullPct = 20,
  className,
}: {
  motor: number;
  pct: number;
  fullPct?: number;
  /** Size and visibility of the track. */
  className: string;
}) {
  const frac = Math.max(-1, Math.min(1, pct / fullPct));
  const outline = motorOutline(motor);
  return (
    <span className={`relative bg-paper-sunk ${className}`} aria-hidden>
      <span className="absolute inset-y-0 left-1/2 w-px bg-ink-faint" />
      <span
        className="absolute inset-y-0"
        data-deviation-bar={motor}
        style={{
          left: frac >= 0 ? '50%' : `${50 + frac * 50}%`,
          width: `${Math.abs(frac) * 50}%`,
          background: motorColor(motor),
          // Inside the bar, so an outlined bar is as long as a plain one.
          boxShadow: outline ? `inset 0 0 0 1px ${outline}` : undefined,
        }}
      />
    </span>
  );
}
