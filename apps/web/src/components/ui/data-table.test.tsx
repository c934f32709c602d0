import type { ColumnDef } from "@tanstack/react-table";
import { render, screen, within } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { describe, expect, it, vi } from "vitest";
import { DataTable } from "./data-table";

interface Row {
  id: string;
  name: string;
  diameterMm: number;
}

const rows: Row[] = [
  { id: "a", name: "Bravo", diameterMm: 6 },
  { id: "b", name: "Alpha", diameterMm: 12 },
  { id: "c", name: "Charlie", diameterMm: 3.175 },
];

const columns: Array<ColumnDef<Row, unknown>> = [
  { id: "name", accessorKey: "name", header: "Name" },
  { id: "diameter", accessorKey: "diameterMm", header: "Diameter", meta: { numeric: true }, cell: (c) => `${String(c.getValue())} mm` },
];

/** The text of the first cell of each body row, in order. */
function firstColumn(): string[] {
  const table = screen.getByRole("table", { name: "Test cutters" });
  return within(table)
    .getAllByRole("row")
    .slice(1)
    .map((row) => within(row).getAllByRole("cell")[0]?.textContent ?? "");
}

describe("DataTable", () => {
  it("sorts a number column ascending on the first click, descending on the second, and says so with aria-sort", async () => {
    const user = userEvent.setup();
    render(<DataTable columns={columns} data={rows} label="Test cutters" getRowId={(r) => r.id} />);

    const header = screen.getByRole("columnheader", { name: /Diameter/ });
    expect(header).toHaveAttribute("aria-sort", "none");
    expect(firstColumn()).toEqual(["Bravo", "Alpha", "Charlie"]);

    await user.click(within(header).getByRole("button", { name: /Diameter/ }));
    expect(header).toHaveAttribute("aria-sort", "ascending");
    expect(firstColumn()).toEqual(["Charlie", "Bravo", "Alpha"]);

    await user.click(within(header).getByRole("button", { name: /Diameter/ }));
    expect(header).toHaveAttribute("aria-sort", "descending");
    expect(firstColumn()).toEqual(["Alpha", "Bravo", "Charlie"]);
  });

  it("sorts text columns A to Z first and can be sorted from the keyboard", async () => {
    const user = userEvent.setup();
    render(<DataTable columns={columns} data={rows} label="Test cutters" />);
    const sortName = screen.getByRole("button", { name: /Name/ });
    sortName.focus();
    await user.keyboard("{Enter}");
    expect(screen.getByRole("columnheader", { name: /Name/ })).toHaveAttribute("aria-sort", "ascending");
    expect(firstColumn()).toEqual(["Alpha", "Bravo", "Charlie"]);
  });

  it("right-aligns numeric columns in the header and the body", () => {
    render(<DataTable columns={columns} data={rows} label="Test cutters" />);
    expect(screen.getByRole("columnheader", { name: /Diameter/ })).toHaveClass("text-right");
    expect(screen.getByRole("cell", { name: "12 mm" })).toHaveClass("text-right", "tabular");
    expect(screen.getByRole("cell", { name: "Alpha" })).toHaveClass("text-left");
  });

  it("shows the empty state, and no pager, when there are no rows", () => {
    render(
      <DataTable columns={columns} data={[]} label="Test cutters" empty={<p>No cutters match these filters.</p>} />,
    );
    expect(screen.getByText("No cutters match these filters.")).toBeInTheDocument();
    expect(screen.queryByRole("navigation")).not.toBeInTheDocument();
  });

  it("shows a loading row while the first page loads, and an error with a retry", async () => {
    const user = userEvent.setup();
    const { rerender } = render(<DataTable columns={columns} data={undefined} isLoading label="Test cutters" />);
    expect(screen.getByRole("status")).toHaveTextContent("Loading…");

    const onRetry = vi.fn();
    rerender(<DataTable columns={columns} data={undefined} error={{ message: "Cannot reach the server." }} onRetry={onRetry} label="Test cutters" />);
    expect(screen.getByRole("alert")).toHaveTextContent("Cannot reach the server.");
    await user.click(screen.getByRole("button", { name: "Try again" }));
    expect(onRetry).toHaveBeenCalledTimes(1);
  });

  it("pages through rows in client mode", async () => {
    const user = userEvent.setup();
    const many = Array.from({ length: 12 }, (_, i) => ({ id: String(i), name: `Cutter ${String(i + 1).padStart(2, "0")}`, diameterMm: i + 1 }));
    render(<DataTable columns={columns} data={many} label="Test cutters" pageSize={10} />);
    expect(screen.getByText(/Rows 1–10 of 12/)).toBeInTheDocument();
    expect(firstColumn()).toHaveLength(10);
    await user.click(screen.getByRole("button", { name: "Next" }));
    expect(screen.getByText(/Rows 11–12 of 12/)).toBeInTheDocument();
    expect(firstColumn()).toEqual(["Cutter 11", "Cutter 12"]);
    expect(screen.getByRole("button", { name: "Next" })).toBeDisabled();
  });

  it("keeps the keyboard's focus on the pager when the last or first page disables the button pressed", async () => {
    const user = userEvent.setup();
    const many = Array.from({ length: 12 }, (_, i) => ({ id: String(i), name: `Cutter ${String(i + 1).padStart(2, "0")}`, diameterMm: i + 1 }));
    render(<DataTable columns={columns} data={many} label="Test cutters" pageSize={10} />);
    screen.getByRole("button", { name: "Next" }).focus();
    await user.keyboard("{Enter}");
    expect(screen.getByText(/Rows 11–12 of 12/)).toBeInTheDocument();
    expect(screen.getByRole("button", { name: "Next" })).toBeDisabled();
    expect(screen.getByRole("button", { name: "Previous" })).toHaveFocus();
    await user.keyboard("{Enter}");
    expect(screen.getByText(/Rows 1–10 of 12/)).toBeInTheDocument();
    expect(screen.getByRole("button", { name: "Next" })).toHaveFocus();
  });

  it("hands sorting and paging to the parent in server mode", async () => {
    const user = userEvent.setup();
    const onSortingChange = vi.fn();
    const onPaginationChange = vi.fn();
    render(
      <DataTable
        columns={columns}
        data={rows}
        label="Test cutters"
        server={{ rowCount: 120, sorting: [], onSortingChange, pagination: { pageIndex: 0, pageSize: 25 }, onPaginationChange }}
      />,
    );
    // The server's order is kept as sent.
    expect(firstColumn()).toEqual(["Bravo", "Alpha", "Charlie"]);
    expect(screen.getByText(/Rows 1–25 of 120/)).toBeInTheDocument();
    expect(screen.getByText(/Page 1 of 5/)).toBeInTheDocument();

    await user.click(screen.getByRole("button", { name: /Diameter/ }));
    const updater = onSortingChange.mock.calls[0]?.[0] as (old: unknown[]) => unknown;
    expect(updater([])).toEqual([{ id: "diameter", desc: false }]);

    await user.click(screen.getByRole("button", { name: "Next" }));
    const pageUpdater = onPaginationChange.mock.calls[0]?.[0] as (old: { pageIndex: number; pageSize: number }) => unknown;
    expect(pageUpdater({ pageIndex: 0, pageSize: 25 })).toEqual({ pageIndex: 1, pageSize: 25 });
  });

  it("puts row actions in a last column", () => {
    render(
      <DataTable
        columns={columns}
        data={rows}
        label="Test cutters"
        rowActions={(row) => <button type="button">Edit {row.name}</button>}
      />,
    );
    const headers = screen.getAllByRole("columnheader");
    expect(headers[headers.length - 1]).toHaveTextContent("Actions");
    expect(screen.getByRole("button", { name: "Edit Alpha" })).toBeInTheDocument();
  });
});
