import type { Material } from "@ringdown/contracts";
import { BookOpen, Copy, Pencil, RotateCcw, Trash2 } from "lucide-react";
import type { ReactNode } from "react";
import { Badge } from "@/components/ui/badge";
import { Button } from "@/components/ui/button";
import { MeasureValue } from "@/components/ui/measure";
import { Sheet } from "@/components/ui/sheet";
import { measures } from "@/components/ui/units";
import { citedSources, groupLabels, originLabels } from "../labels";

function Section({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section className="flex flex-col gap-2">
      <h3 className="text-sm font-semibold text-ink">{title}</h3>
      {children}
    </section>
  );
}

const th = "border-b border-rule bg-paper px-3 py-1.5 text-xs font-medium text-muted";
const td = "border-b border-rule/70 px-3 py-1.5";

/** Everything stored about a material, its source first; the actions the person's role allows. */
export function MaterialDetailsSheet({
  material,
  onClose,
  mayEdit,
  onCopy,
  onEdit,
  onDelete,
  onRestore,
  busy,
}: {
  material: Material | null;
  onClose: () => void;
  mayEdit: boolean;
  onCopy: (m: Material) => void;
  onEdit: (m: Material) => void;
  onDelete: (m: Material) => void;
  onRestore: (m: Material) => void;
  busy: boolean;
}) {
  const m = material;
  const sources = m ? citedSources(m.sourceNote) : [];
  return (
    <Sheet
      open={m !== null}
      onClose={onClose}
      title={m?.name ?? "Material"}
      width="max-w-xl"
      description={
        m && (
          <span className="flex flex-wrap items-center gap-2">
            <Badge tone={m.readOnly ? "neutral" : "brand"}>{m.readOnly ? originLabels.global : originLabels.shop}</Badge>
            <span>{groupLabels[m.group]}</span>
            {m.hardness && <span>· {m.hardness}</span>}
            {m.deletedAt && <Badge tone="limit">Deleted</Badge>}
          </span>
        )
      }
      footer={
        m && (
          <>
            <Button variant="secondary" onClick={onClose} className="mr-auto">
              Close
            </Button>
            {mayEdit && m.deletedAt && (
              <Button onClick={() => onRestore(m)} pending={busy}>
                <RotateCcw className="size-4" aria-hidden /> Restore
              </Button>
            )}
            {mayEdit && !m.deletedAt && !m.readOnly && (
              <>
                <Button variant="quiet" onClick={() => onDelete(m)} className="text-limit">
                  <Trash2 className="size-4" aria-hidden /> Delete…
                </Button>
                <Button variant="secondary" onClick={() => onCopy(m)} pending={busy}>
                  <Copy className="size-4" aria-hidden /> Duplicate
                </Button>
                <Button onClick={() => onEdit(m)}>
                  <Pencil className="size-4" aria-hidden /> Edit
                </Button>
              </>
            )}
            {mayEdit && !m.deletedAt && m.readOnly && (
              <Button onClick={() => onCopy(m)} pending={busy}>
                <Copy className="size-4" aria-hidden /> Copy to adjust
              </Button>
            )}
          </>
        )
      }
    >
      {m && (
        <div className="flex flex-col gap-6">
          <section aria-labelledby="material-source" className="rounded-lg border border-measured/40 bg-surface px-4 py-3">
            <h3 id="material-source" className="flex items-center gap-2 text-sm font-semibold text-measured">
              <BookOpen className="size-4" aria-hidden /> Where these values come from
            </h3>
            <p className="mt-2 text-sm leading-relaxed whitespace-pre-wrap text-ink">{m.sourceNote}</p>
            {sources.length > 0 && (
              <dl className="mt-3 flex flex-col gap-1 border-t border-rule pt-2 text-xs">
                {sources.map((s) => (
                  <div key={s.key} className="grid grid-cols-[4.5rem_1fr] gap-2">
                    <dt className="font-mono text-muted">[{s.key}]</dt>
                    <dd className="text-muted">{s.meaning}</dd>
                  </div>
                ))}
              </dl>
            )}
            {m.readOnly ? (
              <p className="mt-3 text-xs text-muted">Reference data is read-only. Copy it to adjust the numbers for your shop.</p>
            ) : m.copiedFromId ? (
              <p className="mt-3 text-xs text-muted">A shop copy of a reference material; check the note still says where changed numbers come from.</p>
            ) : null}
          </section>

          <Section title="Cutting speed">
            <table className="w-full border-collapse overflow-hidden rounded-lg border border-rule bg-surface text-sm">
              <thead>
                <tr>
                  <th scope="col" className={`${th} text-left`}>Tool material</th>
                  <th scope="col" className={`${th} text-right`}>From</th>
                  <th scope="col" className={`${th} text-right`}>To</th>
                </tr>
              </thead>
              <tbody>
                {(["carbide", "hss"] as const).map((tm) => (
                  <tr key={tm}>
                    <th scope="row" className={`${td} text-left font-normal`}>{tm === "carbide" ? "Carbide" : "HSS"}</th>
                    <td className={`${td} text-right`}><MeasureValue value={m.cuttingSpeed[tm].minMPerMin} measure={measures.cuttingSpeed} /></td>
                    <td className={`${td} text-right`}><MeasureValue value={m.cuttingSpeed[tm].maxMPerMin} measure={measures.cuttingSpeed} /></td>
                  </tr>
                ))}
              </tbody>
            </table>
          </Section>

          <Section title="Chip load per tooth by cutter diameter">
            <table className="w-full border-collapse rounded-lg border border-rule bg-surface text-sm">
              <thead>
                <tr>
                  <th scope="col" className={`${th} text-right`}>Cutter diameter</th>
                  <th scope="col" className={`${th} text-right`}>From</th>
                  <th scope="col" className={`${th} text-right`}>To</th>
                </tr>
              </thead>
              <tbody>
                {[...m.chipLoad]
                  .sort((a, b) => a.diameterMm - b.diameterMm)
                  .map((p) => (
                    <tr key={p.diameterMm}>
                      <td className={`${td} text-right`}><MeasureValue value={p.diameterMm} measure={measures.length} /></td>
                      <td className={`${td} text-right`}><MeasureValue value={p.minMm} measure={measures.chipLoad} /></td>
                      <td className={`${td} text-right`}><MeasureValue value={p.maxMm} measure={measures.chipLoad} /></td>
                    </tr>
                  ))}
              </tbody>
            </table>
            <p className="text-xs text-muted">For carbide cutters; Ringdown interpolates between diameters and scales for HSS.</p>
          </Section>

          <Section title="Cutting force">
            <dl className="grid grid-cols-[1fr_auto] gap-x-6 gap-y-1.5 rounded-lg border border-rule bg-surface px-4 py-3 text-sm">
              <dt className="text-muted">Specific cutting force kc1.1 (Kienzle)</dt>
              <dd className="text-right"><MeasureValue value={m.kc11NPerMm2} measure={measures.specificForce} /></dd>
              <dt className="text-muted">Kienzle exponent mc (dimensionless)</dt>
              <dd className="text-right"><MeasureValue value={m.mc} measure={measures.count} /></dd>
              <dt className="text-muted">Unit power</dt>
              <dd className="text-right"><MeasureValue value={m.unitPowerJPerMm3} measure={measures.specificEnergy} /></dd>
              <dt className="text-muted">Minimum chip thickness (rubbing or burning below)</dt>
              <dd className="text-right"><MeasureValue value={m.minChipThicknessMm} measure={measures.length} /></dd>
            </dl>
          </Section>
        </div>
      )}
    </Sheet>
  );
}
