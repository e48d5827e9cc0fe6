import { spawn } from 'node:child_process';
import { existsSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { processCpuMs, processTreeCpuMs } from './process-cpu';

/** Burns `ms` of this process's CPU time, as Node's own getrusage counts it. */
function burn(ms: number) {
  const start = process.cpuUsage();
  let x = 0;
  while ((process.cpuUsage(start).user + process.cpuUsage(start).system) / 1000 < ms)
    x += Math.sqrt(x + 1);
  return x;
}

describe.runIf(existsSync('/proc/self/stat'))('process CPU from /proc', () => {
  it('agrees with Node’s process.cpuUsage (getrusage) to within a few clock ticks', () => {
    const before = processCpuMs(process.pid)!;
    const usage = process.cpuUsage();
    burn(300);
    const used = process.cpuUsage(usage);
    const delta = processCpuMs(process.pid)! - before;
    // /proc counts in 10 ms ticks (man 5 proc); allow three of them either way.
    expect(Math.abs(delta - (used.user + used.system) / 1000)).toBeLessThanOrEqual(30);
  });

  it('counts a live child’s CPU in its parent’s tree', async () => {
    const child = spawn(
      process.execPath,
      [
        '-e',
        `const s = process.cpuUsage(); let x = 0;
         while ((process.cpuUsage(s).user + process.cpuUsage(s).system) < 300000) x += Math.sqrt(x + 1);
         process.stdout.write('spun\\n'); process.stdin.resume();`,
      ],
      { stdio: ['pipe', 'pipe', 'inherit'] },
    );
    try {
      const before = processTreeCpuMs(process.pid)!;
      const own = processCpuMs(process.pid)!;
      await new Promise<void>((resolve) => child.stdout!.once('data', () => resolve()));
      const childShare =
        processTreeCpuMs(process.pid)! - before - (processCpuMs(process.pid)! - own);
      expect(childShare).toBeGreaterThanOrEqual(270);
    } finally {
      child.kill();
      await new Promise((resolve) => child.once('exit', resolve));
    }
  });

  it('answers null for a process that does not exist', () => {
    expect(processCpuMs(2 ** 22 + 1)).toBeNull();
    expect(processTreeCpuMs(2 ** 22 + 1)).toBeNull();
  });
});
