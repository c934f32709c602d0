import { cn } from "@/lib/cn";
import { formatNumber } from "@/lib/format";

/** Peak level in dB relative to full scale; −∞ shown as "silent". */
export function dbfs(peak: number): number {
  return peak > 0 ? 20 * Math.log10(peak) : Number.NEGATIVE_INFINITY;
}

const FLOOR_DB = -60;

/**
 * The microphone's live peak level on a −60 … 0 dBFS bar, with advice when it is too quiet to
 * analyse or so loud that it clips (clipped peaks add harmonics that are not in the machine).
 */
export function LevelMeter({ peak }: { peak: number }) {
  const db = dbfs(peak);
  const fraction = Number.isFinite(db) ? Math.max(0, Math.min(1, (db - FLOOR_DB) / -FLOOR_DB)) : 0;
  const clipping = peak >= 0.98;
  const quiet = db < -45;
  return (
    <div className="flex flex-col gap-1">
      <div className="flex items-baseline justify-between text-xs text-muted">
        <span id="level-meter-label">Input level</span>
        <span className="tabular">{Number.isFinite(db) ? `${formatNumber(db, { fractionDigits: 0 })} dBFS` : "silent"}</span>
      </div>
      <div
        role="meter"
        aria-labelledby="level-meter-label"
        aria-valuemin={FLOOR_DB}
        aria-valuemax={0}
        aria-valuenow={Number.isFinite(db) ? Math.round(db) : FLOOR_DB}
        aria-valuetext={Number.isFinite(db) ? `${Math.round(db)} dB below full scale` : "silent"}
        className="relative h-3 overflow-hidden rounded-sm border border-rule bg-paper"
      >
        <div
          className={cn("h-full transition-[width] duration-75 motion-reduce:transition-none", clipping ? "bg-limit" : db > -6 ? "bg-near" : "bg-measured")}
          style={{ width: `${fraction * 100}%` }}
        />
        {/* −6 dBFS: above it the sound is close to clipping */}
        <div className="absolute inset-y-0 w-px bg-ink/40" style={{ left: `${(1 - 6 / -FLOOR_DB) * 100}%` }} aria-hidden />
      </div>
      <p className={cn("min-h-4 text-xs", clipping ? "text-limit" : "text-muted")} aria-live="polite">
        {clipping ? "Too loud: the sound clips. Move the phone further from the machine." : quiet ? "Very quiet: move the microphone closer to the spindle." : ""}
      </p>
    </div>
  );
}
