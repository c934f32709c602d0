import { Link } from "react-router-dom";
import { cn } from "@/lib/cn";

export type MachineTab = "figures" | "vibration";

/** The two views of one machine: its figures and assemblies, and its measured vibration profile. */
export function MachineTabs({ machineId, current }: { machineId: string; current: MachineTab }) {
  const base = `/machines/${encodeURIComponent(machineId)}`;
  const tabs: Array<{ id: MachineTab; label: string; to: string }> = [
    { id: "figures", label: "Figures and assemblies", to: base },
    { id: "vibration", label: "Vibration profile", to: `${base}/vibration` },
  ];
  return (
    <nav aria-label="Machine" className="flex gap-1 rounded-lg border border-rule bg-surface p-1 text-sm">
      {tabs.map((t) => (
        <Link
          key={t.id}
          to={t.to}
          aria-current={current === t.id ? "page" : undefined}
          // One text colour per state: with both classes on the active tab the muted grey won (3.6:1 on the tint).
          className={cn("rounded-md px-3 py-1.5 font-medium", current === t.id ? "bg-brand-tint text-brand" : "text-muted hover:bg-paper hover:text-ink")}
        >
          {t.label}
        </Link>
      ))}
    </nav>
  );
}
