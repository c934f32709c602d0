import type { UnitSystem } from "@ringdown/contracts";
import { Card } from "@/components/ui/card";
import { LoadingState, Spinner } from "@/components/ui/spinner";
import { LoadError } from "@/components/ui/load-error";
import { useCutLogs } from "../api/get-cut-logs";
import { LoggedOutcomes } from "./logged-outcomes";

/** The shop's logged cuts on this machine in this material, beside a prediction. */
export function MachineMaterialEvidence({
  shopId,
  machineId,
  materialId,
  system,
  predicted,
}: {
  shopId: string;
  machineId: string;
  materialId: string;
  system: UnitSystem;
  predicted?: { rpm: number; feedMmPerMin: number } | undefined;
}) {
  const logs = useCutLogs(shopId, machineId, materialId);
  return (
    <Card>
      <section aria-labelledby="evidence-title" className="flex flex-col gap-3 px-5 py-4">
        <h2 id="evidence-title" className="flex items-center gap-2 text-base font-semibold text-ink">
          Logged on this machine in this material
          {logs.isFetching && <Spinner className="size-3.5" label="Refreshing" />}
        </h2>
        {logs.isPending ? (
          <LoadingState label="Loading the shop's cut log…" />
        ) : logs.isError ? (
          <LoadError onRetry={() => void logs.refetch()}>Cannot load the cut log: {logs.error.message}</LoadError>
        ) : (
          <LoggedOutcomes logs={logs.data.items} total={logs.data.total} system={system} {...(predicted ? { predicted } : {})} />
        )}
      </section>
    </Card>
  );
}
