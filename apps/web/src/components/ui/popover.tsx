import { useCallback, useEffect, useId, useRef, useState, type ReactNode, type Ref } from "react";
import { cn } from "@/lib/cn";

export interface PopoverTriggerProps {
  ref: Ref<HTMLButtonElement>;
  onClick: () => void;
  "aria-expanded": boolean;
  "aria-controls": string;
}

/**
 * A disclosure that opens a small panel next to its button. Escape closes it
 * and returns focus to the button; a click or focus outside closes it.
 */
export function Popover({
  trigger,
  children,
  placement = "below",
  className,
  panelClassName,
}: {
  trigger: (props: PopoverTriggerProps) => ReactNode;
  children: (close: () => void) => ReactNode;
  placement?: "below" | "above";
  className?: string;
  panelClassName?: string;
}) {
  const [open, setOpen] = useState(false);
  const id = useId();
  const container = useRef<HTMLDivElement>(null);
  const button = useRef<HTMLButtonElement>(null);
  const panel = useRef<HTMLDivElement>(null);

  const close = useCallback((returnFocus = false) => {
    setOpen(false);
    if (returnFocus) button.current?.focus();
  }, []);

  useEffect(() => {
    if (!open) return;
    panel.current?.querySelector<HTMLElement>("button:not([disabled]), input:not([disabled]), a[href]")?.focus();
    const onPointerDown = (event: PointerEvent) => {
      if (!container.current?.contains(event.target as Node)) close();
    };
    const onKeyDown = (event: KeyboardEvent) => {
      if (event.key === "Escape") {
        // Handled here: the drawer around the rail must not close too.
        event.preventDefault();
        close(true);
      }
    };
    document.addEventListener("pointerdown", onPointerDown);
    document.addEventListener("keydown", onKeyDown);
    return () => {
      document.removeEventListener("pointerdown", onPointerDown);
      document.removeEventListener("keydown", onKeyDown);
    };
  }, [open, close]);

  return (
    <div
      ref={container}
      className={cn("relative", className)}
      onBlur={(event) => {
        if (open && event.relatedTarget && !container.current?.contains(event.relatedTarget as Node)) close();
      }}
    >
      {trigger({
        ref: button,
        onClick: () => setOpen((o) => !o),
        "aria-expanded": open,
        "aria-controls": id,
      })}
      <div
        id={id}
        ref={panel}
        hidden={!open}
        className={cn(
          "absolute z-50 rounded-lg border border-rule bg-surface p-1.5 shadow-lg shadow-ink/10",
          placement === "below" ? "top-full mt-1" : "bottom-full mb-1",
          panelClassName,
        )}
      >
        {open && children(() => close(true))}
      </div>
    </div>
  );
}
