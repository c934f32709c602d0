import { operations, type Machine, type Operation, type UnitSystem } from "@ringdown/contracts";
import type { Recommendation } from "@ringdown/machining";
import { useMemo } from "react";
import { useSearchParams } from "react-router-dom";
import { Card } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { useCutLogs } from "@/features/cut-logs/api/get-cut-logs";
import { MachineMaterialEvidence } from "@/features/cut-logs/components/machine-material-evidence";
import { Planner } from "@/features/planner/components/planner";
import { lengthInputText, type PlannerValues } from "@/features/planner/lib/planner-values";
import { StabilityPanel } from "@/features/vibration/components/stability-panel";
import { useActiveShop } from "@/lib/active-shop";
import { useUnitSystem } from "@/lib/auth";
import { useDocumentTitle } from "@/lib/use-document-title";

/**
 * Starting choices from the address (e.g. a recipe's "Open in planner"): ids, the operation and
 * lengths in mm (ap, ae, x, y, fz; a work region as rx0, rx1, ry0, ry1), rpm and the milling direction.
 */
function initialFromSearch(search: URLSearchParams, system: "metric" | "imperial"): Partial<PlannerValues> {
  const initial: Partial<PlannerValues> = {};
  const id = (key: "machineId" | "assemblyId" | "materialId") => {
    const v = search.get(key);
    if (v) initial[key] = v;
  };
  id("machineId");
  id("assemblyId");
  id("materialId");
  const op = search.get("operation");
  if (op && (operations as readonly string[]).includes(op)) initial.operation = op as Operation;
  const mm = (
    key: string,
    field: "axialDepth" | "radialDepth" | "workX" | "workY" | "regionXFrom" | "regionXTo" | "regionYFrom" | "regionYTo" | "chipLoadOverride",
  ) => {
    const v = Number(search.get(key));
    if (search.get(key) !== null && Number.isFinite(v) && v >= 0) initial[field] = lengthInputText(v, system);
  };
  mm("ap", "axialDepth");
  mm("ae", "radialDepth");
  mm("x", "workX");
  mm("y", "workY");
  mm("fz", "chipLoadOverride");
  // A work region comes as all four edges or not at all.
  if (["rx0", "rx1", "ry0", "ry1"].every((key) => search.get(key) !== null)) {
    initial.useRegion = true;
    mm("rx0", "regionXFrom");
    mm("rx1", "regionXTo");
    mm("ry0", "regionYFrom");
    mm("ry1", "regionYTo");
  }
  const rpm = Number(search.get("rpm"));
  if (search.get("rpm") !== null && Number.isFinite(rpm) && rpm > 0) initial.rpmOverride = String(Math.round(rpm));
  const dir = search.get("dir");
  if (dir === "climb" || dir === "conventional") initial.millingDirection = dir;
  return initial;
}

/** Resonance warnings, the nearest stable speed and the stability lobes of the planned cut, with the shop's logged cuts. */
function PlannerStability({
  shopId,
  machine,
  materialId,
  flutes,
  rec,
  millingDirection,
  system,
  onUseRpm,
}: {
  shopId: string;
  machine: Machine;
  materialId: string;
  flutes: number;
  rec: Recommendation;
  millingDirection: "climb" | "conventional";
  system: UnitSystem;
  onUseRpm: (rpm: number) => void;
}) {
  const logs = useCutLogs(shopId, machine.id, materialId);
  return (
    <Card>
      <div className="px-5 py-4">
        <StabilityPanel
          machine={machine}
          flutes={flutes}
          rec={rec}
          cutLogs={logs.data?.items ?? []}
          system={system}
          millingDirection={millingDirection}
          onUseRpm={onUseRpm}
        />
      </div>
    </Card>
  );
}

export function PlannerRoute() {
  useDocumentTitle("Planner");
  const shop = useActiveShop();
  const system = useUnitSystem();
  const [search] = useSearchParams();
  // Read once: later edits live in the form, not the address.
  const initial = useMemo(() => initialFromSearch(search, system), []);

  return (
    <div className="mx-auto flex max-w-7xl flex-col gap-6">
      <header>
        <h1 className="text-xl font-semibold text-ink">Planner</h1>
        <p className="mt-1 text-sm text-muted">Work out a starting recipe for one cutter, material and machine; every number updates as you type.</p>
      </header>
      {shop ? (
        <Planner
          key={shop.shopId}
          shopId={shop.shopId}
          role={shop.role}
          system={system}
          initial={initial}
          evidence={({ machineId, materialId, rec, machine, flutes, millingDirection, applyRpm }) => (
            <>
              {rec && machine && flutes !== null && (
                <PlannerStability
                  shopId={shop.shopId}
                  machine={machine}
                  materialId={materialId}
                  flutes={flutes}
                  rec={rec}
                  millingDirection={millingDirection}
                  system={system}
                  onUseRpm={applyRpm}
                />
              )}
              <MachineMaterialEvidence
                shopId={shop.shopId}
                machineId={machineId}
                materialId={materialId}
                system={system}
                predicted={rec ? { rpm: rec.rpm, feedMmPerMin: rec.feedMmPerMin } : undefined}
              />
            </>
          )}
        />
      ) : (
        <Card>
          <EmptyState title="No shop selected">
            <p>Create a shop or ask to be added to one to plan cuts.</p>
          </EmptyState>
        </Card>
      )}
    </div>
  );
}
