import { useLayoutEffect, useRef, useState } from "react";

const focusable = 'a[href], button:not([disabled]), input:not([disabled]), select:not([disabled]), textarea:not([disabled]), [tabindex]:not([tabindex="-1"])';

/**
 * Opens and closes a native <dialog> as a modal, and mounts its content only once it is shown.
 * `showModal()` moves focus into the dialog; had the content mounted first, a field's
 * `autoFocus` (React focuses it on mount) would have been taken over by the first control (the
 * Close button). Content mounted into the open dialog keeps its `autoFocus`; without one, focus
 * goes to the first control, as the browser would do.
 */
export function useModal(open: boolean) {
  const ref = useRef<HTMLDialogElement>(null);
  const [shown, setShown] = useState(false);

  useLayoutEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) dialog.showModal();
    if (!open && dialog.open) dialog.close();
    setShown(open);
  }, [open]);

  useLayoutEffect(() => {
    const dialog = ref.current;
    if (!shown || !dialog) return;
    const active = document.activeElement;
    if (active && active !== dialog && dialog.contains(active)) return;
    dialog.querySelector<HTMLElement>(focusable)?.focus();
  }, [shown]);

  return { ref, mounted: open && shown };
}
