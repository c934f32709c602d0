import type { Role } from "@ringdown/contracts";
import {
  Boxes,
  ClipboardList,
  CreditCard,
  DatabaseArrowDown,
  Drill,
  Factory,
  Gauge,
  Users,
  type LucideIcon,
} from "lucide-react";

export type AreaKey = "planner" | "recipes" | "cutters" | "materials" | "machines" | "team" | "billing" | "shop-data";

export interface Area {
  key: AreaKey;
  path: string;
  label: string;
  icon: LucideIcon;
  /** One line under the page title: what the area is for. */
  purpose: string;
  /** What will be here once the area is built. */
  comingUp: string;
  /** Only these roles see the area in the rail (all do when absent). */
  roles?: readonly Role[];
}

/** The main areas, in rail order. */
export const areas: readonly Area[] = [
  {
    key: "planner",
    path: "/planner",
    label: "Planner",
    icon: Gauge,
    purpose: "Work out a starting recipe for one cutter, material and machine.",
    comingUp:
      "Pick a cutter, a material and a machine and get spindle speed, feed and depths of cut, each checked against the machine's measured stiffness and vibration modes, with the limit that holds each number back named in words.",
  },
  {
    key: "recipes",
    path: "/recipes",
    label: "Recipes",
    icon: ClipboardList,
    purpose: "The shop's saved recipes and the test cuts logged against them.",
    comingUp:
      "Saved recipes will be listed here with their machine, cutter and material, their status (proposed, approved, retired) and the test cuts logged against them, ready to print as a setup card.",
  },
  {
    key: "cutters",
    path: "/cutters",
    label: "Cutters",
    icon: Drill,
    purpose: "The cutters this shop has approved for use.",
    comingUp:
      "The shop's cutter library will be here: diameter, flutes, stick-out and the maker's limits for each cutter, with import and export of cutter lists and approval by the tooling manager.",
  },
  {
    key: "materials",
    path: "/materials",
    label: "Materials",
    icon: Boxes,
    purpose: "Workpiece materials and the cutting data that goes with them.",
    comingUp:
      "Workpiece materials will be listed here with their specific cutting energy and surface-speed ranges, to choose from when planning a cut.",
  },
  {
    key: "machines",
    path: "/machines",
    label: "Machines",
    icon: Factory,
    purpose: "Each machine's measured ceilings: spindle, power, stiffness and modes.",
    comingUp:
      "Record each machine's spindle range and power, its stiffness measured with a dial indicator, and its vibration modes from a tap test or a recorded cut. Every recipe is held within these measured limits.",
  },
  {
    key: "team",
    path: "/team",
    label: "Team",
    icon: Users,
    purpose: "The people in this shop and what each may do.",
    comingUp:
      "Invite people and choose their role: owner, tooling manager (curates cutters, approves recipes), programmer (plans and proposes recipes) or operator (reads at the machine).",
  },
  {
    key: "billing",
    path: "/billing",
    label: "Billing",
    icon: CreditCard,
    purpose: "Seats and payment for this shop.",
    comingUp: "The shop's owner will manage the subscription, the number of seats and the invoices here.",
    roles: ["owner"],
  },
  {
    key: "shop-data",
    path: "/shop-data",
    label: "Shop data",
    icon: DatabaseArrowDown,
    purpose: "Download what this shop keeps in Ringdown.",
    comingUp: "Owners and tooling managers will download the shop's cutters, recipes and cut logs here, as JSON or CSV.",
    roles: ["owner", "tooling_manager"],
  },
];

export function areaByKey(key: AreaKey): Area {
  const area = areas.find((a) => a.key === key);
  if (!area) throw new Error(`Unknown area ${key}`);
  return area;
}
