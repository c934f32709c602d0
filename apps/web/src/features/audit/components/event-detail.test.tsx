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
    const { container } = render(<EventDetail event={event({ machineId: "m-1", frequencyHz: 180, stiffnessNPerMm: 2500, direction: "y" })} system="metric" />);
    expect(container).toHaveTextContent(`frequency: 180${NUMBER_UNIT_SPACE}Hz`, { normalizeWhitespace: false });
    expect(container).toHaveTextContent(`stiffness: 2${"\u2009"}500${NUMBER_UNIT_SPACE}N/mm`, { normalizeWhitespace: false });
    expect(screen.getByText("direction: y")).toBeInTheDocument();
    expect(container).not.toHaveTextContent("m-1");
  });

  it("shows lengths, stiffnesses and masses in inches, lbf/in and lb for a reader who works in imperial", () => {
    // 1 in = 25.4 mm and 1 lb = 0.453 592 37 kg exactly; 1 lbf = 4.448 221 615 N (NIST SP 811, B.8),
    // so 1 lbf/in = 0.175 126 835 N/mm and 2 500 N/mm = 14 275.4 lbf/in.
    const { container } = render(
      <EventDetail event={event({ backlashMm: 0.0254, xMm: 254, stiffnessNPerMm: 2500, massKg: 45.359237, frequencyHz: 180 })} system="imperial" />,
    );
    expect(container).toHaveTextContent(`backlash: 0.001${NUMBER_UNIT_SPACE}in`, { normalizeWhitespace: false });
    expect(container).toHaveTextContent(`x: 10${NUMBER_UNIT_SPACE}in`, { normalizeWhitespace: false });
    expect(container).toHaveTextContent(`stiffness: 14,275${NUMBER_UNIT_SPACE}lbf/in`, { normalizeWhitespace: false });
    expect(container).toHaveTextContent(`mass: 100${NUMBER_UNIT_SPACE}lb`, { normalizeWhitespace: false });
    expect(container).toHaveTextContent(`frequency: 180${NUMBER_UNIT_SPACE}Hz`, { normalizeWhitespace: false });
    expect(container).not.toHaveTextContent("mm");
  });

  it("writes a change of role as labels, from → to", () => {
    render(<EventDetail event={{ ...event({ from: "operator", to: "tooling_manager" }), action: "member.role_changed", subjectType: "member" }} system="metric" />);
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
        system="metric"
      />,
    );
    const items = screen.getAllByRole("listitem").map((li) => li.textContent);
    expect(items).toEqual(["seats: 3 → 5", "fields: diameter, max rpm"]);
    expect(container).not.toHaveTextContent("status");
  });

  it("shows a dash when an event keeps no details", () => {
    render(<EventDetail event={event({})} system="metric" />);
    expect(screen.getByText("—")).toBeInTheDocument();
  });
});
