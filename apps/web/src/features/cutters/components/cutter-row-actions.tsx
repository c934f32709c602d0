import type { Cutter, CutterStatus } from "@ringdown/contracts";
import { Trash2 } from "lucide-react";
import { Button } from "@/components/ui/button";

export type CutterAction = { kind: "edit" } | { kind: "view" } | { kind: "transition"; to: CutterStatus } | { kind: "delete" } | { kind: "restore" };

/**
 * The status move a curator makes from each status, one per row to keep rows short: a proposal
 * is approved (or deleted if declined), an approved cutter retired, a retired one reinstated.
 */
export function transitionsFrom(status: CutterStatus): Array<{ to: CutterStatus; label: string }> {
  switch (status) {
    case "proposed":
      return [{ to: "approved", label: "Approve" }];
    case "approved":
      return [{ to: "retired", label: "Retire" }];
    case "retired":
      return [{ to: "approved", label: "Reinstate" }];
  }
}

/**
 * Actions at the end of a cutter row: edit (or view), the status moves the person's role allows,
 * delete; restore for a deleted cutter. Each button names its cutter for screen readers.
 */
export function CutterRowActions({
  cutter,
  canEdit,
  canCurate,
  busy,
  onAction,
}: {
  cutter: Cutter;
  canEdit: boolean;
  canCurate: boolean;
  busy: boolean;
  onAction: (action: CutterAction) => void;
}) {
  if (cutter.deletedAt) {
    return canCurate ? (
      <Button size="sm" variant="secondary" onClick={() => onAction({ kind: "restore" })} pending={busy} aria-label={`Restore ${cutter.name}`}>
        Restore
      </Button>
    ) : null;
  }
  return (
    <>
      <Button size="sm" variant="quiet" onClick={() => onAction(canEdit ? { kind: "edit" } : { kind: "view" })} aria-label={`${canEdit ? "Edit" : "View"} ${cutter.name}`}>
        {canEdit ? "Edit" : "View"}
      </Button>
      {canCurate &&
        transitionsFrom(cutter.status).map((t) => (
          <Button
            key={t.to}
            size="sm"
            variant="quiet"
            disabled={busy}
            onClick={() => onAction({ kind: "transition", to: t.to })}
            aria-label={`${t.label} ${cutter.name}`}
            className={t.to === "approved" ? "text-ok" : undefined}
          >
            {t.label}
          </Button>
        ))}
      {canCurate && (
        <Button size="sm" variant="quiet" disabled={busy} onClick={() => onAction({ kind: "delete" })} aria-label={`Delete ${cutter.name}`} className="text-muted hover:text-limit">
          <Trash2 className="size-4" aria-hidden />
        </Button>
      )}
    </>
  );
}
