import { X } from "lucide-react";
import { useId, type ReactNode } from "react";
import { useModal } from "./use-modal";

/**
 * A modal panel along the right edge, for forms too long for a dialog (native <dialog>: focus
 * trap, Escape and the top layer come from the browser). Its content mounts only while open, so
 * a form inside starts fresh each time; the footer stays in view while the body scrolls.
 */
export function Sheet({
  open,
  onClose,
  title,
  description,
  children,
  footer,
  width = "max-w-2xl",
}: {
  open: boolean;
  onClose: () => void;
  title: string;
  description?: ReactNode;
  children: ReactNode;
  footer?: ReactNode;
  width?: string;
}) {
  const { ref, mounted } = useModal(open);
  const titleId = useId();
  const descriptionId = useId();

  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      aria-describedby={description ? descriptionId : undefined}
      onClose={onClose}
      onClick={(event) => {
        if (event.target === event.currentTarget) onClose();
      }}
      className={`fixed inset-y-0 right-0 left-auto m-0 h-dvh max-h-dvh w-full ${width} border-l border-rule bg-paper p-0 text-ink shadow-2xl backdrop:bg-ink/40`}
    >
      {mounted && (
        <div className="flex h-full flex-col">
          <div className="flex items-start justify-between gap-4 border-b border-rule bg-surface px-5 py-4">
            <div className="min-w-0">
              <h2 id={titleId} className="text-base font-semibold">
                {title}
              </h2>
              {description && (
                <div id={descriptionId} className="mt-1 text-sm text-muted">
                  {description}
                </div>
              )}
            </div>
            <button
              type="button"
              onClick={onClose}
              className="-mr-1 flex size-8 shrink-0 cursor-pointer items-center justify-center rounded-md text-muted hover:bg-ink/5 hover:text-ink"
            >
              <X className="size-4" aria-hidden />
              <span className="sr-only">Close</span>
            </button>
          </div>
          {/* Focusable so the body can be scrolled from the keyboard even when it holds no control. */}
          <div role="region" aria-labelledby={titleId} tabIndex={0} className="min-h-0 flex-1 overflow-y-auto px-5 py-5 focus-visible:outline-offset-[-2px]">
            {children}
          </div>
          {footer && <div className="flex items-center justify-end gap-2 border-t border-rule bg-surface px-5 py-3">{footer}</div>}
        </div>
      )}
    </dialog>
  );
}
