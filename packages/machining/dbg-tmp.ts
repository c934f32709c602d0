import { analyzeRingDown } from "./src/signal/analyze-ring-down.ts";
function decay(fn: number, zeta: number, sampleRateHz: number, seconds: number, amp = 1, offset = 0): Float64Array {
  const wn = 2 * Math.PI * fn; const wd = wn * Math.sqrt(1 - zeta * zeta); const n = Math.round(seconds * sampleRateHz); const x = new Float64Array(n);
  for (let i = 0; i < n; i++) { const t = i / sampleRateHz; x[i] = offset + amp * Math.exp(-zeta * wn * t) * Math.cos(wd * t); } return x;
}
const a = decay(28, 0.05, 8000, 1.5, 1); const b = decay(820, 0.03, 8000, 1.5, 0.6);
const x = a.map((v, i) => v + b[i]!);
console.log(analyzeRingDown({ samples: x, sampleRateHz: 8000, bandHz: { minHz: 500, maxHz: 1200 } }));
console.log(analyzeRingDown({ samples: b, sampleRateHz: 8000 }));
console.log(analyzeRingDown({ samples: x, sampleRateHz: 8000, bandHz: { minHz: 10, maxHz: 60 } }));
