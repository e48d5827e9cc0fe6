import type { FlightAnalysis } from '../../shared/analysis/analyze-flight';

const pct = (v: number) => `${v >= 0 ? '+' : ''}${v.toFixed(1)} %`;
const fix = (v: number | null | undefined, d = 1) =>
  v === null || v === undefined ? '—' : v.toFixed(d);

/** The readable summary: verdict first, then the numbers a tuner reads. */
export function summary(file: string, { report: r, detail }: FlightAnalysis): string {
  const out: string[] = [];
  out.push(`Hoverprint · ${file}`);
  out.push(
    `${r.durationS.toFixed(1)} s · ${r.rows} rows at ${Math.round(r.sampleRateHz)} Hz · ${r.motorCount} motors · airframe: ${r.airframe.name}` +
      (r.airframe.assumed ? ' (ASSUMED — pass --airframe for your aircraft)' : ''),
  );
  out.push('');
  out.push('Verdict');
  if (r.findings.length === 0) out.push('  No findings: nothing over the team thresholds.');
  for (const f of r.findings) {
    const tag = f.severity.toUpperCase().padEnd(5);
    const where = [
      f.motor ? `motor ${f.motor}` : '',
      f.axis ?? '',
      f.tS !== undefined ? `t=${f.tS.toFixed(1)} s` : '',
    ]
      .filter(Boolean)
      .join(', ');
    out.push(`  ${tag} ${f.code}${where ? ` (${where})` : ''}`);
    out.push(`        ${f.message}`);
  }
  out.push('');
  out.push(`Hover: ${r.segments.hoverS.toFixed(1)} s in ${r.segments.hover.length} stretch(es)`);
  out.push(
    `Pattern: ${detail.diagnosis.text} (confidence ${Math.round(detail.diagnosis.confidence * 100)} %)`,
  );
  if (r.balance.deviationPct.length) {
    out.push('Balance (hover output vs what the frame predicts)');
    r.balance.deviationPct.forEach((d, i) =>
      out.push(
        `  motor ${i + 1}: ${pct(d).padStart(8)}   share ${(100 * r.balance.measuredShare[i]!).toFixed(1)} % (expected ${(100 * r.balance.expectedShare[i]!).toFixed(1)} %)`,
      ),
    );
    out.push(
      `Torque split: cw ${(100 * r.torqueSplit.cwShare).toFixed(1)} % / ccw ${(100 * r.torqueSplit.ccwShare).toFixed(1)} % (asymmetry ${pct(r.torqueSplit.asymmetryPct)})`,
    );
  }
  if (r.cg)
    out.push(`CG: x ${r.cg.xMm.toFixed(1)} mm (forward +), y ${r.cg.yMm.toFixed(1)} mm (right +)`);
  const vib = Object.entries(r.vibration);
  if (vib.length) {
    out.push(
      'Vibration (band RMS 50 Hz–Nyquist; loudest peaks in dB re 1 (deg/s)²/Hz on the gyro, dB re 1 g²/Hz on the accelerometer)',
    );
    for (const [ch, v] of vib) {
      const peaks = v.peaks
        .slice(0, 3)
        .map(
          (p) =>
            `${p.hz.toFixed(0)} Hz ${p.db.toFixed(0)} dB${p.label ? ` ${p.label}` : ''}${p.motor ? ` m${p.motor}` : ''}`,
        )
        .join(', ');
      out.push(
        `  ${ch.padEnd(7)} ${v.bandRms.toFixed(2).padStart(7)} ${(ch.startsWith('gyro') ? 'deg/s' : 'g').padEnd(5)}  ${peaks || 'no clear peaks'}`,
      );
    }
  }
  if (r.power) {
    const p = r.power;
    out.push(
      `Power: ${p.cells}S, rest ${p.restCellV.toFixed(2)} V/cell, min ${p.minCellV.toFixed(2)} V/cell under load (sag ${p.sagCellV.toFixed(2)} V), ` +
        `R ${p.internalResistanceOhm === null ? '—' : `${(p.internalResistanceOhm * 1000).toFixed(0)} mΩ`}, ${fix(p.mAh, 0)} mAh, ${fix(p.wh, 2)} Wh`,
    );
  }
  const h = r.headroom;
  out.push(
    `Headroom: ${h.saturationS.toFixed(2)} s saturated (${h.saturationEvents.length} events), ESC peak ${h.escPeakA === null ? '—' : `${h.escPeakA.toFixed(1)} A`}, over rating ${h.escOverS.toFixed(2)} s`,
  );
  if (r.tracking) {
    const t = r.tracking;
    const ax = (n: string, a: { rmsDegS: number; lagMs: number | null }) =>
      `${n} ${a.rmsDegS.toFixed(1)} deg/s RMS, lag ${a.lagMs === null ? '—' : `${a.lagMs.toFixed(0)} ms`}`;
    out.push(`Tracking: ${ax('roll', t.roll)}; ${ax('pitch', t.pitch)}; ${ax('yaw', t.yaw)}`);
    const resp = (n: string, a: NonNullable<typeof r.tracking>['roll']) =>
      a.phaseDelayMs === null || a.phaseDelayMs === undefined
        ? `${n} —`
        : `${n} bandwidth ${a.bandwidthHz == null ? '—' : `${a.bandwidthHz.toFixed(1)} Hz`}, ` +
          `peak ${fix(a.peakGainDb)} dB, delay ${a.phaseDelayMs.toFixed(0)} ms`;
    out.push(
      `Stick response: ${resp('roll', t.roll)}; ${resp('pitch', t.pitch)}; ${resp('yaw', t.yaw)}`,
    );
  }
  if (r.drift) {
    const d = r.drift;
    out.push(`Drift against ${d.against}`);
    for (const m of d.motors)
      out.push(
        `  motor ${m.motor}: ${pct(m.nowPct).padStart(8)} now, ${pct(m.baselinePct)} usual (spread ${m.spreadPct.toFixed(1)}), change ${m.changePts >= 0 ? '+' : ''}${m.changePts.toFixed(1)} points`,
      );
    if (d.power)
      out.push(
        `  pack resistance ${d.power.nowMilliohm.toFixed(0)} mΩ, usual ${d.power.baselineMilliohm.toFixed(0)} mΩ`,
      );
  }
  if (r.warnings.length) {
    out.push('');
    out.push('Warnings');
    for (const w of r.warnings) out.push(`  - ${w}`);
  }
  out.push('');
  out.push(
    'Findings are advice, not an airworthiness sign-off. Take the props off for bench checks, handle LiPos with care, and fly by your local rules.',
  );
  return out.join('\n');
}
