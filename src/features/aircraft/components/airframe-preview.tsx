import { useWatch, type Control } from 'react-hook-form';
import { Alert } from '../../../components/ui/alert';
import type { AirframeForm } from '../model/airframe-form';
import { MM_PER_INCH, overlappingProps } from '../../../components/airframe/top-view-geometry';
import { AirframeTopView } from '../../../components/airframe/airframe-top-view';

/** The top view drawn from what is typed, with the spin count and overlapping props called out. */
export function AirframePreview({
  control,
  cg,
}: {
  control: Control<AirframeForm>;
  cg: { x: number; y: number } | undefined;
}) {
  const airframe = useWatch({ control, name: 'airframe' });
  const motors = (airframe.motors ?? []).map((m) => ({
    x: Number(m?.x),
    y: Number(m?.y),
    spin: m?.spin === 'cw' ? ('cw' as const) : ('ccw' as const),
  }));
  const diameter = Number(airframe.prop?.diameterIn);
  const overlaps = Number.isFinite(diameter)
    ? overlappingProps(motors, (diameter * MM_PER_INCH) / 2)
    : [];
  const cw = motors.filter((m) => m.spin === 'cw').length;
  return (
    <aside className="space-y-2 lg:sticky lg:top-4 lg:self-start">
      <AirframeTopView motors={motors} propDiameterIn={diameter} designCg={cg} scaleBar />
      <p className="text-xs text-ink-soft">
        <span className="num">{motors.length}</span> motors · <span className="num">{cw}</span>{' '}
        clockwise · <span className="num">{motors.length - cw}</span> counter-clockwise
      </p>
      {cw !== motors.length - cw && (
        <Alert tone="info">
          Unequal numbers of clockwise and counter-clockwise props: yaw will need uneven effort.
        </Alert>
      )}
      {overlaps.length > 0 && (
        <Alert tone="error">
          Prop discs overlap: {overlaps.map(([a, b]) => `${a}–${b}`).join(', ')}. Check the
          positions or the prop size.
        </Alert>
      )}
    </aside>
  );
}
