import type { Severity } from '../../schemas/report';

/** Small wording helpers every finding uses, so numbers read the same in every message. */
export const pct = (v: number) => `${Math.round(Math.abs(v))} %`;
export const mm = (v: number) => `${Math.round(Math.abs(v))} mm`;
export const list = (ms: readonly (string | number)[]) =>
  ms.length <= 1 ? String(ms[0] ?? '') : `${ms.slice(0, -1).join(', ')} and ${ms[ms.length - 1]}`;

/** `act` at or above `act`, `watch` at or above `watch`, else null. */
export function level(value: number, watch: number, act: number): Severity | null {
  if (value >= act) return 'act';
  if (value >= watch) return 'watch';
  return null;
}
