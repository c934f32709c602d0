/**
 * How smooth is a 100 000-point spectrum? Draws one in headless Chromium with uPlot set up as the
 * recording page's spectrum chart (log magnitude scale, harmonic guides drawn under the line,
 * peak markers over it) and prints the time to create the chart, to redraw it, to zoom and to move
 * the cursor. Figures only, nothing asserted: they depend on the machine (software rendering here).
 *
 *   npx tsx tests/bench/spectrum-chart.bench.ts        (or npm run bench)
 */
import { chromium } from "@playwright/test";
import { createRequire } from "node:module";

const require = createRequire(import.meta.url);
const uplotScript = require.resolve("uplot/dist/uPlot.iife.min.js");
const uplotCss = require.resolve("uplot/dist/uPlot.min.css");
const POINTS = 100_000;

const browser = await chromium.launch({
  executablePath: process.env.RINGDOWN_CHROMIUM ?? "/usr/bin/chromium",
  args: ["--no-sandbox", "--disable-gpu", "--disable-dev-shm-usage"],
});
try {
  const page = await browser.newPage({ viewport: { width: 1280, height: 800 }, deviceScaleFactor: 1 });
  await page.setContent('<!doctype html><html><body style="margin:0"><div id="chart" style="width:1200px"></div></body></html>');
  await page.addStyleTag({ path: uplotCss });
  await page.addScriptTag({ path: uplotScript });
  // tsx names functions through a helper; the function sent to the page needs it there too.
  await page.evaluate("window.__name = (fn) => fn");

  const figures = await page.evaluate(async (points) => {
    type U = {
      redraw: (rebuildPaths?: boolean, recalcAxes?: boolean) => void;
      setScale: (key: string, range: { min: number; max: number }) => void;
      setCursor: (c: { left: number; top: number }) => void;
      valToPos: (v: number, scale: string, canvas?: boolean) => number;
      ctx: CanvasRenderingContext2D;
      bbox: { top: number; height: number };
      scales: Record<string, { min?: number; max?: number }>;
    };
    const UPlot = (window as unknown as { uPlot: new (opts: unknown, data: unknown, el: HTMLElement) => U }).uPlot;
    // A synthetic spectrum: a noise floor with a tooth-passing comb, a spindle comb and one chatter peak.
    const fs = 48_000;
    const f = new Float64Array(points);
    const m = new Float64Array(points);
    let seed = 12345;
    const rnd = () => ((seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648);
    for (let i = 0; i < points; i++) {
      f[i] = (i * fs) / 2 / points;
      m[i] = 1e-4 * (0.5 + rnd());
    }
    const peaks: number[] = [];
    for (const hz of [400, 800, 1200, 1600, 200, 600, 1370]) {
      const i = Math.round((hz / (fs / 2)) * points);
      m[i] = hz === 1370 ? 0.2 : 0.1;
      peaks.push(hz);
    }
    const guides = Array.from({ length: 60 }, (_, k) => 200 * (k + 1));
    // uPlot commits changes in a microtask: each timing waits for the draw hook to run.
    let afterDraw: (() => void) | null = null;
    const timed = (change: () => void) =>
      new Promise<number>((resolve) => {
        const t = performance.now();
        afterDraw = () => {
          afterDraw = null;
          resolve(performance.now() - t);
        };
        change();
      });
    const opts = {
      width: 1200,
      height: 320,
      legend: { show: false },
      cursor: { drag: { x: true, y: false } },
      scales: { x: { time: false }, y: { distr: 3 } },
      axes: [{ label: "Frequency [Hz]" }, { label: "Amplitude (log)", size: 64 }],
      series: [{}, { stroke: "#1F6F8B", width: 1.25, points: { show: false } }],
      hooks: {
        drawAxes: [
          (u: U) => {
            const { top, height } = u.bbox;
            u.ctx.save();
            u.ctx.strokeStyle = "rgba(51, 64, 122, 0.35)";
            for (const hz of guides) {
              if (hz < u.scales.x!.min! || hz > u.scales.x!.max!) continue;
              const x = Math.round(u.valToPos(hz, "x", true)) + 0.5;
              u.ctx.beginPath();
              u.ctx.moveTo(x, top);
              u.ctx.lineTo(x, top + height);
              u.ctx.stroke();
            }
            u.ctx.restore();
          },
        ],
        draw: [
          (u: U) => {
            afterDraw?.();
            u.ctx.save();
            u.ctx.fillStyle = "#22252A";
            for (const hz of peaks) {
              const x = u.valToPos(hz, "x", true);
              const y = u.valToPos(0.1, "y", true) - 7;
              u.ctx.beginPath();
              u.ctx.moveTo(x - 4.5, y - 4);
              u.ctx.lineTo(x + 4.5, y - 4);
              u.ctx.lineTo(x, y + 3.5);
              u.ctx.fill();
            }
            u.ctx.restore();
          },
        ],
      },
    };
    const el = document.getElementById("chart")!;
    const stats = (xs: number[]) => {
      const s = [...xs].sort((a, b) => a - b);
      return { median: s[Math.floor(s.length / 2)]!, p95: s[Math.floor(s.length * 0.95)]!, max: s[s.length - 1]! };
    };

    const t0 = performance.now();
    const u = new UPlot(opts, [f, m], el);
    const createMs = performance.now() - t0;

    const redraws: number[] = [];
    for (let i = 0; i < 40; i++) redraws.push(await timed(() => u.redraw(true, true)));
    const zooms: number[] = [];
    for (let i = 0; i < 30; i++) zooms.push(await timed(() => u.setScale("x", { min: 0, max: 2000 + i * 700 })));
    await timed(() => u.setScale("x", { min: 0, max: fs / 2 }));
    const moves: number[] = [];
    // A cursor move redraws no series (uPlot moves an overlay): timed to the end of its work.
    for (let i = 0; i < 200; i++) {
      const t = performance.now();
      u.setCursor({ left: 10 + ((i * 37) % 1100), top: 100 });
      await Promise.resolve();
      moves.push(performance.now() - t);
    }
    return { createMs, redraw: stats(redraws), zoom: stats(zooms), cursor: stats(moves) };
  }, POINTS);

  const ms = (v: number) => `${v.toFixed(1)} ms`;
  console.log(`Spectrum chart, ${POINTS.toLocaleString("en-US")} points, uPlot in headless Chromium (software canvas):`);
  console.log(`  create and first draw   ${ms(figures.createMs)}`);
  console.log(`  full redraw (paths)     median ${ms(figures.redraw.median)}, p95 ${ms(figures.redraw.p95)}, max ${ms(figures.redraw.max)}`);
  console.log(`  zoom (set x range)      median ${ms(figures.zoom.median)}, p95 ${ms(figures.zoom.p95)}, max ${ms(figures.zoom.max)}`);
  console.log(`  cursor move             median ${ms(figures.cursor.median)}, p95 ${ms(figures.cursor.p95)}, max ${ms(figures.cursor.max)}`);
  console.log(`  (a frame at 60 Hz is 16.7 ms)`);
} finally {
  await browser.close();
}
