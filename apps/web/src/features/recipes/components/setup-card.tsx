import type { Assembly, Cutter, Recipe, UnitSystem } from "@ringdown/contracts";
import type { Recommendation } from "@ringdown/machining";
import { ArrowLeft, Printer } from "lucide-react";
import type { ReactNode } from "react";
import { Link } from "react-router-dom";
import { heldBackBy } from "@/components/recommendation/readout";
import { LimitBars } from "@/components/recommendation/limit-bars";
import { SafetyBand } from "@/components/recommendation/safety-band";
import { Button } from "@/components/ui/button";
import { MeasureValue } from "@/components/ui/measure";
import { measures } from "@/components/ui/units";
import { operationLabels, statusLabels } from "../labels";
import { QrImage } from "./qr-image";
import "./setup-card.css";

function Item({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div className="flex items-baseline justify-between gap-3 border-b border-rule/70 py-1 print:py-0.5">
      <dt className="text-muted">{label}</dt>
      <dd className="text-right font-medium">{children}</dd>
    </div>
  );
}

const dateText = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "numeric" });

/**
 * The card for the machine side: the recipe, machine, assembly, material and operation, the
 * numbers with units, the limits, the cautions, and a QR code that opens the phone cut-log form.
 * Prints black on white on one page.
 */
