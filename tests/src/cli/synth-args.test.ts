import { describe, expect, it } from 'vitest';
import { UsageError } from '../../../src/cli/exit-codes';
import { parseSynthArgs } from '../../../src/cli/synth-args';

describe('parseSynthArgs', () => {
  it('reads a full command line', () => {
    expect(
      parseSynthArgs([
        '--scenario',
        'weak-motor',
        '--seconds',
        '30',
        '--rate=500',
        '--seed',
        '9',
        '--out',
        'a.csv',
        '--gzip',
      ]),
    ).toEqual({
      kind: 'run',
      scenario: 'weak-motor',
      seconds: 30,
      rateHz: 500,
      seed: 9,
      out: 'a.csv',
      gzip: true,
    });
  });

  it('defaults the seed to 1 and the output to none', () => {
    expect(parseSynthArgs(['--scenario', 'clean-quad-x'])).toEqual({
      kind: 'run',
      scenario: 'clean-quad-x',
      seed: 1,
      out: null,
      gzip: false,
    });
  });

  it('lists and helps', () => {
    expect(parseSynthArgs(['--list'])).toEqual({ kind: 'list' });
    expect(parseSynthArgs(['-h'])).toEqual({ kind: 'help' });
  });

  it.each([
    [['--scenario', 'nope'], /unknown scenario "nope"; known: clean-quad-x/],
    [['--scenario'], /needs a value/],
    [['--scenario', 'weak-motor', '--fast'], /unknown option --fast/],
    [['weak-motor'], /did you mean --scenario weak-motor/],
    [['--seconds', '20'], /--scenario is required/],
    [['--scenario', 'weak-motor', '--seconds', 'ten'], /--seconds needs a number/],
    [['--scenario', 'weak-motor', '--seconds', '5'], /from 10 to 3600/],
    [['--scenario', 'weak-motor', '--seed', '1.5'], /--seed needs an integer/],
    [['--scenario', 'weak-motor', '--rate', ''], /--rate needs a number/],
    [['--scenario', 'a', '--scenario', 'b'], /given twice/],
    [['--scenario', 'toString'], /unknown scenario/],
  ])('rejects %j with a clear message', (argv, message) => {
    expect(() => parseSynthArgs(argv)).toThrow(UsageError);
    expect(() => parseSynthArgs(argv)).toThrow(message);
  });
});
