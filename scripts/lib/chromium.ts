/** Debian's Chromium, and the flags that keep it quiet on a machine without a network (browser tests, Lighthouse). */
export const chromiumPath = '/usr/bin/chromium';

export const chromiumFlags = [
	'--no-sandbox',
	'--disable-gpu',
	'--disable-background-networking',
	'--disable-component-update',
	'--disable-sync',
	'--no-first-run'
];
