import { useCallback } from "react";
import { useLocation, useSearchParams } from "react-router-dom";

/** Changes to a list's address: a key set to undefined, "" or false is removed. */
export type ListSearchChanges = Record<string, string | number | boolean | undefined>;

/**
 * The address of a list page whose filters, sort and page live there (so a view can be bookmarked,
 * shared and gone back to), and `update` to change it in place (history replace).
 *
 * `update(changes, resetPage = true)` applies `changes` to the address as it is now, not as it was at
 * the last render: a search typed just before another filter changes lands after it (debounced) and
 * must not undo it. Unless `resetPage` is false it also goes back to the first page.
 *
 * A change that arrives after the person has left the list (a debounced search typed just before a
 * row or another page was opened, while this list is still on screen during the transition) is
 * dropped, so it cannot pull them back to the list.
 */
export function useListSearchParams() {
  const [search, setSearch] = useSearchParams();
  const listPath = useLocation().pathname;

  const update = useCallback(
    (changes: ListSearchChanges, resetPage = true) => {
      if (window.location.pathname !== listPath) return;
      setSearch(
        () => {
          const next = new URLSearchParams(window.location.search);
          for (const [key, value] of Object.entries(changes)) {
            if (value === undefined || value === "" || value === false) next.delete(key);
            else next.set(key, String(value));
          }
          if (resetPage) next.delete("page");
          return next;
        },
        { replace: true },
      );
    },
    [setSearch, listPath],
  );

  return { search, update };
}
