import { useEffect } from "react";

/** Sets the tab title to "<page> · Ringdown". */
export function useDocumentTitle(page: string) {
  useEffect(() => {
    document.title = page ? `${page} · Ringdown` : "Ringdown";
  }, [page]);
}
