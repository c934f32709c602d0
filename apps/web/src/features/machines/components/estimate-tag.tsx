import type { MachineBody } from "@ringdown/contracts";
import { useFormContext, useWatch } from "react-hook-form";
import { Badge } from "@/components/ui/badge";
import { cn } from "@/lib/cn";
import { clearEstimate, isEstimated } from "../estimates";

const title = "A default for this kind of machine, not a measurement. Change the value, or mark it checked once you have measured it.";

/**
 * Says "Estimate" beside a value that came from the defaults by kind. Where the person may edit,
 * the tag is a button that marks the value as checked (kept as it is, no longer an estimate).
 */
export function EstimateTag({ path, what, readOnly = false, className }: { path: string; what: string; readOnly?: boolean; className?: string }) {
  const { setValue, getValues } = useFormContext<MachineBody>();
  const estimated = useWatch<MachineBody, "estimatedFields">({ name: "estimatedFields" }) ?? [];
  if (!isEstimated(estimated, path)) return null;
  if (readOnly) {
    return (
      <Badge tone="near" title={title} className={className}>
        Estimate
      </Badge>
    );
  }
  return (
    <button
      type="button"
      title={title}
      aria-label={`Estimate: mark ${what} as checked`}
      onClick={() => setValue("estimatedFields", clearEstimate(getValues("estimatedFields") ?? [], path), { shouldDirty: true })}
      className={cn(
        "inline-flex cursor-pointer items-center rounded-full border border-near/40 bg-near/10 px-2 py-0.5 text-xs font-medium whitespace-nowrap text-[#8a5a12] hover:bg-near/20",
        className,
      )}
    >
      Estimate
    </button>
  );
}
