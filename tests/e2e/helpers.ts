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
  /** Every URL the page asked for that did not go to 127.0.0.1 (or a data:/blob: URL). */
  offsiteRequests: string[];
  /** Console errors and uncaught page errors. */
  pageErrors: string[];
}

/** A fresh browser with a phone-or-desktop viewport, recording off-site requests and page errors. */
export async function openBrowser(viewport = { width: 1280, height: 860 }): Promise<BrowserSession> {
  const browser = await launchBrowser();
  const context = await browser.newContext({ viewport, baseURL: baseUrl() });
  const page = await context.newPage();
  const offsiteRequests: string[] = [];
  const pageErrors: string[] = [];
  page.on('request', (req) => {
    const url = new URL(req.url());
    if (url.protocol === 'data:' || url.protocol === 'blob:') return;
    if (url.hostname !== '127.0.0.1') offsiteRequests.push(req.url());
  });
  page.on('pageerror', (error) => pageErrors.push(error.message));
  page.on('console', (msg) => { if (msg.type() === 'error') pageErrors.push(msg.text()); });
  return { browser, context, page, offsiteRequests, pageErrors };
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
