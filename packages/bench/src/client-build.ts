import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import * as chromeLauncher from 'chrome-launcher';
import lighthouse from 'lighthouse';
import { round } from './load.ts';

export interface BuildSizes {
  jsFiles: string[];
  cssFiles: string[];
  initialJsGzipKiB: number;
  initialCssGzipKiB: number;
  initialJsRawKiB: number;
}

/** What a first visit downloads before the app can run: index.html's entry script, its modulepreloads and stylesheets. */
export function initialBuildSizes(distDir: string): BuildSizes {
  const html = readFileSync(join(distDir, 'index.html'), 'utf8');
  const attr = (tag: string, name: string) => new RegExp(`${name}="([^"]+)"`).exec(tag)?.[1] ?? null;
  const tags = html.match(/<(script|link)\b[^>]*>/g) ?? [];
  const js = new Set<string>();
  const css = new Set<string>();
  for (const tag of tags) {
    if (tag.startsWith('<script') && attr(tag, 'type') === 'module' && attr(tag, 'src')) js.add(attr(tag, 'src')!);
    if (tag.startsWith('<link') && attr(tag, 'rel') === 'modulepreload' && attr(tag, 'href'))
      js.add(attr(tag, 'href')!);
    if (tag.startsWith('<link') && attr(tag, 'rel') === 'stylesheet' && attr(tag, 'href')) css.add(attr(tag, 'href')!);
  }
  const bytes = (files: Set<string>, gzip: boolean) =>
    [...files].reduce((sum, file) => {
      const content = readFileSync(join(distDir, file.replace(/^\//, '')));
      return sum + (gzip ? gzipSync(content).length : content.length);
    }, 0);
  return {
    jsFiles: [...js],
    cssFiles: [...css],
    initialJsGzipKiB: round(bytes(js, true) / 1024),
    initialCssGzipKiB: round(bytes(css, true) / 1024),
    initialJsRawKiB: round(bytes(js, false) / 1024),
  };
}

export const chromiumFlags = [
  '--headless=new',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

export interface LighthouseScore {
  url: string;
  performance: number | null;
  firstContentfulPaintMs: number | null;
  largestContentfulPaintMs: number | null;
  totalBlockingTimeMs: number | null;
  cumulativeLayoutShift: number | null;
  error?: string;
}

/** Lighthouse's default (mobile) profile, simulated throttling, on Debian's Chromium; one run per page. */
export async function lighthouseScore(url: string, cookie?: string): Promise<LighthouseScore> {
  const chrome = await chromeLauncher.launch({
    chromePath: '/usr/bin/chromium',
    chromeFlags: chromiumFlags,
    logLevel: 'error',
  });
  try {
    const result = await lighthouse(url, {
      port: chrome.port,
      output: 'json',
      logLevel: 'error',
      onlyCategories: ['performance'],
      ...(cookie && { extraHeaders: { Cookie: cookie } }),
    });
    const lhr = result?.lhr;
    if (!lhr) throw new Error('Lighthouse gave no result.');
    const metric = (id: string) =>
      lhr.audits[id]?.numericValue === undefined
        ? null
        : round(lhr.audits[id].numericValue, id === 'cumulative-layout-shift' ? 3 : 0);
    const score = lhr.categories.performance?.score;
    return {
      url,
      performance: score === null || score === undefined ? null : Math.round(score * 100),
      firstContentfulPaintMs: metric('first-contentful-paint'),
      largestContentfulPaintMs: metric('largest-contentful-paint'),
      totalBlockingTimeMs: metric('total-blocking-time'),
      cumulativeLayoutShift: metric('cumulative-layout-shift'),
      ...(lhr.runtimeError && { error: lhr.runtimeError.message }),
    };
  } catch (error) {
    return {
      url,
      performance: null,
      firstContentfulPaintMs: null,
      largestContentfulPaintMs: null,
      totalBlockingTimeMs: null,
      cumulativeLayoutShift: null,
      error: error instanceof Error ? error.message : String(error),
    };
  } finally {
    chrome.kill();
  }
}
