import { roleLabels, type Role, type ShopExportEntity, type UnitSystem } from "@ringdown/contracts";
import { Download, History, Lock } from "lucide-react";
import { useId, useState } from "react";
import { Link } from "react-router-dom";
import { SafetyBand } from "@/components/recommendation/safety-band";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import type { ActiveShop } from "@/lib/active-shop";
import { shopExportCsvUrl, shopExportJsonUrl } from "../api/export-urls";

export const SHOP_DATA_TITLE = "Your shop's data";
const DESCRIPTION = "Download what this shop keeps in Ringdown, for a backup, a spreadsheet or another program.";

/** The roles the server lets take the shop's data out (the export routes answer 403 to the others). */
export function canTakeShopDataOut(role: Role): boolean {
  return role === "owner" || role === "tooling_manager";
}

const unitChoices: Array<{ value: UnitSystem; label: string; detail: string }> = [
  { value: "metric", label: "Metric", detail: "mm, mm/min, mm³/min" },
  { value: "imperial", label: "Imperial", detail: "in, in/min, in³/min" },
];

/** The four CSV files, each with one line on what it holds. */
const csvFiles: Array<{ entity: ShopExportEntity; label: string; holds: string }> = [
  {
    entity: "cutters",
    label: "Cutters",
    holds: "Every cutter in the library with its shape, size, flutes and the maker's top speed; imports back into Cutters as it is.",
  },
  {
    entity: "assemblies",
    label: "Assemblies",
    holds: "Each cutter as mounted on a machine: the holder, stick-out and runout.",
  },
  {
    entity: "recipes",
    label: "Recipes",
    holds: "Each saved recipe at its latest revision: status, depths of cut, spindle speed, feed, chip load, power, deflection and the limit that held it back.",
  },
  {
    entity: "cut-logs",
    label: "Cut logs",
    holds: "Every cut logged from the floor: outcome, the spindle speed and feed actually run, depths, feed override and the note.",
  },
];

/**
 * The shop's data, to take out: the whole shop as one JSON file (SI units) and four CSV files in
 * the chosen units. Owners and tooling managers only; everyone else is told who can.
 */
export function ShopDataPage({ shop, preferredUnits }: { shop: ActiveShop | null; preferredUnits: UnitSystem }) {
  if (!shop || !canTakeShopDataOut(shop.role)) {
    return (
      <div className="mx-auto flex max-w-3xl flex-col gap-6">
        <PageHeader title={SHOP_DATA_TITLE} description={DESCRIPTION} />
        <Card>
          <EmptyState icon={Lock} title="Only owners and tooling managers can download the shop's data">
            <p>
              {shop ? `Your role in ${shop.shopName} is ${roleLabels[shop.role].toLowerCase()}. ` : ""}
              Ask an owner or a tooling manager of {shop?.shopName ?? "your shop"} for a copy of its cutters, recipes or cut logs.
            </p>
          </EmptyState>
        </Card>
      </div>
    );
  }
  return <ShopDataDownloads shop={shop} preferredUnits={preferredUnits} />;
}

function ShopDataDownloads({ shop, preferredUnits }: { shop: ActiveShop; preferredUnits: UnitSystem }) {
  const [units, setUnits] = useState<UnitSystem>(preferredUnits);
  const id = useId();
  const unitsWord = units === "imperial" ? "imperial" : "metric";

  return (
    <div className="mx-auto flex max-w-3xl flex-col gap-6">
      <PageHeader title={SHOP_DATA_TITLE} description={DESCRIPTION} />

      <Card>
        <CardHeader title="The whole shop, in one file" description="JSON, for another program or a backup you can read." />
        <CardBody className="flex flex-col gap-3 text-sm text-ink">
          <p>
            Materials, cutters, machines, assemblies, recipes with every revision and status change, cut logs and test-cut
            ladders, including what is in the bin (with the time it was put there).
          </p>
          <p className="text-muted">
            Always in SI units, whatever the unit choice below: lengths in mm, spindle speed in rpm, feed in mm/min, power in
            W, stiffness in N/mm, frequency in Hz.
          </p>
          <p>
            <a
              href={shopExportJsonUrl(shop.shopId)}
              download
              className="inline-flex h-10 items-center gap-2 rounded-md bg-brand px-4 font-medium text-white hover:bg-brand/90"
            >
              <Download className="size-4" aria-hidden />
              Download everything (JSON)
            </a>
          </p>
        </CardBody>
      </Card>

      <Card>
        <CardHeader title="One kind of record per file" description="CSV, for a spreadsheet. Rows in the bin are left out." />
        <CardBody className="flex flex-col gap-4">
          <fieldset aria-describedby={`${id}-units-note`}>
            <legend className="mb-1.5 text-sm font-medium text-ink">Units in the CSV files</legend>
            <div className="flex flex-wrap gap-x-6 gap-y-1">
              {unitChoices.map((choice) => (
                <label key={choice.value} className="flex cursor-pointer items-center gap-2 text-sm text-ink">
                  <input
                    type="radio"
                    name={`${id}-units`}
                    value={choice.value}
                    checked={units === choice.value}
                    onChange={() => setUnits(choice.value)}
                    className="size-4 accent-brand"
                  />
                  <span>{choice.label}</span>
                  <span className="text-xs text-muted">{choice.detail}</span>
                </label>
              ))}
            </div>
            <p id={`${id}-units-note`} className="mt-1.5 text-xs text-muted">
              Each column's header ends in its unit. Spindle speed (rpm), power (W) and feed override (%) are the same in both.
            </p>
          </fieldset>

          <ul className="divide-y divide-rule border-y border-rule" aria-label="CSV files">
            {csvFiles.map((file) => (
              <li key={file.entity} className="flex flex-wrap items-center justify-between gap-x-6 gap-y-2 py-3">
                <p className="min-w-0 flex-1 basis-64 text-sm text-muted">
                  <span className="block font-medium text-ink">{file.label}</span>
                  {file.holds}
                </p>
                <a
                  href={shopExportCsvUrl(shop.shopId, file.entity, units)}
                  download
                  className="inline-flex h-9 shrink-0 items-center gap-2 rounded-md border border-rule bg-surface px-3 text-sm font-medium text-ink hover:bg-paper"
                >
                  <Download className="size-4" aria-hidden />
                  {`Download ${file.label.toLowerCase()} (${unitsWord})`}
                </a>
              </li>
            ))}
          </ul>

          <SafetyBand compact />
        </CardBody>
      </Card>

      <p className="flex items-start gap-2 text-sm text-muted">
        <History className="mt-0.5 size-4 shrink-0" aria-hidden />
        <span>
          Each download is recorded in the shop's change history: who took which file, and when.
          {shop.role === "owner" && (
            <>
              {" "}
              <Link to="/team/history" className="font-medium text-brand underline underline-offset-4">
                See the change history
              </Link>
            </>
          )}
        </span>
      </p>
    </div>
  );
}
