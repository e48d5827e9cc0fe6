import { describe, expect, it } from 'vitest';
import { parseBenchArgs } from './args';

describe('bench arguments', () => {
  it('keeps the first benchmark name when no engine is given', () => {
    expect(parseBenchArgs(['api', '--json'])).toEqual({
      names: ['api'],
      json: true,
      engine: 'sqlite',
    });
  });

  it('takes the word after --engine as the engine, wherever the flags sit', () => {
    expect(parseBenchArgs(['--json', 'api', '--engine', 'postgres'])).toEqual({
      names: ['api'],
      json: true,
      engine: 'postgres',
    });
    expect(parseBenchArgs(['--engine', 'postgres', 'api', 'parse'])).toEqual({
      names: ['api', 'parse'],
      json: false,
      engine: 'postgres',
    });
  });

  it('leaves the engine missing when --engine ends the line, for the caller to refuse', () => {
    expect(parseBenchArgs(['api', '--engine']).engine).toBeUndefined();
  });
});
