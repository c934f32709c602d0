import { X } from "lucide-react";
import { useId, type ReactNode } from "react";
import { useModal } from "./use-modal";

/**
 * A modal dialog on the native <dialog> element (focus trap, Escape and the
 * top layer come from the browser). Its content mounts only while open, so a
 * form inside starts fresh each time.
 */
export function Dialog({
  open,
  onClose,
  title,
  description,
  children,
}: {
  open: boolean;
  onClose: () => void;
  title: string;
  description?: ReactNode;
  children: ReactNode;
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
        // A click on the backdrop lands on the <dialog> itself.
        if (event.target === event.currentTarget) onClose();
      }}
      className="m-auto w-[calc(100%-2rem)] max-w-md rounded-lg border border-rule bg-surface p-0 text-ink shadow-xl backdrop:bg-ink/40"
    >
      {mounted && (
        <div className="px-5 py-5">
          <div className="mb-4 flex items-start justify-between gap-4">
            <div>
              <h2 id={titleId} className="text-base font-semibold">
                {title}
              </h2>
              {description && (
                <p id={descriptionId} className="mt-1 text-sm text-muted">
                  {description}
                </p>
              )}
            </div>
            <button
              type="button"
              onClick={onClose}
              className="-mr-1 -mt-1 flex size-8 cursor-pointer items-center justify-center rounded-md text-muted hover:bg-ink/5 hover:text-ink"
            >
              <X className="size-4" aria-hidden />
              <span className="sr-only">Close</span>
            </button>
          </div>
          {children}
        </div>
      )}
    </dialog>
  );
}
