import { ArrowLeft, TriangleAlert } from "lucide-react";
import type { Machine } from "@ringdown/contracts";
import { useState, type ReactNode } from "react";
import { Link } from "react-router-dom";
import { Badge } from "@/components/ui/badge";
import { Button } from "@/components/ui/button";
import { Card } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { Notice, PageHeader } from "@/components/ui/page-header";
import { LoadingState } from "@/components/ui/spinner";
import { useActiveShop } from "@/lib/active-shop";
import { isApiError } from "@/lib/api-client";
import { useDocumentTitle } from "@/lib/use-document-title";
import { useMachine } from "../api/get-machine";
import { useRestoreMachine } from "../api/restore-machine";
import { useUpdateMachine } from "../api/update-machine";
import { canEditMachines, kindLabels } from "../labels";
import { bodyOfMachine, MachineForm } from "./machine-form";
import { MachineKeyFigures } from "./machine-key-figures";
import { MachineTabs } from "./machine-tabs";

/** One machine: key figures, then every figure in sections (editable for curators). */
export function MachineDetail({ machineId, related }: { machineId: string; /** Shown under the key figures, e.g. the machine's assemblies. */ related?: (machine: Machine) => ReactNode }) {
  const shop = useActiveShop();
  const shopId = shop?.shopId ?? "";
  const query = useMachine(shopId, machineId);
  const update = useUpdateMachine(shopId);
  const restore = useRestoreMachine(shopId);
  const [notice, setNotice] = useState<string | null>(null);
  useDocumentTitle(query.data?.name ?? "Machine");

  if (query.isPending) return <LoadingState label="Loading the machine…" />;
  if (query.isError) {
    const missing = isApiError(query.error) && query.error.status === 404;
    return (
      <Card className="mx-auto max-w-xl">
        <EmptyState icon={TriangleAlert} title={missing ? "No such machine in this shop" : "The machine could not be loaded"} action={<Link to="/machines" className="text-sm font-medium text-brand underline">All machines</Link>}>
          <p>{missing ? "It may have been deleted, or it belongs to another shop." : query.error.message}</p>
        </EmptyState>
      </Card>
    );
  }

  const machine = query.data;
  const mayEdit = shop ? canEditMachines(shop.role) : false;
  const readOnly = !mayEdit || Boolean(machine.deletedAt);

  return (
    <div className="flex flex-col gap-5">
      <PageHeader
        eyebrow={
          <Link to="/machines" className="inline-flex items-center gap-1 hover:text-ink">
            <ArrowLeft className="size-3.5" aria-hidden /> Machines
          </Link>
        }
        title={machine.name}
        description={
          <span className="flex flex-wrap items-center gap-2">
            {kindLabels[machine.kind]}
            {machine.estimatedFields.length > 0 && (
              <Badge tone="near">{machine.estimatedFields.length} values are estimates</Badge>
            )}
            {machine.deletedAt && <Badge tone="limit">Deleted</Badge>}
          </span>
        }
        actions={
          machine.deletedAt && mayEdit ? (
            <Button pending={restore.isPending} onClick={() => restore.mutate(machine.id)}>
              Restore machine
            </Button>
          ) : undefined
        }
      />
      <MachineTabs machineId={machine.id} current="figures" />
      <MachineKeyFigures machine={machine} />
      {related?.(machine)}
      <h2 className="mt-2 text-base font-semibold text-ink">Figures</h2>
      {!mayEdit && <p className="text-sm text-muted">Tooling managers and the owner edit machines; you can read every figure here.</p>}
      {notice && (
        <Notice onDismiss={() => setNotice(null)}>{notice}</Notice>
      )}
      <MachineForm
        key={machine.id}
        initial={bodyOfMachine(machine)}
        readOnly={readOnly}
        isNew={false}
        showKind
        submitLabel="Save machine"
        onSubmit={(values) => update.mutateAsync({ machineId: machine.id, body: values })}
        onSaved={(saved) => setNotice(`Saved ${saved.name}. Recipes on this machine are checked against the new figures next time they are computed.`)}
      />
    </div>
  );
}
