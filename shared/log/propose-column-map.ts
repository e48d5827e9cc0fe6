import { channelFamily, type Unit } from './channels';
import {
  canonicalReading,
  cellNumber,
  type ProposedColumn,
  type ProposedColumnMap,
} from './column-map';
import { guessFamily, numberedSet, parseWords } from './header-words';
import { unitFromValues } from './unit-from-values';

const axisNames: Record<string, readonly string[]> = {
  gyro: ['gyro_x', 'gyro_y', 'gyro_z'],
  acc: ['acc_x', 'acc_y', 'acc_z'],
  sp: ['sp_roll', 'sp_pitch', 'sp_yaw'],
};

/**
 * Suggests a column map from the words and units in the headers, and units from the first
 * rows' values (cells split by `delimiter`) where a header names none, for a person to
 * confirm. It never applies itself: the reader only uses a map it is given.
 */
export function proposeColumnMap(
  headers: string[],
  sampleRows: string[][] = [],
  delimiter = ',',
): ProposedColumnMap {
  const parsed = headers.map(parseWords);
  const guesses = parsed.map((p) => guessFamily(p.words));
  // A numbered set that starts at 0 in the file (Motor0…Motor3) becomes motor1…motor4 as a
  // whole, so its "Motor1" is not read as our own motor1.
  const sets = guesses.map((g, i) =>
    g && g.zeroBasedPossible && g.slot !== null ? numberedSet(g.family, parsed[i]!.words) : null,
  );
  const zeroBasedSets = new Set(sets.filter((k, i) => k !== null && guesses[i]!.slot === 0));
  const shiftedByOne = (i: number) => sets[i] != null && zeroBasedSets.has(sets[i]);
  const taken = new Map<string, string>();
  const entries: ProposedColumn[] = headers.map((header, i) => {
    const direct = shiftedByOne(i) ? null : canonicalReading(header);
    if (direct) {
      if (taken.has(direct.channel)) {
        return {
          header,
          channel: null,
          unit: null,
          reason: `${direct.channel} is already taken by "${taken.get(direct.channel)}"`,
        };
      }
      taken.set(direct.channel, header);
      return { header, channel: direct.channel, unit: direct.unit, reason: 'our own channel name' };
    }
    const g = guesses[i];
    const p = parsed[i]!;
    if (!g)
      return {
        header,
        channel: null,
        unit: null,
        reason: 'no word we recognise; pick a channel or leave it out',
      };
    let channel: string | null;
    const axes = axisNames[g.family];
    if (axes) {
      channel = g.slot === null ? null : (axes[g.slot] ?? null);
      if (!channel)
        return {
          header,
          channel: null,
          unit: null,
          reason: `"${g.clue}" suggests ${g.family}, but no axis (x/y/z or roll/pitch/yaw) was found`,
        };
    } else if (g.family === 'motor' || g.family === 'rpm' || g.family === 'imotor') {
      if (g.slot === null)
        return {
          header,
          channel: null,
          unit: null,
          reason: `"${g.clue}" suggests ${g.family}, but no motor number was found`,
        };
      const n = g.slot + (shiftedByOne(i) ? 1 : 0);
      channel = `${g.family}${n}`;
    } else {
      channel = g.family;
    }
    if (!channelFamily(channel))
      return {
        header,
        channel: null,
        unit: null,
        reason: `"${header}" looks like ${g.family}, but ${channel} is out of range`,
      };
    if (taken.has(channel)) {
      return {
        header,
        channel: null,
        unit: null,
        reason: `also looks like ${channel}, already taken by "${taken.get(channel)}"; pick one`,
      };
    }
    taken.set(channel, header);
    const family = channelFamily(channel)!;
    let unit: Unit | null = null;
    let unitReason = 'no unit in the header: check it';
    if (p.unit !== null && family.units.includes(p.unit)) {
      unit = p.unit;
      unitReason = `unit ${p.unit} read from "${p.unitText}"`;
    } else if (g.family === 'rpm' && p.words.includes('erpm')) {
      unit = 'erpm';
      unitReason = 'unit erpm read from the name';
    } else if (p.unit !== null) {
      unitReason = `"${p.unitText}" is not a unit ${channel} accepts (${family.units.join(', ')})`;
    }
    const shifted = shiftedByOne(i) ? ' (numbered from 0 in the file, from 1 here)' : '';
    return {
      header,
      channel,
      unit,
      reason: `the word "${g.clue}" suggests ${channel}${shifted}; ${unitReason}`,
    };
  });
  const fromValues = new Map<string, Unit>();
  entries.forEach((e, i) => {
    if (e.channel === null || e.unit !== null || sampleRows.length === 0) return;
    const values = sampleRows.map((r) => cellNumber(r[i], delimiter));
    const guess = unitFromValues(e.channel, values);
    if (guess) {
      e.unit = guess.unit;
      if (guess.unit === 'raw') Object.assign(e, { min: guess.min, max: guess.max });
      e.reason = e.reason.replace('no unit in the header: check it', `${guess.why}: check it`);
      fromValues.set(e.channel, guess.unit);
    }
  });
  // The axes of one sensor share a unit: an accelerometer's x and y read near 0 at rest and
  // say nothing, while its z reads near 1 g or 9.8 m/s².
  for (const e of entries) {
    if (e.channel === null || e.unit !== null) continue;
    const axes = Object.values(axisNames).find((a) => a.includes(e.channel!));
    const sibling = axes?.find((a) => fromValues.has(a));
    if (!sibling) continue;
    e.unit = fromValues.get(sibling)!;
    e.reason = e.reason.replace(
      'no unit in the header: check it',
      `same unit as ${sibling}, read from its values: check it`,
    );
  }
  const mapped = new Set(entries.map((e) => e.channel).filter((c): c is string => c !== null));
  const missing: string[] = [];
  if (!mapped.has('time')) missing.push('time');
  if (!mapped.has('motor1')) missing.push('motor1');
  return { entries, missing };
}
