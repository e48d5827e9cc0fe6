import { spawn, type ChildProcess } from 'node:child_process';

export interface SpawnedServer {
  url: string;
  child: ChildProcess;
  /** Resolves when the process has exited. */
  exited: Promise<number | null>;
}

/** Starts `tsx server/index.ts` as its own process and waits for its "listening" log line. */
export async function spawnServer(env: Record<string, string>): Promise<SpawnedServer> {
  const child = spawn(process.execPath, ['node_modules/tsx/dist/cli.mjs', 'server/index.ts'], {
    env: {
      ...process.env,
      NODE_ENV: 'test',
      PORT: '0',
      HOST: '127.0.0.1',
      LOG_LEVEL: 'info',
      ...env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const exited = new Promise<number | null>((resolve) =>
    child.once('exit', (code) => resolve(code)),
  );
  let stderr = '';
  child.stderr!.on('data', (d: Buffer) => (stderr += d.toString()));
  const url = await new Promise<string>((resolve, reject) => {
    let out = '';
    const onData = (d: Buffer) => {
      out += d.toString();
      const m = /"url":"(http:\/\/[^"]+)"/.exec(out);
      if (m) {
        child.stdout!.off('data', onData);
        // Keep draining so a full pipe never blocks the server.
        child.stdout!.resume();
        resolve(m[1]!.replace('localhost', '127.0.0.1'));
      }
    };
    child.stdout!.on('data', onData);
    void exited.then((code) =>
      reject(new Error(`server exited (${code}) before listening:\n${stderr}`)),
    );
  });
  return { url, child, exited };
}
