import { cutterFields } from "@ringdown/contracts";
import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { render as rtlRender, screen, waitFor } from "@testing-library/react";
import type { ReactElement } from "react";
import userEvent from "@testing-library/user-event";
import { describe, expect, it, vi } from "vitest";
import { z } from "zod";
import { Button } from "./button";
import { meQueryKey } from "@/lib/query-client";
import { Form } from "./form";
import { NumberField } from "./number-field";
import { measures } from "./units";

// The same limits and messages as the shared cutter schema (packages/contracts: cutterFields).
const testSchema = z.object({
  diameterMm: cutterFields.diameterMm,
  maxRpm: cutterFields.maxRpm,
  accelerationMmPerS2: z.number().gt(0),
});

/** Renders with a signed-in person whose stored preference is `system` (as GET /me answers). */
function renderAs(system: "metric" | "imperial", ui: ReactElement) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false, staleTime: Infinity } } });
  client.setQueryData(meQueryKey, {
    user: { id: "7d0c9a52-2f4e-4d36-9b38-1b2a3c4d5e6f", email: "pell@example.test", name: "Pell Marrow", unitSystem: system },
    memberships: [],
    activeShopId: null,
  });
  return rtlRender(<QueryClientProvider client={client}>{ui}</QueryClientProvider>);
}

function TestForm({
  defaults,
  onSubmit,
}: {
  defaults: { diameterMm?: number; maxRpm: number | null; accelerationMmPerS2?: number };
  onSubmit: (values: unknown) => void;
}) {
  return (
    <Form schema={testSchema} defaultValues={defaults} onSubmit={onSubmit} aria-label="Cutter">
      {() => (
        <>
          <NumberField name="diameterMm" label="Diameter" measure={measures.length} />
          <NumberField name="maxRpm" label="Maker's max speed" measure={measures.rpm} nullable />
          <NumberField name="accelerationMmPerS2" label="Acceleration" measure={measures.acceleration} />
          <Button type="submit">Save</Button>
        </>
      )}
    </Form>
  );
}

describe("NumberField", () => {
  it("shows a stored millimetre value in inches and sends what is typed in inches back as millimetres", async () => {
    const user = userEvent.setup();
    const onSubmit = vi.fn();
    renderAs("imperial", <TestForm defaults={{ diameterMm: 6.35, maxRpm: 24000, accelerationMmPerS2: 2540 }} onSubmit={onSubmit} />);

    // 6.35 mm = 0.25 in exactly (1 in = 25.4 mm by definition, 1959 international inch).
    const diameter = screen.getByLabelText(/Diameter/);
    expect(diameter).toHaveValue("0.25");
    expect(screen.getByLabelText(/Acceleration/)).toHaveValue("100");
    expect(screen.getByText("in/s²")).toBeInTheDocument();

    await user.clear(diameter);
    await user.type(diameter, "0.125");
    await user.click(screen.getByRole("button", { name: "Save" }));

    await waitFor(() => expect(onSubmit).toHaveBeenCalledTimes(1));
    const sent = onSubmit.mock.calls[0]?.[0] as { diameterMm: number; maxRpm: number; accelerationMmPerS2: number };
    // 0.125 in × 25.4 mm/in = 3.175 mm (hand calculation).
    expect(sent.diameterMm).toBeCloseTo(3.175, 12);
    expect(sent.maxRpm).toBe(24000);
    // Untouched values go back exactly as stored, with no round-trip drift.
    expect(sent.accelerationMmPerS2).toBe(2540);
  });

  it("leaves metric input as typed", async () => {
    const user = userEvent.setup();
    const onSubmit = vi.fn();
    renderAs("metric", <TestForm defaults={{ diameterMm: 6, maxRpm: null, accelerationMmPerS2: 1000 }} onSubmit={onSubmit} />);
    const diameter = screen.getByLabelText(/Diameter/);
    expect(diameter).toHaveValue("6");
    await user.clear(diameter);
    await user.type(diameter, "3,175");
    await user.click(screen.getByRole("button", { name: "Save" }));
    await waitFor(() => expect(onSubmit).toHaveBeenCalledTimes(1));
    expect(onSubmit.mock.calls[0]?.[0]).toMatchObject({ diameterMm: 3.175, maxRpm: null, accelerationMmPerS2: 1000 });
  });

  it("states the schema's limit in the person's unit", async () => {
    const user = userEvent.setup();
    const onSubmit = vi.fn();
    renderAs("imperial", <TestForm defaults={{ diameterMm: 6.35, maxRpm: null, accelerationMmPerS2: 1000 }} onSubmit={onSubmit} />);
    const diameter = screen.getByLabelText(/Diameter/);
    await user.clear(diameter);
    await user.type(diameter, "5");
    await user.click(screen.getByRole("button", { name: "Save" }));
    // 100 mm ÷ 25.4 mm/in = 3.937 in (four significant digits; the matcher folds the narrow space).
    expect(await screen.findByText("diameter must be at most 3.937 in")).toBeInTheDocument();
    expect(diameter).toHaveAttribute("aria-invalid", "true");
    expect(onSubmit).not.toHaveBeenCalled();
  });

  it("refuses text that is not a number, and treats an empty optional field as no value", async () => {
    const user = userEvent.setup();
    const onSubmit = vi.fn();
    renderAs("metric", <TestForm defaults={{ diameterMm: 6, maxRpm: 18000, accelerationMmPerS2: 1000 }} onSubmit={onSubmit} />);
    const diameter = screen.getByLabelText(/Diameter/);
    await user.clear(diameter);
    await user.type(diameter, "six");
    await user.clear(screen.getByLabelText(/Maker's max speed/));
    await user.click(screen.getByRole("button", { name: "Save" }));
    expect(await screen.findByText("Enter diameter")).toBeInTheDocument();
    await user.clear(diameter);
    await user.type(diameter, "6");
    await user.click(screen.getByRole("button", { name: "Save" }));
    await waitFor(() => expect(onSubmit).toHaveBeenCalledTimes(1));
    expect(onSubmit.mock.calls[0]?.[0]).toMatchObject({ diameterMm: 6, maxRpm: null });
  });

  it("asks for a value in words when the schema has no wording of its own for an empty box", async () => {
    const user = userEvent.setup();
    const onSubmit = vi.fn();
    renderAs("metric", <TestForm defaults={{ diameterMm: 6, maxRpm: null, accelerationMmPerS2: 1000 }} onSubmit={onSubmit} />);
    await user.clear(screen.getByLabelText(/Acceleration/));
    await user.click(screen.getByRole("button", { name: "Save" }));
    expect(await screen.findByText("Enter acceleration")).toBeInTheDocument();
    expect(onSubmit).not.toHaveBeenCalled();
  });
});
