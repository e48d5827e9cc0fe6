/**
 * Browser benchmark: a pilot drops a ~100 MB synthesised log on the import page of the built
 * client, served by the real server, in headless Chromium. Measured: time from the drop to the
 * verdict on screen, and the longest main-thread task meanwhile (PerformanceObserver
 * 'longtask', which reports tasks over 50 ms). Targets (tests/bench/README.md §1.3): ≤ 3 s to the verdict,
 * no task over 100 ms. Reference in the same run: the time the same page takes to read the
 * file's bytes once in a worker (`Blob.arrayBuffer`), the floor any import of it has to pay.
 *
 * `BENCH_CPU_SLOWDOWN=3` runs both pages on a CPU emulated that many times slower (Chromium's
 * DevTools CPU throttling): on a quiet machine the long tasks a busy or slower one would see
 * show up. The default, 1, measures the machine as it is.
 */
import { execFileSync } from 'node:child_process';
import { closeSync, existsSync, mkdtempSync, openSync, rmSync, statSync, writeSync } from 'node:fs';
import { join } from 'node:path';
import { tmpdir } from 'node:os';
import { chromium, type Browser, type Page } from '@playwright/test';
import { freePort, spawnServer } from '../server/helpers/spawn-server';
import { scenarios } from '../../shared/sim/scenarios';
import { simulate } from '../../shared/sim/simulate';
import { writeCanonicalCsvBytes } from '../../shared/sim/csv-writer';
import type { Bench } from './registry';

const TARGET_MB = 100;

/** Emulated CPU slowdown for both pages (1 = none). */
function cpuSlowdown(): number {
  const v = Number(process.env.BENCH_CPU_SLOWDOWN ?? '1');
  if (!Number.isFinite(v) || v < 1) throw new Error('BENCH_CPU_SLOWDOWN must be a number ≥ 1');
  return v;
}

async function slowDown(page: Page, rate: number): Promise<void> {
  if (rate === 1) return;
  const cdp = await page.context().newCDPSession(page);
  await cdp.send('Emulation.setCPUThrottlingRate', { rate });
}

/** A weak-motor flight at 4 kHz, long enough for ~100 MB of canonical CSV; kept between runs. */
function ensureLog(dir: string): string {
  const path = join(dir, 'browser-weak-motor-100mb.csv');
  if (existsSync(path) && statSync(path).size > TARGET_MB * 0.9e6) return path;
  const scenario = scenarios['weak-motor']!;
  // Measured: this scenario writes ~140 bytes a row, so 100 MB is ~180 s at 4 kHz.
  const { log } = simulate(scenario, { seconds: 180, rateHz: 4000, seed: 11 });
  const fd = openSync(path, 'w');
  try {
    for (const chunk of writeCanonicalCsvBytes(log, {
      metadata: { aircraft: 'Kite', scenario: 'weak-motor' },
    }))
      writeSync(fd, chunk);
  } finally {
    closeSync(fd);
  }
  return path;
}

