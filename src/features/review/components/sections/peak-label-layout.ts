/**
 * Where the spectrum chart draws its peak labels so no two overlap: each label sits centred over
 * its line in one of a few rows above the plot; a label that fits no row joins the nearest label
 * already placed ("173 · 189 Hz") when the joined text still fits its row, and otherwise goes
 * unlabelled (its line stays, and the peak table below lists it). Louder peaks are placed first,
 * so they keep their own labels.
 */

export interface LabelRequest {
  /** Frequency of the line, Hz. */
  hz: number;
  /** Loudness, to decide who keeps a label when space runs out. */
  db: number;
}

export interface PlacedLabel {
  hz: number;
  /** Row above the plot, 0 nearest to it; null when the label was merged or dropped. */
  row: number | null;
  /** Text to draw (null when merged into another label or dropped). */
  text: string | null;
}

export interface LabelLayoutOptions {
  /** Width of the plot area, px. */
  widthPx: number;
  /** Frequency axis ends, Hz, and whether it is logarithmic. */
  xMin: number;
  xMax: number;
  xLog: boolean;
  rows?: number;
  /** Width of one character at the label font, px (10 px sans figures are about 6 px wide). */
  charPx?: number;
  /** Clear space kept between two labels in a row, px. */
  gapPx?: number;
}

const hzText = (hz: number[]) => `${hz.map((h) => Math.round(h)).join(' · ')} Hz`;

/** Pixel position of a frequency on the plot's axis. */
export function xToPx(hz: number, o: LabelLayoutOptions): number {
  const f = o.xLog
    ? (Math.log(hz) - Math.log(o.xMin)) / (Math.log(o.xMax) - Math.log(o.xMin))
    : (hz - o.xMin) / (o.xMax - o.xMin);
  return Math.min(1, Math.max(0, f)) * o.widthPx;
}

/** The span a label of `chars` characters occupies when centred at x, kept inside the plot. */
export function labelSpan(x: number, chars: number, o: LabelLayoutOptions): [number, number] {
  const w = chars * (o.charPx ?? 6);
  const lo = Math.min(Math.max(0, x - w / 2), Math.max(0, o.widthPx - w));
  return [lo, lo + w];
}

export function placePeakLabels(
  peaks: readonly LabelRequest[],
  o: LabelLayoutOptions,
): PlacedLabel[] {
  const rows = o.rows ?? 3;
  const gap = o.gapPx ?? 4;
  interface Slot {
    index: number;
    x: number;
    row: number;
    members: number[];
    span: [number, number];
  }
  const slots: Slot[] = [];
  const out: PlacedLabel[] = peaks.map((p) => ({ hz: p.hz, row: null, text: null }));
  const free = (span: [number, number], row: number, except?: Slot) =>
    slots.every(
      (s) =>
        s === except || s.row !== row || span[1] + gap <= s.span[0] || s.span[1] + gap <= span[0],
    );
  const order = peaks.map((_, i) => i).sort((a, b) => peaks[b]!.db - peaks[a]!.db);
  for (const i of order) {
    const x = xToPx(peaks[i]!.hz, o);
    const own = labelSpan(x, hzText([peaks[i]!.hz]).length, o);
    let placed = false;
    for (let row = 0; row < rows && !placed; row++) {
      if (!free(own, row)) continue;
      slots.push({ index: i, x, row, members: [i], span: own });
      placed = true;
    }
    if (placed) continue;
    // Join the nearest placed label if the joined text still fits where that label is.
    const near = [...slots].sort((a, b) => Math.abs(a.x - x) - Math.abs(b.x - x))[0];
    if (!near) continue;
    const members = [...near.members, i].sort((a, b) => peaks[a]!.hz - peaks[b]!.hz);
    const text = hzText(members.map((m) => peaks[m]!.hz));
    const span = labelSpan(near.x, text.length, o);
    if (free(span, near.row, near)) {
      near.members = members;
      near.span = span;
    }
  }
  for (const s of slots) {
    out[s.index] = {
      hz: peaks[s.index]!.hz,
      row: s.row,
      text: hzText(s.members.map((m) => peaks[m]!.hz)),
    };
  }
  return out;
}
