import type { Assembly, Recipe } from "@ringdown/contracts";
import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { render, screen } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { MemoryRouter } from "react-router-dom";
import { describe, expect, it, vi } from "vitest";
import { CopyDialog } from "./copy-dialog";

const shopId = "5d2b7e90-1c4a-4f3e-9b8d-6a0c2e4f1b37";
// Only the fields the dialog reads: the recipe's own assembly and name.
const recipe = { id: "0b9e4c21-7d3f-4a6b-8e52-1f0a9c3d7e64", assemblyId: "a1", name: "Slot 6 mm in cast acrylic" } as Recipe;
const assembly = (id: string, machineName: string): Assembly =>
  ({ id, machineName, cutterName: "3-flute 6 mm upcut", holder: "ER16 collet", cutterStatus: "approved" }) as Assembly;

function renderDialog(props: { targets: Assembly[] | undefined; targetsError?: string | null }, onClose = vi.fn()) {
  render(
    <QueryClientProvider client={new QueryClient()}>
      <MemoryRouter>
        <CopyDialog shopId={shopId} recipe={recipe} onClose={onClose} {...props} />
      </MemoryRouter>
    </QueryClientProvider>,
  );
  return onClose;
}

describe("CopyDialog", () => {
  it("says it is loading while the assemblies are on their way, and can be closed", async () => {
    const onClose = renderDialog({ targets: undefined });
    expect(screen.getByRole("status")).toHaveTextContent("Loading the cutter assemblies…");
    expect(screen.queryByRole("combobox", { name: "Copy onto" })).not.toBeInTheDocument();
    // The dialog's own Close button (its corner × carries the same name).
    await userEvent.setup().click(screen.getByText("Close", { selector: "button" }));
    expect(onClose).toHaveBeenCalledOnce();
  });

  it("names the failure when the assemblies cannot be loaded instead of claiming there are none", () => {
    renderDialog({ targets: undefined, targetsError: "The server did not answer" });
    expect(screen.getByRole("alert")).toHaveTextContent("Cannot load the cutter assemblies to copy onto: The server did not answer");
    expect(screen.queryByText(/There is no other cutter assembly/)).not.toBeInTheDocument();
  });

  it("has nothing to offer when the recipe's own assembly is the only one", () => {
    renderDialog({ targets: [assembly("a1", "Gantry A")] });
    expect(screen.getByText("There is no other cutter assembly to copy onto. Add one under Machines first.")).toBeInTheDocument();
  });

  it("offers every other assembly, never the recipe's own", () => {
    renderDialog({ targets: [assembly("a1", "Gantry A"), assembly("a2", "Bench mill B")] });
    const select = screen.getByRole("combobox", { name: "Copy onto" });
    const labels = Array.from(select.querySelectorAll("option")).map((o) => o.textContent);
    expect(labels).toContain("Bench mill B — 3-flute 6 mm upcut in ER16 collet");
    expect(labels.some((l) => l?.startsWith("Gantry A"))).toBe(false);
  });
});
