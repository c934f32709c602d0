import { machineKindSchema, type MachineKind } from "@ringdown/contracts";
import { ArrowLeft, TriangleAlert } from "lucide-react";
import { useId } from "react";
import { Link, Navigate, useNavigate, useSearchParams } from "react-router-dom";
import { Card } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { Select } from "@/components/ui/select";
import { LoadingState } from "@/components/ui/spinner";
import { useActiveShop } from "@/lib/active-shop";
import { useDocumentTitle } from "@/lib/use-document-title";
import { useCreateMachine } from "../api/create-machine";
import { useMachineDefaults } from "../api/get-machine-defaults";
import { canEditMachines, kindLabels, kindOptions } from "../labels";
import { MachineForm } from "./machine-form";

/** A new machine, started from the typical values for its kind, each labelled as an estimate. */
export function MachineNew() {
  useDocumentTitle("New machine");
  const id = useId();
  const shop = useActiveShop();
  const shopId = shop?.shopId ?? "";
  const navigate = useNavigate();
  const [search, setSearch] = useSearchParams();
  const parsed = machineKindSchema.safeParse(search.get("kind"));
  const kind: MachineKind = parsed.success ? parsed.data : "gantry_router";
  const defaults = useMachineDefaults(shopId, kind);
  const create = useCreateMachine(shopId);

  if (shop && !canEditMachines(shop.role)) return <Navigate to="/machines" replace />;

  return (
    <div className="flex flex-col gap-5">
      <PageHeader
        eyebrow={
          <Link to="/machines" className="inline-flex items-center gap-1 hover:text-ink">
            <ArrowLeft className="size-3.5" aria-hidden /> Machines
          </Link>
        }
        title="New machine"
        description="Typical values for the kind of machine are filled in and marked Estimate. Replace each with your own figure, or mark it checked, as you measure."
      />
      <div className="flex max-w-sm flex-col gap-1.5">
        <label htmlFor={`${id}-kind`} className="text-sm font-medium text-ink">
          Kind of machine
        </label>
        <Select
          id={`${id}-kind`}
          value={kind}
          options={kindOptions}
          onChange={(e) => setSearch({ kind: e.target.value }, { replace: true })}
          aria-describedby={`${id}-kind-hint`}
        />
        <p id={`${id}-kind-hint`} className="text-xs text-muted">
          Changing it starts again from that kind's typical values.
        </p>
      </div>
      {defaults.isPending && <LoadingState label={`Loading typical values for a ${kindLabels[kind].toLowerCase()}…`} />}
      {defaults.isError && (
        <Card>
          <EmptyState icon={TriangleAlert} title="The typical values could not be loaded">
            <p>{defaults.error.message}</p>
          </EmptyState>
        </Card>
      )}
      {defaults.data && (
        <MachineForm
          key={kind}
          initial={{ ...defaults.data, kind }}
          readOnly={false}
          isNew
          showKind={false}
          submitLabel="Add machine"
          onSubmit={(values) => create.mutateAsync({ ...values, kind })}
          onSaved={(saved) => navigate(`/machines/${saved.id}`, { replace: true })}
        />
      )}
    </div>
  );
}
