import type { Recommendation, UnitSystem } from "@ringdown/machining";
import { cn } from "@/lib/cn";
import { LIMIT_STATE_WORDS, limitBars, type LimitBar } from "./readout";

/** One limit: its name, the value against the ceiling in words, and the bar. */
export function LimitBarRow({ bar }: { bar: LimitBar }) {
  const stateWord = LIMIT_STATE_WORDS[bar.state];
  return (
    <li className="flex flex-col gap-1 print:gap-0.5" data-state={bar.state}>
      <div className="flex flex-wrap items-baseline justify-between gap-x-3 gap-y-0.5 text-sm">
        <span className="text-ink">{bar.label}</span>
        <span className="tabular text-xs whitespace-nowrap text-muted">{bar.reading}</span>
      </div>
      <div
        role="meter"
        aria-label={bar.label}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={Math.round(bar.fill * 100)}
        aria-valuetext={`${bar.reading}, ${stateWord}`}
        title={bar.detail}
        className="relative h-2.5 rounded-full bg-rule/60 print:border print:border-black print:bg-white"
      >
        <div
          className="bar-fill absolute inset-y-0 left-0 rounded-full"
          style={{ width: `${Math.max(bar.fill * 100, bar.fill > 0 ? 1.5 : 0)}%`, backgroundColor: bar.colour }}
        />
        <div
          aria-hidden
          className="bar-mark absolute -inset-y-1 w-0.5 -translate-x-1/2 rounded bg-ink"
          style={{ left: `${bar.mark * 100}%` }}
        />
      </div>
      {/* In print (black on white) a bar within its limit needs no words; near and binding keep theirs. */}
      <div className={cn("flex items-center gap-1.5 text-xs", bar.state === "within" && "print:hidden")}>
        <span aria-hidden className="inline-block size-2 rounded-full print:hidden" style={{ backgroundColor: bar.colour }} />
        <span className={cn(bar.state === "binding" ? "font-medium text-limit print:text-black" : "text-muted")}>
          {bar.state === "binding" && bar.over ? "exceeded" : stateWord}
          {bar.kind === "min" ? " · a floor" : ""}
        </span>
      </div>
    </li>
  );
}

/** Every limit the engine checked, worst first. */
export function LimitBars({ rec, system, className }: { rec: Recommendation; system: UnitSystem; className?: string }) {
  const bars = limitBars(rec, system);
  if (bars.length === 0) return <p className="text-sm text-muted">No limits apply to this operation.</p>;
  return (
    <ul aria-label="Limits" className={cn("flex flex-col gap-4", className)}>
      {bars.map((bar) => (
        <LimitBarRow key={bar.id} bar={bar} />
      ))}
    </ul>
  );
}
