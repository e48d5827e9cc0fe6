import { spawn, type ChildProcess } from 'node:child_process';
import { createServer } from 'node:net';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

/** The checkout this helper lives in (tests/server/helpers → ../../..). */
const root = resolve(dirname(fileURLToPath(import.meta.url)), '../../..');

export interface SpawnedServer {
  url: string;
  child: ChildProcess;
  /** Resolves when the process has exited (null code when a signal ended it). */
  exited: Promise<number | null>;
  /**
   * Sends `signal` to the server's process group, waits for it to exit and checks that its port
   * no longer answers; throws if it still does.
   */
  stop(signal?: NodeJS.Signals): Promise<void>;
}

/** A port that was free a moment ago (the OS hands out a fresh ephemeral one each time). */
export function freePort(): Promise<number> {
  return new Promise((resolvePort, reject) => {
    const s = createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const { port } = s.address() as { port: number };
      s.close(() => resolvePort(port));
    });
  });
}

/** True once nothing accepts connections at `url` any more. */
export async function portClosed(url: string): Promise<boolean> {
  return fetch(`${url}/api/health`, { signal: AbortSignal.timeout(2000) }).then(
    () => false,
    (err: unknown) =>
      /ECONNREFUSED/.test(String((err as { cause?: unknown }).cause ?? err)) ||
      /ECONNREFUSED/.test(String(err)),
  );
}

/**
 * Starts the server process itself (`node --import tsx server/index.ts`, no wrapper that forks
 * another process) in its own process group, and waits until /api/health answers.
 */
export async function spawnServer(
  env: Record<string, string>,
  options: { cwd?: string; port?: number } = {},
): Promise<SpawnedServer> {
  const port = options.port ?? (await freePort());
  const child = spawn(
    process.execPath,
    [
      '--import',
      pathToFileURL(join(root, 'node_modules/tsx/dist/loader.mjs')).href,
      join(root, 'server/index.ts'),
    ],
    {
      cwd: options.cwd ?? root,
      env: {
        ...process.env,
        NODE_ENV: 'test',
        PORT: String(port),
        HOST: '127.0.0.1',
        MAIL_FAKE: '1',
        TSX_TSCONFIG_PATH: join(root, 'tsconfig.json'),
        ...env,
      },
      stdio: ['ignore', 'ignore', 'pipe'],
      detached: true,
    },
  );
  let stderr = '';
  child.stderr!.on('data', (d: Buffer) => (stderr += d.toString()));
  const exited = new Promise<number | null>((resolveExit) =>
    child.once('exit', (code) => resolveExit(code)),
  );
  const url = `http://127.0.0.1:${port}`;
  const stop = async (signal: NodeJS.Signals = 'SIGTERM') => {
    if (child.exitCode === null && child.signalCode === null) {
      try {
        process.kill(-child.pid!, signal);
      } catch {
        // the group is already gone
      }
      await exited;
    }
    if (!(await portClosed(url))) throw new Error(`the server at ${url} still answers`);
  };
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
    if (ok) return { url, child, exited, stop };
    await new Promise((r) => setTimeout(r, 100));
  }
}
