import { Search } from "lucide-react";
import { useEffect, useId, useState } from "react";
import { Input } from "@/components/ui/field";
import { Select } from "@/components/ui/select";
import { shapeOptions, statusOptions, toolMaterialOptions } from "../labels";

export interface CutterFilterValues {
  q: string;
  status: string;
  shape: string;
  toolMaterial: string;
  deleted: boolean;
}

/** Filters above the cutter table; the text search waits for a pause in typing. */
export function CutterFilters({ value, onChange }: { value: CutterFilterValues; onChange: (next: Partial<CutterFilterValues>) => void }) {
  const id = useId();
  const [text, setText] = useState(value.q);
  useEffect(() => setText(value.q), [value.q]);
  useEffect(() => {
    if (text === value.q) return;
    const timer = setTimeout(() => onChange({ q: text }), 300);
    return () => clearTimeout(timer);
  }, [text, value.q, onChange]);

  return (
    <div role="search" aria-label="Filter cutters" className="flex flex-wrap items-end gap-3">
      <div className="flex min-w-56 flex-1 flex-col gap-1.5">
        <label htmlFor={`${id}-q`} className="text-xs font-medium text-muted">
          Search
        </label>
        <div className="relative">
          <Search aria-hidden className="pointer-events-none absolute top-1/2 left-3 size-4 -translate-y-1/2 text-muted" />
          <Input
            id={`${id}-q`}
            type="search"
            value={text}
            onChange={(event) => setText(event.target.value)}
            placeholder="Name, maker, part number…"
            className="pl-9"
          />
        </div>
      </div>
      <div className="flex min-w-36 flex-1 flex-col gap-1.5 sm:max-w-44">
        <label htmlFor={`${id}-status`} className="text-xs font-medium text-muted">
          Status
        </label>
        <Select id={`${id}-status`} value={value.status} onChange={(e) => onChange({ status: e.target.value })} options={statusOptions} placeholder="Any status" />
      </div>
      <div className="flex min-w-36 flex-1 flex-col gap-1.5 sm:max-w-52">
        <label htmlFor={`${id}-shape`} className="text-xs font-medium text-muted">
          Shape
        </label>
        <Select id={`${id}-shape`} value={value.shape} onChange={(e) => onChange({ shape: e.target.value })} options={shapeOptions} placeholder="Any shape" />
      </div>
      <div className="flex min-w-36 flex-1 flex-col gap-1.5 sm:max-w-44">
        <label htmlFor={`${id}-tm`} className="text-xs font-medium text-muted">
          Tool material
        </label>
        <Select
          id={`${id}-tm`}
          value={value.toolMaterial}
          onChange={(e) => onChange({ toolMaterial: e.target.value })}
          options={toolMaterialOptions}
          placeholder="Any material"
        />
      </div>
      <label className="flex h-10 cursor-pointer items-center gap-2 text-sm text-ink">
        <input type="checkbox" checked={value.deleted} onChange={(e) => onChange({ deleted: e.target.checked })} className="size-4 accent-brand" />
        Deleted cutters
      </label>
    </div>
  );
}
