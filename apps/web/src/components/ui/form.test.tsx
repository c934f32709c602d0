import { signupBodySchema } from "@ringdown/contracts";
import { render, screen, waitFor } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { describe, expect, it, vi } from "vitest";
import { ApiError } from "@/lib/api-client";
import { Button } from "./button";
import { PasswordField, TextField } from "./field";
import { Form, FormError } from "./form";

function SignupLikeForm({ onSubmit }: { onSubmit: (values: unknown) => Promise<unknown> }) {
  return (
    <Form
      schema={signupBodySchema}
      defaultValues={{ name: "", email: "", password: "", shopName: "" }}
      onSubmit={onSubmit}
      aria-label="Test form"
    >
      {() => (
        <>
          <FormError />
          <TextField name="name" label="Your name" />
          <TextField name="email" label="E-mail" type="email" />
          <PasswordField name="password" label="Password" />
          <TextField name="shopName" label="Shop name" />
          <Button type="submit">Send</Button>
        </>
      )}
    </Form>
  );
}

async function fillValid(user: ReturnType<typeof userEvent.setup>) {
  await user.type(screen.getByLabelText("Your name"), "Ada Tester");
  await user.type(screen.getByLabelText("E-mail"), "ada@example.test");
  await user.type(screen.getByLabelText("Password", { selector: "input" }), "long-enough-pw");
  await user.type(screen.getByLabelText("Shop name"), "Test Shop");
}

describe("Form", () => {
  it("validates with the shared schema before anything is sent", async () => {
    const user = userEvent.setup();
    const onSubmit = vi.fn(async () => undefined);
    render(<SignupLikeForm onSubmit={onSubmit} />);

    await user.type(screen.getByLabelText("Password", { selector: "input" }), "short");
    await user.click(screen.getByRole("button", { name: "Send" }));

    expect(onSubmit).not.toHaveBeenCalled();
    expect(await screen.findByText("Use at least 10 characters")).toBeInTheDocument();
    expect(screen.getByText("Enter your name")).toBeInTheDocument();
    expect(screen.getByLabelText("Password", { selector: "input" })).toHaveAttribute("aria-invalid", "true");
  });

  it("passes parsed values (trimmed, lower-cased e-mail) to onSubmit", async () => {
    const user = userEvent.setup();
    const onSubmit = vi.fn(async () => undefined);
    render(<SignupLikeForm onSubmit={onSubmit} />);
    await user.type(screen.getByLabelText("Your name"), "  Ada Tester ");
    await user.type(screen.getByLabelText("E-mail"), "Ada@Example.TEST");
    await user.type(screen.getByLabelText("Password", { selector: "input" }), "long-enough-pw");
    await user.type(screen.getByLabelText("Shop name"), "Test Shop");
    await user.click(screen.getByRole("button", { name: "Send" }));

    await waitFor(() => expect(onSubmit).toHaveBeenCalledTimes(1));
    expect(onSubmit).toHaveBeenCalledWith({
      name: "Ada Tester",
      email: "ada@example.test",
      password: "long-enough-pw",
      shopName: "Test Shop",
    });
  });

  it("puts each server field error on its field and the message in the form alert", async () => {
    const user = userEvent.setup();
    const onSubmit = vi.fn(async () => {
      throw new ApiError(409, "conflict", "That e-mail address already has an account.", {
        email: "Already registered; sign in instead",
        shopName: "Pick another name",
      });
    });
    render(<SignupLikeForm onSubmit={onSubmit} />);
    await fillValid(user);
    await user.click(screen.getByRole("button", { name: "Send" }));

    const email = screen.getByLabelText("E-mail");
    expect(await screen.findByText("Already registered; sign in instead")).toBeInTheDocument();
    expect(email).toHaveAttribute("aria-invalid", "true");
    expect(email).toHaveAccessibleDescription("Already registered; sign in instead");
    expect(email).toHaveFocus();
    expect(screen.getByLabelText("Shop name")).toHaveAccessibleDescription("Pick another name");
    expect(screen.getByRole("alert")).toHaveTextContent("That e-mail address already has an account.");
    expect(screen.getByLabelText("Your name")).not.toHaveAttribute("aria-invalid");
  });

  it("does not repeat in the alert what a field already says", async () => {
    const user = userEvent.setup();
    const taken = "An account with this e-mail address already exists. Sign in instead.";
    const onSubmit = vi.fn(async () => {
      throw new ApiError(409, "conflict", taken, { email: taken });
    });
    render(<SignupLikeForm onSubmit={onSubmit} />);
    await fillValid(user);
    await user.click(screen.getByRole("button", { name: "Send" }));

    expect(await screen.findByText(taken)).toBeInTheDocument();
    expect(screen.getByLabelText("E-mail")).toHaveAccessibleDescription(taken);
    expect(screen.queryByRole("alert")).not.toBeInTheDocument();
  });

  it("shows server errors for fields the form does not have in the alert", async () => {
    const user = userEvent.setup();
    const onSubmit = vi.fn(async () => {
      throw new ApiError(400, "validation_failed", "Check the highlighted fields.", {
        "billing.seats": "Seats must be a whole number",
      });
    });
    render(<SignupLikeForm onSubmit={onSubmit} />);
    await fillValid(user);
    await user.click(screen.getByRole("button", { name: "Send" }));

    const alert = await screen.findByRole("alert");
    expect(alert).toHaveTextContent("Check the highlighted fields. Seats must be a whole number");
  });

  it("reports a rate limit without touching the fields, and clears it on the next try", async () => {
    const user = userEvent.setup();
    const onSubmit = vi
      .fn<(values: unknown) => Promise<unknown>>()
      .mockRejectedValueOnce(new ApiError(429, "rate_limited", "Too many sign-in attempts. Try again in 15 minutes."))
      .mockResolvedValueOnce(undefined);
    render(<SignupLikeForm onSubmit={onSubmit} />);
    await fillValid(user);
    await user.click(screen.getByRole("button", { name: "Send" }));

    expect(await screen.findByRole("alert")).toHaveTextContent("Too many sign-in attempts. Try again in 15 minutes.");
    expect(screen.getByLabelText("E-mail")).not.toHaveAttribute("aria-invalid");

    await user.click(screen.getByRole("button", { name: "Send" }));
    await waitFor(() => expect(onSubmit).toHaveBeenCalledTimes(2));
    await waitFor(() => expect(screen.queryByRole("alert")).not.toBeInTheDocument());
  });

  it("keeps what was typed and explains an unexpected failure", async () => {
    const user = userEvent.setup();
    const onSubmit = vi.fn(async () => {
      throw new TypeError("Failed to fetch");
    });
    render(<SignupLikeForm onSubmit={onSubmit} />);
    await fillValid(user);
    await user.click(screen.getByRole("button", { name: "Send" }));

    expect(await screen.findByRole("alert")).toHaveTextContent("Something went wrong (Failed to fetch). Nothing was saved; try again.");
    expect(screen.getByLabelText("Your name")).toHaveValue("Ada Tester");
  });
});
