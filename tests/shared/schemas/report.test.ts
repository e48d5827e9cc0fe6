import { describe, expect, it } from 'vitest';
import {
  FlightReport,
  mostSevereFirst,
  SEVERITIES,
  Severity,
  severityRank,
} from '../../../shared/schemas/report';

describe('one severity order', () => {
  it('runs note < watch < act, the order the schema enumerates', () => {
    expect(SEVERITIES).toEqual(['note', 'watch', 'act']);
    expect(Severity.options).toEqual([...SEVERITIES]);
    expect(severityRank('note')).toBeLessThan(severityRank('watch'));
    expect(severityRank('watch')).toBeLessThan(severityRank('act'));
  });

  it('sorts most severe first and keeps the order within a severity', () => {
    const found = [
      { severity: 'note' as const, id: 1 },
      { severity: 'act' as const, id: 2 },
      { severity: 'watch' as const, id: 3 },
      { severity: 'act' as const, id: 4 },
    ];
    expect([...found].sort(mostSevereFirst).map((f) => f.id)).toEqual([2, 4, 3, 1]);
  });

  it('rejects a severity outside the three', () => {
    const finding = { code: 'log-gap', severity: 'urgent', message: 'x' };
    expect(FlightReport.shape.findings.safeParse([finding]).success).toBe(false);
  });
});
