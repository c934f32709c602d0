import { ArrowLeft, TriangleAlert } from "lucide-react";
import { Link, useParams } from "react-router-dom";
import { Badge } from "@/components/ui/badge";
import { Card } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { LoadingState } from "@/components/ui/spinner";
import { useMachine } from "@/features/machines/api/get-machine";
import { MachineTabs } from "@/features/machines/components/machine-tabs";
import { kindLabels } from "@/features/machines/labels";
import { VibrationProfile } from "@/features/vibration/components/vibration-profile";
import { useActiveShop } from "@/lib/active-shop";
import { isApiError } from "@/lib/api-client";
import { useUnitSystem } from "@/lib/auth";
import { useDocumentTitle } from "@/lib/use-document-title";

export function MachineVibrationRoute() {
  const { machineId = "" } = useParams();
  const shop = useActiveShop();
  const system = useUnitSystem();
  const query = useMachine(shop?.shopId ?? "", machineId);
  useDocumentTitle(query.data ? `${query.data.name}: vibration profile` : "Vibration profile");

  if (!shop) return null;
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
  return (
    <div className="mx-auto flex max-w-7xl flex-col gap-5">
      <PageHeader
        eyebrow={
          <Link to="/machines" className="inline-flex items-center gap-1 hover:text-ink">
            <ArrowLeft className="size-3.5" aria-hidden /> Machines
          </Link>
        }
        title={machine.name}
        description={
          <span className="flex flex-wrap items-center gap-2">
            {kindLabels[machine.kind]} · vibration profile
            {machine.deletedAt && <Badge tone="limit">Deleted</Badge>}
          </span>
        }
      />
      <MachineTabs machineId={machine.id} current="vibration" />
      <VibrationProfile key={machine.id} shopId={shop.shopId} role={shop.role} machine={machine} system={system} />
    </div>
  );
}