export function SetupCard({
  recipe,
  assembly,
  cutter,
  rec,
  system,
  logUrl,
}: {
  recipe: Recipe;
  assembly: Assembly | null;
  cutter: Cutter | null;
  /** The server's engine result for the recipe against today's library (limits, warnings); null while loading or unavailable. */
  rec: Recommendation | null;
  system: UnitSystem;
  /** Absolute address of the phone cut-log form for this recipe. */
  logUrl: string;
}) {
  const r = recipe.result;
  const p = recipe.params;
  const fullWidth = recipe.operation === "slot" || recipe.operation === "ramp" || recipe.operation === "drill";
  const held = rec ? heldBackBy(rec, p, system) : recipe.result.bindingLimit;
  const warnings = rec ? rec.warnings.filter((w) => w.severity === "warning").map((w) => w.message) : recipe.result.warnings;

  return (
    <div className="mx-auto flex max-w-3xl flex-col gap-4">
      <div className="flex flex-wrap items-center justify-between gap-3 print:hidden">
        <Link to={`/recipes/${recipe.id}`} className="inline-flex items-center gap-1 text-sm text-muted hover:text-ink">
          <ArrowLeft className="size-3.5" aria-hidden />
          Back to the recipe
        </Link>
        <Button onClick={() => window.print()}>
          <Printer className="size-4" aria-hidden />
          Print the card
        </Button>
      </div>

      <article aria-labelledby="card-title" className="setup-card rounded-lg border border-ink bg-white p-6 text-sm text-ink print:rounded-none print:border-0 print:p-0">
        <header className="border-b-2 border-ink pb-3 print:pb-2">
          <div className="min-w-0">
            <p className="text-xs tracking-wide uppercase">Setup card</p>
            <h1 id="card-title" className="text-xl leading-tight font-semibold">
              {recipe.name}
            </h1>
            <p className="mt-1 text-xs">
              {statusLabels[recipe.status]} · revision {recipe.revision} · {operationLabels[recipe.operation]} · printed{" "}
              {dateText.format(new Date())}
            </p>
          </div>
        </header>

        <div className="mt-3 print:mt-2 grid gap-x-8 gap-y-3 sm:grid-cols-2 print:grid-cols-2">
          <section aria-labelledby="card-setup">
            <h2 id="card-setup" className="mb-1 text-xs font-semibold tracking-wide uppercase">
              Setup
            </h2>
            <dl>
              <Item label="Machine">{recipe.machineName}</Item>
              <Item label="Cutter">{recipe.cutterName}</Item>
              {cutter && (
                <Item label="Cutter size">
                  <MeasureValue value={cutter.diameterMm} measure={measures.length} system={system} /> · {cutter.flutes}{" "}
                  {cutter.flutes === 1 ? "flute" : "flutes"}
                </Item>
              )}
              <Item label="Holder">{assembly?.holder ?? "—"}</Item>
              <Item label="Stick-out">
                <MeasureValue value={assembly?.stickoutMm ?? null} measure={measures.length} system={system} />
              </Item>
              <Item label="Runout (TIR)">
                <MeasureValue value={assembly?.runoutMm ?? null} measure={measures.length} system={system} />
              </Item>
              <Item label="Material">{recipe.materialName}</Item>
              <Item label="Operation">{operationLabels[recipe.operation]}</Item>
              <Item label="Direction">{recipe.operation === "drill" ? "—" : p.millingDirection === "climb" ? "Climb" : "Conventional"}</Item>
              <Item label="Work position">
                X <MeasureValue value={p.workPositionXMm} measure={measures.length} system={system} />, Y{" "}
                <MeasureValue value={p.workPositionYMm} measure={measures.length} system={system} />
              </Item>
              {p.workRegion && (
                <Item label="Checked over">
                  X <MeasureValue value={p.workRegion.xMinMm} measure={measures.length} system={system} />–
                  <MeasureValue value={p.workRegion.xMaxMm} measure={measures.length} system={system} />, Y{" "}
                  <MeasureValue value={p.workRegion.yMinMm} measure={measures.length} system={system} />–
                  <MeasureValue value={p.workRegion.yMaxMm} measure={measures.length} system={system} />
                </Item>
              )}
            </dl>
          </section>

          <section aria-labelledby="card-numbers">
            <h2 id="card-numbers" className="mb-1 text-xs font-semibold tracking-wide uppercase">
              Numbers
            </h2>
            <dl>
              <Item label="Spindle speed">
                <MeasureValue value={Math.round(r.rpm)} measure={measures.rpm} system={system} className="text-base" />
                {rec?.spindleDial && <span className="ml-1 text-xs">(dial {rec.spindleDial.label})</span>}
              </Item>
              <Item label="Feed">
                <MeasureValue value={r.feedMmPerMin} measure={measures.feedRate} system={system} className="text-base" />
              </Item>
              <Item label="Chip load">
                <MeasureValue value={r.chipLoadMm} measure={measures.chipLoad} system={system} />
              </Item>
              <Item label={rec && rec.axialDepthMm < p.axialDepthMm * (1 - 1e-6) ? "Axial depth per pass" : "Axial depth"}>
                <MeasureValue value={rec?.axialDepthMm ?? p.axialDepthMm} measure={measures.length} system={system} />
                {rec && rec.axialDepthMm < p.axialDepthMm * (1 - 1e-6) && (
                  <span className="ml-1 text-xs font-normal">
                    ({Math.ceil(p.axialDepthMm / rec.axialDepthMm - 1e-9)} passes for{" "}
                    <MeasureValue value={p.axialDepthMm} measure={measures.length} system={system} />)
                  </span>
                )}
              </Item>
              <Item label="Radial depth">
                {fullWidth ? "full width" : <MeasureValue value={rec?.radialDepthMm ?? p.radialDepthMm} measure={measures.length} system={system} />}
              </Item>
              <Item label="Cutting power">
                <MeasureValue value={r.powerW} measure={measures.power} system={system} />
              </Item>
              <Item label="Deflection at the tool">
                <MeasureValue value={r.totalDeflectionMm} measure={measures.length} system={system} />
              </Item>
            </dl>
          </section>
        </div>

        <section aria-labelledby="card-limits" className="mt-3">
          <h2 id="card-limits" className="mb-1 text-xs font-semibold tracking-wide uppercase">
            Limits
          </h2>
          <p className="mb-2 text-sm font-medium">{held ? `Held back by: ${held}` : "Nothing held this recipe back: every limit has room."}</p>
          {rec ? (
            <LimitBars rec={rec} system={system} className="grid gap-x-8 gap-y-2 sm:grid-cols-2 print:grid-cols-2" />
          ) : (
            <p className="text-xs">Limit details are shown when the card is opened online.</p>
          )}
        </section>

        {warnings.length > 0 && (
          <section aria-labelledby="card-warnings" className="mt-3">
            <h2 id="card-warnings" className="mb-1 text-xs font-semibold tracking-wide uppercase">
              Watch for
            </h2>
            <ul className="list-disc space-y-0.5 pl-5 text-xs">
              {warnings.map((w) => (
                <li key={w}>{w}</li>
              ))}
            </ul>
          </section>
        )}

        {recipe.notes && (
          <section aria-labelledby="card-notes" className="mt-3">
            <h2 id="card-notes" className="mb-1 text-xs font-semibold tracking-wide uppercase">
              Notes
            </h2>
            <p className="text-xs whitespace-pre-line print:line-clamp-4">{recipe.notes}</p>
          </section>
        )}

        <div className="mt-4 flex items-stretch gap-4 print:mt-2">
          <SafetyBand className="flex-1 border-ink bg-white print:py-2" notes={rec?.safetyNotes} compact />
          <figure className="flex shrink-0 flex-col items-center justify-center gap-1">
            <QrImage value={logUrl} alt="QR code: open the cut-log form for this recipe" size={112} />
            <figcaption className="text-center text-[0.65rem] leading-tight">Scan to log the cut</figcaption>
          </figure>
        </div>

        <footer className="mt-3 print:mt-2 flex flex-wrap justify-between gap-2 border-t border-ink pt-2 text-[0.65rem]">
          <span>Cut log: {logUrl}</span>
          <span>Ringdown · {recipe.machineName}</span>
        </footer>
      </article>
    </div>
  );
}
