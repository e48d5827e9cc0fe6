import { spawn, type ChildProcess } from 'node:child_process';
import { createServer } from 'node:net';

export interface SpawnedServer {
  url: string;
  child: ChildProcess;
  /** Resolves when the process has exited. */
  exited: Promise<number | null>;
}

/** A port that was free a moment ago (the OS hands out a fresh ephemeral one each time). */
function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const { port } = s.address() as { port: number };
      s.close(() => resolve(port));
    });
  });
}

/**
 * Starts `node --import tsx server/index.ts` as its own process (no wrapper that forks, so a
 * kill reaches the server itself) and waits until /api/health answers.
 */
export async function spawnServer(env: Record<string, string>): Promise<SpawnedServer> {
  const port = await freePort();
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    env: {
      ...process.env,
      NODE_ENV: 'test',
      PORT: String(port),
      HOST: '127.0.0.1',
      MAIL_FAKE: '1',
      ...env,
    },
    stdio: ['ignore', 'ignore', 'pipe'],
  });
  let stderr = '';
  child.stderr!.on('data', (d: Buffer) => (stderr += d.toString()));
  const exited = new Promise<number | null>((resolve) =>
    child.once('exit', (code) => resolve(code)),
  );
  const url = `http://127.0.0.1:${port}`;
  for (;;) {
    if (child.exitCode !== null || child.signalCode !== null) {
      throw new Error(
        `server exited (${child.exitCode ?? child.signalCode}) before listening:\n${stderr}`,
      );
    }
    const ok = await fetch(`${url}/api/health`).then(
      (r) => r.ok,
      () => false,
    );
    if (ok) return { url, child, exited };
    await new Promise((r) => setTimeout(r, 100));
  }
}
