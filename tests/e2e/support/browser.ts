import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, type BrowserContext } from 'playwright-core';

/**
 * Debian's chromium, headless, driven by playwright-core: no browser is
 * downloaded. Every background service that could reach the network is off,
 * and each launch gets a fresh profile folder (a persistent context on
 * it, so a page reload keeps the page's localStorage as a user's browser does).
 */
export function chromiumPath(): string {
  for (const candidate of [process.env.CHROMIUM_PATH, '/usr/bin/chromium', '/usr/bin/chromium-browser']) {
    if (candidate && existsSync(candidate)) return candidate;
  }
  try {
    return execFileSync('sh', ['-c', 'command -v chromium || command -v chromium-browser'], { encoding: 'utf8' }).trim();
  } catch {
    throw new Error('chromium was not found: install it (apt-get install -y chromium) or set CHROMIUM_PATH');
  }
}

export interface LaunchedBrowser {
  context: BrowserContext;
  close(): Promise<void>;
}

export async function launchChromium(): Promise<LaunchedBrowser> {
  const profile = mkdtempSync(join(tmpdir(), 'spotloom-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: chromiumPath(),
    headless: true,
    viewport: { width: 1500, height: 950 },
    timezoneId: 'America/Sao_Paulo', // as in vitest.config.ts: nothing may depend on the machine's zone
    locale: 'en-US',
    args: [
      '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking',
      '--disable-component-update', '--disable-sync', '--disable-default-apps', '--disable-extensions',
      '--disable-domain-reliability', '--metrics-recording-only', '--no-default-browser-check',
    ],
  });
  return {
    context,
    close: async () => {
      await context.close().catch(() => undefined);
      rmSync(profile, { recursive: true, force: true });
    },
  };
}
