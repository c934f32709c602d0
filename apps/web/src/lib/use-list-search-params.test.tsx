import { act, render, screen } from "@testing-library/react";
import { use } from "react";
import { createBrowserRouter, RouterProvider } from "react-router-dom";
import { beforeEach, describe, expect, it } from "vitest";
import { useListSearchParams, type ListSearchChanges } from "./use-list-search-params";

/** The list's `update`, as a debounced search box holds it. */
let update: (changes: ListSearchChanges, resetPage?: boolean) => void;

function List() {
  const list = useListSearchParams();
  update = list.update;
  return <p>List showing “{list.search.get("q") ?? ""}”</p>;
}

/** A page that is still loading when the router has already moved to it (never resolves). */
const neverLoads = new Promise<never>(() => {});
function SlowPage(): never {
  return use(neverLoads);
}

function renderAt(address: string) {
  window.history.replaceState(null, "", address);
  const router = createBrowserRouter([
    { path: "/things", Component: List },
    { path: "/things/:id", Component: SlowPage },
  ]);
  render(<RouterProvider router={router} />);
  return router;
}

beforeEach(() => window.history.replaceState(null, "", "/"));

describe("useListSearchParams", () => {
  it("applies each change on top of the address as it is now and goes back to the first page", async () => {
    const router = renderAt("/things?page=3&shape=ball");
    // Two changes before the list renders again: the second must not undo the first.
    await act(async () => {
      update({ q: "6 mm" });
      update({ status: "approved", shape: "" });
    });
    expect(new URLSearchParams(window.location.search)).toEqual(new URLSearchParams("q=6+mm&status=approved"));
    expect(router.state.location.pathname).toBe("/things");
    expect(screen.getByText("List showing “6 mm”")).toBeInTheDocument();

    await act(async () => update({ page: 2 }, false));
    expect(new URLSearchParams(window.location.search).get("page")).toBe("2");
  });

  it("drops a change that arrives after the person has left the list while it is still on screen", async () => {
    const router = renderAt("/things");
    // A row is opened: the router and the address move on while the next page is still loading,
    // so the list stays on screen and its debounced search can still fire.
    await act(async () => {
      await router.navigate("/things/42");
    });
    expect(window.location.pathname).toBe("/things/42");
    expect(screen.getByText("List showing “”")).toBeInTheDocument();

    await act(async () => update({ q: "typed just before" }));
    expect(window.location.pathname).toBe("/things/42");
    expect(window.location.search).toBe("");
    expect(router.state.location.pathname).toBe("/things/42");
  });
});
