import type { CutterStatus, UnitSystem } from "@ringdown/contracts";
import { ChevronDown, Download } from "lucide-react";
import { Popover } from "@/components/ui/popover";
import { cutterExportUrl } from "../api/export-cutters";

const choices: Array<{ units: UnitSystem; label: string; detail: string }> = [
  { units: "metric", label: "Metric", detail: "lengths in mm" },
  { units: "imperial", label: "Imperial", detail: "lengths in inches" },
];

/** Downloads the shop's cutters (the status filter applies) as CSV in either unit system. */
export function ExportCuttersMenu({ shopId, status, preferred }: { shopId: string; status?: CutterStatus; preferred: UnitSystem }) {
  const ordered = [...choices].sort((a, b) => Number(b.units === preferred) - Number(a.units === preferred));
  return (
    <Popover
      panelClassName="right-0 w-60"
      trigger={(props) => (
        <button
          {...props}
          type="button"
          className="inline-flex h-10 cursor-pointer items-center gap-2 rounded-md border border-rule bg-surface px-4 text-sm font-medium text-ink hover:bg-paper"
        >
          <Download className="size-4" aria-hidden />
          Export CSV
          <ChevronDown className="size-4 text-muted" aria-hidden />
        </button>
      )}
    >
      {(close) => (
        <ul className="flex flex-col" aria-label="Export units">
          {ordered.map((c) => (
            <li key={c.units}>
              <a
                href={cutterExportUrl(shopId, c.units, status)}
                download
                onClick={() => close()}
                className="flex flex-col rounded-md px-3 py-2 text-sm text-ink hover:bg-paper"
              >
                <span className="font-medium">{c.label}</span>
                <span className="text-xs text-muted">{status ? `${status} cutters, ` : "All cutters, "}{c.detail}</span>
              </a>
            </li>
          ))}
        </ul>
      )}
    </Popover>
  );
}
