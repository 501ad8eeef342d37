import { join } from 'node:path';
import { inject } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { launchBrowser } from '../setup/chromium';

export const baseUrl = () => inject('baseUrl');

/** Where screenshots go (git-ignored). */
export function screenshotPath(name: string): string {
  return join(inject('artifactsDir'), 'screenshots', `${name}.png`);
}

export interface BrowserSession {
  browser: Browser;
  context: BrowserContext;
  page: Page;
  /** Every URL the page asked for that did not go to 127.0.0.1 (or a data:/blob: URL), map tiles aside. */
  offsiteRequests: string[];
  /** Requests to the map's tile server: expected, and expected to fail on a machine with no network. */
  tileRequests: string[];
  /** Console errors and uncaught page errors (failed map tiles aside). */
  pageErrors: string[];
}

/** The client's default tile server (src/components/map/mapConfig.ts); tests build without VITE_TILE_URL. */
export const TILE_SERVER_HOST = 'tile.openstreetmap.org';

/** True for a request to the map's tile server. */
export function isTileRequest(url: string): boolean {
  try {
    const { hostname } = new URL(url);
    return hostname === TILE_SERVER_HOST || hostname.endsWith(`.${TILE_SERVER_HOST}`);
  } catch {
    return false;
  }
}

/** Options of {@link openBrowser} beyond the viewport. */
export interface BrowserOptions {
  /** The browser's own time zone (IANA), e.g. to check that times follow the site's zone instead. */
  timezoneId?: string;
}

/** A fresh browser with a phone-or-desktop viewport, recording off-site requests and page errors. */
export async function openBrowser(viewport = { width: 1280, height: 860 }, options: BrowserOptions = {}): Promise<BrowserSession> {
  const browser = await launchBrowser();
  const context = await browser.newContext({ viewport, baseURL: baseUrl(), ...(options.timezoneId ? { timezoneId: options.timezoneId } : {}) });
  const page = await context.newPage();
  const offsiteRequests: string[] = [];
  const tileRequests: string[] = [];
  const pageErrors: string[] = [];
  page.on('request', (req) => {
    const url = new URL(req.url());
    if (url.protocol === 'data:' || url.protocol === 'blob:') return;
    if (isTileRequest(req.url())) tileRequests.push(req.url());
    else if (url.hostname !== '127.0.0.1') offsiteRequests.push(req.url());
  });
  page.on('pageerror', (error) => pageErrors.push(error.message));
  page.on('console', (msg) => {
    if (msg.type() !== 'error') return;
    // A tile that cannot load is the offline case the map handles; it is not a page error.
    if (isTileRequest(msg.location().url)) return;
    pageErrors.push(msg.text());
  });
  return { browser, context, page, offsiteRequests, tileRequests, pageErrors };
}

/**
 * Makes every map tile fail, as with no network, whether or not this machine has one: the map
 * must then show its offline base. The requests are still recorded in `tileRequests`.
 */
export async function failTileRequests(session: BrowserSession): Promise<void> {
  await session.context.route((url) => isTileRequest(url.toString()), (route) => route.abort('internetdisconnected'));
}

/** Clicks the element at a point given as fractions of its width and height (0..1). */
export async function clickAt(page: Page, selector: string, fx: number, fy: number): Promise<void> {
  const target = page.locator(selector).first();
  await target.scrollIntoViewIfNeeded();
  const box = await target.boundingBox();
  if (!box) throw new Error(`${selector} is not visible`);
  await page.mouse.click(box.x + box.width * fx, box.y + box.height * fy);
}

export async function signIn(page: Page, email: string, password: string): Promise<void> {
  await page.goto('/signin');
  await page.locator('input[name="email"]').fill(email);
  await page.locator('input[name="password"]').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByTestId('home-greeting').waitFor();
}

/**
 * Evaluates a JavaScript expression in the page. Written as a string because the test code is
 * type-checked without the DOM library (it runs in Node).
 */
export function evalInPage<T>(page: Page, expression: string): Promise<T> {
  return page.evaluate(expression) as Promise<T>;
}

/** The computed value of a CSS property on the first element matching the selector. */
export function computedStyle(page: Page, selector: string, property: string): Promise<string> {
  return evalInPage(page, `getComputedStyle(document.querySelector(${JSON.stringify(selector)})).getPropertyValue(${JSON.stringify(property)})`);
}
