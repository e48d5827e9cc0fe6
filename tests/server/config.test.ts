import { spawn } from 'node:child_process';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { ConfigError, parseConfig } from '../../server/config';

describe('parseConfig', () => {
  it('fills the documented defaults', () => {
    const c = parseConfig({});
    expect(c.port).toBe(8080);
    expect(c.env).toBe('development');
    expect(c.dataDir).toBe(resolve('./data'));
    expect(c.dbPath).toBe(resolve('./data/hoverprint.sqlite'));
    expect(c.publicUrl).toBe('http://localhost:8080');
    // Neither fake nor real SMTP unless asked: mail goes to the log.
    expect(c.mail.mode).toBe('log');
  });

  it('puts the database file inside DATA_DIR and builds links from PUBLIC_URL', () => {
    const c = parseConfig({
      DATA_DIR: '/srv/hp',
      PORT: '9000',
      PUBLIC_URL: 'https://hp.example.org/',
    });
    expect(c.dbPath).toBe('/srv/hp/hoverprint.sqlite');
    expect(c.publicUrl).toBe('https://hp.example.org');
  });

  it('defaults PUBLIC_URL to the chosen port', () => {
    expect(parseConfig({ PORT: '9100' }).publicUrl).toBe('http://localhost:9100');
  });

  it('treats an empty value as unset', () => {
    expect(parseConfig({ PORT: '' }).port).toBe(8080);
  });

  it.each([
    ['PORT', 'abc'],
    ['PORT', '70000'],
    ['PORT', '80.5'],
    ['NODE_ENV', 'staging'],
    ['PUBLIC_URL', 'not a url'],
    ['MAIL_FAKE', 'maybe'],
    ['MAX_UPLOAD_MB', '-1'],
  ])('rejects %s=%s naming the variable', (name, value) => {
    expect(() => parseConfig({ [name]: value })).toThrow(ConfigError);
    expect(() => parseConfig({ [name]: value })).toThrow(new RegExp(`${name}="${value}"`));
  });

  it('names every bad variable at once', () => {
    try {
      parseConfig({ PORT: 'abc', NODE_ENV: 'staging' });
      expect.unreachable();
    } catch (err) {
      expect(String(err)).toMatch(/PORT/);
      expect(String(err)).toMatch(/NODE_ENV/);
    }
  });

  it('turns the fake mail on only when MAIL_FAKE is set, in any environment', () => {
    for (const NODE_ENV of ['development', 'production', 'test']) {
      expect(parseConfig({ NODE_ENV }).mail.mode).toBe('log');
      expect(parseConfig({ NODE_ENV, MAIL_FAKE: '1' }).mail.mode).toBe('fake');
      expect(parseConfig({ NODE_ENV, SMTP_URL: 'smtp://mail.example.org:587' }).mail.mode).toBe(
        'smtp',
      );
    }
    expect(parseConfig({ MAIL_FAKE: '0', SMTP_URL: 'smtp://mail.example.org:587' }).mail.mode).toBe(
      'smtp',
    );
  });
});

describe('starting the server with a bad environment', () => {
  it('exits non-zero with a message naming PORT', async () => {
    const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
      env: { ...process.env, PORT: 'abc', NODE_ENV: 'test' },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let stderr = '';
    child.stderr.on('data', (d: Buffer) => (stderr += d.toString()));
    const code = await new Promise<number | null>((r) => child.on('exit', r));
    expect(code).toBe(78);
    expect(stderr).toMatch(/PORT="abc": expected a port number/);
  });
});
