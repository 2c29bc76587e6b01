// Support of the browser tests and the `web` benchmark: the system Chromium driven by Playwright
// (never a downloaded browser), the built page served from 127.0.0.1 on a free port, and the
// generated measured files the tests upload. Plain JavaScript so the benchmark runner imports it too.
import { execFileSync } from 'node:child_process';
import { createWriteStream, existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { chromium } from 'playwright';
import { mulberry32, referenceStream } from '../../../../fixtures/generate.mjs';
import { startStaticServer } from '../../scripts/staticServer.mjs';

/** The built page. */
export const DIST = fileURLToPath(new URL('../../dist/', import.meta.url));

/** The Chromium to drive: LOOPWISE_CHROMIUM, or Debian's chromium on PATH; null when there is none. */
export function chromiumBinary() {
  const given = process.env.LOOPWISE_CHROMIUM;
  if (given) return existsSync(given) ? given : null;
  for (const name of ['chromium', 'chromium-browser']) {
    try {
      const path = execFileSync('sh', ['-c', `command -v ${name}`], { encoding: 'utf8' }).trim();
      if (path) return path;
    } catch {
      // not on PATH
    }
  }
  return null;
}

/** True when the page has been built (pnpm test and pnpm web build it). */
export function pageBuilt() {
  return existsSync(new URL('../../dist/index.html', import.meta.url));
}

/** Starts the static server on the built page and a headless Chromium. */
export async function startBrowser(binary) {
  const server = await startStaticServer(DIST);
  const browser = await chromium.launch({ executablePath: binary, args: ['--no-sandbox', '--disable-dev-shm-usage'] });
  return {
    url: server.url,
    browser,
    async stop() {
      await browser.close();
      await server.close();
    },
  };
}

/**
 * Opens the page at `width` × `height` and records what must not happen: console errors, page
 * errors, and any request that leaves the page's origin (blob: URLs of its own downloads are
 * of its origin). `init` (a function) runs in the page before its own scripts.
 */
export async function openPage(browser, url, width = 1200, height = 900, init = null) {
  const context = await browser.newContext({ viewport: { width, height }, acceptDownloads: true, serviceWorkers: 'block' });
  const page = await context.newPage();
  if (init !== null) await page.addInitScript(init);
  const origin = new URL(url).origin;
  const problems = { consoleErrors: [], outside: [] };
  page.on('console', (m) => {
    if (m.type() === 'error') problems.consoleErrors.push(m.text());
  });
  page.on('pageerror', (e) => problems.consoleErrors.push(`page error: ${e.message}`));
  await context.route('**/*', (route) => {
    const u = route.request().url();
    if (new URL(u).origin === origin) return route.continue();
    problems.outside.push(u);
    return route.abort();
  });
  context.on('request', (r) => {
    const u = r.url();
    if (!(u.startsWith(origin + '/') || u.startsWith(`blob:${origin}/`) || u.startsWith('data:'))) problems.outside.push(u);
  });
  await page.goto(url);
  return { context, page, problems };
}

/**
 * Writes a measured file as a data logger would (invented data, for tests): a semicolon-separated
 * table with a units row and decimal commas, columns `t` [s], `SG1` [`unit`, default µε] and
 * `T_oil` [°C]; SG1 is the reference history of fixtures/generate.mjs times `scale` (default 4),
 * rounded to 0.01. `spikes` one-sample spikes of 8000 units are put in at seeded places. Returns
 * the SG1 values as written (the numbers the file holds, exactly).
 */
export async function writeStrainFile(path, samples, { spikes = 0, seed = 11, unit = 'µε', scale = 4 } = {}) {
  const [values] = await writeLoggerFile(path, samples, [{ name: 'SG1', unit, scale, spikes, seed, stream: referenceStream() }]);
  return values;
}

/**
 * As {@link writeStrainFile} with two gauges: `SG1` [µε] (the reference history × 4) and `SG2`
 * [MPa] (the reference history of another seed × 0.5). Returns both as written.
 */
export async function writeTwoGaugeFile(path, samples) {
  return writeLoggerFile(path, samples, [
    { name: 'SG1', unit: 'µε', scale: 4, spikes: 0, seed: 1, stream: referenceStream() },
    { name: 'SG2', unit: 'MPa', scale: 0.5, spikes: 0, seed: 2, stream: referenceStream(0x2bad5eed) },
  ]);
}

async function writeLoggerFile(path, samples, signals) {
  const out = createWriteStream(path);
  const chunks = signals.map(() => new Float64Array(65536));
  const values = signals.map(() => new Float64Array(samples));
  const spikeAt = signals.map((g) => {
    const next = mulberry32(g.seed);
    const at = new Set();
    while (at.size < g.spikes) at.add(100 + Math.floor(next() * (samples - 200)));
    return at;
  });
  const write = (text) => (out.write(text) ? Promise.resolve() : new Promise((r) => out.once('drain', r)));
  const comma = (x) => String(x).replace('.', ',');
  await write(`t;${signals.map((g) => g.name).join(';')};T_oil\n[s];${signals.map((g) => `[${g.unit}]`).join(';')};[°C]\n`);
  for (let at = 0; at < samples; at += 65536) {
    signals.forEach((g, j) => g.stream.fill(chunks[j]));
    const n = Math.min(65536, samples - at);
    const lines = [];
    for (let k = 0; k < n; k++) {
      const i = at + k;
      const fields = signals.map((g, j) => {
        let v = Math.round(100 * g.scale * chunks[j][k]) / 100;
        if (spikeAt[j].has(i)) v = Math.round(100 * (v + (i % 2 ? 1 : -1) * 8000)) / 100;
        values[j][i] = v;
        return comma(v);
      });
      lines.push(`${(i / 200).toFixed(3).replace('.', ',')};${fields.join(';')};${(40 + (i % 7) / 10).toFixed(1).replace('.', ',')}\n`);
    }
    await write(lines.join(''));
  }
  await new Promise((resolve, reject) => out.end((e) => (e ? reject(e) : resolve())));
  return values;
}

/**
 * Runs in the page before its scripts (for `openPage`'s `init`): notes every main-thread task
 * longer than 50 ms that the browser reports (PerformanceObserver, entry type 'longtask') in
 * `window.__longTasks` as [start, duration] in ms.
 */
export function observeLongTasks() {
  window.__longTasks = [];
  new PerformanceObserver((list) => {
    for (const e of list.getEntries()) window.__longTasks.push([e.startTime, e.duration]);
  }).observe({ type: 'longtask', buffered: true });
}

/**
 * Whether the page's long-task observer ({@link observeLongTasks}) is live: a busy 120 ms task of
 * the page's own event loop (a timer, not the caller's evaluation) must be reported within 500 ms.
 */
export async function longTaskObserverIsLive(page) {
  await page.evaluate(() => {
    setTimeout(() => {
      const t = performance.now();
      while (performance.now() - t < 120);
    }, 0);
  });
  await page.waitForTimeout(500);
  return page.evaluate(() => window.__longTasks.some((t) => t[1] >= 110));
}
