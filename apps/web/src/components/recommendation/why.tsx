import type { Explanation, LimitCheck } from "@ringdown/machining";
import { useEffect, useId, useRef, useState, type ReactNode } from "react";
import { cn } from "@/lib/cn";
import { formatReading } from "./readout";

/**
 * A number that explains itself: hover, focus or tap it and a panel lists the formula, its inputs
 * and which limit bound it. Escape closes; a tap pins it open until the next tap or Escape.
 * The panel is text only, so it is tied to the button as its description.
 */
export function Why({
  label,
  explanation,
  limits,
  children,
  align = "right",
}: {
  /** What the number is, e.g. "Spindle speed". */
  label: string;
  explanation: Explanation;
  /** The recommendation's limits, to name the ones that bound this number. */
  limits: readonly LimitCheck[];
  children: ReactNode;
  align?: "left" | "right";
}) {
  const [open, setOpen] = useState(false);
  const [pinned, setPinned] = useState(false);
  const id = useId();
  const ref = useRef<HTMLSpanElement>(null);

  useEffect(() => {
    if (!open) return;
    const onKey = (event: KeyboardEvent) => {
      if (event.key === "Escape") {
        event.preventDefault();
        setOpen(false);
        setPinned(false);
      }
    };
    const onPointerDown = (event: PointerEvent) => {
      if (!ref.current?.contains(event.target as Node)) {
        setOpen(false);
        setPinned(false);
      }
    };
    document.addEventListener("keydown", onKey);
    document.addEventListener("pointerdown", onPointerDown);
    return () => {
      document.removeEventListener("keydown", onKey);
      document.removeEventListener("pointerdown", onPointerDown);
    };
  }, [open]);

  const bound = explanation.boundBy
    .map((lid) => limits.find((l) => l.id === lid)?.label ?? lid)
    .filter((v, i, all) => all.indexOf(v) === i);

  return (
    <span
      ref={ref}
      className="relative inline-flex"
      onPointerEnter={(e) => {
        if (e.pointerType === "mouse") setOpen(true);
      }}
      onPointerLeave={(e) => {
        if (e.pointerType === "mouse" && !pinned) setOpen(false);
      }}
    >
      <button
        type="button"
        aria-expanded={open}
        aria-describedby={open ? id : undefined}
        aria-label={`${label}: why?`}
        onFocus={() => setOpen(true)}
        onBlur={() => {
          if (!pinned) setOpen(false);
        }}
        onClick={() => {
          // Tap pins it; a second tap unpins and closes.
          if (pinned) {
            setPinned(false);
            setOpen(false);
          } else {
            setPinned(true);
            setOpen(true);
          }
        }}
        className="cursor-help rounded-sm underline decoration-rule-strong decoration-dotted underline-offset-4 hover:decoration-ink"
      >
        {children}
      </button>
      {open && (
        <span
          id={id}
          role="tooltip"
          className={cn(
            "absolute top-full z-50 mt-1.5 block w-80 max-w-[80vw] rounded-lg border border-rule bg-surface p-3 text-left text-xs leading-relaxed font-normal text-ink shadow-lg shadow-ink/10",
            align === "right" ? "right-0" : "left-0",
          )}
        >
          <span className="block font-semibold">Why this {label.toLowerCase()}</span>
          <span className="mt-1 block font-mono text-[0.7rem] text-ink">{explanation.formula}</span>
          {explanation.inputs.length > 0 && (
            <span className="mt-2 block">
              <span className="block text-muted">Inputs (as computed, in metric units)</span>
              {explanation.inputs.map((input) => (
                <span key={input.name} className="flex justify-between gap-3 border-b border-rule/60 py-0.5 last:border-b-0">
                  <span>{input.name}</span>
                  <span className="tabular whitespace-nowrap">
                    {typeof input.value === "number" ? formatReading(input.value, "metric") : input.value}
                    {input.unit ? `\u202F${input.unit}` : ""}
                  </span>
                </span>
              ))}
            </span>
          )}
          <span className="mt-2 block">
            <span className="text-muted">Bound by: </span>
            {bound.length > 0 ? <span className="font-medium text-limit">{bound.join("; ")}</span> : <span>no limit; the target value held</span>}
          </span>
          {explanation.notes.map((note) => (
            <span key={note} className="mt-1 block text-muted">
              {note}
            </span>
          ))}
          <span className="mt-2 block text-muted">Source: {explanation.source}</span>
        </span>
      )}
    </span>
  );
}
