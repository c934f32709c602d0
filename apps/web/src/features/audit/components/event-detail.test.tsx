import { render, screen } from "@testing-library/react";
import type { AuditEvent } from "@ringdown/contracts";
import { describe, expect, it } from "vitest";
import { NUMBER_UNIT_SPACE } from "@/lib/format";
import { EventDetail } from "./event-detail";

const event = (detail: Record<string, unknown>): AuditEvent => ({
  id: "00000000-0000-4000-8000-000000000001",
  action: "mode.added",
  actorId: null,
  actorName: "Test person",
  subjectType: "mode",
  subjectId: "00000000-0000-4000-8000-000000000002",
  subjectLabel: "Test router: Y 180 Hz",
  detail,
  ip: null,
  createdAt: "2025-03-01T10:00:00.000Z",
});

describe("EventDetail", () => {
  it("shows numbers with the unit their key names, and leaves ids out", () => {
    const { container } = render(<EventDetail event={event({ machineId: "m-1", frequencyHz: 180, stiffnessNPerMm: 2500, direction: "y" })} />);
    expect(container).toHaveTextContent(`frequency: 180${NUMBER_UNIT_SPACE}Hz`, { normalizeWhitespace: false });
    expect(container).toHaveTextContent(`stiffness: 2${"\u2009"}500${NUMBER_UNIT_SPACE}N/mm`, { normalizeWhitespace: false });
    expect(screen.getByText("direction: y")).toBeInTheDocument();
    expect(container).not.toHaveTextContent("m-1");
  });

  it("writes a change of role as labels, from → to", () => {
    render(<EventDetail event={{ ...event({ from: "operator", to: "tooling_manager" }), action: "member.role_changed", subjectType: "member" }} />);
    expect(screen.getByRole("listitem")).toHaveTextContent("Operator → Tooling manager");
  });

  it("lists only what differs between before and after, and edited fields in words", () => {
    const { container } = render(
      <EventDetail
        event={event({
          before: { status: "active", seats: 3, cancelAtPeriodEnd: false },
          after: { status: "active", seats: 5, cancelAtPeriodEnd: false },
          fields: ["diameterMm", "maxRpm"],
        })}
      />,
    );
    const items = screen.getAllByRole("listitem").map((li) => li.textContent);
    expect(items).toEqual(["seats: 3 → 5", "fields: diameter, max rpm"]);
    expect(container).not.toHaveTextContent("status");
  });

  it("shows a dash when an event keeps no details", () => {
    render(<EventDetail event={event({})} />);
    expect(screen.getByText("—")).toBeInTheDocument();
  });
});
