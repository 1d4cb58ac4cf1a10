import { chromium, type Browser } from 'playwright-core';

export const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

// Debian's Chromium, headless; the background-networking flags stop it calling hosts this
// network refuses. Playwright gives each launch a fresh temporary profile of its own.
const FLAGS = [
	'--headless',
	'--no-sandbox',
	'--disable-gpu',
	'--disable-quic',
	'--no-first-run',
	'--disable-background-networking',
	'--disable-component-update',
	'--disable-sync'
];

export function launchChromium(): Promise<Browser> {
	return chromium.launch({ executablePath: CHROMIUM, args: FLAGS });
}
