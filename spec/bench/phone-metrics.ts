/**
 * The pieces of `bench:phone` that touch the browser and the wire: a byte-counting loopback proxy in
 * front of the server (it sees every byte, the service worker's own fetches included, which a page's
 * DevTools session does not), mobile throttling through CDP, and Chromium's own performance entries
 * (largest-contentful-paint, layout-shift, longtask, paint) gathered by an init script.
 */
import { createServer, connect, type Server, type Socket } from 'node:net';
import type { BrowserContext, Page } from 'playwright-core';

/**
 * Mobile throttling, as Lighthouse's mobile preset describes its target: 1.6 Mbps down, 750 kbps up,
 * 150 ms round trip, a CPU four times slower than this machine (Lighthouse documentation, "throttling").
 */
export const MOBILE = { downloadBps: 1_600_000, uploadBps: 750_000, rttMs: 150, cpuSlowdown: 4 } as const;

/** A loopback TCP proxy that counts the bytes the server sends (response headers and bodies, as on the wire). */
export interface WireCounter {
  port: number;
  /** Bytes sent by the server since the last reset. */
  bytes(): number;
  reset(): void;
  close(): Promise<void>;
}

/** Starts a counting proxy to `targetPort` on 127.0.0.1, listening on a free port. */
export function startWireCounter(targetPort: number): Promise<WireCounter> {
  let received = 0;
  const sockets = new Set<Socket>();
  const server: Server = createServer((client) => {
    const upstream = connect(targetPort, '127.0.0.1');
    sockets.add(client).add(upstream);
    upstream.on('data', (chunk: Buffer) => (received += chunk.length));
    client.pipe(upstream);
    upstream.pipe(client);
    const end = (): void => {
      client.destroy();
      upstream.destroy();
      sockets.delete(client);
      sockets.delete(upstream);
    };
    client.on('error', end).on('close', end);
    upstream.on('error', end).on('close', end);
  });
  return new Promise((done, reject) => {
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const address = server.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      done({
        port,
        bytes: () => received,
        reset: () => (received = 0),
        close: () =>
          new Promise<void>((closed) => {
            for (const s of sockets) s.destroy();
            server.close(() => closed());
          }),
      });
    });
  });
}

/** Applies the mobile network and CPU throttling to one page through its own CDP session. */
export async function throttle(context: BrowserContext, page: Page): Promise<void> {
  const cdp = await context.newCDPSession(page);
  await cdp.send('Network.enable');
  await cdp.send('Network.emulateNetworkConditions', {
    offline: false,
    latency: MOBILE.rttMs,
    downloadThroughput: MOBILE.downloadBps / 8,
    uploadThroughput: MOBILE.uploadBps / 8,
  });
  await cdp.send('Emulation.setCPUThrottlingRate', { rate: MOBILE.cpuSlowdown });
}

/**
 * Collects the page's performance entries from its first moment. CLS is the largest session window
 * of layout shifts without recent input (gaps under 1 s, windows at most 5 s), as web.dev defines it;
 * "main content" is the first frame after an element matching `mainSelector` has a size.
 */
export function metricsInitScript(mainSelector: string): string {
  return `(() => {
  const mainSelector = ${JSON.stringify(mainSelector)};
  const m = { lcpMs: 0, fcpMs: 0, cls: 0, longTasks: [], mainMs: 0 };
  window.__llMetrics = m;
  const observe = (type, fn) => { try { new PerformanceObserver((list) => list.getEntries().forEach(fn)).observe({ type, buffered: true }); } catch {} };
  observe('largest-contentful-paint', (e) => { m.lcpMs = e.renderTime || e.loadTime || e.startTime; });
  observe('paint', (e) => { if (e.name === 'first-contentful-paint') m.fcpMs = e.startTime; });
  observe('longtask', (e) => { m.longTasks.push([e.startTime, e.duration]); });
  let windowStart = -1, last = -1, windowValue = 0;
  observe('layout-shift', (e) => {
    if (e.hadRecentInput) return;
    if (windowStart < 0 || e.startTime - last > 1000 || e.startTime - windowStart > 5000) { windowStart = e.startTime; windowValue = 0; }
    last = e.startTime; windowValue += e.value; m.cls = Math.max(m.cls, windowValue);
  });
  const watch = () => {
    const selector = mainSelector;
    const check = () => {
      if (m.mainMs) return;
      const el = document.querySelector(selector);
      if (el && el.getBoundingClientRect().height > 0) { requestAnimationFrame(() => { if (!m.mainMs) m.mainMs = performance.now(); }); observer.disconnect(); }
    };
    const observer = new MutationObserver(check);
    document.addEventListener('DOMContentLoaded', () => { observer.observe(document.body, { childList: true, subtree: true, attributes: true }); check(); });
  };
  watch();
})();`;
}

/** One screen's figures. */
export interface ScreenFigures {
  /** Bytes the server sent while the screen loaded (to network quiet). */
  pageBytes: number;
  /** Bytes including what the service worker fetched in the background to cache the app. */
  totalBytes: number;
  lcpMs: number;
  /** When the screen's main content was first painted (0 when not watched). */
  mainMs: number;
  tbtMs: number;
  cls: number;
  /** Longest task on the main thread. */
  longestTaskMs: number;
}

interface RawMetrics {
  lcpMs: number;
  fcpMs: number;
  cls: number;
  longTasks: [number, number][];
  mainMs: number;
}

/** Reads the gathered entries; TBT = Σ (long task − 50 ms) for tasks from FCP to now. */
export async function readMetrics(page: Page): Promise<Omit<ScreenFigures, 'pageBytes' | 'totalBytes'>> {
  const raw = await page.evaluate(() => (window as unknown as { __llMetrics: RawMetrics }).__llMetrics);
  let tbtMs = 0;
  let longestTaskMs = 0;
  for (const [start, duration] of raw.longTasks) {
    longestTaskMs = Math.max(longestTaskMs, duration);
    if (start + duration > raw.fcpMs) tbtMs += Math.max(0, duration - 50);
  }
  return { lcpMs: raw.lcpMs, mainMs: raw.mainMs, tbtMs, cls: raw.cls, longestTaskMs };
}
