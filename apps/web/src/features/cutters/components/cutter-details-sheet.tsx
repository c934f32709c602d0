import type { Cutter } from "@ringdown/contracts";
import type { ReactNode } from "react";
import { Badge } from "@/components/ui/badge";
import { Button } from "@/components/ui/button";
import { MeasureValue } from "@/components/ui/measure";
import { Sheet } from "@/components/ui/sheet";
import { measures } from "@/components/ui/units";
import { shapeLabels, statusLabels, statusTones, toolMaterialLabels } from "../labels";

function Row({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div className="grid grid-cols-[10rem_1fr] gap-3 border-b border-rule/70 py-2 text-sm last:border-b-0">
      <dt className="text-muted">{label}</dt>
      <dd className="text-ink">{children}</dd>
    </div>
  );
}

/** Everything stored about a cutter, for people who may read but not edit it. */
export function CutterDetailsSheet({ cutter, onClose }: { cutter: Cutter | null; onClose: () => void }) {
  return (
    <Sheet
      open={cutter !== null}
      onClose={onClose}
      title={cutter?.name ?? "Cutter"}
      description={cutter && <Badge tone={statusTones[cutter.status]}>{statusLabels[cutter.status]}</Badge>}
      footer={<Button variant="secondary" onClick={onClose}>Close</Button>}
      width="max-w-lg"
    >
      {cutter && (
        <dl className="rounded-lg border border-rule bg-surface px-4">
          <Row label="Shape">{shapeLabels[cutter.shape]}</Row>
          <Row label="Tool material">{toolMaterialLabels[cutter.toolMaterial]}</Row>
          <Row label="Diameter"><MeasureValue value={cutter.diameterMm} measure={measures.length} /></Row>
          <Row label="Flutes"><MeasureValue value={cutter.flutes} measure={measures.count} /></Row>
          <Row label="Flute length"><MeasureValue value={cutter.fluteLengthMm} measure={measures.length} /></Row>
          <Row label="Overall length"><MeasureValue value={cutter.overallLengthMm} measure={measures.length} /></Row>
          <Row label="Shank diameter"><MeasureValue value={cutter.shankDiameterMm} measure={measures.length} /></Row>
          <Row label="Corner radius"><MeasureValue value={cutter.cornerRadiusMm} measure={measures.length} /></Row>
          <Row label="Helix angle"><MeasureValue value={cutter.helixDeg} measure={measures.degrees} /></Row>
          <Row label="Tip angle"><MeasureValue value={cutter.tipAngleDeg} measure={measures.degrees} /></Row>
          <Row label="Maker's max speed"><MeasureValue value={cutter.maxRpm} measure={measures.rpm} /></Row>
          <Row label="Coating">{cutter.coating || "—"}</Row>
          <Row label="Maker">{cutter.maker || "—"}</Row>
          <Row label="Part number">{cutter.partNumber || "—"}</Row>
          <Row label="Notes"><span className="whitespace-pre-wrap">{cutter.notes || "—"}</span></Row>
        </dl>
      )}
    </Sheet>
  );
}
