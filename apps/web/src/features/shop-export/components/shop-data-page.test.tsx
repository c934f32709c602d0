import { render, screen, within } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { MemoryRouter } from "react-router-dom";
import { describe, expect, it } from "vitest";
import type { ActiveShop } from "@/lib/active-shop";
import { ShopDataPage } from "./shop-data-page";

const shopId = "3f6c2a10-8e4b-4d7a-9c21-5b0e7f9a1d42";
const shop = (role: ActiveShop["role"]): ActiveShop => ({
  shopId,
  shopName: "Tallowmere Jig & Gauge",
  role,
  userId: "7a1e9c04-2b3d-4f5e-8a6b-0c1d2e3f4a5b",
});

function renderPage(active: ActiveShop | null, preferredUnits: "metric" | "imperial" = "metric") {
  return render(
    <MemoryRouter>
      <ShopDataPage shop={active} preferredUnits={preferredUnits} />
    </MemoryRouter>,
  );
}

const csvHref = (file: string, units: string) => `/api/shops/${shopId}/export/${file}.csv?units=${units}`;
const csvLinks = () => within(screen.getByRole("list", { name: "CSV files" })).getAllByRole("link");

describe("ShopDataPage", () => {
  it("offers the whole shop as JSON and the four CSV files in the person's own units (metric)", () => {
    renderPage(shop("tooling_manager"), "metric");

    expect(screen.getByRole("heading", { level: 1, name: "Your shop's data" })).toBeInTheDocument();
    const json = screen.getByRole("link", { name: "Download everything (JSON)" });
    expect(json).toHaveAttribute("href", `/api/shops/${shopId}/export?format=json`);
    expect(json).toHaveAttribute("download");
    expect(screen.getByText(/lengths in mm, spindle speed in rpm, feed in mm\/min, power in W, stiffness in N\/mm, frequency in Hz/)).toBeInTheDocument();

    expect(screen.getByRole("radio", { name: /Metric/ })).toBeChecked();
    expect(csvLinks().map((a) => a.getAttribute("href"))).toEqual([
      csvHref("cutters", "metric"),
      csvHref("assemblies", "metric"),
      csvHref("recipes", "metric"),
      csvHref("cut-logs", "metric"),
    ]);
    for (const link of csvLinks()) expect(link).toHaveAttribute("download");
    expect(screen.getByRole("link", { name: "Download cut logs (metric)" })).toHaveAttribute("href", csvHref("cut-logs", "metric"));

    // The standing caution goes with the recipes file; the history note with every download.
    expect(screen.getByRole("complementary", { name: "Safety" })).toHaveTextContent("Starting points only");
    expect(screen.getByText(/recorded in the shop's change history/)).toBeInTheDocument();
    // Only owners can read the change history, so a tooling manager gets no link to it.
    expect(screen.queryByRole("link", { name: "See the change history" })).not.toBeInTheDocument();
  });

  it("starts in imperial for a person who works in inches, and the choice changes every CSV link", async () => {
    const user = userEvent.setup();
    renderPage(shop("owner"), "imperial");

    expect(screen.getByRole("radio", { name: /Imperial/ })).toBeChecked();
    expect(csvLinks().map((a) => a.getAttribute("href"))).toEqual([
      csvHref("cutters", "imperial"),
      csvHref("assemblies", "imperial"),
      csvHref("recipes", "imperial"),
      csvHref("cut-logs", "imperial"),
    ]);
    expect(screen.getByRole("link", { name: "Download recipes (imperial)" })).toHaveAttribute("href", csvHref("recipes", "imperial"));

    await user.click(screen.getByRole("radio", { name: /Metric/ }));
    expect(screen.getByRole("link", { name: "Download recipes (metric)" })).toHaveAttribute("href", csvHref("recipes", "metric"));
    expect(csvLinks().every((a) => a.getAttribute("href")?.endsWith("?units=metric"))).toBe(true);
    // The JSON file is SI whatever the choice.
    expect(screen.getByRole("link", { name: "Download everything (JSON)" })).toHaveAttribute("href", `/api/shops/${shopId}/export?format=json`);
    expect(screen.getByRole("link", { name: "See the change history" })).toHaveAttribute("href", "/team/history");
  });

  it.each(["programmer", "operator"] as const)("tells a %s that only owners and tooling managers can download, with no links", (role) => {
    renderPage(shop(role));

    expect(screen.getByRole("heading", { level: 1, name: "Your shop's data" })).toBeInTheDocument();
    expect(screen.getByRole("heading", { level: 2, name: "Only owners and tooling managers can download the shop's data" })).toBeInTheDocument();
    expect(screen.getByText(/Ask an owner or a tooling manager of Tallowmere Jig & Gauge/)).toBeInTheDocument();
    expect(screen.queryAllByRole("link")).toHaveLength(0);
    expect(screen.queryByRole("radio")).not.toBeInTheDocument();
  });

  it("refuses in the same words when no shop is chosen", () => {
    renderPage(null);
    expect(screen.getByRole("heading", { level: 2, name: "Only owners and tooling managers can download the shop's data" })).toBeInTheDocument();
    expect(screen.queryAllByRole("link")).toHaveLength(0);
  });
});