const bench: Bench = async ({ json, dir }) => {
  const say = (s: string) => {
    if (!json) console.log(s);
  };
  const slowdown = cpuSlowdown();
  const root = process.cwd();
  // Our own build folder, so a shared `dist/` being rebuilt by someone else cannot interfere;
  // outside `.bench/` because the static server refuses paths through dot-folders.
  const site = mkdtempSync(join(tmpdir(), 'hoverprint-bench-site-'));
  say('building the client…');
  execFileSync(
    process.execPath,
    [
      join(root, 'node_modules/vite/bin/vite.js'),
      'build',
      '--outDir',
      join(site, 'dist'),
      '--emptyOutDir',
    ],
    {
      cwd: root,
      stdio: json ? 'ignore' : ['ignore', 'ignore', 'inherit'],
    },
  );
  const file = ensureLog(dir);
  const fileMB = statSync(file).size / 1e6;
  say(`log: ${file} (${fileMB.toFixed(1)} MB)`);

  const port = await freePort();
  const dataDir = mkdtempSync(join(tmpdir(), 'hoverprint-bench-browser-'));
  const base = `http://127.0.0.1:${port}`;
  // The server process itself, in the site folder so it serves that build; stopped (and its
  // port checked closed) in the finally below whatever happens in between.
  const server = await spawnServer(
    {
      NODE_ENV: 'production',
      DATA_DIR: dataDir,
      PUBLIC_URL: base,
      LOG_LEVEL: 'silent',
    },
    { cwd: site, port },
  );
  let browser: Browser | undefined;
  try {
    browser = await chromium.launch({
      executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
      args: [
        '--headless',
        '--no-sandbox',
        '--disable-gpu',
        '--no-first-run',
        '--disable-background-networking',
        '--disable-component-update',
        '--disable-sync',
      ],
    });
    const page = await browser.newPage({ viewport: { width: 1440, height: 1000 } });
    await slowDown(page, slowdown);
    await page.addInitScript(() => {
      const w = window as unknown as { __longest: number; __tasks: number };
      w.__longest = 0;
      w.__tasks = 0;
      new PerformanceObserver((list) => {
        for (const e of list.getEntries()) {
          w.__tasks++;
          if (e.duration > w.__longest) w.__longest = e.duration;
        }
      }).observe({ type: 'longtask' });
    });

    const dropOnce = async () => {
      await page.goto(`${base}/import`);
      await page.getByRole('button', { name: 'Choose files…' }).waitFor();
      await page.evaluate(() => {
        const w = window as unknown as { __longest: number; __tasks: number };
        w.__longest = 0;
        w.__tasks = 0;
      });
      const t0 = Date.now();
      await page.getByLabel('Flight logs').setInputFiles(file);
      await page.getByRole('region', { name: 'Verdict' }).waitFor({ timeout: 120_000 });
      const verdictMs = Date.now() - t0;
      // Let the charts below the verdict finish their first paint before reading the longest task.
      await page.waitForTimeout(500);
      const { longest, tasks } = await page.evaluate(() => {
        const w = window as unknown as { __longest: number; __tasks: number };
        return { longest: w.__longest, tasks: w.__tasks };
      });
      return { verdictMs, longestTaskMs: longest, tasks };
    };

    // Reference: reading the same file's bytes once in a worker, in a page of its own.
    const refPage = await browser.newPage();
    await slowDown(refPage, slowdown);
    await refPage.goto(`${base}/import`);
    await refPage.getByRole('button', { name: 'Choose files…' }).waitFor();
    const refHandle = refPage.evaluate(async () => {
      const input = document.querySelector('input[type=file]') as HTMLInputElement;
      return new Promise<number>((res) => {
        input.addEventListener(
          'change',
          (e) => {
            e.stopImmediatePropagation();
            const f = input.files![0]!;
            const src =
              'onmessage = async (e) => { const t = performance.now(); await e.data.arrayBuffer(); postMessage(performance.now() - t); }';
            const worker = new Worker(
              URL.createObjectURL(new Blob([src], { type: 'text/javascript' })),
            );
            worker.onmessage = (m) => {
              worker.terminate();
              res(m.data as number);
            };
            worker.postMessage(f);
          },
          { capture: true, once: true },
        );
      });
    });
    await refPage.locator('input[type=file]').setInputFiles(file);
    const bytesReadMs = await refHandle;
    await refPage.close();

    // The first drop warms the worker bundles and the page cache; the best of the next two is reported.
    await dropOnce();
    const runs = [await dropOnce(), await dropOnce()];
    const best = runs.reduce((a, b) => (b.verdictMs < a.verdictMs ? b : a));
    const longestTaskMs = Math.max(...runs.map((r) => r.longestTaskMs));
    if (slowdown !== 1) say(`CPU emulated ${slowdown}× slower on both pages`);
    say(`reference: reading the file's bytes once in a worker: ${bytesReadMs.toFixed(0)} ms`);
    say(
      `drop → verdict: ${best.verdictMs} ms (${(best.verdictMs / bytesReadMs).toFixed(1)}× the byte read) — target ≤ 3000 ms`,
    );
    say(
      `longest main-thread task: ${longestTaskMs.toFixed(0)} ms (${Math.max(...runs.map((r) => r.tasks))} tasks over 50 ms) — target ≤ 100 ms`,
    );
    return {
      fileMB: Math.round(fileMB * 10) / 10,
      verdictMs: best.verdictMs,
      longestTaskMs: Math.round(longestTaskMs),
      bytesReadMs: Math.round(bytesReadMs),
      cpuSlowdown: slowdown,
    };
  } finally {
    await browser?.close();
    await server.stop();
    rmSync(dataDir, { recursive: true, force: true });
    rmSync(site, { recursive: true, force: true });
  }
};

export default bench;
