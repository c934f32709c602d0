import { render, screen } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { describe, expect, it, vi } from "vitest";
import { LoadError } from "./load-error";

describe("LoadError", () => {
  it("announces what failed and asks again when told how", async () => {
    const onRetry = vi.fn();
    render(<LoadError onRetry={onRetry}>Cannot load the ladder: The server did not answer</LoadError>);
    expect(screen.getByRole("alert")).toHaveTextContent("Cannot load the ladder: The server did not answer");
    await userEvent.setup().click(screen.getByRole("button", { name: "Try again" }));
    expect(onRetry).toHaveBeenCalledOnce();
  });

  it("offers no button it cannot honour", () => {
    render(<LoadError>Cannot load the cutter assemblies to copy onto: gone</LoadError>);
    expect(screen.queryByRole("button")).not.toBeInTheDocument();
  });
});
