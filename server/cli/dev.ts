/**
 * `npm run dev`: the API under `tsx watch` and Vite's dev server together; Vite proxies /api
 * to the API port. Either one exiting, or Ctrl-C, stops both.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { loadConfig } from '../config';

const config = loadConfig();
const apiPort = String(config.port);
const children: ChildProcess[] = [];

function run(name: string, args: string[], env: NodeJS.ProcessEnv) {
  const child = spawn(process.execPath, args, { stdio: 'inherit', env });
  child.on('exit', (code, signal) => {
    if (!stopping) {
      console.error(`${name} exited (${signal ?? code}); stopping the dev loop`);
      stop(code ?? 1);
    }
  });
  children.push(child);
}

let stopping = false;
function stop(code: number) {
  stopping = true;
  for (const child of children) if (child.exitCode === null) child.kill('SIGTERM');
  setTimeout(() => process.exit(code), 500).unref();
}

// Loopback only: the dev inbox shows reset links, and the fake mail is on (MAIL_FAKE=1).
const env = {
  ...process.env,
  PORT: apiPort,
  API_PORT: apiPort,
  NODE_ENV: 'development',
  HOST: '127.0.0.1',
  MAIL_FAKE: '1',
};
run(
  'api',
  ['node_modules/tsx/dist/cli.mjs', 'watch', '--clear-screen=false', 'server/index.ts'],
  env,
);
run('vite', ['node_modules/vite/bin/vite.js'], env);
process.once('SIGINT', () => stop(0));
process.once('SIGTERM', () => stop(0));
