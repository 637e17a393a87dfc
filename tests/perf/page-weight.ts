// What a phone pays to open each page: the JavaScript it downloads (compressed bytes as sent) and
// the main thread's total blocking time, measured in Debian's Chromium at phone size with the CPU
// slowed 4× by Chromium's own throttling (DevTools protocol, Emulation.setCPUThrottlingRate).
// Total blocking time: the part over 50 ms of every long task after the first contentful paint,
// until the network has been quiet for half a second and a second more has passed (the usual
// definition runs to time-to-interactive; a page with no long task after that point adds none).
import { chromium } from '@playwright/test';

export type PageWeight = {
	page: string;
	path: string;
	jsKb: number;
	tbtMs: number;
	scripts: number;
	/** Every opening's blocking time, for the spread. */
	tbtRunsMs?: number[];
};

/** Each page opened `times` times in a fresh context; the median blocking time is reported. */
export async function benchPageWeight(
	origin: string,
	pages: { name: string; path: string }[],
	times = 3
) {
	const browser = await chromium.launch({
		executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
		args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run']
	});
	const out: PageWeight[] = [];
	try {
		for (const p of pages) {
			const runs: PageWeight[] = [];
			for (let t = 0; t < times; t++) runs.push(await open(p));
			const by = [...runs].sort((a, b) => a.tbtMs - b.tbtMs);
			out.push({ ...by[Math.floor(by.length / 2)], tbtRunsMs: runs.map((r) => r.tbtMs) });
		}
	} finally {
		await browser.close();
	}
	return out;

	async function open(p: { name: string; path: string }): Promise<PageWeight> {
		{
			const ctx = await browser.newContext({
				viewport: { width: 390, height: 844 },
				deviceScaleFactor: 2,
				isMobile: true,
				hasTouch: true
			});
			const page = await ctx.newPage();
			const cdp = await ctx.newCDPSession(page);
			await cdp.send('Emulation.setCPUThrottlingRate', { rate: 4 });
			await page.addInitScript(() => {
				const w = window as unknown as { longTasks: [number, number][] };
				w.longTasks = [];
				new PerformanceObserver((list) => {
					for (const e of list.getEntries()) w.longTasks.push([e.startTime, e.duration]);
				}).observe({ type: 'longtask', buffered: true });
			});
			const sizes: Promise<number>[] = [];
			page.on('requestfinished', (req) => {
				if (req.resourceType() === 'script')
					sizes.push(req.sizes().then((s) => s.responseBodySize));
			});
			await page.goto(origin + p.path, { waitUntil: 'networkidle' });
			await page.waitForTimeout(1000);
			const { fcp, long } = await page.evaluate(() => ({
				fcp: performance.getEntriesByName('first-contentful-paint')[0]?.startTime ?? 0,
				long: (window as unknown as { longTasks: [number, number][] }).longTasks
			}));
			const tbt = long
				.filter(([start]) => start >= fcp)
				.reduce((a, [, d]) => a + Math.max(0, d - 50), 0);
			const bytes = (await Promise.all(sizes)).reduce((a, b) => a + b, 0);
			await ctx.close();
			return {
				page: p.name,
				path: p.path,
				jsKb: Number((bytes / 1024).toFixed(1)),
				tbtMs: Math.round(tbt),
				scripts: sizes.length
			};
		}
	}
}
