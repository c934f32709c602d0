import { render, screen } from "@testing-library/react";
import { describe, expect, it } from "vitest";
import { NUMBER_UNIT_SPACE, THIN_SPACE } from "@/lib/format";
import { Quantity } from "./quantity";

describe("Quantity", () => {
  it("shows the number in tabular figures with its unit after it in a lighter style", () => {
    const { container } = render(<Quantity value={18000} unit="rpm" />);
    const root = container.firstElementChild as HTMLElement;
    expect(root).toHaveClass("tabular");
    expect(root).toHaveTextContent(`18${THIN_SPACE}000${NUMBER_UNIT_SPACE}rpm`, { normalizeWhitespace: false });
    const [number, unit] = Array.from(root.children);
    expect(number).toHaveTextContent(`18${THIN_SPACE}000`, { normalizeWhitespace: false });
    expect(number).toHaveClass("font-medium");
    expect(unit).toHaveTextContent("rpm");
    expect(unit).toHaveClass("text-muted");
  });

  it("groups with commas for a person who reads imperial", () => {
    render(<Quantity value={12500} unit="ft/min" system="imperial" />);
    expect(screen.getByText("12,500")).toBeInTheDocument();
  });

  it("rounds as asked and shows a dash without a value, keeping the unit", () => {
    const { container, rerender } = render(<Quantity value={0.0512} unit="mm/tooth" fractionDigits={3} />);
    expect(container).toHaveTextContent(`0.051${NUMBER_UNIT_SPACE}mm/tooth`, { normalizeWhitespace: false });
    rerender(<Quantity value={null} unit="mm" />);
    expect(container).toHaveTextContent(`—${NUMBER_UNIT_SPACE}mm`, { normalizeWhitespace: false });
  });
});
