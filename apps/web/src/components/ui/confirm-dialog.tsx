import { TriangleAlert } from "lucide-react";
import type { ReactNode } from "react";
import { Button } from "./button";
import { Dialog } from "./dialog";

/**
 * Asks before something that cannot be undone from here. A refusal from the server is shown
 * inside the dialog (not lost behind it), with an optional other way out, e.g. "Retire instead".
 */
export function ConfirmDialog({
  open,
  onClose,
  title,
  children,
  confirmLabel,
  onConfirm,
  pending = false,
  danger = false,
  error,
  alternative,
}: {
  open: boolean;
  onClose: () => void;
  title: string;
  children: ReactNode;
  confirmLabel: string;
  onConfirm: () => void;
  pending?: boolean;
  danger?: boolean;
  /** The server's refusal, in its words. */
  error?: string | null;
  /** Another action offered beside the refusal. */
  alternative?: ReactNode;
}) {
  return (
    <Dialog open={open} onClose={onClose} title={title}>
      <div className="flex flex-col gap-4 text-sm">
        <div className="text-ink">{children}</div>
        {error && (
          <div role="alert" className="flex flex-col gap-3 rounded-md border border-limit/40 bg-limit/5 px-3 py-2 text-limit">
            <p className="flex items-start gap-2">
              <TriangleAlert className="mt-0.5 size-4 shrink-0" aria-hidden />
              <span>{error}</span>
            </p>
            {alternative && <div className="flex justify-end">{alternative}</div>}
          </div>
        )}
        <div className="flex justify-end gap-2">
          <Button variant="secondary" onClick={onClose}>
            {error ? "Close" : "Cancel"}
          </Button>
          {!error && (
            <Button variant={danger ? "danger" : "primary"} onClick={onConfirm} pending={pending}>
              {confirmLabel}
            </Button>
          )}
        </div>
      </div>
    </Dialog>
  );
}
