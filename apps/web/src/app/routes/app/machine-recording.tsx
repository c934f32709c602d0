import { ArrowLeft, TriangleAlert } from "lucide-react";
import { Link, useParams } from "react-router-dom";
import { Card } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { LoadingState } from "@/components/ui/spinner";
import { useMachine } from "@/features/machines/api/get-machine";
import { RecordingDetailView } from "@/features/vibration/components/recording-detail";
import { canEditProfile } from "@/features/vibration/labels";
import { useActiveShop } from "@/lib/active-shop";
import { isApiError } from "@/lib/api-client";
import { useUnitSystem } from "@/lib/auth";
import { useDocumentTitle } from "@/lib/use-document-title";

export function MachineRecordingRoute() {
  const { machineId = "", recordingId = "" } = useParams();
  const shop = useActiveShop();
  const system = useUnitSystem();
  const query = useMachine(shop?.shopId ?? "", machineId);
  useDocumentTitle(query.data ? `Recording on ${query.data.name}` : "Recording");
  const profilePath = `/machines/${encodeURIComponent(machineId)}/vibration?tab=recordings`;

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
    <div className="mx-auto flex max-w-6xl flex-col gap-5">
      <PageHeader
        eyebrow={
          <Link to={profilePath} className="inline-flex items-center gap-1 hover:text-ink">
            <ArrowLeft className="size-3.5" aria-hidden /> {machine.name}: recordings
          </Link>
        }
        title="Recording"
      />
      <RecordingDetailView
        key={recordingId}
        shopId={shop.shopId}
        machine={machine}
        recordingId={recordingId}
        mayEdit={canEditProfile(shop.role)}
        system={system}
        profilePath={profilePath}
      />
    </div>
  );
}
