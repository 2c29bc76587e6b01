// Types of browser.mjs for the TypeScript tests.
import type { Browser, BrowserContext, Page } from 'playwright';

export const DIST: string;
export function chromiumBinary(): string | null;
export function pageBuilt(): boolean;
export function startBrowser(binary: string): Promise<{ url: string; browser: Browser; stop(): Promise<void> }>;
export function openPage(browser: Browser, url: string, width?: number, height?: number, init?: (() => void) | null): Promise<{ context: BrowserContext; page: Page; problems: { consoleErrors: string[]; outside: string[] } }>;
export function writeStrainFile(path: string, samples: number, options?: { spikes?: number; seed?: number; unit?: string; scale?: number }): Promise<Float64Array>;
export function observeLongTasks(): void;
export function longTaskObserverIsLive(page: import('playwright').Page): Promise<boolean>;
export function writeTwoGaugeFile(path: string, samples: number): Promise<Float64Array[]>;
